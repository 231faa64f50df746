package org.axistack.field;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.stream.IntStream;

/**
 * Piecewise Chebyshev expansions of the unit-bias axial potentials and their derivatives (each derivative
 * order fitted separately from its exact values, so no accuracy is lost to differentiation), for fast
 * evaluation by Clenshaw's recurrence (e.g. W. H. Press et al., Numerical Recipes, 3rd ed., sec. 5.8).
 * Interval lengths follow the distance from the axis to the nearest charge, so each expansion is analytic
 * well beyond its interval; an interval is halved (up to three times) until the tail of its expansion (the sum of
 * the last three coefficients) is within {@link #TOLERANCE} x 4^order of that order's largest coefficient over
 * the range, for every unit bias. Where that does not happen, and
 * where an electrode comes closer to the axis than {@link #EXACT_FRACTION} of the range, the exact ring sum
 * is used instead (the test suite checks the result against the exact sum everywhere). Re-biasing combines
 * the coefficients linearly. Built in a fork-join pool of its own, so it may be first used from any thread,
 * including a task of the common pool.
 */
final class AxialExpansion {

    /** Highest derivative order held in the expansion. */
    static final int ORDER = 8;
    /** Chebyshev points (and coefficients) per interval. */
    static final int POINTS = 20;
    /**
     * Target accuracy of order k relative to its largest magnitude over the expansion's range: 1e-11 * 4^k.
     * Higher derivatives of the exact sum itself carry the quadrature error of the far panels (it grows with
     * the order), which no expansion can beat; asking for more only splits intervals without end.
     */
    static final double TOLERANCE = 1e-11;
    /** Stretches where an electrode is closer to the axis than this fraction of the range use the exact sum. */
    static final double EXACT_FRACTION = 1e-3;

    private final double[] breaks;
    /** coef[e][interval][order][j] */
    private final double[][][][] coef;
    private final double maxError;

    private AxialExpansion(double[] breaks, double[][][][] coef, double maxError) {
        this.breaks = breaks;
        this.coef = coef;
        this.maxError = maxError;
    }

    double zMin() {
        return breaks[0];
    }

    double zMax() {
        return breaks[breaks.length - 1];
    }

    /** Largest tail estimate of the accepted intervals, relative to each order's scale and divided by 4^order. */
    double maxError() {
        return maxError;
    }

    /** Number of intervals. */
    int intervals() {
        return breaks.length - 1;
    }

