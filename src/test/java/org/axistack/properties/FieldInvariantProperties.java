package org.axistack.properties;

import static org.assertj.core.api.Assertions.assertThat;

import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import org.axistack.field.BiasedField;
import org.axistack.field.FieldSolution;
import org.axistack.mesh.BoundaryMesh;
import org.axistack.mesh.Panel;
import org.axistack.model.Stack;
import org.axistack.model.ZR;

/**
 * Invariants of electrostatics that every boundary-element solution must keep, on random stacks of every
 * shape (disks included), one solve per try. Seeds are printed by jqwik on failure; rerun one with
 * {@code @Property(seed = "...")}.
 */
class FieldInvariantProperties {

    /**
     * Largest deviation of the surface potential between collocation nodes from the electrode's bias, as a
     * fraction of the largest |bias|, for the small property-test meshes (about 200 unknowns). Measured: below
     * 1e-5 on most stacks; the worst seen, 7e-3, was a 4.6 mm panel facing another electrode across a 0.5 mm
     * gap (the same stack at 400 unknowns: 1.4e-7). The mesher refines toward edges, not toward close
     * neighbours across a face, so coarse meshes of tight stacks are the weak case.
     */
    static final double SURFACE_TOLERANCE = 1e-2;

    @Provide
    Arbitrary<Stack> anyStack() {
        return RandomStacks.stacks(true, 1.5);
    }

    /**
     * The solve satisfies its collocation equations (residual per volt of bias below 1e-9), and the
     * potential on every panel, midway between its nodes and at both ends, equals the electrode's bias
     * (the boundary condition, checked where it was not imposed).
     */
    @Property(seed = "20261201")
    void boundaryConditionHoldsBetweenNodes(@ForAll("anyStack") Stack s) {
        FieldSolution sol = Lens.solve(s);
        assertThat(sol.residual()).isLessThan(1e-9);
        BiasedField f = sol.biased();
        BoundaryMesh mesh = sol.mesh();
        double[] tau = mesh.nodeTau();
        double scale = 0;
        for (double b : s.biases_V()) {
            scale = Math.max(scale, Math.abs(b));
        }
        for (Panel p : mesh.panels()) {
            double bias = s.electrodes().get(p.electrode()).bias_V();
            double[] between = new double[tau.length + 1];
            between[0] = tau[0] / 2;
            for (int j = 1; j < tau.length; j++) {
                between[j] = (tau[j - 1] + tau[j]) / 2;
            }
            between[tau.length] = (1 + tau[tau.length - 1]) / 2;
            for (double t : between) {
                ZR q = p.at(t);
                double phi = f.potential_V(q.z_m(), q.r_m());
                assertThat(Math.abs(phi - bias)).as("potential at %s on %s (bias %s V)", q,
                        s.electrodes().get(p.electrode()).name(), bias).isLessThanOrEqualTo(SURFACE_TOLERANCE * scale + 1e-9);
            }
        }
    }

    /**
     * Reciprocity (Green's reciprocity theorem; J. D. Jackson, Classical Electrodynamics, 3rd ed., problem
     * 1.12, and the properties of capacitance coefficients in sec. 1.13): the capacitance matrix is symmetric,
     * its diagonal positive and its off-diagonal entries negative (a conductor at 0 V takes charge of the
     * opposite sign from a neighbour at +1 V). Symmetry is not imposed by the collocation method, so it
     * measures the discretisation: held to 1e-3 of sqrt(C_ii C_jj) at these small meshes (measured: about
     * 1e-9 typically, 1.6e-5 at worst over the first hundred random stacks).
     */
    @Property(seed = "20261201")
    void capacitanceMatrixIsSymmetricWithTheRightSigns(@ForAll("anyStack") Stack s) {
        double[][] c = Lens.solve(s).capacitanceMatrix_F();
        double worst = 0;
        for (int i = 0; i < c.length; i++) {
            assertThat(c[i][i]).as("C[%d][%d]", i, i).isPositive();
            for (int j = 0; j < c.length; j++) {
                if (i != j) {
                    assertThat(c[i][j]).as("C[%d][%d]", i, j).isNegative();
                    double rel = Math.abs(c[i][j] - c[j][i]) / Math.sqrt(c[i][i] * c[j][j]);
                    worst = Math.max(worst, rel);
                }
            }
        }
        assertThat(worst).isLessThan(1e-3);
    }
}
