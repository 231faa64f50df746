package org.axistack.trace;

import org.axistack.field.Field;
import org.axistack.model.Codata2018;

/** Test fixture: Coulomb field of a point charge q on the axis at zc (Coulomb's law). */
record PointChargeField(double charge_C, double zc_m) implements Field {

    @Override
    public double potential_V(double z_m, double r_m) {
        double k = charge_C / (4 * Math.PI * Codata2018.EPSILON0_F_PER_M);
        return k / Math.hypot(z_m - zc_m, r_m);
    }

    @Override
    public double evaluate(double z_m, double r_m, double[] out) {
        double k = charge_C / (4 * Math.PI * Codata2018.EPSILON0_F_PER_M);
        double d = Math.hypot(z_m - zc_m, r_m);
        double d3 = d * d * d;
        out[0] = k * (z_m - zc_m) / d3;
        out[1] = k * r_m / d3;
        return k / d;
    }
}
