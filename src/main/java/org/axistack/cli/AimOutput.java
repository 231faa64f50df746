package org.axistack.cli;

import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import org.axistack.model.Numbers;
import org.axistack.model.Units;
import org.axistack.model.Sectors;
import org.axistack.model.Stack;
import org.axistack.model.StartRay;
import org.axistack.optics.SplitDeflection;
import org.axistack.optics.SteeringSolve;
import org.axistack.optics.SteeringSolve.Target;
import org.axistack.trace.SteeringBundle;
import org.axistack.tune.BiasRange;

/** The steering result as a map (JSON keys, snake_case with units) and as text. */
final class AimOutput {

    private AimOutput() {
    }

    static Map<String, Object> map(String shownAs, Stack stack, SteeringSolve solve, List<Target> targets,
            BiasRange range, double zStart, SteeringBundle bundle) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("stack", shownAs);
        StartRay s = stack.beam().startRay();
        Map<String, Object> start = new LinkedHashMap<>();
        start.put("z_mm", Units.mToMm(zStart));
        start.put("x_mm", Units.mToMm(s.x_m()));
        start.put("y_mm", Units.mToMm(s.y_m()));
        start.put("slope_x_mrad", Units.radToMrad(s.slopeX_rad()));
        start.put("slope_y_mrad", Units.radToMrad(s.slopeY_rad()));
        m.put("start", start);
        List<Map<String, Object>> tg = new ArrayList<>();
        for (Target t : targets) {
            Map<String, Object> x = new LinkedHashMap<>();
            x.put("z_mm", Units.mToMm(t.z_m()));
            x.put("x_mm", Units.mToMm(t.x_m()));
            x.put("y_mm", Units.mToMm(t.y_m()));
            if (t.slopes()) {
                x.put("slope_x_mrad", Units.radToMrad(t.slopeX_rad()));
                x.put("slope_y_mrad", Units.radToMrad(t.slopeY_rad()));
            }
            tg.add(x);
        }
        m.put("targets", tg);
        m.put("method", "first order in the sector biases: linear solve on the unit responses of the dipole harmonic"
                + " (central ray by variation of constants on the round lens)");
        m.put("supply_range_V", List.of(range.from_V(), range.to_V()));
        boolean within = true;
        List<Map<String, Object>> st = new ArrayList<>();
        for (int i = 0; i < solve.steerers().size(); i++) {
            int e = solve.steerers().get(i);
            String name = stack.electrodes().get(e).name();
            Sectors before = stack.sectors().get(name);
            Sectors after = solve.after().get(e);
            Map<String, Object> x = new LinkedHashMap<>();
            x.put("electrode", name);
            x.put("sectors", after.count());
            x.put("x_bias_change_V", solve.changeX_V(i));
            x.put("y_bias_change_V", solve.changeY_V(i));
            x.put("x_bias_V", after.xDifferential_V());
            x.put("y_bias_V", after.yDifferential_V());
            x.put("common_bias_V", after.common_V());
            x.put("sector_biases_before_V", before.biases_V());
            x.put("sector_biases_V", after.biases_V());
            List<Double> margins = new ArrayList<>();
            double least = Double.POSITIVE_INFINITY;
            for (double b : after.biases_V()) {
                double mg = Math.min(b - range.from_V(), range.to_V() - b);
                margins.add(mg);
                least = Math.min(least, mg);
            }
            x.put("supply_margin_V", margins);
            x.put("least_margin_V", least);
            within &= least >= 0;
            st.add(x);
        }
        m.put("steerers", st);
        m.put("within_supply_range", within);
        m.put("relative_singular_value", solve.relativeSingularValue());
        double[] planes = solve.planes_m();
        List<Map<String, Object>> rows = new ArrayList<>();
        for (int p = 0; p < planes.length; p++) {
            Map<String, Object> x = new LinkedHashMap<>();
            x.put("plane", p < targets.size() ? "target " + (p + 1) : stack.monitorLabel(p - targets.size()));
            x.put("z_mm", Units.mToMm(planes[p]));
            double[] b = solve.rayBefore(p);
            double[] a = solve.rayAfter(p);
            x.put("before_x_mm", Units.mToMm(b[0]));
            x.put("before_y_mm", Units.mToMm(b[1]));
            x.put("x_mm", Units.mToMm(a[0]));
            x.put("y_mm", Units.mToMm(a[1]));
            x.put("slope_x_mrad", Units.radToMrad(a[2]));
            x.put("slope_y_mrad", Units.radToMrad(a[3]));
            List<Map<String, Object>> per = new ArrayList<>();
            for (int e : solve.steerers()) {
                SplitDeflection.PerVolt pv = solve.deflection().perVolt(p, e);
                Map<String, Object> q = new LinkedHashMap<>();
                q.put("electrode", stack.electrodes().get(e).name());
                q.put("x_bias_offset_x_mm_per_V", Units.mToMm(pv.xPerVx_m()));
                q.put("x_bias_offset_y_mm_per_V", Units.mToMm(pv.yPerVx_m()));
                q.put("y_bias_offset_x_mm_per_V", Units.mToMm(pv.xPerVy_m()));
                q.put("y_bias_offset_y_mm_per_V", Units.mToMm(pv.yPerVy_m()));
                per.add(q);
            }
            x.put("per_volt", per);
            if (bundle != null) {
                x.put("exact_x_mm", Units.mToMm(bundle.central()[p][0]));
                x.put("exact_y_mm", Units.mToMm(bundle.central()[p][1]));
                x.put("exact_minus_first_order_mm", Units.mToMm(bundle.firstOrderMiss()[p]));
                x.put("deflection_aberration_mm", Units.mToMm(bundle.growth_m()[p]));
                x.put("bundle_rms_radius_mm", Units.mToMm(bundle.spot_m()[p]));
                x.put("unsteered_bundle_rms_radius_mm", Units.mToMm(bundle.roundSpot_m()[p]));
            }
            rows.add(x);
        }
        m.put("planes", rows);
        if (bundle != null) {
            m.put("bundle_radius_mm", Units.mToMm(bundle.radius_m()));
            m.put("exact_trace", "relativistic rays in the round field plus the split electrodes' harmonics 1 to "
                    + AimCommand.EXACT_ORDER + " by element sums; four rays at +-bundle radius in x and y around the"
                    + " central ray, against the same offsets through the unsteered lens");
            m.put("energy_conservation", bundle.energyError());
            m.put("trace_seconds", bundle.seconds());
        }
        return m;
    }

    @SuppressWarnings("unchecked")
    static void text(PrintWriter w, Stack stack, Map<String, Object> m) {
        w.println("Steering of " + stack.title() + " (" + m.get("stack") + ")");
        Map<String, Object> s = (Map<String, Object>) m.get("start");
        w.println("Central ray starts at z = " + n(s.get("z_mm")) + " mm, x = " + n(s.get("x_mm")) + " mm, y = "
                + n(s.get("y_mm")) + " mm, slopes " + n(s.get("slope_x_mrad")) + ", " + n(s.get("slope_y_mrad"))
                + " mrad");
        for (Map<String, Object> t : (List<Map<String, Object>>) m.get("targets")) {
            w.println("Target: at z = " + n(t.get("z_mm")) + " mm, x = " + n(t.get("x_mm")) + " mm, y = "
                    + n(t.get("y_mm")) + " mm" + (t.containsKey("slope_x_mrad") ? ", slopes " + n(t.get("slope_x_mrad"))
                    + ", " + n(t.get("slope_y_mrad")) + " mrad" : ""));
        }
        w.println("Method: " + m.get("method") + ".");
        List<Double> r = (List<Double>) m.get("supply_range_V");
        w.println();
        w.println("Biases found (each sector supply reaches " + n(r.get(0)) + " to " + n(r.get(1)) + " V):");
        for (Map<String, Object> x : (List<Map<String, Object>>) m.get("steerers")) {
            w.println("  " + x.get("electrode") + " (" + x.get("sectors") + " sectors): x bias " + n(x.get("x_bias_V"))
                    + " V (change " + n(x.get("x_bias_change_V")) + "), y bias " + n(x.get("y_bias_V")) + " V (change "
                    + n(x.get("y_bias_change_V")) + "), common " + n(x.get("common_bias_V")) + " V");
            List<Double> b = (List<Double>) x.get("sector_biases_V");
            List<Double> mg = (List<Double>) x.get("supply_margin_V");
            StringBuilder sb = new StringBuilder("    sector biases V (margin to the supply range V):");
            for (int i = 0; i < b.size(); i++) {
                sb.append(' ').append(i + 1).append(": ").append(n(b.get(i))).append(" (").append(n(mg.get(i)))
                        .append(')');
            }
            w.println(sb);
        }
        if (Boolean.FALSE.equals(m.get("within_supply_range"))) {
            w.println("  OUTSIDE THE SUPPLY RANGE: a negative margin is beyond what the supply reaches.");
        }
        w.println();
        w.println("Central ray (first order) before and after, and per volt of each steerer's x and y bias:");
        for (Map<String, Object> x : (List<Map<String, Object>>) m.get("planes")) {
            w.println("  " + x.get("plane") + " at z = " + n(x.get("z_mm")) + " mm: before (" + n(x.get("before_x_mm"))
                    + ", " + n(x.get("before_y_mm")) + ") mm, after (" + n(x.get("x_mm")) + ", " + n(x.get("y_mm"))
                    + ") mm, slopes (" + n(x.get("slope_x_mrad")) + ", " + n(x.get("slope_y_mrad")) + ") mrad");
            for (Map<String, Object> q : (List<Map<String, Object>>) x.get("per_volt")) {
                w.println("    " + q.get("electrode") + ": per V of x bias (" + n(q.get("x_bias_offset_x_mm_per_V"))
                        + ", " + n(q.get("x_bias_offset_y_mm_per_V")) + ") mm, per V of y bias ("
                        + n(q.get("y_bias_offset_x_mm_per_V")) + ", " + n(q.get("y_bias_offset_y_mm_per_V")) + ") mm");
            }
            if (x.containsKey("exact_x_mm")) {
                w.println("    exact 3-D trace: (" + n(x.get("exact_x_mm")) + ", " + n(x.get("exact_y_mm")) + ") mm, "
                        + n(1000 * (Double) x.get("exact_minus_first_order_mm")) + " um from the first-order ray;"
                        + " deflection aberration " + n(1000 * (Double) x.get("deflection_aberration_mm"))
                        + " um RMS (bundle RMS radius " + n(1000 * (Double) x.get("bundle_rms_radius_mm"))
                        + " um steered, " + n(1000 * (Double) x.get("unsteered_bundle_rms_radius_mm")) + " um unsteered)");
            }
        }
        if (m.containsKey("exact_trace")) {
            w.println();
            w.println("Exact trace: " + m.get("exact_trace") + "; bundle radius " + n(m.get("bundle_radius_mm"))
                    + " mm; energy conserved to " + Numbers.estimate(
                            (Double) m.get("energy_conservation")) + "; " + String.format(java.util.Locale.ROOT,
                            "%.1f", (Double) m.get("trace_seconds")) + " s.");
        }
    }

    /** A number for the text; below 1e-12 (of a mm, mrad or V: rounding of an exact zero) shown as 0. */
    private static String n(Object x) {
        double v = ((Number) x).doubleValue();
        return PlanCommand.num(Math.abs(v) < 1e-12 ? 0 : v);
    }
}
