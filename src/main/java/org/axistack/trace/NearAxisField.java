package org.axistack.trace;

import org.axistack.field.AxialField;
import org.axistack.field.Field;
import org.axistack.field.NearAxisSeries;

/**
 * The field near the axis from the axial potential and its derivatives, by the classical power
 * series of an axially symmetric harmonic potential, phi(r, z) = sum_n (-1)^n (r/2)^(2n) / (n!)^2
 * V^(2n)(z) (e.g. Hawkes and Kasper, "Principles of Electron Optics", vol. 1, ch. 7). The series is
 * kept to V^(6) (terms to r^6); E = -grad phi is the exact gradient of that truncated potential, so
 * the truncated field is conservative and energy along a ray is conserved to the integrator's
 * accuracy. The first omitted term, (r/2)^8 / (4!)^2 V^(8), is the error estimate
 * {@link #truncationEstimate_V}. Immutable; thread-safe if the axial field is.
 */
public final class NearAxisField implements Field {

    /** Derivative order the series needs from the axial field (V^(7) for E_z, V^(8) for the estimate). */
    public static final int ORDER = 8;

    private final AxialField axial;

    public NearAxisField(AxialField axial) {
        if (axial == null) {
            throw new IllegalArgumentException("the near-axis field needs an axial field");
        }
        this.axial = axial;
    }

    @Override
    public double potential_V(double z_m, double r_m) {
        double[] v = new double[ORDER + 1];
        axial.axial(z_m, ORDER, v);
        return series(v, r_m, null);
    }

    @Override
    public double evaluate(double z_m, double r_m, double[] fieldOut) {
        double[] v = new double[ORDER + 1];
        axial.axial(z_m, ORDER, v);
        return series(v, r_m, fieldOut);
    }

    /**
     * Potential (and field if fieldOut is not null) at radius r from the axial derivatives v[0..7].
     */
    static double series(double[] v, double r, double[] fieldOut) {
        return NearAxisSeries.evaluate(v, 4, r, fieldOut == null ? new double[2] : fieldOut);
    }

    /** Magnitude of the first omitted potential term, (r/2)^8 / 576 |V^(8)|, V. */
    static double truncationEstimate_V(double[] v, double r) {
        double r2 = r * r;
        double r8 = r2 * r2 * r2 * r2;
        return r8 / 147456.0 * Math.abs(v[8]);
    }
}
