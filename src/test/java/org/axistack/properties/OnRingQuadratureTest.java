package org.axistack.properties;

import static org.assertj.core.api.Assertions.assertThat;

import org.axistack.field.BiasedField;
import org.axistack.field.FieldSolution;
import org.axistack.io.StackReader;
import org.axistack.mesh.Panel;
import org.axistack.model.Stack;
import org.axistack.model.ZR;
import org.junit.jupiter.api.Test;

/**
 * Regression: the surface potential of a thin tube within nanometres of its edge. Found by
 * {@link FieldInvariantProperties} (seed 3496676065718465733): a sub-point of the near-panel quadrature rounded
 * onto the target, the ring kernel's elliptic integral with m1 = 0 returned about 1e12, and the potential
 * 13 nm from the tube's end read -438 V instead of the tube's 0 V (the largest bias being 832 V). The
 * boundary condition is the reference: the potential on a conductor equals its bias.
 */
class OnRingQuadratureTest {

    static final String STACK = String.join("\n",
            "[beam]", "particle = \"ion\"", "mass_u = 4.0026", "charge_state = 2", "energy_eV = 35793.76",
            "[[electrode]]", "name = \"e0\"", "shape = \"tube\"", "bias_V = 0.0", "radius_mm = 1.5",
            "z_start_mm = 0.0", "z_end_mm = 25.0",
            "[[electrode]]", "name = \"e1\"", "shape = \"disk\"", "bias_V = 676.502", "z_mm = 26.0", "radius_mm = 4.409",
            "[[electrode]]", "name = \"e2\"", "shape = \"aperture\"", "bias_V = -110.961", "z_mm = 27.609",
            "hole_radius_mm = 1.529", "outer_radius_mm = 4.206",
            "[[electrode]]", "name = \"e3\"", "shape = \"ring\"", "bias_V = 832.205", "z_mm = 32.7816666666667",
            "radius_mm = 2.37566666666667", "wire_radius_mm = 0.195666666666667",
            "[[electrode]]", "name = \"e4\"", "shape = \"tube\"", "bias_V = 55.48", "radius_mm = 1.615",
            "z_start_mm = 33.6243333333333", "z_end_mm = 34.6963333333333",
            "[mesh]", "target_elements = 200", "edge_levels = 3", "");

    @Test
    void potentialNanometresFromATubeEdgeIsTheTubeBias() throws Exception {
        Stack s = StackReader.parse(STACK, "regression.toml");
        FieldSolution sol = Lens.solve(s);
        BiasedField f = sol.biased();
        int checked = 0;
        for (Panel p : sol.mesh().panels()) {
            if (p.electrode() != 0 || p.singularEnd() == 0) {
                continue;
            }
            for (double tau : new double[] {0.9, 0.99, 0.995, 0.999}) {
                double t = p.singularEnd() > 0 ? tau : 1 - tau;
                ZR q = p.at(t);
                assertThat(Math.abs(f.potential_V(q.z_m(), q.r_m()))).as("at %s", q).isLessThan(1e-6);
                checked++;
            }
        }
        assertThat(checked).isEqualTo(8);
    }
}
