package org.axistack.tune;

import org.axistack.model.PhysicsMessage;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Optional;

import org.axistack.field.FieldSolution;
import org.axistack.model.Biases;
import org.axistack.model.Stack;
import org.hipparchus.linear.Array2DRowRealMatrix;
import org.hipparchus.linear.ArrayRealVector;
import org.hipparchus.linear.RealVector;
import org.hipparchus.optim.nonlinear.vector.leastsquares.LeastSquaresBuilder;
import org.hipparchus.optim.nonlinear.vector.leastsquares.LeastSquaresOptimizer;
import org.hipparchus.optim.nonlinear.vector.leastsquares.LevenbergMarquardtOptimizer;
import org.hipparchus.util.Pair;

/**
 * Two conditions with two electrodes, solved together: the image at a plane plus a magnification, or plus an
 * image-side focal length (three-or-more-element lenses).
 *
 * <p>Method: both residuals (the continuous focusing condition of {@link FocusProbe} and the second condition's
 * pole-free residual, {@link SecondCondition}) are sampled on a {@value #GRID} x {@value #GRID} grid of the two
 * bias ranges; every grid cell across whose corners both residuals change sign, and the few best grid points,
 * start the Levenberg-Marquardt method (Hipparchus {@code LevenbergMarquardtOptimizer}; J. J. More, The
 * Levenberg-Marquardt algorithm: implementation and theory, Lecture Notes in Mathematics 630, 1978) with a
 * central-difference Jacobian. Converged points inside the ranges with both residuals below
 * {@value #TOLERANCE} are solutions; when there is none, the point of smallest residual is reported as the
 * nearest approach. Re-biasing by superposition only.
 */
public final class PairTuner {

    /** Grid points per bias range for the start search. */
    public static final int GRID = 13;
    /** A solution satisfies both residuals to this (relative) value. */
    public static final double TOLERANCE = 1e-9;
    private static final int EXTRA_STARTS = 4;

    private final FieldSolution solution;
    private final Stack stack;

    public PairTuner(FieldSolution solution, Stack stack) {
        solution.requireGeometryOf(stack);
        this.solution = solution;
        this.stack = stack;
    }

    /**
     * One solution (or the nearest approach).
     *
     * @param focus    the image description at these biases (electrode: the first one varied)
     * @param achieved achieved second quantity (magnification, or focal length in m)
     * @param residual Euclidean norm of the two residuals
     */
    public record PairSolution(FocusSolution focus, double firstBias_V, double secondBias_V, double achieved,
            double residual) {
    }

    /**
     * @param solutions   all distinct solutions found, by increasing first bias
     * @param nearest     the best point when there is no solution
     * @param evaluations optics evaluations used
     */
    public record PairResult(String first, String second, FocusTarget target, SecondCondition condition,
            BiasRange firstRange, BiasRange secondRange, List<PairSolution> solutions, Optional<PairSolution> nearest,
            int evaluations) {
        public PairResult {
            solutions = List.copyOf(solutions);
        }

        public boolean found() {
            return !solutions.isEmpty();
        }
    }

