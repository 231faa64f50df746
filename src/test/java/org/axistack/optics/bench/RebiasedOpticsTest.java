package org.axistack.optics.bench;

import static org.assertj.core.api.Assertions.assertThat;

import org.axistack.optics.CardinalElements;
import org.axistack.optics.ParaxialOptics;
import org.junit.jupiter.api.Test;

/**
 * The fast path of the benchmark gives the same optics as the direct boundary-element field: superposed unit
 * tables against the biased BEM field evaluated directly (superposition is exact; the only difference is the
 * Hermite interpolation, measured at build time).
 */
class RebiasedOpticsTest {

    @Test
    void tabulatedSuperpositionMatchesDirectField() {
        DemoEinzel demo = new DemoEinzel();
        double[] biases = {0, 1700, 0};
        CardinalElements fast = ParaxialOptics.of(demo.units.withBiases(biases), demo.stack).cardinal();
        CardinalElements direct = ParaxialOptics.of(demo.solution.withBiases(biases), demo.stack).cardinal();
        System.out.printf("demo einzel: f2 %.6f mm (direct %.6f mm), table error %.2e V, plane sensitivity %.2e%n",
                fast.focalLengthImage_m() * 1e3, direct.focalLengthImage_m() * 1e3, demo.maxTableError_V,
                fast.planeSensitivity());
        assertThat(fast.converging()).isTrue();
        assertThat(Math.abs(fast.focalLengthImage_m() / direct.focalLengthImage_m() - 1)).isLessThan(1e-8);
        assertThat(Math.abs(fast.focalPointImageZ_m() - direct.focalPointImageZ_m()))
                .isLessThan(1e-8 * fast.focalLengthImage_m());
        long t0 = System.nanoTime();
        int n = 20;
        for (int i = 0; i < n; i++) {
            ParaxialOptics.of(demo.units.withBiases(new double[] {0, 1600 + i, 0}), demo.stack).cardinal();
        }
        System.out.printf("mean time per new bias set (informative, not asserted): %.2f ms%n",
                (System.nanoTime() - t0) / 1e6 / n);
    }
}
