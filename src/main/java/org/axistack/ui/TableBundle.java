package org.axistack.ui;

import java.util.ArrayList;
import java.util.List;

import org.axistack.field.BiasedField;
import org.axistack.model.Stack;
import org.axistack.trace.BundleResult;
import org.axistack.trace.BundleTracer;
import org.axistack.trace.ElectrodeGeometry;
import org.axistack.trace.FieldMap;
import org.axistack.trace.RaySet;
import org.axistack.trace.RaySets;
import org.axistack.trace.TraceProgress;
import org.axistack.trace.TraceSettings;
import org.axistack.trace.TraceTargets;
import org.axistack.trace.Tracer;

/**
 * The bundle behind the window's trajectory table: the same field and tracer as {@code trace} with its
 * defaults (a uniform disk of 100 parallel rays over 40 % of the narrowest bore from the beam start; near-axis
 * series of the solver's axial expansion plus a field map of the remainder with its measured error; tolerance 1e-11), observed at the lens
 * centre and at the screen.
 */
public final class TableBundle {

    /** Rays in the table bundle. */
    public static final int RAYS = 100;

    private TableBundle() {
    }

    /**
     * Traces the bundle.
     *
     * @throws java.util.concurrent.CancellationException when progress asks to stop
     */
    public static BundleResult trace(Stack stack, BiasedField field, TraceProgress progress) {
        ElectrodeGeometry geometry = ElectrodeGeometry.of(stack);
        double bore = stack.openBore_m();
        double start = stack.beam().startZ_m().orElse(stack.minZ_m());
        double screen = stack.screenZ_m().orElse(stack.maxZ_m());
        List<Double> planes = new ArrayList<>();
        double centre = 0.5 * (stack.minZ_m() + stack.maxZ_m());
        if (centre > start && centre < screen) {
            planes.add(centre);
        }
        planes.add(screen);
        TraceTargets targets = new TraceTargets(planes, screen);
        RaySet rays = RaySets.uniformDisk(stack.beam().particle(), stack.beam().energy_eV(), start, 0.4 * bore, RAYS, 1);
        FieldMap map = FieldMap.forRays(field, geometry, start, screen, bore, FieldMap.defaultStep_m(bore), progress);
        Tracer tracer = new Tracer(map, geometry, TraceSettings.defaults());
        return BundleTracer.perCore(tracer).trace(rays, targets, progress);
    }
}
