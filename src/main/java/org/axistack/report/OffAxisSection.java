package org.axistack.report;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import org.axistack.optics.OffAxisAberrations;
import org.axistack.optics.OffAxisEffects;
import org.axistack.plan.LensPlan;

/**
 * The plan report's section on the off-axis third-order aberrations of the stack's finite object (coma, astigmatism,
 * field curvature, distortion, the Petzval coefficient), with their effects at the image for the object height and
 * aperture angle the user gave; a one-line note when the object is at infinity. Values from
 * {@link OffAxisAberrations}; nothing is computed here but unit conversion.
 */
final class OffAxisSection {

    private OffAxisSection() {
    }

    static void html(StringBuilder b, LensPlan plan) {
        if (plan.offAxis().isEmpty()) {
            if (plan.cardinal().isPresent()) {
                b.append("<p class=\"note\">Off-axis aberrations: ").append(Html.esc(plan.offAxisNote())).append(".</p>\n");
            }
            return;
        }
        OffAxisEffects use = plan.offAxis().get();
        OffAxisAberrations oa = use.coefficients();
        b.append("<h2>Off-axis aberrations (finite object)</h2>\n");
        boolean height = use.objectHeight_m().isPresent();
        double h = height ? use.objectHeight_m().getAsDouble() : Double.NaN;
        double[] effects = use.imageEffects_m().orElse(null);
        double[] shifts = height ? oa.focalShifts_m(h) : null;
        List<List<String>> rows = new ArrayList<>();
        rows.add(List.of("spherical C (mm)", Html.g(oa.spherical_m() * 1e3), effects == null ? "-"
                : um(effects[0]) + " um (M C a^3)"));
        rows.add(List.of("coma K", Html.g(oa.coma()), effects == null ? "-" : um(effects[1]) + " um tangential (3 M K h a^2), "
                + um(effects[2]) + " um sagittal"));
        rows.add(List.of("field curvature F (1/mm)", Html.g(oa.fieldCurvature_per_m() * 1e-3), effects == null ? "-"
                : um(effects[3]) + " um (M F h^2 a)"));
        rows.add(List.of("astigmatism A (1/mm)", Html.g(oa.astigmatism_per_m() * 1e-3), effects == null ? "-"
                : um(effects[4]) + " um (M A h^2 a)"));
        rows.add(List.of("distortion D (1/mm^2)", Html.g(oa.distortion_per_m2() * 1e-6), !height ? "-"
                : um(oa.imageEffects_m(h, 0)[5]) + " um = " + Html.g(oa.distortion_per_m2() * h * h)
                        + " of the image height (" + (oa.distortion_per_m2() > 0 ? "pincushion" : "barrel") + ")"));
        rows.add(List.of("Petzval P = F - 2A (1/mm)", Html.g(oa.petzval_per_m() * 1e-3), !height ? "-"
                : "focus shift along the axis: tangential " + Html.g(shifts[0] * 1e3) + " mm, sagittal "
                        + Html.g(shifts[1] * 1e3) + " mm, Petzval " + Html.g(shifts[2] * 1e3) + " mm"));
        rows.add(List.of("lateral colour C_L", Html.g(oa.lateralChromatic()), !height ? "-"
                : "image height changes by -C_L dT/T_o (T_o the kinetic energy at the object): "
                        + um(-oa.magnification() * oa.lateralChromatic() * h * 1e-3) + " um per 0.1 % of energy"));
        String at = !height ? "effect at the image (give --object-height-mm and --aperture-mrad)"
                : String.format(Locale.ROOT, "effect at the image, object height h = %s mm%s", Html.trim(h * 1e3),
                        use.aperture_rad().isPresent() ? ", aperture a = " + Html.trim(use.aperture_rad().getAsDouble() * 1e3)
                                + " mrad (object side)" : " (give --aperture-mrad for the blur)");
        b.append(Html.table(List.of("coefficient", "value", at), rows));
        b.append(String.format(Locale.ROOT, "<p class=\"note\">Object at z = %s mm, Gaussian image at %s mm, M = %s. ",
                HtmlReport.mm(oa.objectZ_m()), HtmlReport.mm(oa.imageZ_m()), Html.g(oa.magnification())))
                .append(Html.esc(oa.convention()))
                .append(". About a stop elsewhere the coefficients change by the stop-shift formulas of optics.md"
                        + " (optics --stop-z-mm gives them); the Petzval coefficient and Cc do not. Third order (first order"
                        + " in dT for the colour) only.</p>\n");
    }

    private static String um(double m) {
        return Html.g(m * 1e6);
    }
}
