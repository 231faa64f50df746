package org.axistack.beam;

import static org.axistack.model.Codata2018.EPSILON0_F_PER_M;
import static org.axistack.model.Codata2018.SPEED_OF_LIGHT_M_PER_S;

import org.axistack.model.Relativity;

/**
 * Relativistic kinematics of a particle in terms of its acceleration potential U = T/|q| (volts) and
 * its rest potential V0 = m c^2/|q|, and the generalised perveance of a round beam.
 *
 * <p>Formulas (standard, e.g. M. Reiser, <i>Theory and Design of Charged Particle Beams</i>, 2nd ed.,
 * Wiley 2008, sections 2.2 and 4.2): gamma = 1 + U/V0; U* = U (1 + U/(2 V0)); (beta gamma)^2 =
 * gamma^2 - 1 = 2 U* / V0; generalised perveance K = |q| I / (2 pi eps0 m c^3 (beta gamma)^3), which with
 * m c^2 = |q| V0 is K = I / (2 pi eps0 c V0 (beta gamma)^3) and tends to
 * I / (4 pi eps0 sqrt(2|q|/m) U^(3/2)) for U &lt;&lt; V0.
 */
public final class BeamKinematics {

    private BeamKinematics() {
    }

    /** (beta gamma)^2 = 2 U* / V0 (signed: negative where U &lt; 0, i.e. where the particle cannot go). */
    public static double betaGammaSquared(double u_V, double restPotential_V) {
        return 2 * Relativity.relativisticPotential_V(u_V, restPotential_V) / restPotential_V;
    }

    /** beta gamma = p/(m c) for U &gt; 0. */
    public static double betaGamma(double u_V, double restPotential_V) {
        if (!(u_V > 0)) {
            throw new IllegalArgumentException("acceleration potential must be > 0 V, got " + u_V);
        }
        return Math.sqrt(betaGammaSquared(u_V, restPotential_V));
    }

    /**
     * Generalised perveance K = I / (2 pi eps0 c V0 (beta gamma)^3), dimensionless.
     *
     * @param current_A       beam current magnitude, A
     * @param restPotential_V m c^2 / |q|, V
     * @param betaGamma       beta gamma of the beam, &gt; 0
     */
    public static double perveance(double current_A, double restPotential_V, double betaGamma) {
        double bg3 = betaGamma * betaGamma * betaGamma;
        return current_A / (2 * Math.PI * EPSILON0_F_PER_M * SPEED_OF_LIGHT_M_PER_S * restPotential_V * bg3);
    }
}
