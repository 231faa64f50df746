package org.axistack.beam;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.axistack.model.Particle;
import org.junit.jupiter.api.Test;

/** Uniform linear focusing: the matched envelope is constant. */
class MatchedBeamTest {

    @Test
    void matchedBeamStaysConstant() {
        // Source: matched solution of R'' + k0^2 R - K/R - eps^2/R^3 = 0, k0^2 R^4 - K R^2 - eps^2 = 0,
        // R^2 = (K + sqrt(K^2 + 4 k0^2 eps^2)) / (2 k0^2) (Reiser, Theory and Design of Charged Particle
        // Beams, 2nd ed., eq. 4.89 form; solved here as a quadratic in R^2).
        double v0 = Particle.proton().restPotential_V();
        double bg = BeamKinematics.betaGamma(20e3, v0);
        double k0sq = 100; // k0 = 10 /m
        UniformFocusingChannel ch = new UniformFocusingChannel(k0sq, bg, v0);
        double current = 2e-3;
        double k = BeamKinematics.perveance(current, v0, bg);
        double eps = 3e-6;
        double rm = Math.sqrt((k + Math.sqrt(k * k + 4 * k0sq * eps * eps)) / (2 * k0sq));
        assertThat(ch.matchedRadius_m(k, eps * bg)).isCloseTo(rm, within(1e-15));
        EnvelopeSolver solver = new EnvelopeSolver();
        EnvelopeCurve c = solver.solve(ch, new EnvelopeProblem(0, 2.0, rm, 0, current, eps * bg));
        assertThat(c.points()).allSatisfy(p -> assertThat(p.radius_m()).isCloseTo(rm, within(1e-9 * rm)));

        // control: a 1 % mismatch oscillates visibly (the test above can fail)
        EnvelopeCurve m = solver.solve(ch, new EnvelopeProblem(0, 2.0, 1.01 * rm, 0, current, eps * bg));
        double dev = m.points().stream().mapToDouble(p -> Math.abs(p.radius_m() - rm)).max().orElseThrow();
        assertThat(dev).isGreaterThan(0.009 * rm);
    }

    @Test
    void smallMismatchOscillatesAtTheEnvelopeWavenumber() {
        // Linearising the envelope equation about the matched radius: k_env^2 = 2 k0^2 + 2 k^2 with the
        // depressed wavenumber k^2 = k0^2 - K/Rm^2 (Reiser, section 4.4.1, breathing mode; 2 k0 without
        // space charge, sqrt(2) k0 at full depression). The waist spacing of a 1e-5 mismatch is the period
        // 2 pi / k_env; the amplitude-dependent shift is of order 1e-10 here.
        double v0 = Particle.proton().restPotential_V();
        double bg = BeamKinematics.betaGamma(20e3, v0);
        double k0sq = 400; // k0 = 20 /m
        UniformFocusingChannel ch = new UniformFocusingChannel(k0sq, bg, v0);
        for (double current : new double[] {0, 2e-3, 20e-3}) {
            double k = BeamKinematics.perveance(current, v0, bg);
            double eps = 2e-6;
            double rm = Math.sqrt((k + Math.sqrt(k * k + 4 * k0sq * eps * eps)) / (2 * k0sq));
            double kEnv = Math.sqrt(2 * k0sq + 2 * (k0sq - k / (rm * rm)));
            EnvelopeCurve c = new EnvelopeSolver().solve(ch,
                    new EnvelopeProblem(0, 2.0, rm * (1 + 1e-5), 0, current, eps * bg));
            java.util.List<Waist> w = c.waists();
            assertThat(w.size()).as("I = %s A", current).isGreaterThan(4);
            double period = (w.get(w.size() - 1).z_m() - w.get(0).z_m()) / (w.size() - 1);
            assertThat(period).as("I = %s A", current).isCloseTo(2 * Math.PI / kEnv, within(1e-6 * period));
        }
    }
}
