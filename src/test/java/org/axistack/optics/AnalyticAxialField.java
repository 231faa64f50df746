package org.axistack.optics;

import java.util.function.Function;

import org.axistack.field.AxialField;
import org.hipparchus.analysis.differentiation.DSFactory;
import org.hipparchus.analysis.differentiation.DerivativeStructure;

/**
 * Test-tree axial potentials given in closed form; derivatives up to order 8 by exact automatic
 * differentiation (Hipparchus DerivativeStructure), so no finite differences enter the checks.
 */
final class AnalyticAxialField implements AxialField {

    private static final DSFactory[] FACTORIES = new DSFactory[MAX_ORDER + 1];

    static {
        for (int k = 0; k <= MAX_ORDER; k++) {
            FACTORIES[k] = new DSFactory(1, k);
        }
    }

    private final Function<DerivativeStructure, DerivativeStructure> v;

    AnalyticAxialField(Function<DerivativeStructure, DerivativeStructure> v) {
        this.v = v;
    }

    @Override
    public void axial(double z_m, int order, double[] out) {
        DerivativeStructure r = v.apply(FACTORIES[order].variable(0, z_m));
        for (int k = 0; k <= order; k++) {
            out[k] = r.getPartialDerivative(k);
        }
    }

    /** V(z) = slope * z: a uniform field E_z = -slope. */
    static AnalyticAxialField uniform(double slope_V_per_m) {
        return new AnalyticAxialField(z -> z.multiply(slope_V_per_m));
    }

    /** V(z) = peak * exp(-z^2/w^2): an einzel-like bump (potential harmonic off axis through its series). */
    static AnalyticAxialField gaussian(double peak_V, double width_m) {
        return new AnalyticAxialField(z -> z.divide(width_m).square().negate().exp().multiply(peak_V));
    }

    /** V(z) = v1 + (v2 - v1)(1 + tanh(z/w))/2: an immersion lens with exponentially decaying ends. */
    static AnalyticAxialField tanhStep(double v1_V, double v2_V, double width_m) {
        return new AnalyticAxialField(z -> z.divide(width_m).tanh().add(1).multiply(0.5 * (v2_V - v1_V)).add(v1_V));
    }

    /**
     * Circular hole of radius a in a thin conducting plane at potential v0 separating uniform fields with
     * axial potential slopes s1 (left) and s2 (right): V(z) = v0 + (s1 + s2) z/2 + (s2 - s1)(a + z atan(z/a))/pi
     * (classical solution for a hole in a conducting sheet: J. D. Jackson, Classical Electrodynamics, 3rd ed.,
     * section 3.13, cited from memory; its asymptotes are v0 + s1 z and v0 + s2 z).
     */
    static AnalyticAxialField aperture(double v0_V, double s1_V_per_m, double s2_V_per_m, double a_m) {
        return new AnalyticAxialField(z -> z.multiply(0.5 * (s1_V_per_m + s2_V_per_m))
                .add(z.multiply(z.divide(a_m).atan()).add(a_m).multiply((s2_V_per_m - s1_V_per_m) / Math.PI))
                .add(v0_V));
    }
}
