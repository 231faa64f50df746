package org.axistack.size;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.List;
import java.util.Map;
import java.util.concurrent.CancellationException;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.concurrent.atomic.AtomicInteger;

import org.hipparchus.exception.MathIllegalStateException;
import org.hipparchus.optim.InitialGuess;
import org.hipparchus.optim.MaxEval;
import org.hipparchus.optim.SimpleBounds;
import org.hipparchus.optim.nonlinear.scalar.GoalType;
import org.hipparchus.optim.nonlinear.scalar.ObjectiveFunction;
import org.hipparchus.optim.nonlinear.scalar.noderiv.BOBYQAOptimizer;
import org.hipparchus.optim.univariate.BrentOptimizer;
import org.hipparchus.optim.univariate.SearchInterval;
import org.hipparchus.optim.univariate.UnivariateObjectiveFunction;
import org.hipparchus.random.SobolSequenceGenerator;

/**
 * The sizing search. The varied parameters are mapped linearly onto the unit cube. A first stage evaluates the
 * centre and a Sobol low-discrepancy sample of the cube (I. M. Sobol', USSR Comput. Math. Math. Phys. 7, 1967;
 * Hipparchus generator) in parallel; a second stage starts one local search from each of the best distinct
 * points, in parallel: Powell's BOBYQA bound-constrained derivative-free optimiser (M. J. D. Powell, "The
 * BOBYQA algorithm for bound constrained optimization without derivatives", Cambridge report NA2009/06;
 * Hipparchus implementation) for two or more varied parameters, Brent's line minimiser for one. The function
 * minimised for a geometry is the best over its focusing designs of ln(objective) + 20 x (sum of relative
 * excesses over the limits), and 100 when no bias within the supply focuses: a penalty method, so designs that
 * break a limit steer the search back. Every evaluated design is kept for the trade-off front.
 * Deterministic: the same requirements give the same sequence of candidates whatever the thread timing.
 */
public final class Sizer {

    /** Penalty weight per unit of relative excess over a limit. */
    static final double PENALTY = 20;
    /** Function value of a geometry with no focusing design. */
    static final double NO_FOCUS = 100;
    /** Largest penalty term, so that a focusing design always scores better than no focus. */
    static final double MAX_PENALTY = 60;
    /** BOBYQA stopping trust-region radius in the unit cube: the optimiser's tolerance on the parameters. */
    public static final double PARAMETER_TOLERANCE = 2e-3;

    private final Requirements req;
    private final DesignEvaluator evaluator;
    private final SizingProgress progress;
    private final Map<String, DesignEvaluator.Candidate> memo = new ConcurrentHashMap<>();
    private final List<DesignEvaluator.Candidate> order = java.util.Collections.synchronizedList(new ArrayList<>());
    private final AtomicInteger done = new AtomicInteger();
    private final AtomicBoolean cancelled = new AtomicBoolean();
    private volatile double best = Double.NaN;
    private volatile String stage = "initial sample";

    public Sizer(Requirements req, FocusFinder finder, SizingProgress progress) {
        this.req = req;
        this.evaluator = new DesignEvaluator(req, finder);
        this.progress = progress == null ? SizingProgress.NONE : progress;
    }

    public DesignEvaluator evaluator() {
        return evaluator;
    }

    /** Runs the search; throws {@link CancellationException} when the progress callback cancels. */
    public List<DesignEvaluator.Candidate> search() {
        int[] varied = req.varied();
        int n = varied.length;
        int budget = req.search().evaluations();
        ExecutorService pool = Executors.newFixedThreadPool(req.search().threads(), r -> {
            Thread t = new Thread(r, "sizer");
            t.setDaemon(true);
            return t;
        });
        try {
            if (n == 0) {
                evaluate(new double[0]);
                return List.copyOf(order);
            }
            int starts = Math.max(1, Math.min(req.search().threads(), 4));
            int first = Math.max(Math.min(budget / 3, 4 * n + 4), Math.min(budget, 2 * starts));
            List<double[]> sample = new ArrayList<>();
            double[] centre = new double[n];
            Arrays.fill(centre, 0.5);
            sample.add(centre);
            SobolSequenceGenerator sobol = new SobolSequenceGenerator(n);
            sobol.skipTo(1);
            while (sample.size() < first) {
                sample.add(sobol.nextVector());
            }
            List<Future<Double>> fs = new ArrayList<>();
            for (double[] x : sample) {
                fs.add(pool.submit(() -> evaluate(x)));
            }
            double[] values = new double[sample.size()];
            for (int i = 0; i < fs.size(); i++) {
                values[i] = get(fs.get(i));
            }
            Integer[] idx = new Integer[values.length];
            for (int i = 0; i < idx.length; i++) {
                idx[i] = i;
            }
            Arrays.sort(idx, Comparator.comparingDouble(i -> values[i]));
            List<double[]> startPoints = new ArrayList<>();
            for (int i : idx) {
                if (startPoints.size() >= starts || values[i] >= NO_FOCUS) {
                    break;
                }
                startPoints.add(sample.get(i));
            }
            if (startPoints.isEmpty()) {
                startPoints.add(sample.get(idx[0]));
            }
            stage = "local search";
            int each = Math.max((budget - first) / startPoints.size(), 2 * n + 3);
            List<Future<Double>> local = new ArrayList<>();
            for (double[] x0 : startPoints) {
                local.add(pool.submit(() -> localSearch(x0, each)));
            }
            for (Future<Double> f : local) {
                get(f);
            }
            return List.copyOf(order);
        } finally {
            pool.shutdownNow();
        }
    }

