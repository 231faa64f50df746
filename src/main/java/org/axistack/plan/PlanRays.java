package org.axistack.plan;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;

import org.axistack.field.BiasedField;
import org.axistack.model.Units;
import org.axistack.model.Beam;
import org.axistack.model.Stack;
import org.axistack.trace.BundleResult;
import org.axistack.trace.BundleTracer;
import org.axistack.trace.ElectrodeGeometry;
import org.axistack.trace.FieldMap;
import org.axistack.trace.RaySets;
import org.axistack.trace.RayStart;
import org.axistack.trace.TraceProgress;
import org.axistack.trace.TraceSettings;
import org.axistack.trace.TraceTargets;
import org.axistack.trace.Tracer;
import org.axistack.trace.Trajectory;

/**
 * A small meridional fan of exact rays for the plan's geometry picture: parallel rays at 10..50% of the smallest
 * bore (object at infinity) or a fan from the object point filling about half the bore at the lens, traced from
 * the beam start to the stack's right end in the same field model as the trace command.
 */
final class PlanRays {

    record Fan(List<Trajectory> rays, String note) {
    }

    private PlanRays() {
    }

    static Fan trace(Stack stack, BiasedField biased) {
        Beam beam = stack.beam();
        ElectrodeGeometry geometry = ElectrodeGeometry.of(stack);
        double bore = stack.openBore_m();
        // rays stop where the beam lands: the screen when the stack has one, else the stack's right end
        double endZ = stack.screenZ_m().orElse(stack.maxZ_m());
        boolean fromObject = beam.objectZ_m().isPresent() && beam.objectZ_m().getAsDouble() < endZ;
        double startZ = fromObject ? beam.objectZ_m().getAsDouble() : beam.startZ_m().orElse(stack.minZ_m());
        List<RayStart> starts = new ArrayList<>();
        int id = 0;
        String what;
        if (fromObject) {
            double centre = 0.5 * (stack.minZ_m() + stack.maxZ_m());
            double dist = Math.max(centre - startZ, bore);
            double maxSlope = 0.5 * bore / dist;
            for (int i = -4; i <= 4; i++) {
                starts.add(RayStart.withSlopes(id++, 0, 0, startZ, maxSlope * i / 4, 0, beam.energy_eV()));
            }
            what = String.format(Locale.ROOT, "9 rays from the object point at z = %s mm, slopes up to +-%s mrad",
                    PlanFormat.num(Units.mToMm(startZ)), PlanFormat.num(Units.radToMrad(maxSlope)));
        } else {
            List<Double> heights = PlanAnalysis.RAY_HEIGHTS_OF_BORE;
            for (double h : heights) {
                starts.add(RayStart.withSlopes(id++, -h * bore, 0, startZ, 0, 0, beam.energy_eV()));
                starts.add(RayStart.withSlopes(id++, h * bore, 0, startZ, 0, 0, beam.energy_eV()));
            }
            what = String.format(Locale.ROOT, "%d rays parallel to the axis at +-%s to %s %% of the smallest bore (%s mm), "
                    + "from z = %s mm", starts.size(), PlanFormat.num(100 * heights.get(0)),
                    PlanFormat.num(100 * heights.get(heights.size() - 1)), PlanFormat.num(Units.mToMm(bore)),
                    PlanFormat.num(Units.mToMm(startZ)));
        }
        TraceTargets targets = new TraceTargets(List.of(endZ), endZ);
        Tracer.checkTargets(geometry, targets);
        for (RayStart r : starts) {
            Tracer.checkPlacement(geometry, r, targets);
        }
        FieldMap map = FieldMap.forRays(biased, geometry, startZ, endZ, bore, FieldMap.defaultStep_m(bore),
                TraceProgress.none());
        Tracer tracer = new Tracer(map, geometry, TraceSettings.defaults().withRecordPath(true));
        BundleResult res = BundleTracer.perCore(tracer).trace(RaySets.of(beam.particle(), starts, what), targets,
                TraceProgress.none());
        Map<String, Integer> ends = new TreeMap<>();
        for (Trajectory t : res.trajectories()) {
            ends.merge(t.statusLabel(), 1, Integer::sum);
        }
        return new Fan(res.trajectories(), what + "; exact relativistic rays (Dormand-Prince, near-axis series plus a "
                + "mapped remainder, as in the trace command); " + endings(ends, stack.screenZ_m().isPresent()));
    }

    /** How the rays ended, in words ("all 10 reached the screen", "8 reached the screen, 2 hit electrode focus"). */
    static String endings(Map<String, Integer> ends, boolean screen) {
        int total = ends.values().stream().mapToInt(Integer::intValue).sum();
        List<String> parts = new ArrayList<>();
        for (Map.Entry<String, Integer> e : ends.entrySet()) {
            String label = e.getKey();
            String what;
            if (label.equals("screen")) {
                what = screen ? "reached the screen" : "reached the end of the stack";
            } else if (label.startsWith("hit:")) {
                what = "hit electrode " + label.substring(4);
            } else if (label.equals("reflected")) {
                what = "turned back (reflected)";
            } else if (label.equals("left_region")) {
                what = "left the field region";
            } else if (label.equals("step_limit")) {
                what = "stopped at the integrator's step limit";
            } else {
                what = "ended as " + label;
            }
            parts.add((ends.size() == 1 && e.getValue() == total && total > 1 ? "all " : "") + e.getValue() + " " + what);
        }
        return parts.isEmpty() ? "no rays traced" : String.join(", ", parts);
    }
}
