package org.axistack.cli;

import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.OptionalDouble;

import org.axistack.field.SectorField;
import org.axistack.model.Sectors;
import org.axistack.model.Stack;
import org.axistack.model.Units;
import org.axistack.optics.ParaxialOptics;
import org.axistack.optics.Stigmation;
import org.axistack.optics.Stigmation.Split;

/**
 * The stigmators in the optics output: for a stack with split electrodes that carry a quadrupole harmonic, the x
 * and y focal lengths and focal points (and images of the object) at the stored sector biases, the astigmatic
 * difference and its axis, per volt of each stigmator's 0- and 45-degree patterns, and on request the pattern
 * biases that cancel a given astigmatism; first order in the sector biases ({@link Stigmation}).
 */
final class StigmationOutput {

    private StigmationOutput() {
    }

    /** Whether any split electrode of the stack carries the quadrupole harmonic. */
    static boolean hasStigmators(Stack stack) {
        return stack.sectors().values().stream().anyMatch(s -> s.carries(2));
    }

    /**
     * Adds the "stigmation" key.
     *
     * @param given {difference m, axis rad} of an astigmatism to cancel, or null
     */
    static void put(Map<String, Object> out, Stack stack, SectorField field, ParaxialOptics optics,
            OptionalDouble objectZ, double[] given) {
        if (field == null || !hasStigmators(stack)) {
            return;
        }
        Stigmation st = Stigmation.of(field, optics, objectZ);
        Map<Integer, List<Double>> biases = new LinkedHashMap<>();
        stack.sectorsByIndex().forEach((e, s) -> biases.put(e, s.biases_V()));
        Split[] now = st.at(biases);
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("method", "first order in the sector biases: the quadrupole harmonic (m = 2) as a source on the round"
                + " lens's rays");
        m.put("astigmatism_of", st.hasImage() ? "image of the object" : "image-side focal point");
        double p = 1 / st.focalLength_m();
        m.put("focal_length_x_mm", mm(1 / (p + now[0].c())));
        m.put("focal_length_y_mm", mm(1 / (p - now[0].c())));
        m.put("focal_point_x_z_mm", mm(st.focalPointZ_m() + now[1].c()));
        m.put("focal_point_y_z_mm", mm(st.focalPointZ_m() - now[1].c()));
        if (st.hasImage()) {
            m.put("image_x_z_mm", mm(st.imageZ_m() + now[2].c()));
            m.put("image_y_z_mm", mm(st.imageZ_m() - now[2].c()));
        }
        Split a = st.hasImage() ? now[2] : now[1];
        m.put("astigmatic_difference_mm", mm(2 * a.magnitude()));
        // below a picometre the split is the rounding of equal sector biases, without an axis
        m.put("astigmatism_axis_deg", a.magnitude() > 1e-12 ? axisDeg(a.axis_rad()) : null);
        List<Map<String, Object>> per = new ArrayList<>();
        for (int e : st.electrodes()) {
            Sectors s = stack.sectorsByIndex().get(e);
            Map<String, Object> one = new LinkedHashMap<>();
            one.put("electrode", stack.names().get(e));
            one.put("sectors", s.count());
            List<Map<String, Object>> patterns = new ArrayList<>();
            for (int deg : new int[] {0, 45}) {
                Stigmation.PerVolt pv = st.perVolt(e, deg);
                Split sp = st.hasImage() ? pv.image_m() : pv.focus_m();
                Map<String, Object> pm = new LinkedHashMap<>();
                pm.put("pattern_deg", deg);
                pm.put("present", pv.present());
                pm.put("astigmatic_difference_mm_per_V", mm(2 * sp.magnitude()));
                pm.put("axis_deg", sp.magnitude() > 0 ? axisDeg(sp.axis_rad()) : null);
                pm.put("shift_x_mm_per_V", mm(sp.c()));
                pm.put("shift_y_mm_per_V", mm(-sp.c()));
                pm.put("power_difference_per_m_per_V", finite(2 * pv.power_per_m().magnitude()));
                patterns.add(pm);
            }
            one.put("patterns", patterns);
            one.put("stored_quad_0_V", projection(s, 0));
            one.put("stored_quad_45_V", projection(s, 45));
            per.add(one);
        }
        m.put("stigmators", per);
        if (given != null) {
            Stigmation.Cancel c = st.cancel(given[0], given[1]);
            Map<String, Object> cm = new LinkedHashMap<>();
            cm.put("given_difference_mm", Units.mToMm(given[0]));
            cm.put("given_axis_deg", Math.toDegrees(given[1]));
            List<Map<String, Object>> set = new ArrayList<>();
            c.settings().forEach((e, v) -> {
                Sectors s = stack.sectorsByIndex().get(e);
                Map<String, Object> sm = new LinkedHashMap<>();
                sm.put("electrode", stack.names().get(e));
                sm.put("add_quad_0_V", v[0]);
                sm.put("add_quad_45_V", v[1]);
                List<Double> p0 = Stigmation.pattern(s, 0);
                List<Double> p45 = Stigmation.pattern(s, 45);
                List<Double> b = new ArrayList<>();
                for (int i = 0; i < s.count(); i++) {
                    b.add(s.biases_V().get(i) + v[0] * p0.get(i) + v[1] * p45.get(i));
                }
                sm.put("sector_biases_V", b);
                set.add(sm);
            });
            cm.put("settings", set);
            cm.put("residual_difference_mm", Units.mToMm(2 * c.residual().magnitude()));
            m.put("cancel", cm);
        }
        out.put("stigmation", m);
    }

