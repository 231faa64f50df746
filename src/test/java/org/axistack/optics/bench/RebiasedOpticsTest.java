package org.axistack.optics.bench;

import static org.assertj.core.api.Assertions.assertThat;

import org.axistack.field.AxialField;
import org.axistack.field.BiasedField;
import org.axistack.optics.CardinalElements;
import org.axistack.optics.ParaxialOptics;
import org.junit.jupiter.api.Test;

/**
 * The fast path of the benchmark gives the same optics as the exact boundary-element sums: the re-biased field's
 * axial Chebyshev expansion against the exact Legendre-form sum over the surface-charge rings.
 */
class RebiasedOpticsTest {

    @Test
    void tabulatedSuperpositionMatchesDirectField() {
        DemoEinzel demo = new DemoEinzel();
        double[] biases = {0, 1700, 0};
        BiasedField field = demo.solution.withBiases(biases);
        CardinalElements fast = ParaxialOptics.of(field, demo.stack).cardinal();
        AxialField exact = field::exactAxial;
        CardinalElements direct = ParaxialOptics.of(exact, demo.stack).cardinal();
        System.out.printf("demo einzel: f2 %.6f mm (exact sums %.6f mm), expansion error %.2e, plane sensitivity %.2e%n",
                fast.focalLengthImage_m() * 1e3, direct.focalLengthImage_m() * 1e3, field.axialExpansionError(),
                fast.planeSensitivity());
        assertThat(fast.converging()).isTrue();
        assertThat(Math.abs(fast.focalLengthImage_m() / direct.focalLengthImage_m() - 1)).isLessThan(1e-8);
        assertThat(Math.abs(fast.focalPointImageZ_m() - direct.focalPointImageZ_m()))
                .isLessThan(1e-8 * fast.focalLengthImage_m());
        long t0 = System.nanoTime();
        int n = 20;
        for (int i = 0; i < n; i++) {
            ParaxialOptics.of(demo.solution.withBiases(new double[] {0, 1600 + i, 0}), demo.stack).cardinal();
        }
        System.out.printf("mean time per new bias set (informative, not asserted): %.2f ms%n",
                (System.nanoTime() - t0) / 1e6 / n);
    }
}
