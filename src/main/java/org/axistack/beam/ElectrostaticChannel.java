package org.axistack.beam;

import org.axistack.field.AxialField;
import org.axistack.model.Particle;
import org.axistack.model.Relativity;

/**
 * A round electrostatic lens seen by the envelope equation: U(z) = U0 - sign(q) V(z) from the axial
 * potential (potential 0 at infinity), with the relativistic paraxial coefficients
 * a = gamma U'/(2 U*), kappa = gamma U''/(4 U*) (the paraxial ray equation of round electrostatic
 * lenses, e.g. P. W. Hawkes and E. Kasper, <i>Principles of Electron Optics</i>, vol. 1, ch. 15).
 *
 * @param field            the solved axial potential and its derivatives
 * @param particle         the species
 * @param energyPerCharge_V kinetic energy at 0 V divided by |q|, V (U0), &gt; 0
 */
public record ElectrostaticChannel(AxialField field, Particle particle, double energyPerCharge_V)
        implements EnvelopeChannel {

    /**
     * Below this fraction of U0 the coefficients are held at their value there; the solver stops the
     * beam as reflected before the held values can matter.
     */
    static final double CLAMP_FRACTION = 1e-9;

    public ElectrostaticChannel {
        if (field == null || particle == null) {
            throw new IllegalArgumentException("electrostatic channel needs a field and a particle");
        }
        if (!(energyPerCharge_V > 0) || !Double.isFinite(energyPerCharge_V)) {
            throw new IllegalArgumentException("beam energy per charge must be > 0 V, got " + energyPerCharge_V);
        }
    }

    /** Acceleration potential U(z) = T(z)/|q|, V (may be &lt;= 0 where the particle cannot go). */
    public double accelerationPotential_V(double z_m) {
        return energyPerCharge_V - particle.chargeSign() * field.axialPotential_V(z_m);
    }

    @Override
    public void coefficients(double z_m, double[] out) {
        double[] v = new double[3];
        field.axial(z_m, 2, v);
        double s = particle.chargeSign();
        double u = energyPerCharge_V - s * v[0];
        double du = -s * v[1];
        double d2u = -s * v[2];
        double v0 = restPotential_V();
        out[BETA_GAMMA_SQUARED] = BeamKinematics.betaGammaSquared(u, v0);
        double uc = Math.max(u, CLAMP_FRACTION * energyPerCharge_V);
        double g = Relativity.gamma(uc, v0);
        double us = Relativity.relativisticPotential_V(uc, v0);
        out[DAMPING] = g * du / (2 * us);
        out[FOCUSING] = g * d2u / (4 * us);
    }

    @Override
    public double restPotential_V() {
        return particle.restPotential_V();
    }
}
