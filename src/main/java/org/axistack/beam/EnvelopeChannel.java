package org.axistack.beam;

/**
 * What the envelope equation needs from the optics the beam passes through: at each z the damping
 * coefficient a(z) = gamma U'/(2 U*) (1/m), the linear focusing strength kappa(z) = gamma U''/(4 U*)
 * (1/m^2) and (beta gamma)^2 (the beam's momentum, which scales the perveance and the geometric
 * emittance). Implementations are immutable and thread-safe.
 */
public interface EnvelopeChannel {

    /** Index of a(z), 1/m, in the output array. */
    int DAMPING = 0;
    /** Index of kappa(z), 1/m^2. */
    int FOCUSING = 1;
    /** Index of (beta gamma)^2, dimensionless; &lt;= 0 where the particle cannot be. */
    int BETA_GAMMA_SQUARED = 2;

    /**
     * Coefficients at z.
     *
     * @param out receives a, kappa and (beta gamma)^2 at the indices above
     */
    void coefficients(double z_m, double[] out);

    /** Rest potential m c^2/|q| of the particle, V. */
    double restPotential_V();
}
