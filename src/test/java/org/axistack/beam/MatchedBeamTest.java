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
}
