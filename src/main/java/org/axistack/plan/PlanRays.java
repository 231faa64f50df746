package org.axistack.plan;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;

import org.axistack.field.BiasedField;
import org.axistack.io.Units;
import org.axistack.model.Beam;
import org.axistack.model.Stack;
import org.axistack.trace.BundleResult;
import org.axistack.trace.BundleTracer;
import org.axistack.trace.ElectrodeGeometry;
import org.axistack.trace.FieldMap;
import org.axistack.trace.NearAxisField;
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
        double bore = stack.electrodes().stream().mapToDouble(e -> e.contour().minR_m()).filter(r -> r > 0).min()
                .orElse(1e-3);
        double endZ = stack.maxZ_m(); // the stack's right end, so the picture shows a focus beyond the screen too
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
            for (int i = -5; i <= 5; i++) {
                if (i != 0) {
                    starts.add(RayStart.withSlopes(id++, 0.1 * bore * i, 0, startZ, 0, 0, beam.energy_eV()));
                }
            }
            what = String.format(Locale.ROOT, "10 rays parallel to the axis at +-10..50%% of the smallest bore (%s mm), "
                    + "from z = %s mm", PlanFormat.num(Units.mToMm(bore)), PlanFormat.num(Units.mToMm(startZ)));
        }
        TraceTargets targets = new TraceTargets(List.of(endZ), endZ);
        Tracer.checkTargets(geometry, targets);
        for (RayStart r : starts) {
            Tracer.checkPlacement(geometry, r, targets);
        }
        double step = bore / 40;
        double z0 = Math.max(geometry.regionZMin_m(), Math.min(startZ, endZ) - 4 * step);
        double z1 = Math.min(geometry.regionZMax_m(), endZ + 4 * step);
        FieldMap map = new FieldMap(biased, new NearAxisField(biased), geometry, z0, z1, bore, step, TraceProgress.none());
        Tracer tracer = new Tracer(map, geometry, TraceSettings.defaults().withRecordPath(true));
        BundleResult res = BundleTracer.perCore(tracer).trace(RaySets.of(beam.particle(), starts, what), targets,
                TraceProgress.none());
        Map<String, Integer> ends = new TreeMap<>();
        for (Trajectory t : res.trajectories()) {
            ends.merge(t.statusLabel(), 1, Integer::sum);
        }
        return new Fan(res.trajectories(), what + "; exact relativistic rays (Dormand-Prince, near-axis series plus a "
                + "mapped remainder, as in the trace command); ended: " + ends);
    }
}
