package org.axistack.beam;

/**
 * The continuous (smooth) linear focusing channel: constant focusing kappa = k0^2, no acceleration.
 * The standard idealisation of a periodic focusing lattice averaged over its period (M. Reiser,
 * <i>Theory and Design of Charged Particle Beams</i>, 2nd ed., section 4.4), where the envelope
 * equation R'' + k0^2 R - K/R - eps^2/R^3 = 0 has the matched (constant) solution
 * R^2 = (K + sqrt(K^2 + 4 k0^2 eps^2)) / (2 k0^2).
 *
 * @param k0Squared_per_m2 focusing strength k0^2, 1/m^2, &gt;= 0
 * @param betaGamma        beta gamma of the beam, &gt; 0
 * @param restPotential_V  m c^2/|q| of the particle, V
 */
public record UniformFocusingChannel(double k0Squared_per_m2, double betaGamma, double restPotential_V)
        implements EnvelopeChannel {

    public UniformFocusingChannel {
        if (!(k0Squared_per_m2 >= 0) || !(betaGamma > 0) || !(restPotential_V > 0)
                || !Double.isFinite(k0Squared_per_m2 + betaGamma + restPotential_V)) {
            throw new IllegalArgumentException("uniform channel needs k0^2 >= 0, beta gamma > 0, rest potential > 0");
        }
    }

    /** Matched edge radius for normalised edge emittance epsN and perveance K, m. */
    public double matchedRadius_m(double perveance, double normalisedEmittance_m_rad) {
        double eps = normalisedEmittance_m_rad / betaGamma;
        double k2 = k0Squared_per_m2;
        return Math.sqrt((perveance + Math.sqrt(perveance * perveance + 4 * k2 * eps * eps)) / (2 * k2));
    }

    @Override
    public void coefficients(double z_m, double[] out) {
        out[DAMPING] = 0;
        out[FOCUSING] = k0Squared_per_m2;
        out[BETA_GAMMA_SQUARED] = betaGamma * betaGamma;
    }
}