    public PairResult solve(String first, String second, FocusTarget target, SecondCondition condition,
            BiasRange firstRange, BiasRange secondRange) {
        int i1 = stack.indexOf(first);
        int i2 = stack.indexOf(second);
        if (i1 < 0 || i2 < 0) {
            throw PhysicsMessage.UNKNOWN_ELECTRODE.exception("name", i1 < 0 ? first : second, "names", String.join(", ", stack.names()));
        }
        if (i1 == i2) {
            throw PhysicsMessage.SAME_ELECTRODE_TWICE.exception("name", first);
        }
        if (condition instanceof SecondCondition.Magnification && target.objectAtInfinity()) {
            throw PhysicsMessage.MAGNIFICATION_NEEDS_OBJECT.exception();
        }
        FocusProbe probe = new FocusProbe(solution, stack, target);
        Biases base = stack.biases();
        int[] count = {0};
        double[][][] res = new double[GRID][GRID][];
        double[] g1 = new double[GRID];
        double[] g2 = new double[GRID];
        for (int a = 0; a < GRID; a++) {
            g1[a] = firstRange.from_V() + firstRange.width_V() * a / (GRID - 1);
            g2[a] = secondRange.from_V() + secondRange.width_V() * a / (GRID - 1);
        }
        List<double[]> starts = new ArrayList<>();
        List<double[]> ranked = new ArrayList<>();
        for (int a = 0; a < GRID; a++) {
            for (int b = 0; b < GRID; b++) {
                res[a][b] = residuals(probe, base, i1, i2, g1[a], g2[b], condition, target, count);
                if (res[a][b] != null) {
                    ranked.add(new double[] {g1[a], g2[b], norm(res[a][b])});
                }
            }
        }
        for (int a = 0; a + 1 < GRID; a++) {
            for (int b = 0; b + 1 < GRID; b++) {
                double[][] corners = {res[a][b], res[a + 1][b], res[a][b + 1], res[a + 1][b + 1]};
                if (straddles(corners, 0) && straddles(corners, 1)) {
                    starts.add(new double[] {0.5 * (g1[a] + g1[a + 1]), 0.5 * (g2[b] + g2[b + 1])});
                }
            }
        }
        ranked.sort(Comparator.comparingDouble(r -> r[2]));
        for (int k = 0; k < Math.min(EXTRA_STARTS, ranked.size()); k++) {
            starts.add(new double[] {ranked.get(k)[0], ranked.get(k)[1]});
        }
        List<double[]> found = new ArrayList<>();
        double[] best = null;
        for (double[] start : starts) {
            double[] x = refine(probe, base, i1, i2, start, condition, target, count, firstRange, secondRange);
            if (x == null) {
                continue;
            }
            if (best == null || x[2] < best[2]) {
                best = x;
            }
            boolean inside = firstRange.contains(x[0]) && secondRange.contains(x[1]);
            boolean duplicate = found.stream().anyMatch(f -> Math.abs(f[0] - x[0]) < 1e-6 * firstRange.width_V()
                    && Math.abs(f[1] - x[1]) < 1e-6 * secondRange.width_V());
            if (x[2] < TOLERANCE && inside && !duplicate) {
                found.add(x);
            }
        }
        found.sort(Comparator.comparingDouble(f -> f[0]));
        List<PairSolution> solutions = new ArrayList<>();
        for (double[] f : found) {
            solutions.add(describe(probe, base, i1, i2, f, first, condition, target));
        }
        Optional<PairSolution> nearest = Optional.empty();
        if (solutions.isEmpty() && best != null) {
            nearest = Optional.of(describe(probe, base, i1, i2, best, first, condition, target));
        }
        return new PairResult(first, second, target, condition, firstRange, secondRange, solutions, nearest, count[0]);
    }

    private PairSolution describe(FocusProbe probe, Biases base, int i1, int i2, double[] x, String first,
            SecondCondition condition, FocusTarget target) {
        FocusProbe.Point p = probe.at(biases(base, i1, i2, x[0], x[1]));
        FocusSolution focus = BiasTuner.describe(stack, first, i1, p, target);
        return new PairSolution(focus, x[0], x[1], condition.achieved(p.optics(), target), x[2]);
    }

    private static boolean straddles(double[][] corners, int k) {
        boolean pos = false;
        boolean neg = false;
        for (double[] c : corners) {
            if (c == null) {
                return false;
            }
            pos |= c[k] >= 0;
            neg |= c[k] <= 0;
        }
        return pos && neg;
    }

    private static double norm(double[] r) {
        return Math.hypot(r[0], r[1]);
    }

    private static double[] biases(Biases base, int i1, int i2, double v1, double v2) {
        return base.with(base.names().get(i1), v1).with(base.names().get(i2), v2).toArray_V();
    }

    /** The two residuals, or null when the beam turns back. */
    private static double[] residuals(FocusProbe probe, Biases base, int i1, int i2, double v1, double v2,
            SecondCondition condition, FocusTarget target, int[] count) {
        count[0]++;
        FocusProbe.Point p = probe.at(biases(base, i1, i2, v1, v2));
        if (!p.valid()) {
            return null;
        }
        return new double[] {p.miss(), condition.residual(p.optics(), target)};
    }

