package org.axistack.trace;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.concurrent.CancellationException;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.concurrent.atomic.AtomicInteger;

/**
 * Traces every ray of a set on a fixed pool of worker threads (rays are independent, so this is
 * plain data parallelism). Reports progress after each ray and stops early when cancelled. The
 * result is the same for any number of threads.
 */
public final class BundleTracer {

    private final Tracer tracer;
    private final int threads;

    /** @param threads worker threads (&gt;= 1; the number of cores is the usual choice) */
    /**
     * Heap bytes kept per traced ray, estimated from the object layout of a finished ray (a {@link RayStart},
     * a {@link Trajectory} with its end {@link RayPoint} and their headers, about 400 bytes) with a factor 2.5
     * for the bundle's lists and statistics. An estimate, not a measurement: the limit below keeps 50 % of the
     * heap free for the field solution, the field map and the output.
     */
    static final long BYTES_PER_RAY = 1000;
    /** Heap bytes per ray and observation plane (one {@link PlaneCrossing} and its list slot, about 100 bytes, x2.5). */
    static final long BYTES_PER_CROSSING = 250;
    /** Most rays in one bundle whatever the heap (keeps run time bounded as well). */
    public static final int MAX_RAYS = 5_000_000;

    /** Largest number of rays the current heap can hold for a bundle observed at the given number of planes. */
    public static int maxRaysForHeap(int planes) {
        long perRay = BYTES_PER_RAY + BYTES_PER_CROSSING * Math.max(1, planes);
        long byHeap = (long) (0.5 * Runtime.getRuntime().maxMemory()) / perRay;
        return (int) Math.min(byHeap, MAX_RAYS);
    }

    public BundleTracer(Tracer tracer, int threads) {
        if (tracer == null) {
            throw new IllegalArgumentException("the bundle tracer needs a tracer");
        }
        if (threads < 1) {
            throw new IllegalArgumentException("threads must be at least 1: " + threads);
        }
        this.tracer = tracer;
        this.threads = threads;
    }

    /** A bundle tracer with one thread per available core. */
    public static BundleTracer perCore(Tracer tracer) {
        return new BundleTracer(tracer, Runtime.getRuntime().availableProcessors());
    }

    /**
     * Traces the set. Bad rays or targets are reported before any tracing (IllegalArgumentException).
     *
     * @throws CancellationException if the progress listener asked to stop
     */
    public BundleResult trace(RaySet set, TraceTargets targets, TraceProgress progress) {
        long t0 = System.nanoTime();
        tracer.validateTargets(targets);
        for (RayStart r : set.rays()) {
            tracer.validateStart(set.particle(), r, targets);
        }
        int n = set.size();
        Trajectory[] out = new Trajectory[n];
        AtomicInteger next = new AtomicInteger();
        AtomicInteger done = new AtomicInteger();
        int workers = Math.min(threads, n);
        AtomicBoolean stop = new AtomicBoolean();
        Runnable work = () -> {
            int i;
            try {
                while (!stop.get() && (i = next.getAndIncrement()) < n) {
                    if (progress.isCancelled()) {
                        throw new CancellationException("trace cancelled");
                    }
                    out[i] = tracer.trace(set.particle(), set.rays().get(i), targets, progress);
                    progress.raysDone(done.incrementAndGet(), n);
                }
            } catch (RuntimeException | Error e) {
                stop.set(true);
                throw e;
            }
        };
        if (workers == 1) {
            work.run();
        } else {
            ExecutorService pool = Executors.newFixedThreadPool(workers, r -> {
                Thread t = new Thread(r, "axistack-trace");
                t.setDaemon(true);
                return t;
            });
            try {
                List<Future<?>> fs = new ArrayList<>();
                for (int w = 0; w < workers; w++) {
                    fs.add(pool.submit(work));
                }
                for (Future<?> f : fs) {
                    f.get();
                }
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                throw new CancellationException("trace interrupted");
            } catch (ExecutionException e) {
                Throwable c = e.getCause();
                if (c instanceof RuntimeException re) {
                    throw re;
                }
                if (c instanceof Error er) {
                    throw er;
                }
                throw new IllegalStateException(c);
            } finally {
                pool.shutdownNow();
            }
        }
        return new BundleResult(set, targets, Arrays.asList(out), (System.nanoTime() - t0) * 1e-9);
    }
}
