package org.axistack.trace;

import org.axistack.field.AxialField;
import org.axistack.field.Field;

/** Test fixture: a uniform field E_z = e0 everywhere, potential phi = phi0 - e0 z (textbook). */
public record UniformField(double phi0_V, double e0_V_per_m) implements Field, AxialField {

    @Override
    public double potential_V(double z_m, double r_m) {
        return phi0_V - e0_V_per_m * z_m;
    }

    @Override
    public double evaluate(double z_m, double r_m, double[] out) {
        out[0] = e0_V_per_m;
        out[1] = 0;
        return potential_V(z_m, r_m);
    }

    @Override
    public void axial(double z_m, int order, double[] out) {
        out[0] = potential_V(z_m, 0);
        if (order >= 1) {
            out[1] = -e0_V_per_m;
        }
        for (int k = 2; k <= order; k++) {
            out[k] = 0;
        }
    }
}
