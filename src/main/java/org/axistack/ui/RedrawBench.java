package org.axistack.ui;

import java.lang.management.ManagementFactory;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.function.ToDoubleFunction;
import javax.swing.SwingUtilities;

import org.axistack.model.Stack;

/**
 * Times the window's answer to a bias change, for the speed target of the issue (change to redraw within 50 ms on
 * the demo lens): opens a lens in a window (recent files kept in memory, never in the user's preferences), moves
 * the bias of the electrode with the largest |bias| back and forth in steps of 0.6 % (up to 12 %), waiting for each
 * redraw and then 20 ms (a slider dragged at about 25 changes a second), and reports medians over the timed changes
 * after untimed warm-up changes (the Java compiler's warm-up). Wall-clock times, on whatever else the machine is
 * doing: the load average is reported with them. Needs a display.
 */
public final class RedrawBench {

    /** Pause after each redraw before the next change, ms. */
    static final int GAP_MS = 20;

    /**
     * Medians over the timed changes, ms.
     *
     * @param electrode       the electrode whose bias was moved
     * @param warmup          untimed changes before the timed ones
     * @param changes         timed changes
     * @param warmupMedian_ms change to redraw, median of the warm-up changes
     * @param median_ms       change to redraw, median of the timed changes
     * @param max_ms          change to redraw, the slowest timed change
     * @param compute_ms      view computation, wall clock
     * @param computeCpu_ms   view computation, processor time of both threads
     * @param toPaint_ms      from installing the view until the paint began
     * @param paint_ms        the paint, wall clock
     * @param paintCpu_ms     the paint, processor time of the event thread
     * @param loadAverage     the system's one-minute load average at the end
     * @param cores           processors available
     */
    public record Result(String electrode, int warmup, int changes, double warmupMedian_ms, double median_ms,
            double max_ms, double compute_ms, double computeCpu_ms, double toPaint_ms, double paint_ms,
            double paintCpu_ms, double loadAverage, int cores) {

        /** One line for the console. */
        public String describe() {
            return String.format(Locale.ROOT, "bias of %s moved %d times after %d warm-up changes (warm-up median"
                    + " %.1f ms): change to redraw median %.1f ms, max %.1f ms; view computation %.1f ms wall / %.1f ms"
                    + " cpu, to paint %.1f ms, paint %.1f ms wall / %.1f ms cpu; load average %.2f on %d cores",
                    electrode, changes, warmup, warmupMedian_ms, median_ms, max_ms, compute_ms, computeCpu_ms,
                    toPaint_ms, paint_ms, paintCpu_ms, loadAverage, cores);
        }
    }

    private RedrawBench() {
    }

    /** Opens the stack file (the built-in demo lens when null) in a window, measures, and closes the window. */
    public static Result run(Path file, int warmup, int changes) throws Exception {
        RecentFiles recent = RecentFiles.inMemory();
        recent.markCautionsSeen(); // a modal dialog would wait for a person
        LensWindow w = Desktop.open(file, recent);
        try {
            long end = System.nanoTime() + 600_000_000_000L;
            while (w.current == null) {
                if (System.nanoTime() > end) {
                    throw new IllegalStateException("the lens was not shown within 10 minutes");
                }
                Thread.sleep(50);
            }
            return measure(w, warmup, changes);
        } finally {
            SwingUtilities.invokeAndWait(() -> {
                w.shutdown();
                w.dispose();
            });
        }
    }

    /** Measures on an open window showing a lens. */
    static Result measure(LensWindow w, int warmup, int changes) throws Exception {
        if (warmup < 0 || changes < 1) {
            throw new IllegalArgumentException("need at least one timed change");
        }
        Stack s = w.current.stack();
        double[] b = s.biases_V();
        int k = 0;
        for (int i = 1; i < b.length; i++) {
            if (Math.abs(b[i]) > Math.abs(b[k])) {
                k = i;
            }
        }
        double base = b[k] != 0 ? b[k] : 0.1 * s.beam().energyPerCharge_V();
        int electrode = k;
        int first = w.chartPanel.redrawCount();
        for (int i = 1; i <= warmup + changes; i++) {
            double v = base * (1 + 0.006 * (i % 21));
            int n = w.chartPanel.redrawCount();
            SwingUtilities.invokeAndWait(() -> w.biasPanel.set(electrode, v, false));
            long end = System.nanoTime() + 60_000_000_000L;
            while (w.chartPanel.redrawCount() <= n) {
                if (System.nanoTime() > end) {
                    throw new IllegalStateException("no redraw within a minute of a bias change");
                }
                Thread.sleep(1);
            }
            Thread.sleep(GAP_MS);
        }
        List<TimedChartPanel.Redraw> all = w.chartPanel.redraws();
        List<TimedChartPanel.Redraw> warm = all.subList(first, first + warmup);
        List<TimedChartPanel.Redraw> r = all.subList(first + warmup, all.size());
        return new Result(s.electrodes().get(k).name(), warmup, r.size(),
                warm.isEmpty() ? Double.NaN : median(warm, TimedChartPanel.Redraw::total_ms),
                median(r, TimedChartPanel.Redraw::total_ms),
                r.stream().mapToDouble(TimedChartPanel.Redraw::total_ms).max().orElse(Double.NaN),
                median(r, TimedChartPanel.Redraw::compute_ms), median(r, TimedChartPanel.Redraw::computeCpu_ms),
                median(r, TimedChartPanel.Redraw::toPaint_ms), median(r, TimedChartPanel.Redraw::paint_ms),
                median(r, TimedChartPanel.Redraw::paintCpu_ms),
                ManagementFactory.getOperatingSystemMXBean().getSystemLoadAverage(),
                Runtime.getRuntime().availableProcessors());
    }

    private static double median(List<TimedChartPanel.Redraw> l, ToDoubleFunction<TimedChartPanel.Redraw> f) {
        double[] v = l.stream().mapToDouble(f).toArray();
        Arrays.sort(v);
        return v.length % 2 == 1 ? v[v.length / 2] : 0.5 * (v[v.length / 2 - 1] + v[v.length / 2]);
    }
}
