package org.axistack.tune;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;
import java.util.OptionalDouble;
import java.util.concurrent.CancellationException;

import org.assertj.core.api.Assertions;
import org.axistack.optics.Aberrations;
import org.axistack.optics.CardinalElements;
import org.axistack.optics.ParaxialOptics;
import org.junit.jupiter.api.Test;

/**
 * Issue 6: a parallel sweep gives, at sampled points, the same numbers as direct optics computations at those
 * biases (fresh re-biased field, cardinal elements, imaging, aberration integrals) to round-off; reflection is
 * reported per point; cancelling stops it.
 */
class BiasSweepTest {

    @Test
    void sampledPointsEqualDirectOptics() {
        OptionalDouble object = OptionalDouble.of(-0.06);
        List<SweepPoint> pts = BiasSweep.run(SolvedDemo.SOLUTION, SolvedDemo.STACK, "focus", -300, 300, 60, object,
                BiasSweep.Progress.NONE);
        assertThat(pts).hasSize(61);
        assertThat(pts.get(0).status()).isEqualTo("reflected");
        int checked = 0;
        for (int i : new int[] {17, 30, 45, 60}) {
            SweepPoint p = pts.get(i);
            double[] b = SolvedDemo.STACK.biases_V();
            b[1] = p.bias_V();
            ParaxialOptics o = ParaxialOptics.of(SolvedDemo.SOLUTION.withBiases(b), SolvedDemo.STACK);
            CardinalElements c = o.cardinal();
            if (c.kind() == CardinalElements.Kind.AFOCAL) {
                assertThat(p.focalLengthImage_m()).isInfinite();
                continue;
            }
            Aberrations ab = o.aberrations(-0.06);
            close(p.focalLengthImage_m(), c.focalLengthImage_m());
            close(p.focalLengthObject_m(), c.focalLengthObject_m());
            close(p.focalPointImageZ_m(), c.focalPointImageZ_m());
            close(p.principalPlaneObjectZ_m(), c.principalPlaneObjectZ_m());
            close(p.imageZ_m(), o.imaging(-0.06).imageZ_m());
            close(p.magnification(), o.imaging(-0.06).lateralMagnification());
            close(p.sphericalAberration_m(), ab.sphericalImage_m());
            close(p.chromaticAberration_m(), ab.chromaticImage_m());
            checked++;
        }
        assertThat(checked).isGreaterThanOrEqualTo(3);
    }

    private static void close(double a, double b) {
        assertThat(Math.abs(a - b)).isLessThanOrEqualTo(1e-12 * Math.abs(b));
    }

    @Test
    void cancelling() {
        Assertions.assertThatThrownBy(() -> BiasSweep.run(SolvedDemo.SOLUTION, SolvedDemo.STACK, "focus", -100, 100, 40,
                OptionalDouble.empty(), (done, total) -> done < 3)).isInstanceOf(CancellationException.class);
    }
}
