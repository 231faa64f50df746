package org.axistack.field;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;

import org.axistack.model.Electrode;
import org.axistack.model.MeshSettings;
import org.junit.jupiter.api.Test;

/**
 * The capacitance-matrix check against reciprocity and the sign law (J. D. Jackson, Classical Electrodynamics,
 * 3rd ed., sec. 1.13): hand-made matrices for the policy, a solved pair for the path through the solver.
 */
class CapacitanceCheckTest {

    private static final List<Electrode> PAIR = List.of(new Electrode.Tube("left", 0, 5e-3, -20e-3, -0.5e-3, 1e-3),
            new Electrode.Tube("right", 100, 5e-3, 0.5e-3, 20e-3, 1e-3));

    @Test
    void aSoundMatrixIsNeitherWarnedNorRefused() {
        CapacitanceCheck c = CapacitanceCheck.of(new double[][] {{2e-12, -1e-12}, {-1e-12, 3e-12}});
        assertThat(c.warned()).isFalse();
        assertThat(c.refused()).isFalse();
        assertThat(c.offDiagonal()).isCloseTo(-1 / Math.sqrt(6), org.assertj.core.data.Offset.offset(1e-15));
        assertThat(c.message(PAIR)).isEmpty();
    }

    @Test
    void aSmallAsymmetryIsWarnedWithThePairTheGapAndTheFix() {
        CapacitanceCheck c = CapacitanceCheck.of(new double[][] {{1e-12, -0.5e-12}, {-0.50001e-12, 1e-12}});
        assertThat(c.asymmetry()).isCloseTo(1e-5, org.assertj.core.data.Offset.offset(1e-9));
        assertThat(c.warned()).isTrue();
        assertThat(c.refused()).isFalse();
        assertThat(c.message(PAIR)).contains("'left'", "'right'", "1000 micrometres", "target_elements",
                "less accurate");
    }

    @Test
    void aPositiveMutualTermOrALargeAsymmetryIsRefused() {
        CapacitanceCheck positive = CapacitanceCheck.of(new double[][] {{1e-12, 0.2e-12}, {0.2e-12, 1e-12}});
        assertThat(positive.refused()).isTrue();
        assertThat(positive.message(PAIR)).contains("positive mutual capacitance", "'left'", "'right'");
        CapacitanceCheck skew = CapacitanceCheck.of(new double[][] {{1e-12, -0.5e-12}, {-0.4e-12, 1e-12}});
        assertThat(skew.refused()).isTrue();
        assertThat(skew.message(PAIR)).contains("not to be trusted");
    }

    @Test
    void aSingleElectrodeHasNothingToCheck() {
        CapacitanceCheck c = CapacitanceCheck.of(new double[][] {{1e-12}});
        assertThat(c.warned()).isFalse();
        assertThat(c.message(PAIR.subList(0, 1))).isEmpty();
    }

    /** The solver runs the check on what it returns: a sound pair of tubes passes it (1e-9 typically). */
    @Test
    void theSolverChecksWhatItReturns() {
        FieldSolution s = BemSolver.solve(PAIR, new MeshSettings(400, 4), SolveProgress.NONE);
        assertThat(s.capacitanceCheck().warned()).isFalse();
        assertThat(s.capacitanceCheck().asymmetry()).isLessThan(1e-6);
    }

    /**
     * A wire ring 10 micrometres above a thin disk on a mesh of 64 unknowns (a few panels against a gap four orders of
     * magnitude smaller; the first case a random search found): without the mesher's gap-aware refinement the solve
     * returned a matrix 1.5e-3 from symmetric and the solver refused it; with it the matrix is sound.
     */
    @Test
    void aNearTouchingPairOnACoarseMeshKeepsReciprocity() {
        List<Electrode> pair = List.of(new Electrode.Disk("plate", -376.329, 0, 0.021962211744800255, 0),
                new Electrode.Ring("wire", -426.974, 4.252898122532431e-4, 0.0031819864937343294, 4.148429506982405e-4));
        CapacitanceCheck c = BemSolver.solve(pair, new MeshSettings(64, 4), SolveProgress.NONE).capacitanceCheck();
        assertThat(c.warned()).isFalse();
        assertThat(c.offDiagonal()).isNegative();
    }
}
