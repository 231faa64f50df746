package org.axistack.beam;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.DoubleRange;
import org.axistack.model.Particle;

/**
 * In a drift the envelope equation R'' = K/R + eps^2/R^3 has the first integral
 * H = R'^2/2 - K ln R + eps^2/(2 R^2) (it is a one-dimensional motion in a potential; classical mechanics).
 * H must hold along every computed envelope, through waists and analytic crossovers alike.
 */
class EnvelopeInvariantProperties {

    @Property(tries = 40, seed = "20261201")
    void driftInvariantHolds(@ForAll @DoubleRange(min = 0.2, max = 3) double r0_mm,
            @ForAll @DoubleRange(min = -30, max = 30) double slope_mrad,
            @ForAll @DoubleRange(min = 0, max = 1000) double perveance_per_million,
            @ForAll @DoubleRange(min = 0, max = 20) double eps_mm_mrad) {
        double r0 = r0_mm * 1e-3;
        double slope = slope_mrad * 1e-3;
        double perveance = perveance_per_million * 1e-6;
        double eps = eps_mm_mrad * 1e-6;
        if (perveance == 0 && eps == 0) {
            return; // the linear case has no such invariant worth testing (a straight ray)
        }
        double v0 = Particle.proton().restPotential_V();
        double bg = 0.01;
        // K = I / (2 pi eps0 c V0 (beta gamma)^3): current for the wanted perveance
        double current = perveance / BeamKinematics.perveance(1.0, v0, bg);
        UniformFocusingChannel drift = new UniformFocusingChannel(0, bg, v0);
        EnvelopeCurve c = new EnvelopeSolver().solve(drift, new EnvelopeProblem(0, 0.5, r0, slope, current, eps * bg));
        double h0 = slope * slope / 2 - perveance * Math.log(r0) + eps * eps / (2 * r0 * r0);
        double scale = slope * slope / 2 + perveance * (1 + Math.abs(Math.log(r0))) + eps * eps / (2 * r0 * r0);
        for (EnvelopePoint p : c.points()) {
            assertThat(Double.isFinite(p.radius_m())).isTrue();
            if (p.radius_m() < 1e-3 * r0) {
                continue; // at an analytic crossover point the tabulated slope is the entry slope
            }
            double h = p.slope_rad() * p.slope_rad() / 2 - perveance * Math.log(p.radius_m())
                    + eps * eps / (2 * p.radius_m() * p.radius_m());
            // 1e-7: through the floor of an analytic crossover of an almost emittance-free beam the K/R force
            // grows a thousandfold and the integrator's step error with it; the worst case found (r0 0.2 mm,
            // slope -0.53 mrad, perveance 1e-8, no emittance) drifts by 6e-8 of the scale; away from such
            // crossovers the drift stays below 1e-9
            assertThat(h).as("z = %s", p.z_m()).isCloseTo(h0, within(1e-7 * scale));
        }
    }
}
