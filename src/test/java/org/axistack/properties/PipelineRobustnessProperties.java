package org.axistack.properties;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import org.axistack.field.BiasedField;
import org.axistack.model.Stack;
import org.axistack.optics.Aberrations;
import org.axistack.optics.CardinalElements;
import org.axistack.optics.ParaxialOptics;
import org.axistack.optics.BlockedAxisException;
import org.axistack.optics.ReflectionException;

/**
 * Any valid stack, of any shape and with biases up to 1.5 times the beam's energy per charge (so mirrors
 * occur), goes through solve and optics without an exception other than a reported reflection and without a
 * NaN. A reflection must be real: the axial kinetic energy is zero where it is reported (common practice,
 * no source).
 */
class PipelineRobustnessProperties {

    @Provide
    Arbitrary<Stack> anyStack() {
        return RandomStacks.stacks(true, 1.5);
    }

    @Property(seed = "20261201")
    void solveAndOpticsGiveNumbersOrAReportedMirror(@ForAll("anyStack") Stack s) {
        BiasedField f = Lens.solve(s).biased();
        double[] range = ParaxialOptics.searchRange_m(s);
        for (double z = range[0]; z <= range[1]; z += (range[1] - range[0]) / 50) {
            assertThat(f.axialPotential_V(z)).isFinite();
        }
        ParaxialOptics o;
        try {
            o = ParaxialOptics.of(f, s);
        } catch (ReflectionException e) {
            double zt = e.reflection().turningZ_m();
            assertThat(zt).isBetween(range[0], range[1]);
            double u = s.beam().energyPerCharge_V() - s.beam().particle().chargeSign() * f.axialPotential_V(zt);
            assertThat(u).isCloseTo(0, within(1e-6 * s.beam().energyPerCharge_V()));
            assertThat(e.getMessage()).contains("reflected");
            return;
        } catch (BlockedAxisException e) {
            // reported only for an electrode that really reaches the axis inside the searched range
            org.axistack.model.Contour blocker = s.electrode(e.electrode()).contour();
            assertThat(blocker.minR_m()).isLessThanOrEqualTo(0.0);
            assertThat(blocker.maxZ_m()).isGreaterThan(range[0]);
            assertThat(blocker.minZ_m()).isLessThan(range[1]);
            assertThat(e.getMessage()).contains(e.electrode(), "crosses the axis");
            return;
        }
        CardinalElements c = o.cardinal();
        assertThat(c.planeSensitivity()).isNotNaN();
        assertThat(c.zStart_m()).isFinite();
        assertThat(c.zEnd_m()).isFinite();
        if (c.kind() == CardinalElements.Kind.AFOCAL) {
            assertThat(c.focalLengthImage_m()).isInfinite();
            return;
        }
        for (double v : new double[] {c.focalPointObjectZ_m(), c.focalPointImageZ_m(), c.principalPlaneObjectZ_m(),
                c.principalPlaneImageZ_m(), c.focalLengthObject_m(), c.focalLengthImage_m()}) {
            assertThat(v).isFinite();
        }
        assertThat(Math.signum(c.focalLengthObject_m())).isEqualTo(Math.signum(c.focalLengthImage_m()));
        Aberrations a = o.aberrations();
        assertThat(a.sphericalImage_m()).isFinite();
        assertThat(a.chromaticImage_m()).isFinite();
    }
}
