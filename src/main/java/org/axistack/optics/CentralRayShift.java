package org.axistack.optics;

import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;

import org.axistack.field.MisalignmentResponse;

/**
 * How the central ray (the ray that enters on the mechanical axis, parallel to it, at the object-side reference
 * plane) moves when one electrode is decentred or tilted, to first order. A dipole perturbation x Phi_1(z) of
 * the potential adds a transverse force to the relativistic paraxial ray equation (derived in misalignment.md):
 *
 * <pre>
 *   x'' + g U' x' / (2 U*) + g U'' x / (4 U*) = -s g Phi_1 / (2 U*),   s = sign of the charge,
 * </pre>
 *
 * solved, as for split electrodes, by {@link CentralRayDeflection} (variation of constants on the round lens's
 * transfer matrix, composite Gauss-Legendre quadrature): one source per electrode and motion, acting over the
 * optics' traced range (object-side to image-side reference plane, where the round field is taken as ended too,
 * so a whole moved lens stays consistent); beyond it the ray follows the round lens. Immutable and thread-safe
 * (planes inside the range are computed on demand and kept).
 */
public final class CentralRayShift {

    private final ParaxialOptics optics;
    private final MisalignmentResponse response;
    private final int intervals;
    private final int electrodes;
    /** The responses up to the end of the range. */
    private final CentralRayDeflection whole;
    /** Planes inside the range, each with its own quadrature up to the plane. */
    private final Map<Double, CentralRayDeflection> inside = new ConcurrentHashMap<>();

    private CentralRayShift(MisalignmentResponse response, ParaxialOptics optics, int intervals) {
        this.response = response;
        this.optics = optics;
        this.intervals = intervals;
        this.electrodes = response.electrodes();
        this.whole = CentralRayDeflection.of(optics, optics.zStart_m(), optics.zEnd_m(),
                new double[] {optics.zEnd_m()}, sources(response), intervals);
    }

    /** Every response of every electrode as a dipole source, index 2 k + motion. */
    static CentralRayDeflection.Sources sources(MisalignmentResponse response) {
        int ne = response.electrodes();
        return new CentralRayDeflection.Sources() {
            @Override
            public int count() {
                return 2 * ne;
            }

            @Override
            public void at(double z_m, double[] out) {
                double[][] dip = new double[ne][2];
                response.dipoles(z_m, dip);
                for (int k = 0; k < ne; k++) {
                    out[2 * k] = dip[k][0];
                    out[2 * k + 1] = dip[k][1];
                }
            }
        };
    }

    /** The central-ray shifts of every response, default quadrature (96 intervals). */
    public static CentralRayShift of(MisalignmentResponse response, ParaxialOptics optics) {
        return of(response, optics, CentralRayDeflection.DEFAULT_INTERVALS);
    }

    /**
     * @param optics    paraxial optics of the same biased field the responses belong to
     * @param intervals number of equal quadrature intervals over the traced range
     */
    public static CentralRayShift of(MisalignmentResponse response, ParaxialOptics optics, int intervals) {
        if (intervals < 1) {
            throw new IllegalArgumentException("need at least one quadrature interval, got " + intervals);
        }
        return new CentralRayShift(response, optics, intervals);
    }

    /** The field responses the shifts are computed from. */
    public MisalignmentResponse response() {
        return response;
    }

    /** The paraxial optics the shifts are computed in. */
    public ParaxialOptics optics() {
        return optics;
    }

    /**
     * Height (m) and slope of the central ray at plane z, per unit motion of {@code electrode} (per metre of
     * decentre along x, per radian of tilt about y through its centre). Planes beyond the traced range are
     * reached through the round lens (a drift where the field is taken as ended); a plane inside it gets its own
     * quadrature up to the plane.
     */
    public double[] at(int electrode, MisalignmentResponse.Motion motion, double z_m) {
        if (electrode < 0 || electrode >= electrodes) {
            throw new IllegalArgumentException("electrode index " + electrode + " outside 0.." + (electrodes - 1));
        }
        int source = 2 * electrode + motion.ordinal();
        double end = whole.sourceEnd_m();
        if (z_m >= end) {
            return whole.beyondSources(source, z_m);
        }
        if (!(z_m > optics.zStart_m())) {
            return new double[] {0, 0};
        }
        CentralRayDeflection d = inside.computeIfAbsent(z_m, z -> CentralRayDeflection.of(optics, optics.zStart_m(),
                z, new double[] {z}, sources(response), intervals));
        return new double[] {d.unitOffset_m(0, source), d.unitSlope_rad(0, source)};
    }
}
