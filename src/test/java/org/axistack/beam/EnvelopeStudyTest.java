package org.axistack.beam;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.List;
import java.util.OptionalDouble;

import org.axistack.field.AxialField;
import org.axistack.model.Beam;
import org.axistack.model.Electrode;
import org.axistack.model.MeshSettings;
import org.axistack.model.Particle;
import org.axistack.model.Stack;
import org.axistack.model.SurfaceFieldLimits;
import org.junit.jupiter.api.Test;

/**
 * The study layer: bore fill, warnings, the three-way comparison. The fields here are analytic stand-ins
 * (the electrodes only provide walls), so every number is checked against a closed form of that field.
 */
class EnvelopeStudyTest {

    static Stack stack(Beam beam, OptionalDouble screen, Electrode... e) {
        return new Stack("study test", beam, List.of(e), screen, MeshSettings.defaults(), SurfaceFieldLimits.defaults());
    }

    final Beam proton = new Beam(Particle.proton(), 5000, OptionalDouble.of(-0.02), OptionalDouble.empty());

    @Test
    void boreFillMatchesHyperbolaInDrift() {
        // tube of bore 3 mm from z = 0 to 40 mm, thin aperture of hole 1.5 mm at z = 60 mm; drift field
        Stack s = stack(proton, OptionalDouble.of(0.1), new Electrode.Tube("tube", 0, 3e-3, 0, 0.04, 0),
                new Electrode.Aperture("stop", 0, 0.06, 1.5e-3, 10e-3, 0));
        double r0 = 0.4e-3;
        double eps = 10e-6; // 10 mm mrad edge, waist at the start plane z = -20 mm
        EnvelopeStudyResult res = new EnvelopeStudy().run(s, TestFields.drift(),
                new EnvelopeRequest(0, new EnvelopeStart.Source(r0, eps / r0)));
        java.util.function.DoubleUnaryOperator hyper = z -> Math.hypot(r0, eps * (z + 0.02) / r0);
        BoreClearance tube = res.clearances().get(0);
        BoreClearance stop = res.clearances().get(1);
        // tube: worst fill at its exit z = 40 mm; stop: at its plane
        assertThat(tube.zWorst_m()).isCloseTo(0.04, within(1e-12));
        assertThat(tube.fill()).isCloseTo(hyper.applyAsDouble(0.04) / 3e-3, within(1e-9));
        assertThat(stop.fill()).isCloseTo(hyper.applyAsDouble(0.06) / 1.5e-3, within(1e-9));
        assertThat(tube.status()).isEqualTo(hyper.applyAsDouble(0.04) / 3e-3 >= 0.7 ? BoreClearance.Status.NEAR
                : BoreClearance.Status.CLEAR);
        assertThat(stop.status()).isEqualTo(BoreClearance.Status.HIT); // 2.0 mm beam in a 1.5 mm hole
        assertThat(res.blocking()).isTrue();
        assertThat(res.warnings()).anySatisfy(w -> {
            assertThat(w.kind()).isEqualTo(EnvelopeWarning.Kind.HITS_ELECTRODE);
            assertThat(w.electrode()).isEqualTo("stop");
        });
        assertThat(res.screenRadius_m().getAsDouble()).isCloseTo(hyper.applyAsDouble(0.1), within(1e-9 * 2e-3));
        assertThat(res.emittanceOnly()).isSameAs(res.full());
        assertThat(res.spaceChargeOnly().waists()).isEmpty(); // zero current, zero emittance, parallel: a ray
        assertThat(res.dominance()).contains("no current");
    }

    @Test
    void startOutsideFirstBoreIsWarned() {
        Stack s = stack(proton, OptionalDouble.empty(), new Electrode.Tube("inlet", 0, 2e-3, 0, 0.03, 0));
        EnvelopeStudyResult res = new EnvelopeStudy().run(s, TestFields.drift(),
                new EnvelopeRequest(1e-6, new EnvelopeStart.RadiusSlope(3e-3, 0, Emittance.edge(1e-6))));
        assertThat(res.warnings()).anySatisfy(w -> {
            assertThat(w.kind()).isEqualTo(EnvelopeWarning.Kind.START_OUTSIDE_BORE);
            assertThat(w.message()).contains("inlet").contains("reduce the start radius below 2.000 mm");
        });
        assertThat(res.spaceChargeRatio()).isPresent();
        assertThat(res.full().points()).allSatisfy(p -> assertThat(Double.isFinite(p.radius_m())).isTrue());
    }

