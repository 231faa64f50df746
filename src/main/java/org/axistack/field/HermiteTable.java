package org.axistack.field;

/**
 * A smooth function of z tabulated with its first two derivatives on a uniform grid and interpolated by quintic
 * Hermite polynomials (matching the value and both derivatives at each node; classical Hermite interpolation,
 * e.g. R. L. Burden and J. D. Faires, Numerical Analysis, section 3.4), with the step halved until the largest
 * difference from the function at the interval midpoints is at most a given fraction of the largest |value| on
 * the grid (the measured error is kept). Outside the grid the function is called directly. The nodes are evaluated
 * in parallel (the source must be thread-safe). Immutable.
 */
final class HermiteTable {

    /** The function: out[0..2] = f, f', f'' at z; called from several threads. */
    interface Source {
        void at(double z, double[] out);
    }

    private final Source source;
    private final double z0;
    private final double h;
    private final int n;
    private final double[] f;
    private final double[] d1;
    private final double[] d2;
    private final double error;

    private HermiteTable(Source source, double z0, double h, int n, double[] f, double[] d1, double[] d2,
            double error) {
        this.source = source;
        this.z0 = z0;
        this.h = h;
        this.n = n;
        this.f = f;
        this.d1 = d1;
        this.d2 = d2;
        this.error = error;
    }

    /**
     * Tabulates on [from, to] starting with the given step, halving it (at most {@code halvings} times) until the
     * midpoint error is within {@code relTol} of the peak; the last table is kept even if it misses (its
     * {@link #relativeError()} says so).
     */
    static HermiteTable of(Source source, double from, double to, double step, double relTol, int halvings) {
        if (!(to > from) || !(step > 0)) {
            throw new IllegalArgumentException("table needs from < to and a positive step");
        }
        int n = Math.max(2, (int) Math.ceil((to - from) / step));
        double[][] nodes = nodes(source, from, to, n);
        HermiteTable t = null;
        for (int k = 0; k <= halvings; k++) {
            double h = (to - from) / n;
            double peak = 0;
            for (double v : nodes[0]) {
                peak = Math.max(peak, Math.abs(v));
            }
            HermiteTable cand = new HermiteTable(source, from, h, n, nodes[0], nodes[1], nodes[2], 0);
            // the midpoints are the next grid's odd nodes: reuse them if the step must be halved
            double[][] mids = new double[3][n];
            int count = n;
            java.util.stream.IntStream.range(0, count).parallel().forEach(i -> {
                double[] o = new double[3];
                source.at(from + (i + 0.5) * h, o);
                mids[0][i] = o[0];
                mids[1][i] = o[1];
                mids[2][i] = o[2];
            });
            double worst = 0;
            for (int i = 0; i < n; i++) {
                worst = Math.max(worst, Math.abs(cand.value(from + (i + 0.5) * h) - mids[0][i]));
            }
            double rel = peak > 0 ? worst / peak : 0;
            t = new HermiteTable(source, from, h, n, nodes[0], nodes[1], nodes[2], rel);
            if (rel <= relTol || k == halvings) {
                break;
            }
            double[][] finer = new double[3][2 * n + 1];
            for (int c = 0; c < 3; c++) {
                for (int i = 0; i <= n; i++) {
                    finer[c][2 * i] = nodes[c][i];
                }
                for (int i = 0; i < n; i++) {
                    finer[c][2 * i + 1] = mids[c][i];
                }
            }
            nodes = finer;
            n *= 2;
        }
        return t;
    }

    private static double[][] nodes(Source source, double from, double to, int n) {
        double[][] v = new double[3][n + 1];
        double h = (to - from) / n;
        java.util.stream.IntStream.rangeClosed(0, n).parallel().forEach(i -> {
            double[] o = new double[3];
            source.at(from + i * h, o);
            v[0][i] = o[0];
            v[1][i] = o[1];
            v[2][i] = o[2];
        });
        return v;
    }

    /** Largest midpoint error found, relative to the largest |value| on the grid. */
    double relativeError() {
        return error;
    }

    /** Number of intervals. */
    int intervals() {
        return n;
    }

    /** The interpolated value at z (the function itself outside the grid). */
    double value(double z) {
        double s = (z - z0) / h;
        if (!(s >= 0 && s <= n)) {
            double[] out = new double[3];
            source.at(z, out);
            return out[0];
        }
        int i = Math.min((int) s, n - 1);
        double t = s - i;
        double t2 = t * t;
        double t3 = t2 * t;
        double t4 = t3 * t;
        double t5 = t4 * t;
        double h00 = 1 - 10 * t3 + 15 * t4 - 6 * t5;
        double h01 = 10 * t3 - 15 * t4 + 6 * t5;
        double h10 = t - 6 * t3 + 8 * t4 - 3 * t5;
        double h11 = -4 * t3 + 7 * t4 - 3 * t5;
        double h20 = 0.5 * (t2 - 3 * t3 + 3 * t4 - t5);
        double h21 = 0.5 * (t3 - 2 * t4 + t5);
        return f[i] * h00 + f[i + 1] * h01 + h * (d1[i] * h10 + d1[i + 1] * h11)
                + h * h * (d2[i] * h20 + d2[i + 1] * h21);
    }
}
