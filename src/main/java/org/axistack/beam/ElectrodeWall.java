package org.axistack.beam;

import java.util.ArrayList;
import java.util.List;
import java.util.OptionalDouble;

import org.axistack.model.Electrode;
import org.axistack.model.Segment;
import org.axistack.model.ZR;

/**
 * The inner wall of one electrode as seen from the axis: at each z within the electrode's extent, the
 * smallest radius its meridian outline reaches there (arcs are followed as 32-piece polylines, which
 * misplaces an arc wall by at most 0.5 % of its radius).
 */
final class ElectrodeWall {

    private static final int ARC_PIECES = 32;

    private final Electrode electrode;
    private final List<double[]> pieces = new ArrayList<>();
    private final double zMin;
    private final double zMax;
    private final double bore;

    ElectrodeWall(Electrode electrode) {
        this.electrode = electrode;
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        double b = Double.POSITIVE_INFINITY;
        for (Segment s : electrode.contour().segments()) {
            int n = s instanceof Segment.Arc ? ARC_PIECES : 1;
            for (int k = 0; k < n; k++) {
                ZR a = s.at((double) k / n);
                ZR c = s.at((double) (k + 1) / n);
                pieces.add(new double[] {a.z_m(), a.r_m(), c.z_m(), c.r_m()});
                lo = Math.min(lo, Math.min(a.z_m(), c.z_m()));
                hi = Math.max(hi, Math.max(a.z_m(), c.z_m()));
                b = Math.min(b, Math.min(a.r_m(), c.r_m()));
            }
        }
        this.zMin = lo;
        this.zMax = hi;
        this.bore = b;
    }

    Electrode electrode() {
        return electrode;
    }

    double zMin_m() {
        return zMin;
    }

    double zMax_m() {
        return zMax;
    }

    /** Smallest radius of the outline (0 when it touches the axis), m. */
    double bore_m() {
        return bore;
    }

    /** Wall radius at z, or empty outside the electrode's extent. */
    OptionalDouble wallAt(double z) {
        double best = Double.POSITIVE_INFINITY;
        for (double[] p : pieces) {
            double z1 = p[0];
            double z2 = p[2];
            if (z < Math.min(z1, z2) || z > Math.max(z1, z2)) {
                continue;
            }
            double r = z1 == z2 ? Math.min(p[1], p[3]) : p[1] + (p[3] - p[1]) * (z - z1) / (z2 - z1);
            best = Math.min(best, r);
        }
        return best == Double.POSITIVE_INFINITY ? OptionalDouble.empty() : OptionalDouble.of(best);
    }

    /** Planes at which to compare the envelope with the wall: every outline vertex and a uniform grid. */
    List<Double> probes() {
        List<Double> z = new ArrayList<>();
        for (double[] p : pieces) {
            z.add(p[0]);
            z.add(p[2]);
        }
        for (int k = 0; k <= 64; k++) {
            z.add(zMin + (zMax - zMin) * k / 64);
        }
        return z;
    }
}
