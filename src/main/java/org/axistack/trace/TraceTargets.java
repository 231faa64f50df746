package org.axistack.trace;

import java.util.Arrays;
import java.util.List;

/**
 * Where rays are observed and where they end.
 *
 * @param planes_m  observation planes, m, in increasing order (may be empty)
 * @param screenZ_m the end plane (screen), m: a ray reaching it stops there
 */
public record TraceTargets(List<Double> planes_m, double screenZ_m) {

    public TraceTargets {
        planes_m = List.copyOf(planes_m);
        if (!Double.isFinite(screenZ_m)) {
            throw new IllegalArgumentException("screen position must be finite");
        }
        for (double z : planes_m) {
            if (!Double.isFinite(z)) {
                throw new IllegalArgumentException("plane positions must be finite");
            }
        }
        double[] sorted = planes_m.stream().mapToDouble(Double::doubleValue).sorted().toArray();
        planes_m = Arrays.stream(sorted).boxed().toList();
    }

    public static TraceTargets screenOnly(double screenZ_m) {
        return new TraceTargets(List.of(), screenZ_m);
    }
}
