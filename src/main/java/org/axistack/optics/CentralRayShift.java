package org.axistack.optics;

import java.util.stream.IntStream;

import org.axistack.field.MisalignmentResponse;
import org.hipparchus.analysis.integration.gauss.GaussIntegrator;
import org.hipparchus.analysis.integration.gauss.GaussIntegratorFactory;

/**
 * How the central ray (the ray that enters on the mechanical axis, parallel to it, at the object-side reference
 * plane) moves when one electrode is decentred or tilted, to first order. A dipole perturbation x Phi_1(z) of
 * the potential adds a transverse force to the relativistic paraxial ray equation (derived in misalignment.md):
 *
 * <pre>
 *   x'' + g U' x' / (2 U*) + g U'' x / (4 U*) = -s g Phi_1 / (2 U*),   s = sign of the charge,
 * </pre>
 *
 * so the central ray is the response of the round lens to that source term, started at 0 with slope 0:
 * x(z) = Int T_12(z' -&gt; z) F(z') dz', x'(z) = Int T_22(z' -&gt; z) F(z') dz' (variation of constants,
 * T the round lens's transfer matrix). Composite Gauss-Legendre quadrature over the optics' traced range
 * (8 points on each of {@code intervals} equal intervals); Phi_1 of every response is tabulated once at the
 * nodes. Immutable and thread-safe.
 */
public final class CentralRayShift {

    /** Gauss points per interval. */
    static final int POINTS = 8;

    private final ParaxialOptics optics;
    private final int electrodes;
    private final double[] nodeZ;
    /** F(z') times the quadrature weight, [2k + motion][node], 1/m per unit motion. */
    private final double[][] source;
    /** Height and slope at the end of the quadrature range per unit slope at each node: T_12, T_22. */
    private final double[] toEndHeight;
    private final double[] toEndSlope;

    private final MisalignmentResponse response;
    private final int intervals;
    /** End of the quadrature range (the optics' image-side plane, or a plane inside it), m. */
    private final double rangeEnd;

    private CentralRayShift(MisalignmentResponse response, ParaxialOptics optics, int intervals, int electrodes,
            double[] nodeZ, double[][] source, double rangeEnd) {
        this.response = response;
        this.intervals = intervals;
        this.optics = optics;
        this.electrodes = electrodes;
        this.nodeZ = nodeZ;
        this.source = source;
        this.rangeEnd = rangeEnd;
        toEndHeight = new double[nodeZ.length];
        toEndSlope = new double[nodeZ.length];
        for (int j = 0; j < nodeZ.length; j++) {
            TransferMatrix t = optics.transfer(nodeZ[j], rangeEnd);
            toEndHeight[j] = t.b();
            toEndSlope[j] = t.d();
        }
    }

    /** The central-ray shifts of every response, default quadrature (96 intervals). */
    public static CentralRayShift of(MisalignmentResponse response, ParaxialOptics optics) {
        return of(response, optics, 96);
    }

    /**
     * @param optics    paraxial optics of the same biased field the responses belong to
     * @param intervals number of equal quadrature intervals over the traced range
     */
    public static CentralRayShift of(MisalignmentResponse response, ParaxialOptics optics, int intervals) {
        if (intervals < 1) {
            throw new IllegalArgumentException("need at least one quadrature interval, got " + intervals);
        }
        return over(response, optics, intervals, optics.zEnd_m());
    }

    private static CentralRayShift over(MisalignmentResponse response, ParaxialOptics optics, int intervals,
            double zEnd) {
        GaussIntegrator g = new GaussIntegratorFactory().legendre(POINTS, 0, 1);
        double zs = optics.zStart_m();
        double h = (zEnd - zs) / intervals;
        int n = intervals * POINTS;
        double[] z = new double[n];
        double[] w = new double[n];
        for (int i = 0; i < intervals; i++) {
            for (int q = 0; q < POINTS; q++) {
                z[i * POINTS + q] = zs + h * (i + g.getPoint(q));
                w[i * POINTS + q] = h * g.getWeight(q);
            }
        }
        int ne = response.electrodes();
        double[][] src = new double[2 * ne][n];
        AccelerationPotential p = optics.potential();
        double sign = p.chargeSign();
        IntStream.range(0, n).parallel().forEach(j -> {
            double[][] dip = new double[ne][2];
            response.dipoles(z[j], dip);
            double u = p.u_V(z[j]);
            double factor = -sign * p.g(u) / (2 * p.uStar(u)) * w[j];
            for (int k = 0; k < ne; k++) {
                src[2 * k][j] = factor * dip[k][0];
                src[2 * k + 1][j] = factor * dip[k][1];
            }
        });
        return new CentralRayShift(response, optics, intervals, ne, z, src, zEnd);
    }

    /** The paraxial optics the shifts are computed in. */
    public ParaxialOptics optics() {
        return optics;
    }

    /**
     * Height (m) and slope of the central ray at plane z, per unit motion of {@code electrode} (per metre of
     * decentre along x, per radian of tilt about y through its centre). Planes beyond the traced range are
     * reached by a drift; a plane inside it gets its own quadrature up to the plane (the same number of
     * intervals over the shorter range).
     */
    public double[] at(int electrode, MisalignmentResponse.Motion motion, double z_m) {
        if (electrode < 0 || electrode >= electrodes) {
            throw new IllegalArgumentException("electrode index " + electrode + " outside 0.." + (electrodes - 1));
        }
        if (z_m < rangeEnd) {
            if (!(z_m > optics.zStart_m())) {
                return new double[] {0, 0};
            }
            return over(response, optics, intervals, z_m).at(electrode, motion, z_m);
        }
        double[] f = source[2 * electrode + motion.ordinal()];
        double x = 0;
        double s = 0;
        for (int j = 0; j < nodeZ.length; j++) {
            x += toEndHeight[j] * f[j];
            s += toEndSlope[j] * f[j];
        }
        // beyond the end of the range the field is taken as free (the optics' image-side plane): a drift
        return new double[] {x + (z_m - rangeEnd) * s, s};
    }
}