    /** Builds the expansion for every unit solution over [zMin, zMax]. */
    static AxialExpansion build(FieldSolution s, double zMin, double zMax) {
        int ne = s.electrodes().size();
        FieldSolution unit = s;
        BiasedField probe = s.withBiases(new double[ne]);
        // Initial intervals: length about the clearance from the axis. Where an electrode comes closer to the axis
        // than EXACT_FRACTION of the range (a disk or plate across the axis, whose charge makes the axial
        // derivatives jump), no expansion is made: those stretches are evaluated by the exact sum.
        double minLen = EXACT_FRACTION * (zMax - zMin);
        List<double[]> work = new ArrayList<>();
        List<double[]> done = new ArrayList<>();
        List<double[][][]> doneCoef = new ArrayList<>();
        double z = zMin;
        while (z < zMax) {
            double c = probe.clearance_m(z, 0);
            boolean exact = c < minLen;
            double len = exact ? minLen : Math.min(c, 0.1 * (zMax - zMin));
            double end = Math.min(zMax, z + len);
            if (zMax - end < 0.3 * len) {
                end = zMax;
            }
            if (exact) {
                if (!done.isEmpty() && doneCoef.get(done.size() - 1) == null && done.get(done.size() - 1)[1] == z) {
                    done.get(done.size() - 1)[1] = end;
                } else {
                    done.add(new double[] {z, end});
                    doneCoef.add(null);
                }
            } else {
                work.add(new double[] {z, end});
            }
            z = end;
        }
        double worst = 0;
        double[][] scale = null;
        for (int pass = 0; pass < 4 && !work.isEmpty(); pass++) {
            List<double[]> current = work;
            double[][][][] fitted = new double[current.size()][][][];
            inOwnPool(() -> IntStream.range(0, current.size()).parallel().forEach(i -> {
                double[] iv = current.get(i);
                fitted[i] = fit(unit, iv[0], iv[1]);
            }));
            if (scale == null) {
                // Global scale of every (electrode, order) over the whole range: the error is measured against it,
                // since far from the lens high derivatives are tiny and made of round-off.
                scale = new double[ne][ORDER + 1];
                for (double[][][] f : fitted) {
                    for (int e = 0; e < ne; e++) {
                        for (int o = 0; o <= ORDER; o++) {
                            for (double c : f[e][o]) {
                                scale[e][o] = Math.max(scale[e][o], Math.abs(c));
                            }
                        }
                    }
                }
            }
            double[] errors = new double[current.size()];
            for (int i = 0; i < current.size(); i++) {
                errors[i] = tail(fitted[i], scale);
            }
            work = new ArrayList<>();
            for (int i = 0; i < current.size(); i++) {
                double[] iv = current.get(i);
                if (errors[i] > TOLERANCE && pass < 3 && iv[1] - iv[0] > 2 * minLen) {
                    double mid = 0.5 * (iv[0] + iv[1]);
                    work.add(new double[] {iv[0], mid});
                    work.add(new double[] {mid, iv[1]});
                } else if (errors[i] > TOLERANCE) {
                    done.add(iv); // the expansion does not converge here: exact sums
                    doneCoef.add(null);
                } else {
                    done.add(iv);
                    doneCoef.add(fitted[i]);
                    worst = Math.max(worst, errors[i]);
                }
            }
        }
        Integer[] idx = new Integer[done.size()];
        for (int i = 0; i < idx.length; i++) {
            idx[i] = i;
        }
        Arrays.sort(idx, (a, b) -> Double.compare(done.get(a)[0], done.get(b)[0]));
        double[] breaks = new double[idx.length + 1];
        double[][][][] coef = new double[ne][idx.length][][];
        for (int i = 0; i < idx.length; i++) {
            breaks[i] = done.get(idx[i])[0];
            double[][][] c = doneCoef.get(idx[i]);
            for (int e = 0; e < ne; e++) {
                coef[e][i] = c == null ? null : c[e];
            }
        }
        breaks[idx.length] = zMax;
        return new AxialExpansion(breaks, coef, worst);

    }

    /**
     * Runs the parallel fits in a pool of their own: the expansion is built under the solution's lock on first
     * use, possibly from a task of the common pool while other common-pool workers wait for that lock; work
     * queued on the common pool could then never run (a deadlock seen with one common-pool worker on 2 cores).
     */
    private static void inOwnPool(Runnable work) {
        java.util.concurrent.ForkJoinPool pool = new java.util.concurrent.ForkJoinPool(
                Math.max(1, Runtime.getRuntime().availableProcessors()));
        try {
            pool.submit(work).get();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new java.util.concurrent.CancellationException("axial expansion interrupted");
        } catch (java.util.concurrent.ExecutionException e) {
            if (e.getCause() instanceof RuntimeException re) {
                throw re;
            }
            throw new IllegalStateException(e.getCause());
        } finally {
            pool.shutdown();
        }
    }

    /** coefficients [electrode][order][j] on [a, b]. */
    private static double[][][] fit(FieldSolution unit, double a, double b) {
        int ne = unit.electrodes().size();
        double[][][] c = new double[ne][ORDER + 1][POINTS];
        double[][] all = new double[ne][ORDER + 1];
        for (int k = 0; k < POINTS; k++) {
            double x = Math.cos(Math.PI * (k + 0.5) / POINTS);
            double z = 0.5 * (a + b) + 0.5 * (b - a) * x;
            unit.unitAxial(z, ORDER, all);
            for (int e = 0; e < ne; e++) {
                double[] d = all[e];
                for (int o = 0; o <= ORDER; o++) {
                    for (int j = 0; j < POINTS; j++) {
                        c[e][o][j] += d[o] * Math.cos(Math.PI * j * (k + 0.5) / POINTS);
                    }
                }
            }
        }
        for (int e = 0; e < ne; e++) {
            for (int o = 0; o <= ORDER; o++) {
                for (int j = 0; j < POINTS; j++) {
                    c[e][o][j] *= 2.0 / POINTS;
                }
                c[e][o][0] *= 0.5;
            }
        }
        return c;
    }

