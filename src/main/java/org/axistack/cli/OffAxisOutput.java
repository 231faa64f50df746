package org.axistack.cli;

import java.io.PrintWriter;
import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;

import org.axistack.optics.OffAxisAberrations;

/**
 * The off-axis third-order aberrations in the {@code optics} output: the JSON object {@code off_axis_aberrations}
 * (coefficients with units in their names and, for a given object height and aperture angle, their effects at the
 * image) and the text lines printed from it.
 */
final class OffAxisOutput {

    private OffAxisOutput() {
    }

    /** The JSON object; height and aperture may be null (their effects are then left out). */
    static Map<String, Object> map(OffAxisAberrations oa, Double height_mm, Double aperture_mrad) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("object_z_mm", oa.objectZ_m() * 1e3);
        m.put("image_z_mm", oa.imageZ_m() * 1e3);
        m.put("magnification", oa.magnification());
        m.put("spherical_C_mm", oa.spherical_m() * 1e3);
        m.put("coma_K", oa.coma());
        m.put("field_curvature_F_per_mm", oa.fieldCurvature_per_m() * 1e-3);
        m.put("astigmatism_A_per_mm", oa.astigmatism_per_m() * 1e-3);
        m.put("distortion_D_per_mm2", oa.distortion_per_m2() * 1e-6);
        m.put("petzval_P_per_mm", oa.petzval_per_m() * 1e-3);
        m.put("axial_chromatic_Cc_mm", oa.chromatic_m() * 1e3);
        m.put("lateral_chromatic_CL", oa.lateralChromatic());
        m.put("stop_slope_per_mm", oa.stopSlope() * 1e-3);
        m.put("quadrature_change", oa.quadratureChange());
        if (height_mm != null) {
            double h = height_mm * 1e-3;
            m.put("object_height_mm", height_mm);
            double[] dz = oa.focalShifts_m(h);
            m.put("focus_shift_tangential_mm", dz[0] * 1e3);
            m.put("focus_shift_sagittal_mm", dz[1] * 1e3);
            m.put("focus_shift_petzval_mm", dz[2] * 1e3);
            m.put("distortion_um", oa.imageEffects_m(h, 0)[5] * 1e6);
            m.put("distortion_relative", oa.distortion_per_m2() * h * h);
            if (aperture_mrad != null) {
                double[] e = oa.imageEffects_m(h, aperture_mrad * 1e-3);
                m.put("aperture_mrad", aperture_mrad);
                m.put("spherical_um", e[0] * 1e6);
                m.put("coma_tangential_um", e[1] * 1e6);
                m.put("coma_sagittal_um", e[2] * 1e6);
                m.put("field_curvature_um", e[3] * 1e6);
                m.put("astigmatism_um", e[4] * 1e6);
            }
        }
        m.put("convention", oa.convention() + "; effects at the Gaussian image for object height h and object-side"
                + " aperture angle alpha: spherical M C alpha^3, coma 3 M K h alpha^2 (tangential) and M K h alpha^2"
                + " (sagittal), field curvature M F h^2 alpha, astigmatism M A h^2 alpha, distortion M D h^3, for the pencil"
                + " about the chief ray (the Petzval coefficient does not depend on where the aperture is); focus shifts"
                + " along the axis from the Gaussian"
                + " image of the tangential, sagittal and Petzval surfaces at height h");
        return m;
    }

    /** The text lines. */
    static void print(PrintWriter w, Map<String, Object> m) {
        w.println(String.format(Locale.ROOT, "  off-axis third-order aberrations (object at z = %s mm, M = %s):",
                f(m.get("object_z_mm")), f(m.get("magnification"))));
        w.println(String.format(Locale.ROOT, "    C = %s mm, coma K = %s, field curvature F = %s /mm, astigmatism A = %s /mm,",
                f(m.get("spherical_C_mm")), f(m.get("coma_K")), f(m.get("field_curvature_F_per_mm")),
                f(m.get("astigmatism_A_per_mm"))));
        w.println(String.format(Locale.ROOT, "    distortion D = %s /mm^2, Petzval P = F - 2A = %s /mm, lateral colour C_L = %s"
                + " (axial Cc = %s mm)", f(m.get("distortion_D_per_mm2")), f(m.get("petzval_P_per_mm")),
                f(m.get("lateral_chromatic_CL")), f(m.get("axial_chromatic_Cc_mm"))));
        if (m.containsKey("object_height_mm")) {
            double rel = ((Number) m.get("distortion_relative")).doubleValue();
            w.println(String.format(Locale.ROOT, "    at object height %s mm: distortion %s um (%s of the image height, %s);"
                    + " focus shift tangential %s mm, sagittal %s mm, Petzval %s mm", f(m.get("object_height_mm")),
                    f(m.get("distortion_um")), f(rel), rel > 0 ? "outward: pincushion" : rel < 0 ? "inward: barrel" : "none",
                    f(m.get("focus_shift_tangential_mm")),
                    f(m.get("focus_shift_sagittal_mm")), f(m.get("focus_shift_petzval_mm"))));
        }
        if (m.containsKey("aperture_mrad")) {
            w.println(String.format(Locale.ROOT, "    with aperture %s mrad, at the Gaussian image: spherical %s um, coma %s um"
                    + " (tangential) / %s um (sagittal), field curvature %s um, astigmatism %s um",
                    f(m.get("aperture_mrad")), f(m.get("spherical_um")), f(m.get("coma_tangential_um")),
                    f(m.get("coma_sagittal_um")), f(m.get("field_curvature_um")), f(m.get("astigmatism_um"))));
        }
        w.println("    (" + m.get("convention") + ")");
    }

    private static String f(Object x) {
        if (x == null) {
            return "-";
        }
        return org.axistack.model.Numbers.general(((Number) x).doubleValue(), org.axistack.model.Numbers.MESSAGE_DIGITS);
    }
}
