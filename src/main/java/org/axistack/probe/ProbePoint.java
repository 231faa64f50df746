package org.axistack.probe;

/**
 * The probe at one current and image-side aperture half-angle: partial FW50 diameters, the root-power-sum
 * total (the model's answer) and the quadrature sum (for comparison), all in m.
 *
 * @param current_A      probe current, A
 * @param alpha_rad      image-side aperture half-angle, rad
 * @param source_m       d_I, geometric FW50 image of the source
 * @param diffraction_m  d_A, FW50 of the Airy pattern
 * @param spherical_m    d_S, FW50 of the spherical-aberration spot at its best (FW50) focus
 * @param chromatic_m    d_C, FW50 of the chromatic spot
 * @param fw50_m         root-power-sum total (Barth and Kruit)
 * @param quadrature_m   sqrt of the sum of squares of the partial diameters
 * @param dominant       the largest partial diameter
 * @param interior       true when the angle is an interior optimum of the searched range (false when it sits at
 *                       a range end, or when the angle is fixed by the current at a fixed magnification)
 */
public record ProbePoint(double current_A, double alpha_rad, double source_m, double diffraction_m, double spherical_m,
        double chromatic_m, double fw50_m, double quadrature_m, ProbeTerm dominant, boolean interior) {

    /** The partial diameter of one term, m. */
    public double partial_m(ProbeTerm term) {
        return switch (term) {
            case SOURCE -> source_m;
            case DIFFRACTION -> diffraction_m;
            case SPHERICAL -> spherical_m;
            case CHROMATIC -> chromatic_m;
        };
    }

    /** Share of one term in the total, (d_term/d)^2 in quadrature terms (0..1), for "negligible" statements. */
    public double share(ProbeTerm term) {
        double d = partial_m(term) / quadrature_m;
        return d * d;
    }
}
