package org.axistack.size;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.List;
import java.util.OptionalDouble;

import org.axistack.field.SolveProgress;
import org.axistack.model.Beam;
import org.axistack.model.Particle;
import org.junit.jupiter.api.Test;

/**
 * The focusing conditions other than object-to-image: a focal length (solved by {@link ScanFocusFinder}, which the
 * tuner does not pose) and a parallel beam focused on a plane (through the tuner), each on one immersion geometry.
 * The found design must have the asked-for f2 or focal point, as the paraxial optics define them.
 */
class FocusConditionTest {

    static Requirements immersion(OptionalDouble image, OptionalDouble focal) {
        return new Requirements("immersion", new Beam(Particle.electron(), 500), OptionalDouble.empty(), image, focal,
                0.002, 0.2, 6000, 1e7, Family.IMMERSION_TUBES,
                List.of(new Parameter("bore_radius", 0.004, 0.004), new Parameter("gap", 0.002, 0.002),
                        new Parameter("tube_length", 0.03, 0.03), new Parameter("wall", 0.001, 0.001)),
                Objective.SPHERICAL, new SearchSettings(4, 150, 150, 16, 1));
    }

    @Test
    void aFocalLengthIsMetByEveryBiasFound() {
        Requirements r = immersion(OptionalDouble.empty(), OptionalDouble.of(0.05));
        DesignEvaluator.Candidate c = new DesignEvaluator(r, new TunerFocusFinder(12))
                .evaluate(new double[] {0.004, 0.002, 0.03, 0.001}, 150, SolveProgress.NONE);
        assertThat(c.designs()).isNotEmpty();
        for (Design d : c.designs()) {
            // the residual is solved to ~1e-13; 1e-6 of f leaves room for the re-evaluation of the optics
            assertThat(d.focalLength_m()).isCloseTo(0.05, within(5e-8));
        }
    }

    /** Returning false from the progress callback stops the search with a CancellationException. */
    @Test
    void theSearchCanBeCancelled() {
        Requirements r = immersion(OptionalDouble.of(0.08), OptionalDouble.empty());
        List<Parameter> varied = List.of(new Parameter("bore_radius", 0.003, 0.005), new Parameter("gap", 0.002, 0.002),
                new Parameter("tube_length", 0.03, 0.03), new Parameter("wall", 0.001, 0.001));
        Requirements v = new Requirements(r.title(), r.beam(), r.objectZ_m(), r.imageZ_m(), r.focalLength_m(),
                r.minBore_m(), r.maxLength_m(), r.maxBias_V(), r.maxSurfaceField_V_per_m(), r.family(), varied,
                r.objective(), new SearchSettings(20, 100, 100, 16, 1));
        int[] calls = {0};
        assertThatThrownBy(() -> SizingStudy.run(v, new TunerFocusFinder(8), (stage, done, budget, best) -> ++calls[0] < 2))
                .isInstanceOf(java.util.concurrent.CancellationException.class);
        assertThat(calls[0]).isEqualTo(2);
    }

    @Test
    void aParallelBeamIsFocusedOnThePlane() {
        Requirements r = immersion(OptionalDouble.of(0.08), OptionalDouble.empty());
        DesignEvaluator.Candidate c = new DesignEvaluator(r, new TunerFocusFinder(12))
                .evaluate(new double[] {0.004, 0.002, 0.03, 0.001}, 150, SolveProgress.NONE);
        assertThat(c.designs()).isNotEmpty();
        for (Design d : c.designs()) {
            assertThat(d.imageZ_m()).isCloseTo(0.08, within(1e-6));
            assertThat(d.spherical_m()).isPositive(); // Scherzer's theorem
        }
    }
}
