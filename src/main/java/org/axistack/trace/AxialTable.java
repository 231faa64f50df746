package org.axistack.trace;

import org.axistack.field.AxialField;

/**
 * A tabulated axial potential for fast near-axis tracing: V and its derivatives to order 8 stored on
 * a uniform z grid and interpolated piecewise by Hermite polynomials (quintic for orders 0..6,
 * matching V^(k), V^(k+1), V^(k+2) at the nodes; cubic for order 7; linear for order 8; classical
 * Hermite interpolation, e.g. Burden and Faires, "Numerical Analysis", section 3.4). Outside the
 * grid the underlying field is called directly. The largest interpolation error of V and V' is
 * measured at build time against the underlying field at every interval midpoint and reported by
 * {@link #maxPotentialError_V()} and {@link #maxFieldError_V_per_m()}. Immutable and thread-safe.
 */
public final class AxialTable implements AxialField {

    private final AxialField source;
    private final double z0;
    private final double h;
    private final int n;
    private final double[][] nodes; // nodes[i][k] = V^(k)(z0 + i h)
    private final double maxPotentialError_V;
    private final double maxFieldError_V_per_m;

    /**
     * @param source underlying axial field
     * @param zMin_m left end of the grid, m
     * @param zMax_m right end of the grid, m
     * @param step_m node spacing, m (&gt; 0)
     */
    public AxialTable(AxialField source, double zMin_m, double zMax_m, double step_m) {
        if (!(zMax_m > zMin_m) || !(step_m > 0) || !Double.isFinite(zMax_m - zMin_m)) {
            throw new IllegalArgumentException("axial table needs z_max > z_min and a positive step");
        }
        int count = (int) Math.ceil((zMax_m - zMin_m) / step_m);
        if (count > 2_000_000) {
            throw new IllegalArgumentException("axial table step too small: " + count + " intervals");
        }
        this.source = source;
        this.n = Math.max(count, 1);
        this.z0 = zMin_m;
        this.h = (zMax_m - zMin_m) / n;
        this.nodes = new double[n + 1][AxialField.MAX_ORDER + 1];
        for (int i = 0; i <= n; i++) {
            source.axial(z0 + i * h, AxialField.MAX_ORDER, nodes[i]);
        }
        double ep = 0, ef = 0;
        double[] exact = new double[2], approx = new double[2];
        for (int i = 0; i < n; i++) {
            double z = z0 + (i + 0.5) * h;
            source.axial(z, 1, exact);
            axial(z, 1, approx);
            ep = Math.max(ep, Math.abs(exact[0] - approx[0]));
            ef = Math.max(ef, Math.abs(exact[1] - approx[1]));
        }
        this.maxPotentialError_V = ep;
        this.maxFieldError_V_per_m = ef;
    }

    /** Largest |V_table - V| found at the interval midpoints, V. */
    public double maxPotentialError_V() {
        return maxPotentialError_V;
    }

    /** Largest |V'_table - V'| found at the interval midpoints, V/m. */
    public double maxFieldError_V_per_m() {
        return maxFieldError_V_per_m;
    }

    @Override
    public void axial(double z_m, int order, double[] out) {
        double s = (z_m - z0) / h;
        if (!(s >= 0) || s > n) {
            source.axial(z_m, order, out);
            return;
        }
        int i = Math.min((int) s, n - 1);
        double t = s - i;
        double[] a = nodes[i], b = nodes[i + 1];
        double t2 = t * t, t3 = t2 * t, t4 = t3 * t, t5 = t4 * t;
        double h0 = 1 - 10 * t3 + 15 * t4 - 6 * t5;
        double h1 = t - 6 * t3 + 8 * t4 - 3 * t5;
        double h2 = 0.5 * (t2 - 3 * t3 + 3 * t4 - t5);
        double h5 = 10 * t3 - 15 * t4 + 6 * t5;
        double h4 = -4 * t3 + 7 * t4 - 3 * t5;
        double h3 = 0.5 * (t3 - 2 * t4 + t5);
        double hh = h * h;
        for (int k = 0; k <= order; k++) {
            if (k <= AxialField.MAX_ORDER - 2) {
                out[k] = a[k] * h0 + h * a[k + 1] * h1 + hh * a[k + 2] * h2 + b[k] * h5 + h * b[k + 1] * h4
                        + hh * b[k + 2] * h3;
            } else if (k == AxialField.MAX_ORDER - 1) {
                double c0 = 1 - 3 * t2 + 2 * t3, c1 = t - 2 * t2 + t3, c2 = 3 * t2 - 2 * t3, c3 = -t2 + t3;
                out[k] = a[k] * c0 + h * a[k + 1] * c1 + b[k] * c2 + h * b[k + 1] * c3;
            } else {
                out[k] = a[k] * (1 - t) + b[k] * t;
            }
        }
    }
}
