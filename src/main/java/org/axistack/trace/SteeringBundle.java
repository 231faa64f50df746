package org.axistack.trace;

import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.stream.IntStream;

import org.axistack.field.BiasedField;
import org.axistack.field.SectorField;
import org.axistack.model.Beam;
import org.axistack.model.StartRay;
import org.axistack.optics.SteeringSolve;

/**
 * The steering found by {@link SteeringSolve} checked by exact rays in the three-dimensional field
 * ({@link SteeredRays}): the central ray from its start offset and slopes with the sector biases found, and four
 * rays around it (offset by +-a in x and in y at the start, parallel to it). The same four offsets around the axis
 * are traced through the lens without steering (every sector at its electrode's common bias, the beam on the
 * axis); the deflection aberration at a plane is the RMS change of the bundle's pattern relative to its central
 * ray between the two, sqrt(mean |(r_i - r_c) - r_i,round|^2): zero for a perfect deflector in a perfect lens; it
 * gathers the deflection field's own aberrations and the off-axis aberrations of the round lens that the steered
 * beam passes off its axis. Immutable.
 *
 * @param radius_m       bundle radius a at the start, m
 * @param planes_m       the steering solve's planes (targets first, then monitors), m
 * @param central        exact {x, y, x', y'} of the central ray at each plane, m and rad
 * @param firstOrderMiss distance between the exact central ray and the first-order one at each plane, m
 * @param growth_m       deflection aberration (RMS pattern change) at each plane, m
 * @param spot_m         RMS radius of the steered bundle about its central ray at each plane, m
 * @param roundSpot_m    RMS radius of the unsteered bundle at each plane, m
 * @param energyError    largest relative change of the total energy along any ray
 * @param seconds        wall-clock seconds of all traces
 */
public record SteeringBundle(double radius_m, double[] planes_m, double[][] central, double[] firstOrderMiss,
        double[] growth_m, double[] spot_m, double[] roundSpot_m, double energyError, double seconds) {

    /** Relative tolerance of the exact traces. */
    public static final double TOLERANCE = 1e-10;

    /**
     * Traces the central ray and the bundles.
     *
     * @param round  the round field at the electrodes' common biases
     * @param field  the solved harmonics (the more harmonics, the closer the field off the axis)
     * @param zStart where the central ray starts, m
     * @param a      bundle radius, m
     * @param bore   the narrowest bore, m
     */
    public static SteeringBundle trace(BiasedField round, SectorField field, SteeringSolve solve, Beam beam,
            double zStart, double a, double bore) {
        long t0 = System.nanoTime();
        double[] planes = solve.planes_m();
        double[] sorted = Arrays.stream(planes).distinct().sorted().toArray();
        int[] at = new int[planes.length];
        for (int p = 0; p < planes.length; p++) {
            at[p] = Arrays.binarySearch(sorted, planes[p]);
        }
        Map<Integer, List<Double>> biases = new LinkedHashMap<>();
        solve.after().forEach((e, s) -> biases.put(e, s.biases_V()));
        SteeredRays steered = new SteeredRays(round, field, biases, beam.particle(), beam.energyPerCharge_V(), bore,
                TOLERANCE);
        SteeredRays plain = steered.withSectorBiases(Map.of());
        StartRay s = beam.startRay();
        double[][] offsets = {{0, 0}, {a, 0}, {-a, 0}, {0, a}, {0, -a}};
        double[][][] runs = new double[2 * offsets.length - 1][][];
        IntStream.range(0, runs.length).parallel().forEach(i -> {
            if (i < offsets.length) {
                double[] st = {s.x_m() + offsets[i][0], s.y_m() + offsets[i][1], s.slopeX_rad(), s.slopeY_rad()};
                runs[i] = steered.trace(zStart, st, sorted);
            } else {
                double[] o = offsets[i - offsets.length + 1];
                runs[i] = plain.trace(zStart, new double[] {o[0], o[1], 0, 0}, sorted);
            }
        });
        double worst = 0;
        for (double[][] r : runs) {
            worst = Math.max(worst, r[sorted.length][0]);
        }
        double[][] central = new double[planes.length][];
        double[] miss = new double[planes.length];
        double[] growth = new double[planes.length];
        double[] spot = new double[planes.length];
        double[] roundSpot = new double[planes.length];
        for (int p = 0; p < planes.length; p++) {
            double[] c = runs[0][at[p]];
            central[p] = c.clone();
            double[] fo = solve.rayAfter(p);
            miss[p] = Math.hypot(c[0] - fo[0], c[1] - fo[1]);
            double g = 0;
            double sp = 0;
            double rs = 0;
            for (int i = 1; i < offsets.length; i++) {
                double[] r = runs[i][at[p]];
                double[] q = runs[offsets.length + i - 1][at[p]];
                double dx = r[0] - c[0];
                double dy = r[1] - c[1];
                g += (dx - q[0]) * (dx - q[0]) + (dy - q[1]) * (dy - q[1]);
                sp += dx * dx + dy * dy;
                rs += q[0] * q[0] + q[1] * q[1];
            }
            int n = offsets.length - 1;
            growth[p] = Math.sqrt(g / n);
            spot[p] = Math.sqrt(sp / n);
            roundSpot[p] = Math.sqrt(rs / n);
        }
        return new SteeringBundle(a, planes, central, miss, growth, spot, roundSpot, worst,
                (System.nanoTime() - t0) * 1e-9);
    }
}