    @Test
    void mirrorIsReportedAsReflectionWithoutNaN() {
        // electron of 1 keV into a potential step to -2 kV: U = 1000 + V(z) = -1000 tanh(z/w) reaches 0 at
        // z = 0; the solver stops where (beta gamma)^2 falls to 1e-6 of its start value, solved below in closed form.
        Beam e = new Beam(Particle.electron(), 1000, OptionalDouble.of(-0.03), OptionalDouble.empty());
        double w = 0.005;
        AxialField f = TestFields.step(-2000, w);
        Stack s = stack(e, OptionalDouble.empty(), new Electrode.Tube("mirror", -2000, 10e-3, 0, 0.05, 0));
        EnvelopeStudyResult res = new EnvelopeStudy().run(s, f,
                new EnvelopeRequest(1e-6, new EnvelopeStart.RadiusSlope(1e-3, 0, Emittance.edge(1e-6))));
        Termination t = res.full().termination();
        assertThat(t.kind()).isEqualTo(Termination.Kind.REFLECTED);
        // (beta gamma)^2 floor = 1e-6 x start value; at U << V0 that is U ~ 1e-6 U(start) to within U/V0
        double v0 = Particle.electron().restPotential_V();
        double uStart = 1000 - 1000 * (1 + Math.tanh(-0.03 / w));
        double bg2Floor = 1e-6 * BeamKinematics.betaGammaSquared(uStart, v0);
        double uFloor = v0 * (Math.sqrt(1 + bg2Floor) - 1);
        double zRef = w * atanh(-uFloor / 1000); // U = 1000 + V = -1000 tanh(z/w) = uFloor
        assertThat(t.z_m()).isCloseTo(zRef, within(1e-9));
        assertThat(res.blocking()).isTrue();
        assertThat(res.warnings()).anySatisfy(x -> assertThat(x.kind()).isEqualTo(EnvelopeWarning.Kind.REFLECTED));
        assertThat(res.full().points()).allSatisfy(p -> {
            assertThat(Double.isFinite(p.radius_m() + p.slope_rad() + p.perveance() + p.emittance_m_rad())).isTrue();
        });
    }

    static double atanh(double x) {
        return 0.5 * Math.log((1 + x) / (1 - x));
    }

    @Test
    void diskOnAxisIsReported() {
        Stack s = stack(proton, OptionalDouble.empty(), new Electrode.Disk("plate", 0, 0.05, 5e-3, 0));
        EnvelopeStudyResult res = new EnvelopeStudy().run(s, TestFields.drift(),
                new EnvelopeRequest(0, new EnvelopeStart.RadiusSlope(1e-3, 0, Emittance.edge(1e-6))));
        assertThat(res.clearances().get(0).status()).isEqualTo(BoreClearance.Status.CLOSES_AXIS);
        assertThat(res.warnings()).anySatisfy(x -> assertThat(x.kind()).isEqualTo(EnvelopeWarning.Kind.CLOSES_AXIS));
    }

    @Test
    void badInputGivesClearMessages() {
        assertThatThrownBy(() -> new EnvelopeRequest(-1e-3, new EnvelopeStart.Source(1e-3, 1e-3)))
                .isInstanceOf(org.axistack.model.PhysicsException.class).hasMessageContaining("current").hasMessageContaining(">= 0 A");
        assertThatThrownBy(() -> Emittance.edge(-1e-6)).isInstanceOf(org.axistack.model.PhysicsException.class)
                .hasMessageContaining("emittance").hasMessageContaining("-1");
        assertThatThrownBy(() -> Emittance.edge(Double.NaN)).isInstanceOf(org.axistack.model.PhysicsException.class);
        assertThatThrownBy(() -> new EnvelopeProblem(0, 1, 0, 0, 1e-3, 0)).isInstanceOf(org.axistack.model.PhysicsException.class)
                .hasMessageContaining("radius");
        assertThatThrownBy(() -> new EnvelopeProblem(1, 0, 1e-3, 0, 0, 0)).hasMessageContaining("end plane");
        // start plane inside a mirror: the beam cannot be there
        Beam e = new Beam(Particle.electron(), 1000, OptionalDouble.of(0.02), OptionalDouble.empty());
        Stack s = stack(e, OptionalDouble.empty(), new Electrode.Tube("mirror", -2000, 10e-3, 0, 0.05, 0));
        assertThatThrownBy(() -> new EnvelopeStudy().run(s, TestFields.step(-2000, 0.005),
                new EnvelopeRequest(0, new EnvelopeStart.Source(1e-3, 1e-3))))
                .isInstanceOf(org.axistack.model.PhysicsException.class).hasMessageContaining("cannot reach the start plane");
    }

    @Test
    void cancellationIsHonoured() {
        ElectrostaticChannel ch = new ElectrostaticChannel(TestFields.drift(), Particle.proton(), 1000);
        Thread.currentThread().interrupt();
        try {
            assertThatThrownBy(() -> new EnvelopeSolver().solve(ch, new EnvelopeProblem(0, 1, 1e-3, 0, 1e-3, 1e-6)))
                    .isInstanceOf(java.util.concurrent.CancellationException.class);
        } finally {
            Thread.interrupted();
        }
    }
}