    /**
     * Error estimate of a fitted interval: the size of the last three Chebyshev coefficients (for an analytic
     * function they bound the truncation error; e.g. L. N. Trefethen, Approximation Theory and Approximation
     * Practice, SIAM 2013, ch. 8), relative to the global scale of each (electrode, order).
     */
    private static double tail(double[][][] c, double[][] scale) {
        double worst = 0;
        for (int e = 0; e < c.length; e++) {
            for (int o = 0; o <= ORDER; o++) {
                if (scale[e][o] > 0) {
                    double t = 0;
                    for (int j = POINTS - 3; j < POINTS; j++) {
                        t += Math.abs(c[e][o][j]);
                    }
                    worst = Math.max(worst, t / scale[e][o] / Math.pow(4, o));
                }
            }
        }
        return worst;
    }

    static double clenshaw(double[] c, double x) {
        double b1 = 0, b2 = 0;
        double x2 = 2 * x;
        for (int j = c.length - 1; j >= 1; j--) {
            double t = x2 * b1 - b2 + c[j];
            b2 = b1;
            b1 = t;
        }
        return x * b1 - b2 + c[0];
    }

    /** Combined coefficients for a bias set: [interval][order][j]. */
    double[][][] combine(double[] biases) {
        int ni = breaks.length - 1;
        double[][][] out = new double[ni][ORDER + 1][POINTS];
        for (int e = 0; e < biases.length; e++) {
            double b = biases[e];
            if (b == 0) {
                continue;
            }
            for (int i = 0; i < ni; i++) {
                if (coef[e][i] == null) {
                    out[i] = null;
                    continue;
                }
                for (int o = 0; o <= ORDER; o++) {
                    double[] src = coef[e][i][o];
                    double[] dst = out[i][o];
                    for (int j = 0; j < POINTS; j++) {
                        dst[j] += b * src[j];
                    }
                }
            }
        }
        return out;
    }

    /**
     * Evaluates combined coefficients at z (inside [zMin, zMax]) for orders 0..order.
     *
     * @return false where this stretch has no expansion (the caller then uses the exact sum)
     */
    boolean evaluate(double[][][] combined, double z, int order, double[] out) {
        int i = Arrays.binarySearch(breaks, z);
        if (i < 0) {
            i = -i - 2;
        }
        i = Math.max(0, Math.min(i, breaks.length - 2));
        if (combined[i] == null) {
            return false;
        }
        double a = breaks[i], b = breaks[i + 1];
        double x = (2 * z - a - b) / (b - a);
        if (order == 2) {
            clenshaw3(combined[i], x, out);
            return true;
        }
        for (int o = 0; o <= order; o++) {
            out[o] = clenshaw(combined[i][o], x);
        }
        return true;
    }

    /**
     * Orders 0, 1 and 2 at once (what the paraxial ray equation asks at every step): the same Clenshaw
     * recurrence as {@link #clenshaw}, with the three independent chains interleaved so they overlap in
     * the processor instead of waiting on one another. Same operations in the same order per series, so
     * the results are identical to three separate calls.
     */
    private static void clenshaw3(double[][] c, double x, double[] out) {
        double[] c0 = c[0], c1 = c[1], c2 = c[2];
        double x2 = 2 * x;
        double p1 = 0, p2 = 0, q1 = 0, q2 = 0, s1 = 0, s2 = 0;
        for (int j = c0.length - 1; j >= 1; j--) {
            double tp = x2 * p1 - p2 + c0[j];
            double tq = x2 * q1 - q2 + c1[j];
            double ts = x2 * s1 - s2 + c2[j];
            p2 = p1;
            p1 = tp;
            q2 = q1;
            q1 = tq;
            s2 = s1;
            s1 = ts;
        }
        out[0] = x * p1 - p2 + c0[0];
        out[1] = x * q1 - q2 + c1[0];
        out[2] = x * s1 - s2 + c2[0];
    }
}
