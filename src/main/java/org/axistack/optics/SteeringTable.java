package org.axistack.optics;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import org.axistack.field.FieldSolution;
import org.axistack.field.SectorField;
import org.axistack.field.SolveProgress;
import org.axistack.model.Sectors;
import org.axistack.model.Stack;

/**
 * What the split electrodes of a stack do to the central ray, for a plan: at the screen (or the image-side
 * reference plane) and at every monitor plane, the offset per volt of each split electrode's x and y differential
 * bias, and the central ray at the stored sector biases with the beam's start offset and slopes. First order
 * ({@link SplitDeflection}); the dipole harmonic is solved once on the plan's mesh. Immutable.
 *
 * @param planeNames "screen" (or "image-side plane") then the monitors' labels
 * @param planes_m   the planes, m
 * @param zStart_m   where the central ray starts, m
 * @param perVolt    perVolt.get(p) one entry per split electrode (stack order) at plane p
 * @param names      split electrode names, stack order
 * @param sectors    their sector counts
 * @param ray        {x, y, x', y'} of the central ray at each plane, m and rad
 */
public record SteeringTable(List<String> planeNames, double[] planes_m, double zStart_m,
        List<List<SplitDeflection.PerVolt>> perVolt, List<String> names, List<Integer> sectors, double[][] ray) {

    public SteeringTable {
        planeNames = List.copyOf(planeNames);
        planes_m = planes_m.clone();
        perVolt = perVolt.stream().map(List::copyOf).toList();
        names = List.copyOf(names);
        sectors = List.copyOf(sectors);
        ray = ray.clone();
    }

    /**
     * The table of a stack with split electrodes.
     *
     * @param solution the round solution of the stack's geometry
     * @param optics   the round optics at the stack's biases
     * @throws IllegalArgumentException if the stack has no split electrode
     */
    public static SteeringTable of(Stack stack, FieldSolution solution, ParaxialOptics optics, SolveProgress progress) {
        if (!stack.hasSectors()) {
            throw new IllegalArgumentException("the stack has no split electrode");
        }
        Map<Integer, Sectors> byIndex = new LinkedHashMap<>();
        Map<Integer, List<Double>> biases = new LinkedHashMap<>();
        for (String n : stack.names()) {
            Sectors s = stack.sectors().get(n);
            if (s != null) {
                byIndex.put(stack.indexOf(n), s);
                biases.put(stack.indexOf(n), s.biases_V());
            }
        }
        double zStart = stack.beam().startZ_m().orElse(optics.zStart_m());
        List<String> labels = new ArrayList<>();
        List<Double> zs = new ArrayList<>();
        labels.add(stack.screenZ_m().isPresent() ? "screen" : "image-side plane");
        zs.add(stack.screenZ_m().orElse(optics.zEnd_m()));
        for (int i = 0; i < stack.monitors().size(); i++) {
            labels.add(stack.monitorLabel(i));
            zs.add(stack.monitors().get(i).z_m());
        }
        double[] planes = zs.stream().mapToDouble(Double::doubleValue).toArray();
        SectorField field = SectorField.solve(solution, byIndex, 1, progress);
        SplitDeflection d = SplitDeflection.of(field, optics, zStart, planes);
        List<List<SplitDeflection.PerVolt>> per = new ArrayList<>();
        double[][] ray = new double[planes.length][];
        for (int p = 0; p < planes.length; p++) {
            List<SplitDeflection.PerVolt> row = new ArrayList<>();
            for (int e : d.electrodes()) {
                row.add(d.perVolt(p, e));
            }
            per.add(row);
            ray[p] = d.ray(p, biases, stack.beam().startRay());
        }
        List<String> names = new ArrayList<>();
        List<Integer> counts = new ArrayList<>();
        for (int e : d.electrodes()) {
            names.add(stack.electrodes().get(e).name());
            counts.add(byIndex.get(e).count());
        }
        return new SteeringTable(labels, planes, zStart, per, names, counts, ray);
    }
}
