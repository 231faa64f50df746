package org.axistack.optics;

import java.util.OptionalDouble;

/**
 * Third-order spherical and first-order chromatic aberration coefficients of a round electrostatic lens.
 *
 * <p>Image side, object at infinity (always given): a ray entering parallel to the axis at height h
 * (alpha = h/f2) leaves along a line that meets the asymptotic paraxial image focal plane at
 * -Cs alpha^3; raising the kinetic energy by dT moves the image focal point by +Cc dT/T (T the kinetic
 * energy in image space), so the ray meets the nominal focal plane at +Cc alpha dT/T.
 *
 * <p>Object side, finite object at z_o (when given): an axial ray leaving the object at slope alpha_o meets
 * the asymptotic Gaussian image plane at M Cs_o alpha_o^3 (M the lateral magnification), and with the kinetic
 * energy raised by dT at -M Cc_o alpha_o dT/T_o (T_o the kinetic energy at the object).
 *
 * <p>Both are positive for any static round lens free of space charge (Scherzer's theorem).
 *
 * @param sphericalImage_m  Cs, image side, object at infinity, m
 * @param chromaticImage_m  Cc, image side, object at infinity, m
 * @param objectZ_m         the finite object position the object-side coefficients refer to, if any
 * @param sphericalObject_m Cs_o, object side, m (present with objectZ)
 * @param chromaticObject_m Cc_o, object side, m (present with objectZ)
 * @param relativistic      whether the relativistic trajectory equation was expanded
 * @param quadratureChange  relative change of the integrals at the last quadrature refinement
 */
public record Aberrations(double sphericalImage_m, double chromaticImage_m, OptionalDouble objectZ_m,
        OptionalDouble sphericalObject_m, OptionalDouble chromaticObject_m, boolean relativistic,
        double quadratureChange) {

    /** The convention in words, for reports and the JSON key aberration_convention. */
    public String convention() {
        String base = "image side, object at infinity: a ray entering parallel at height h (alpha = h/f2) meets the"
                + " paraxial image focal plane at -Cs alpha^3; an energy change dT shifts the image focal point by"
                + " +Cc dT/T (T the image-side kinetic energy); third-order aberration integrals of the "
                + (relativistic ? "relativistic" : "non-relativistic") + " trajectory equation";
        if (objectZ_m.isPresent()) {
            base += String.format(java.util.Locale.ROOT,
                    "; object side for the object at z = %.4f mm: Cs_o with image-plane miss M Cs_o alpha_o^3,"
                            + " Cc_o with miss -M Cc_o alpha_o dT/T_o (T_o the kinetic energy at the object)",
                    objectZ_m.getAsDouble() * 1e3);
        }
        return base;
    }
}
