package org.axistack.ui;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import org.axistack.model.PhysicsException;
import org.axistack.field.AxialField;
import org.axistack.model.Units;
import org.axistack.model.Beam;
import org.axistack.model.Stack;
import org.axistack.report.LensChart;
import org.axistack.trace.ElectrodeGeometry;
import org.axistack.trace.NearAxisField;
import org.axistack.trace.RayPoint;
import org.axistack.trace.RaySet;
import org.axistack.trace.RaySets;
import org.axistack.trace.RayStart;
import org.axistack.trace.TraceSettings;
import org.axistack.trace.TraceStatus;
import org.axistack.trace.TraceTargets;
import org.axistack.trace.Tracer;
import org.axistack.trace.Trajectory;

/**
 * The few rays drawn while a bias moves: a meridional fan from the beam's object point when the stack has
 * one (and it lies in the traced region), otherwise rays parallel to the axis at fixed fractions of the
 * narrowest bore (traced above the axis, drawn on both sides). They are exact (Lorentz-force, Dormand-Prince 8(5,3)) rays in the
 * near-axis series field of the axial potential ({@link NearAxisField}, terms to r^6), which is what makes
 * them cheap enough to redraw live; the series' truncation error grows like (r / bore)^8, so rays close to
 * the electrodes are drawn less accurately than the bundle of the trajectory table, which uses the
 * measured-error field map.
 */
public final class LiveRays {

    /** Fractions of the narrowest bore at which parallel rays start. */
    static final double[] HEIGHTS = org.axistack.plan.PlanAnalysis.RAY_HEIGHTS_OF_BORE.stream()
            .mapToDouble(Double::doubleValue).toArray(); // the same rays as the report's figure
    /** Rays in the object-point fan. */
    static final int FAN_RAYS = 9;

    /** Relative tolerance of the live rays: a drawing, so looser than the trajectory table's 1e-11. */
    static final double RAY_TOLERANCE = 1e-7;

    private LiveRays() {
    }

    /**
     * The traced rays and how they were made.
     *
     * @param trajectories every ray with its recorded path
     * @param note         what the rays are, in words
     */
    public record Result(List<Trajectory> trajectories, String note) {
        public Result {
            trajectories = List.copyOf(trajectories);
        }

        /** Rays that reached the end plane, as lines (z, x) in mm. */
        public LensChart.Lines kept() {
            return lines(true);
        }

        /** Rays that hit, turned back or left, as lines in mm. */
        public LensChart.Lines lost() {
            return lines(false);
        }

        private LensChart.Lines lines(boolean reached) {
            LensChart.LinesBuilder b = new LensChart.LinesBuilder();
            for (Trajectory t : trajectories) {
                if ((t.status() == TraceStatus.SCREEN) != reached) {
                    continue;
                }
                for (double sign : mirror(t)) {
                    for (RayPoint p : t.path()) {
                        b.add(Units.mToMm(p.z_m()), sign * Units.mToMm(p.x_m()));
                    }
                    b.add(Units.mToMm(t.end().z_m()), sign * Units.mToMm(t.end().x_m()));
                    b.breakLine();
                }
            }
            return b.build();
        }
    }

    /**
     * Parallel rays start above the axis and are drawn mirrored too (the field is axially symmetric, so the
     * ray from -h is the mirror image of the ray from +h); fan rays are drawn as traced.
     */
    private static double[] mirror(Trajectory t) {
        return t.start().dirX() == 0 ? new double[] {1, -1} : new double[] {1};
    }

    /** The rays' start set for a stack. */
    static RaySet raySet(Stack stack, ElectrodeGeometry geometry, TraceTargets targets) {
        Beam beam = stack.beam();
        double bore = stack.openBore_m();
        if (beam.objectZ_m().isPresent()) {
            double z0 = beam.objectZ_m().getAsDouble();
            double distance = Math.max(stack.minZ_m() - z0, bore);
            RaySet fan = RaySets.pointFan(beam.particle(), beam.energy_eV(), z0, 0,
                    Math.atan(0.5 * bore / distance), FAN_RAYS, 1);
            if (placeable(geometry, fan, targets)) {
                return fan;
            }
        }
        double z0 = beam.startZ_m().orElse(stack.minZ_m());
        List<RayStart> rays = new ArrayList<>();
        for (double h : HEIGHTS) {
            rays.add(new RayStart(rays.size() + 1, h * bore, 0, z0, 0, 0, 1, beam.energy_eV()));
        }
        return RaySets.of(beam.particle(), rays, String.format(Locale.ROOT,
                "parallel rays at %s to %s of the %s mm bore", pct(HEIGHTS[0]), pct(HEIGHTS[HEIGHTS.length - 1]),
                UiFormat.num(Units.mToMm(bore))));
    }

    private static boolean placeable(ElectrodeGeometry g, RaySet set, TraceTargets targets) {
        try {
            for (RayStart r : set.rays()) {
                Tracer.checkPlacement(g, r, targets);
            }
            return true;
        } catch (IllegalArgumentException | PhysicsException e) {
            return false;
        }
    }

    private static String pct(double f) {
        return Math.round(f * 100) + " %";
    }

    /** Traces the live rays through the near-axis series of the axial field, to the stack's screen (or right end). */
    public static Result trace(Stack stack, AxialField axial) {
        ElectrodeGeometry geometry = ElectrodeGeometry.of(stack);
        double screen = stack.screenZ_m().orElse(stack.maxZ_m());
        TraceTargets targets = TraceTargets.screenOnly(screen);
        RaySet set = raySet(stack, geometry, targets);
        Tracer tracer = new Tracer(new NearAxisField(axial), geometry,
                TraceSettings.defaults().withRelativeTolerance(RAY_TOLERANCE).withRecordPath(true));
        List<Trajectory> out = new ArrayList<>();
        String problem = "";
        for (RayStart r : set.rays()) {
            try {
                out.add(tracer.trace(set.particle(), r, targets));
            } catch (IllegalArgumentException | PhysicsException e) {
                problem = "; a ray could not start: " + e.getMessage();
            }
        }
        return new Result(out, set.description() + " (exact rays in the near-axis series field)" + problem);
    }
}
