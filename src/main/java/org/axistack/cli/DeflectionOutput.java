package org.axistack.cli;

import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

import org.axistack.field.BiasedField;
import org.axistack.field.SectorField;
import org.axistack.field.SolveProgress;
import org.axistack.model.Units;
import org.axistack.model.Sectors;
import org.axistack.model.Stack;
import org.axistack.optics.ParaxialOptics;
import org.axistack.optics.SplitDeflection;

/**
 * The central ray's deflection by split electrodes in the optics output: offset and slope at the screen (or the
 * image-side reference plane when the stack names no screen) at the stored sector biases, and per split
 * electrode the screen offset per volt of its x and y differential bias.
 */
final class DeflectionOutput {

    private DeflectionOutput() {
    }

    /**
     * Adds the deflection keys to {@code out} when the stack has split electrodes; returns the harmonics solved
     * (1, and 2 when a split electrode carries a quadrupole, for {@link StigmationOutput}), or null.
     */
    static SectorField put(Map<String, Object> out, Stack stack, BiasedField field, ParaxialOptics optics,
            SolveProgress progress) {
        if (!stack.hasSectors()) {
            return null;
        }
        Map<Integer, Sectors> byIndex = new LinkedHashMap<>();
        Map<Integer, List<Double>> biases = new LinkedHashMap<>();
        stack.sectors().forEach((name, s) -> {
            byIndex.put(stack.indexOf(name), s);
            biases.put(stack.indexOf(name), s.biases_V());
        });
        double zScreen = stack.screenZ_m().orElse(optics.zEnd_m());
        if (!(zScreen > optics.zStart_m())) {
            return null;
        }
        SectorField sf = SectorField.solve(field.solution(), byIndex, StigmationOutput.hasStigmators(stack) ? 2 : 1,
                progress);
        SplitDeflection d = SplitDeflection.of(sf, optics, optics.zStart_m(), new double[] {zScreen});
        double[] ray = d.ray(0, biases);
        out.put("deflection_plane_z_mm", Units.mToMm(zScreen));
        out.put("screen_offset_x_mm", Units.mToMm(ray[0]));
        out.put("screen_offset_y_mm", Units.mToMm(ray[1]));
        out.put("screen_slope_x_mrad", Units.radToMrad(ray[2]));
        out.put("screen_slope_y_mrad", Units.radToMrad(ray[3]));
        List<Map<String, Object>> per = new ArrayList<>();
        for (int e : d.electrodes()) {
            SplitDeflection.PerVolt pv = d.perVolt(0, e);
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("electrode", stack.electrodes().get(e).name());
            m.put("sectors", byIndex.get(e).count());
            double w = byIndex.get(e).slitWidth_m();
            if (w > 0) {
                // the linear-ramp slit model's measured error (harmonic-field.md): the deflection per volt is high by
                // up to about 0.33 (w/R)^2, R the electrode's bore
                double bore = stack.electrodes().get(e).contour().minR_m();
                m.put("slit_model_error", bore > 0 ? SectorField.SLIT_DIPOLE_ERROR * (w / bore) * (w / bore) : null);
            }
            m.put("x_bias_offset_x_mm_per_V", Units.mToMm(pv.xPerVx_m()));
            m.put("x_bias_offset_y_mm_per_V", Units.mToMm(pv.yPerVx_m()));
            m.put("y_bias_offset_x_mm_per_V", Units.mToMm(pv.xPerVy_m()));
            m.put("y_bias_offset_y_mm_per_V", Units.mToMm(pv.yPerVy_m()));
            per.add(m);
        }
        out.put("deflection", per);
        out.put("deflection_method", "first order in the sector biases (dipole harmonic, central ray launched on the"
                + " axis at the object-side reference plane)");
        return sf;
    }

    /** Text lines for the deflection keys, if present. */
    @SuppressWarnings("unchecked")
    static void print(PrintWriter w, Map<String, Object> out) {
        if (!out.containsKey("screen_offset_x_mm")) {
            return;
        }
        w.println(String.format(Locale.ROOT, "  central ray at z = %.6g mm (%s):", (Double) out.get("deflection_plane_z_mm"),
                out.get("deflection_method")));
        w.println(String.format(Locale.ROOT, "    offset x %.6g mm, y %.6g mm; slope x %.6g mrad, y %.6g mrad",
                (Double) out.get("screen_offset_x_mm"), (Double) out.get("screen_offset_y_mm"),
                (Double) out.get("screen_slope_x_mrad"), (Double) out.get("screen_slope_y_mrad")));
        for (Map<String, Object> m : (List<Map<String, Object>>) out.get("deflection")) {
            w.println(String.format(Locale.ROOT, "    %s (%d sectors): per V of x bias (%.6g, %.6g) mm, per V of y bias"
                    + " (%.6g, %.6g) mm", m.get("electrode"), (Integer) m.get("sectors"),
                    (Double) m.get("x_bias_offset_x_mm_per_V"), (Double) m.get("x_bias_offset_y_mm_per_V"),
                    (Double) m.get("y_bias_offset_x_mm_per_V"), (Double) m.get("y_bias_offset_y_mm_per_V")));
            if (m.get("slit_model_error") instanceof Double err) {
                w.println(String.format(Locale.ROOT, "      slits modelled as linear ramps across them: the per-volt figures"
                        + " may be high by about %.2g (relative; measured against open slits in two dimensions)", err));
            }
        }
    }
}
