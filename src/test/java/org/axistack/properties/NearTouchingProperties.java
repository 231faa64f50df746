package org.axistack.properties;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;

import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import org.axistack.field.BemSolver;
import org.axistack.field.CapacitanceCheck;
import org.axistack.field.FieldSolution;
import org.axistack.field.SolveException;
import org.axistack.field.SolveProgress;
import org.axistack.model.GeometryCheck;
import org.axistack.model.MeshSettings;
import org.axistack.model.Particle;
import org.axistack.model.Stack;

/**
 * Near-touching electrodes (issue 24, item 5): random stacks of every shape whose gaps are 1 to 100 micrometres,
 * above the touching limit but far below the panels. Reciprocity and the sign law (J. D. Jackson, Classical
 * Electrodynamics, 3rd ed., sec. 1.13 and problem 1.12) must hold on the solved capacitance matrix, as must
 * convergence: the gap-aware refinement of the mesher is what makes them hold (without it, at 600 unknowns the
 * first 30 stacks of one seed reached asymmetries of 0.6 and positive mutual capacitances of 0.2 of
 * sqrt(C_ii C_jj); with it, 1.6e-5 at worst over 150 stacks, 1e-9 typically).
 */
class NearTouchingProperties {

    /** Element budget: coarse on purpose (panels a millimetre long against micrometre gaps). */
    static final MeshSettings MESH = new MeshSettings(600, 4);

    @Provide
    Arbitrary<Stack> nearTouching() {
        Arbitrary<RandomStacks.Spec> spec = Combinators.combine(Arbitraries.of(RandomStacks.Shape.class),
                Arbitraries.doubles().between(1, 25), Arbitraries.doubles().between(2.5, 12),
                Arbitraries.doubles().between(2, 15),
                Arbitraries.oneOf(Arbitraries.just(0.0), Arbitraries.doubles().between(0.2, 3)),
                Arbitraries.doubles().between(-3, -1).map(e -> Math.pow(10, e)), // gap 1 um .. 100 um, in mm
                Arbitraries.doubles().between(-0.5, 0.5)).as(RandomStacks.Spec::new);
        return spec.list().ofMinSize(2).ofMaxSize(3)
                .map(l -> RandomStacks.build(l, Particle.electron(), 1000).withMesh(MESH))
                .filter(s -> GeometryCheck.check(s.electrodes()).isEmpty());
    }

    /**
     * The matrix is symmetric to 1e-4 of sqrt(C_ii C_jj) with no positive mutual term, or the solve is refused
     * with a message naming the pair; anything above 1e-6 is flagged. A refusal must stay rare: it is counted and
     * failed if it happens here (none in 150 measured stacks).
     */
    @Property(seed = "20261205")
    void capacitanceMatrixKeepsReciprocityAndSigns(@ForAll("nearTouching") Stack s) {
        FieldSolution sol;
        try {
            sol = BemSolver.solve(s.electrodes(), s.mesh(), SolveProgress.NONE);
        } catch (SolveException e) {
            throw new AssertionError("refused a near-touching stack the refinement should handle: " + e.getMessage(), e);
        }
        CapacitanceCheck c = sol.capacitanceCheck();
        assertThat(c.refused()).isFalse();
        assertThat(c.offDiagonal()).as("largest mutual capacitance / sqrt(C_ii C_jj)").isLessThanOrEqualTo(1e-6);
        assertThat(c.asymmetry()).as("asymmetry").isLessThan(1e-4);
        assertThat(c.warned()).isEqualTo(c.asymmetry() > CapacitanceCheck.WARN_ASYMMETRY);
        if (c.warned()) {
            assertThat(c.message(s.electrodes())).contains(s.electrodes().get(c.first()).name(),
                    s.electrodes().get(c.second()).name(), "micrometres", "target_elements");
        }
    }

    /**
     * Convergence: the mutual capacitance across the narrowest gap settles when the mesh is refined (target
     * doubled): within 1e-3 of the diagonal scale. Common practice, no source: refinement is the check of a
     * discretisation.
     */
    @Property(seed = "20261206", tries = 3)
    void narrowGapCapacitanceSettlesUnderRefinement(@ForAll("nearTouching") Stack s) {
        double[][] coarse = BemSolver.solve(s.electrodes(), s.mesh(), SolveProgress.NONE).capacitanceMatrix_F();
        List<org.axistack.model.Electrode> es = s.electrodes();
        double[][] fine = BemSolver.solve(es, new MeshSettings(2 * MESH.targetElements(), MESH.edgeLevels()),
                SolveProgress.NONE).capacitanceMatrix_F();
        for (int i = 0; i < coarse.length; i++) {
            for (int j = 0; j < coarse.length; j++) {
                double scale = Math.sqrt(fine[i][i] * fine[j][j]);
                assertThat(Math.abs(coarse[i][j] - fine[i][j]) / scale).as("C[%d][%d]", i, j).isLessThan(1e-3);
            }
        }
    }
}
