package org.axistack.field;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;

import org.axistack.model.Electrode;
import org.axistack.model.MeshSettings;
import org.junit.jupiter.api.Test;

/** The fast axial expansion against the exact Legendre-form sum it was fitted to. */
class AxialExpansionTest {

    @Test
    void expansionMatchesExactSumEverywhere() {
        List<Electrode> es = List.of(new Electrode.Tube("in", 0, 0.004, -0.04, -0.003, 0),
                new Electrode.Aperture("stop", -1200, 0, 0.0015, 0.01, 0.0005),
                new Electrode.Tube("out", 300, 0.004, 0.003, 0.04, 0.001));
        FieldSolution s = BemSolver.solve(es, new MeshSettings(700, 10), SolveProgress.NONE);
        BiasedField f = s.withBiases(new double[] {0, -1200, 300});
        long t0 = System.nanoTime();
        double[] fast = new double[7];
        f.axial(0, 6, fast);
        System.out.printf("axial expansion built in %.3f s, max relative error %.2e%n", (System.nanoTime() - t0) * 1e-9,
                f.axialExpansionError());
        double[] exact = new double[7];
        double[] scale = new double[7];
        for (double z = -0.07; z <= 0.07; z += 0.0007) {
            f.exactAxial(z, 6, exact);
            for (int k = 0; k <= 6; k++) {
                scale[k] = Math.max(scale[k], Math.abs(exact[k]));
            }
        }
        for (double z = -0.0713; z <= 0.0713; z += 0.000331) {
            f.axial(z, 6, fast);
            f.exactAxial(z, 6, exact);
            for (int k = 0; k <= 6; k++) {
                assertThat(Math.abs(fast[k] - exact[k])).as("order %d at z=%g", k, z).isLessThan(1e-9 * scale[k]);
            }
        }
    }

    /**
     * A disk across the axis makes the axial derivatives jump at the disk: there the expansion gives way to the
     * exact sum, so the fast path still equals the exact one and stays quick to build.
     */
    @Test
    void diskAcrossTheAxisFallsBackToExactSums() {
        List<Electrode> es = List.of(new Electrode.Disk("plate", 100, 0, 0.01, 0.001),
                new Electrode.Aperture("hole", -50, 0.006, 0.002, 0.01, 0.0005));
        FieldSolution s = BemSolver.solve(es, new MeshSettings(400, 4), SolveProgress.NONE);
        BiasedField f = s.biased();
        double[] fast = new double[3];
        double[] exact = new double[3];
        long t0 = System.nanoTime();
        f.axial(0.003, 2, fast);
        double build = (System.nanoTime() - t0) * 1e-9;
        System.out.printf("disk on the axis: expansion built in %.2f s, %d intervals%n", build, f.axialExpansionIntervals());
        for (double z = -0.02; z <= 0.02; z += 0.00037) {
            f.axial(z, 2, fast);
            f.exactAxial(z, 2, exact);
            for (int k = 0; k <= 2; k++) {
                assertThat(Math.abs(fast[k] - exact[k])).as("order %d at z=%g", k, z)
                        .isLessThanOrEqualTo(1e-8 * (Math.abs(exact[k]) + 100 / Math.pow(0.002, k)));
            }
        }
        // inside the solid plate the potential is the plate's bias
        assertThat(f.axialPotential_V(0.0)).isCloseTo(100.0, org.assertj.core.data.Offset.offset(1e-6 * 100));
    }
}