    /**
     * Levenberg-Marquardt from a start, inside the ranges through the change of variables v = c + h sin t (c, h
     * the centre and half-width of a range; a bounded minimum then is a stationary point in t); a forward-difference
     * Jacobian. Returns {v1, v2, residual norm}, or the best point reached if it stops early, or null.
     */
    private static double[] refine(FocusProbe probe, Biases base, int i1, int i2, double[] start,
            SecondCondition condition, FocusTarget target, int[] count, BiasRange r1, BiasRange r2) {
        double c1 = 0.5 * (r1.from_V() + r1.to_V());
        double c2 = 0.5 * (r2.from_V() + r2.to_V());
        double w1 = 0.5 * r1.width_V();
        double w2 = 0.5 * r2.width_V();
        double h1 = 1e-7 * w1;
        double h2 = 1e-7 * w2;
        double[] bestSeen = {Double.NaN, Double.NaN, Double.POSITIVE_INFINITY};
        double[] t0 = {Math.asin(Math.max(-1, Math.min(1, (start[0] - c1) / w1))),
            Math.asin(Math.max(-1, Math.min(1, (start[1] - c2) / w2)))};
        try {
            LeastSquaresOptimizer.Optimum opt = new LevenbergMarquardtOptimizer().optimize(new LeastSquaresBuilder()
                    .start(t0)
                    .target(new double[] {0, 0})
                    .maxEvaluations(150)
                    .maxIterations(100)
                    .model(point -> {
                        double t1 = point.getEntry(0);
                        double t2 = point.getEntry(1);
                        double v1 = c1 + w1 * Math.sin(t1);
                        double v2 = c2 + w2 * Math.sin(t2);
                        double[] r0 = residuals(probe, base, i1, i2, v1, v2, condition, target, count);
                        if (r0 == null) {
                            // a mirror here: a large residual makes the optimizer reject the step and shrink it
                            return new Pair<>(new ArrayRealVector(new double[] {1e6, 1e6}),
                                    new Array2DRowRealMatrix(new double[][] {{1, 0}, {0, 1}}));
                        }
                        if (norm(r0) < bestSeen[2]) {
                            bestSeen[0] = v1;
                            bestSeen[1] = v2;
                            bestSeen[2] = norm(r0);
                        }
                        double s1 = v1 + h1 > r1.to_V() ? -h1 : h1;
                        double s2 = v2 + h2 > r2.to_V() ? -h2 : h2;
                        double[] a1 = residuals(probe, base, i1, i2, v1 + s1, v2, condition, target, count);
                        double[] a2 = residuals(probe, base, i1, i2, v1, v2 + s2, condition, target, count);
                        double[][] j = new double[2][2];
                        for (int k = 0; k < 2; k++) {
                            j[k][0] = a1 == null ? 0 : (a1[k] - r0[k]) / s1 * w1 * Math.cos(t1);
                            j[k][1] = a2 == null ? 0 : (a2[k] - r0[k]) / s2 * w2 * Math.cos(t2);
                        }
                        return new Pair<>(new ArrayRealVector(r0), new Array2DRowRealMatrix(j));
                    })
                    .build());
            RealVector t = opt.getPoint();
            double v1 = c1 + w1 * Math.sin(t.getEntry(0));
            double v2 = c2 + w2 * Math.sin(t.getEntry(1));
            double[] r = residuals(probe, base, i1, i2, v1, v2, condition, target, count);
            if (r == null || norm(r) > bestSeen[2]) {
                return Double.isFinite(bestSeen[2]) ? bestSeen : null;
            }
            return new double[] {v1, v2, norm(r)};
        } catch (org.hipparchus.exception.MathIllegalStateException e) {
            // did not converge within the evaluation budget: keep the best point it reached
            return Double.isFinite(bestSeen[2]) ? bestSeen : null;
        }
    }
}
