package org.axistack.size;

import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import org.axistack.model.Electrode;

/**
 * One focusing design: a geometry of the family and a bias that meets the focusing condition, with its scores.
 * SI units. For a finite object the aberration coefficients are the object-side ones (Cs_o, Cc_o of
 * {@link org.axistack.optics.Aberrations}), for a parallel beam the image-side ones.
 *
 * @param family          the family
 * @param parameters_m    sizing parameters, m, in family order
 * @param dimensions_m    machining dimensions, m
 * @param electrodes      the electrodes at their biases
 * @param bias_V          bias of the family's biased electrode, V
 * @param imageZ_m        real image: where the object's axial ray, traced in the full field, crosses the axis (for a
 *                        parallel beam the real crossing of the ray entering parallel), m
 * @param focalLength_m   image-side focal length f2, m
 * @param magnification   lateral magnification (NaN for a parallel beam)
 * @param spherical_m     Cs, m
 * @param chromatic_m     Cc, m
 * @param maxSurfaceField_V_per_m largest electrode surface field, V/m
 * @param length_m        overall stack length, m
 * @param checks          every limit with the design's value (broken or not)
 * @param unknowns        boundary-element unknowns of the solve behind it
 * @param opticsError     estimated relative error of the cardinal elements (of f)
 * @param planWarnings    what {@code plan} on the written design warns of about its optics' accuracy and its gaps
 *                        (the same words: error estimate above the default accuracy, an open lens whose far field
 *                        matters, a gap above the default gap rule); empty when plan has nothing to say there
 */
public record Design(Family family, List<Double> parameters_m, Map<String, Double> dimensions_m,
        List<Electrode> electrodes, double bias_V, double imageZ_m, double focalLength_m, double magnification,
        double spherical_m, double chromatic_m, double maxSurfaceField_V_per_m, double length_m,
        List<Violation> checks, int unknowns, double opticsError, List<String> planWarnings) {

    public Design {
        parameters_m = List.copyOf(parameters_m);
        dimensions_m = Collections.unmodifiableMap(new LinkedHashMap<>(dimensions_m));
        electrodes = List.copyOf(electrodes);
        checks = List.copyOf(checks);
        planWarnings = List.copyOf(planWarnings);
    }

    public double maxAbsBias_V() {
        return Math.abs(bias_V);
    }

    public boolean feasible() {
        return checks.stream().noneMatch(Violation::broken);
    }

    /** Sum of the relative excesses over broken limits (0 when feasible). */
    public double totalExcess() {
        return checks.stream().mapToDouble(v -> Math.max(0, v.excess())).sum();
    }

    public List<Violation> broken() {
        List<Violation> l = new ArrayList<>();
        for (Violation v : checks) {
            if (v.broken()) {
                l.add(v);
            }
        }
        return l;
    }

    public Violation check(Limit l) {
        return checks.stream().filter(v -> v.limit() == l).findFirst().orElseThrow();
    }

    /** Surface-field limit over the largest surface field (above 1 means room to spare). */
    public double fieldMargin() {
        return check(Limit.SURFACE_FIELD).allowed() / maxSurfaceField_V_per_m;
    }

    /** Decelerating when the biased electrode pushes the particle back (bias and charge of the same sign). */
    public boolean decelerating(int chargeSign) {
        return bias_V * chargeSign > 0;
    }
}