    private double localSearch(double[] x0, int maxEval) {
        int n = x0.length;
        try {
            if (n == 1) {
                double lo = Math.max(0, x0[0] - 0.25), hi = Math.min(1, x0[0] + 0.25);
                new BrentOptimizer(1e-6, PARAMETER_TOLERANCE).optimize(new MaxEval(maxEval), GoalType.MINIMIZE,
                        new UnivariateObjectiveFunction(x -> evaluate(new double[] {x})),
                        new SearchInterval(lo, hi, x0[0]));
            } else {
                double[] lower = new double[n], upper = new double[n];
                Arrays.fill(upper, 1);
                new BOBYQAOptimizer(2 * n + 1, 0.15, PARAMETER_TOLERANCE).optimize(new MaxEval(maxEval),
                        GoalType.MINIMIZE, new ObjectiveFunction(this::evaluate), new InitialGuess(x0.clone()),
                        new SimpleBounds(lower, upper));
            }
        } catch (MathIllegalStateException e) {
            // evaluation budget used up: the designs evaluated so far are kept
        }
        return 0;
    }

    private static double get(Future<Double> f) {
        try {
            return f.get();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new CancellationException("interrupted");
        } catch (ExecutionException e) {
            if (e.getCause() instanceof RuntimeException r) {
                throw r;
            }
            throw new IllegalStateException(e.getCause());
        }
    }

    /** Sizing parameters (m) of a point of the unit cube of the varied parameters. */
    public double[] parameters(double[] x) {
        List<Parameter> ps = req.parameters();
        double[] p = new double[ps.size()];
        int[] varied = req.varied();
        for (int i = 0; i < p.length; i++) {
            p[i] = ps.get(i).min_m();
        }
        for (int k = 0; k < varied.length; k++) {
            Parameter q = ps.get(varied[k]);
            double u = Math.min(1, Math.max(0, x[k]));
            p[varied[k]] = q.min_m() + u * (q.max_m() - q.min_m());
        }
        return p;
    }

    /** The penalised function value of one point of the unit cube (memoised). */
    double evaluate(double[] x) {
        if (cancelled.get()) {
            throw new CancellationException("sizing cancelled");
        }
        String key = Arrays.toString(x);
        DesignEvaluator.Candidate c = memo.get(key);
        if (c == null) {
            c = evaluator.evaluate(parameters(x), req.search().meshElements(), (s, f) -> !cancelled.get());
            DesignEvaluator.Candidate prev = memo.putIfAbsent(key, c);
            if (prev == null) {
                order.add(c);
                int k = done.incrementAndGet();
                for (Design d : c.designs()) {
                    if (d.feasible()) {
                        double s = req.objective().score(d);
                        synchronized (this) {
                            if (Double.isNaN(best) || s < best) {
                                best = s;
                            }
                        }
                    }
                }
                if (!progress.update(stage, k, req.search().evaluations(), best)) {
                    cancelled.set(true);
                    throw new CancellationException("sizing cancelled");
                }
            } else {
                c = prev;
            }
        }
        return value(c);
    }

    double value(DesignEvaluator.Candidate c) {
        double v = NO_FOCUS;
        for (Design d : c.designs()) {
            v = Math.min(v, Math.log(req.objective().score(d)) + Math.min(MAX_PENALTY, PENALTY * d.totalExcess()));
        }
        return v;
    }
}