    /** The stored biases' amplitude of one quadrupole pattern (projection on cos 2 theta_s or sin 2 theta_s), V. */
    private static Double projection(Sectors s, int deg) {
        List<Double> p = Stigmation.pattern(s, deg);
        double num = 0;
        double den = 0;
        for (int i = 0; i < s.count(); i++) {
            num += s.biases_V().get(i) * p.get(i);
            den += p.get(i) * p.get(i);
        }
        return den > 1e-12 ? num / den : null;
    }

    private static Double mm(double m) {
        return finite(Units.mToMm(m));
    }

    private static Double finite(double x) {
        return Double.isFinite(x) ? x : null;
    }

    private static String f(Object v) {
        return v == null ? "n/a" : org.axistack.model.Numbers.text((Double) v);
    }

    /** An axis in degrees within (-90, 90] (axes are defined modulo 180 degrees). */
    private static double axisDeg(double rad) {
        double d = Math.toDegrees(rad);
        return d <= -90 + 1e-9 ? d + 180 : d;
    }

    /** Text lines for the stigmation key, if present. */
    @SuppressWarnings("unchecked")
    static void print(PrintWriter w, Map<String, Object> out) {
        if (!(out.get("stigmation") instanceof Map<?, ?> raw)) {
            return;
        }
        Map<String, Object> m = (Map<String, Object>) raw;
        boolean image = m.containsKey("image_x_z_mm");
        w.println("  stigmators (" + m.get("method") + "; astigmatism of the " + m.get("astigmatism_of") + "):");
        w.println("    at the stored biases: focal length x " + f(m.get("focal_length_x_mm")) + " mm, y "
                + f(m.get("focal_length_y_mm")) + " mm; focal point x at z = " + f(m.get("focal_point_x_z_mm"))
                + " mm, y at z = " + f(m.get("focal_point_y_z_mm")) + " mm");
        if (image) {
            w.println("    image of the object: x at z = " + f(m.get("image_x_z_mm")) + " mm, y at z = "
                    + f(m.get("image_y_z_mm")) + " mm");
        }
        w.println("    astigmatic difference " + f(m.get("astigmatic_difference_mm")) + " mm" + (m.get(
                "astigmatism_axis_deg") == null ? " (none)" : " (rays in the plane at " + f(m.get("astigmatism_axis_deg"))
                        + " deg from x focus farther downstream)"));
        for (Map<String, Object> s : (List<Map<String, Object>>) m.get("stigmators")) {
            w.println("    " + s.get("electrode") + " (" + s.get("sectors") + " sectors), per volt of its quadrupole"
                    + " patterns (sector s at V cos 2theta_s, 0 deg; V sin 2theta_s, 45 deg):");
            for (Map<String, Object> p : (List<Map<String, Object>>) s.get("patterns")) {
                if (!Boolean.TRUE.equals(p.get("present"))) {
                    w.println("      " + p.get("pattern_deg") + " deg: none (these sectors cannot make this pattern's"
                            + " quadrupole)");
                    continue;
                }
                w.println("      " + p.get("pattern_deg") + " deg: astigmatic difference " + f(p.get(
                        "astigmatic_difference_mm_per_V")) + " mm/V, axis " + f(p.get("axis_deg")) + " deg; x shift "
                        + f(p.get("shift_x_mm_per_V")) + " mm/V, y shift " + f(p.get("shift_y_mm_per_V")) + " mm/V");
            }
        }
        if (m.get("cancel") instanceof Map<?, ?> craw) {
            Map<String, Object> c = (Map<String, Object>) craw;
            w.println("    to cancel " + f(c.get("given_difference_mm")) + " mm of astigmatism along "
                    + f(c.get("given_axis_deg")) + " deg (least total bias):");
            for (Map<String, Object> s : (List<Map<String, Object>>) c.get("settings")) {
                w.println("      " + s.get("electrode") + ": add " + f(s.get("add_quad_0_V")) + " V of the 0-deg and "
                        + f(s.get("add_quad_45_V")) + " V of the 45-deg pattern; sector biases then "
                        + list((List<Double>) s.get("sector_biases_V")) + " V");
            }
            w.println("      left: " + f(c.get("residual_difference_mm")) + " mm");
        }
    }

    private static String list(List<Double> v) {
        List<String> s = new ArrayList<>();
        for (double x : v) {
            s.add(org.axistack.model.Numbers.trimZeros(org.axistack.model.Numbers.general(x,
                    org.axistack.model.Numbers.BIAS_DIGITS)));
        }
        return "[" + String.join(", ", s) + "]";
    }
}
