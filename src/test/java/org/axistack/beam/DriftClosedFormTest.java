package org.axistack.beam;

import org.axistack.verify.Erfi;
import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.axistack.model.Particle;
import org.junit.jupiter.api.Test;

/** Envelope in a field-free drift against the two classical closed forms. */
class DriftClosedFormTest {

    private final EnvelopeSolver solver = new EnvelopeSolver();

    @Test
    void universalBeamSpreadCurve() {
        // Source: the universal beam-spread curve of a laminar round beam in a drift,
        // z = R0 sqrt(pi/(2K)) erfi(sqrt(ln(R/R0))), from R'' = K/R with R'(0) = 0: R'^2 = 2K ln(R/R0)
        // (e.g. M. Reiser, Theory and Design of Charged Particle Beams, 2nd ed., section 4.2; derived
        // again here: substitute R = R0 exp(t^2)). Proton, 10 keV, 1 mA, R0 = 1 mm.
        Particle proton = Particle.proton();
        ElectrostaticChannel ch = new ElectrostaticChannel(TestFields.drift(), proton, 10_000);
        double r0 = 1e-3;
        EnvelopeCurve c = solver.solve(ch, new EnvelopeProblem(0, 0.5, r0, 0, 1e-3, 0));
        assertThat(c.termination().reachedEnd()).isTrue();
        double k = c.points().get(0).perveance();
        assertThat(k).isGreaterThan(1e-4);
        assertThat(c.last().radius_m()).as("the beam must really spread").isGreaterThan(3 * r0);
        int checked = 0;
        for (EnvelopePoint p : c.points()) {
            if (p.z_m() < 0.05) {
                continue; // ln(R/R0) ~ 0 near the start: the closed form is ill-conditioned there
            }
            double zFormula = r0 * Math.sqrt(Math.PI / (2 * k)) * Erfi.erfi(Math.sqrt(Math.log(p.radius_m() / r0)));
            assertThat(zFormula).as("z at R = %s", p.radius_m()).isCloseTo(p.z_m(), within(1e-6 * p.z_m()));
            assertThat(p.slope_rad()).isCloseTo(Math.sqrt(2 * k * Math.log(p.radius_m() / r0)),
                    within(1e-9 * p.slope_rad()));
            checked++;
        }
        assertThat(checked).isGreaterThan(300);
        assertThat(c.waists()).isEmpty();
    }

    @Test
    void emittanceOnlyHyperbola() {
        // Source: free drift of a beam ellipse, R(z)^2 = R0^2 + (eps z / R0)^2 for a waist R0 at z = 0
        // (linear beam optics, e.g. Reiser section 3.3; the envelope of an upright emittance ellipse).
        double r0 = 0.5e-3;
        double eps = 2e-6; // geometric edge emittance, m rad (2 mm mrad)
        double zs = -0.3;
        double rs = Math.sqrt(r0 * r0 + Math.pow(eps * zs / r0, 2));
        double slope = eps * eps * zs / (r0 * r0 * rs);
        Particle e = Particle.electron();
        double u = 2000;
        double bg = BeamKinematics.betaGamma(u, e.restPotential_V());
        ElectrostaticChannel ch = new ElectrostaticChannel(TestFields.drift(), e, u);
        EnvelopeCurve c = solver.solve(ch, new EnvelopeProblem(zs, 0.4, rs, slope, 0, eps * bg));
        for (EnvelopePoint p : c.points()) {
            double ref = Math.sqrt(r0 * r0 + Math.pow(eps * p.z_m() / r0, 2));
            assertThat(p.radius_m()).as("R at z = %s", p.z_m()).isCloseTo(ref, within(1e-9 * ref));
            assertThat(p.emittance_m_rad()).isCloseTo(eps, within(1e-15 * eps));
        }
        assertThat(c.waists()).hasSize(1);
        Waist w = c.waists().get(0);
        assertThat(w.kind()).isEqualTo(Waist.Kind.SMOOTH);
        assertThat(w.z_m()).isCloseTo(0, within(1e-9 * 0.3));
        assertThat(w.radius_m()).isCloseTo(r0, within(1e-9 * r0));
    }

    @Test
    void deepSpaceChargeCrossoverIsPassedWithoutNaN() {
        // Laminar beam aimed at the axis in a drift: R'^2/2 - K ln R is conserved (the universal-curve
        // invariant), so the waist is R0 exp(-s^2/(2K)) (far below the floor here) and the beam leaves
        // the crossover symmetrically, back to R0 at twice the crossover distance.
        Particle proton = Particle.proton();
        ElectrostaticChannel ch = new ElectrostaticChannel(TestFields.drift(), proton, 10_000);
        double r0 = 1e-3;
        double s = -0.01;
        double current = 1e-6;
        EnvelopeCurve c = solver.solve(ch, new EnvelopeProblem(0, 0.25, r0, s, current, 0));
        double k = c.points().get(0).perveance();
        assertThat(c.waists()).hasSize(1);
        Waist w = c.waists().get(0);
        assertThat(w.kind()).isEqualTo(Waist.Kind.CROSSOVER);
        double expected = r0 * Math.exp(-s * s / (2 * k));
        assertThat(w.radius_m()).isCloseTo(expected, within(1e-6 * expected + Double.MIN_NORMAL));
        double zc = w.z_m();
        EnvelopePoint back = c.at(2 * zc);
        assertThat(back.radius_m()).isCloseTo(r0, within(1e-6 * r0));
        assertThat(back.slope_rad()).isCloseTo(-s, within(1e-6 * -s));
        assertThat(c.points()).allSatisfy(p -> assertThat(Double.isFinite(p.radius_m() + p.slope_rad())).isTrue());
    }
}
