package org.axistack.beam;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.axistack.model.Codata2018;
import org.axistack.model.Particle;
import org.junit.jupiter.api.Test;

class PerveanceTest {

    /** K = q I / (2 pi eps0 m gamma^3 v^3), the definition (Reiser eq. 4.24), from gamma and v of the kinetic energy. */
    static double definition(Particle p, double current, double kinetic_J) {
        double mc2 = p.mass_kg() * Math.pow(Codata2018.SPEED_OF_LIGHT_M_PER_S, 2);
        double t = kinetic_J / mc2;
        double gamma = 1 + t;
        // v = c sqrt(gamma^2 - 1)/gamma with gamma^2 - 1 = t (2 + t), free of cancellation at low energy
        double v = Codata2018.SPEED_OF_LIGHT_M_PER_S * Math.sqrt(t * (2 + t)) / gamma;
        return p.absCharge_C() * current
                / (2 * Math.PI * Codata2018.EPSILON0_F_PER_M * p.mass_kg() * Math.pow(gamma * v, 3));
    }

    @Test
    void generalisedPerveanceMatchesDefinitionAtAllEnergies() {
        Particle e = Particle.electron();
        for (double u : new double[] {10, 1e3, 1e5, 1e6}) {
            double k = BeamKinematics.perveance(1e-3, e.restPotential_V(), BeamKinematics.betaGamma(u, e.restPotential_V()));
            double ref = definition(e, 1e-3, u * Codata2018.ELEMENTARY_CHARGE_C);
            assertThat(k).as("U = %s V", u).isCloseTo(ref, within(1e-12 * ref));
        }
    }

    @Test
    void lowEnergyLimitIsTheNonRelativisticForm() {
        // K -> I / (4 pi eps0 sqrt(2q/m) U^(3/2)) for U << m c^2/q (Reiser eq. 4.25); the relative
        // difference is (3/4) U/V0 to first order, so at 1 kV for a proton it is below 1e-6.
        Particle p = Particle.proton();
        double u = 1000;
        double i = 5e-3;
        double k = BeamKinematics.perveance(i, p.restPotential_V(), BeamKinematics.betaGamma(u, p.restPotential_V()));
        double nonRel = i / (4 * Math.PI * Codata2018.EPSILON0_F_PER_M * Math.sqrt(2 * p.absCharge_C() / p.mass_kg())
                * Math.pow(u, 1.5));
        assertThat(k).isCloseTo(nonRel, within(1e-6 * nonRel));
        assertThat(Math.abs(k / nonRel - 1)).isCloseTo(0.75 * u / p.restPotential_V(), within(1e-8));
    }

    @Test
    void emittanceConversions() {
        // edge = 4 x rms (KV beam, Lapostolle 1971); normalised = beta gamma x geometric
        double bg = 0.1;
        assertThat(new Emittance(1e-6, Emittance.Measure.RMS, Emittance.Frame.GEOMETRIC_AT_START)
                .normalisedEdge_m_rad(bg)).isCloseTo(4e-7, within(1e-20));
        assertThat(new Emittance(1e-6, Emittance.Measure.EDGE, Emittance.Frame.NORMALISED)
                .normalisedEdge_m_rad(bg)).isEqualTo(1e-6);
    }
}
