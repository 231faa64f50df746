package org.axistack.probe;

import org.axistack.model.Codata2018;
import org.axistack.model.Particle;
import org.axistack.model.Relativity;

/**
 * What the probe model needs of the lens at one working point, image side: Cs_i and Cc_i in the convention of
 * {@link org.axistack.optics.AberrationPolynomials} (an axial ray at image-side slope a misses the Gaussian image
 * by Cs_i a^3 and, with the kinetic energy raised by dT, by -Cc_i a dT/T_i), the particle and its acceleration
 * potential at the image (U_i, so T_i = |q| U_i), and the lateral magnification (NaN when the object is at
 * infinity).
 *
 * @param sphericalImage_m  Cs_i, m, &gt;= 0
 * @param chromaticImage_m  Cc_i, m, &gt;= 0
 * @param particle          the beam particle
 * @param imagePotential_V  U_i, acceleration potential at the image, V &gt; 0
 * @param magnification     lateral magnification source to probe (NaN: object at infinity)
 */
public record ProbeLens(double sphericalImage_m, double chromaticImage_m, Particle particle, double imagePotential_V,
        double magnification) {

    public ProbeLens {
        if (!(sphericalImage_m >= 0) || !(chromaticImage_m >= 0) || !Double.isFinite(sphericalImage_m + chromaticImage_m)) {
            throw new IllegalArgumentException("Cs and Cc must be finite and >= 0 (Scherzer): " + sphericalImage_m + ", "
                    + chromaticImage_m);
        }
        if (!(imagePotential_V > 0) || !Double.isFinite(imagePotential_V)) {
            throw new IllegalArgumentException("the image-side acceleration potential must be > 0: " + imagePotential_V);
        }
    }

    /** Kinetic energy at the image, eV per elementary charge of the particle's charge state: |q| U_i / e. */
    public double imageEnergy_eV() {
        return Math.abs(particle.chargeNumber()) * imagePotential_V;
    }

    /** Relativistic acceleration potential U*_i at the image, V (brightness scales with it). */
    public double imageRelativisticPotential_V() {
        return Relativity.relativisticPotential_V(imagePotential_V, particle.restPotential_V());
    }

    /**
     * de Broglie wavelength at the image, m: lambda = h / p with p = sqrt(2 m |q| U*_i) (relativistic momentum
     * written with U* = U (1 + U/(2 Vr)), Vr = m c^2/|q|; Hawkes and Kasper vol. 1 ch. 2, from memory).
     */
    public double wavelength_m() {
        double p = Math.sqrt(2 * particle.mass_kg() * particle.absCharge_C() * imageRelativisticPotential_V());
        return Codata2018.PLANCK_J_S / p;
    }
}
