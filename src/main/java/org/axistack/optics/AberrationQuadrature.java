package org.axistack.optics;

import java.util.ArrayList;
import java.util.List;

/**
 * The one quadrature of the aberration integrands along the whole axis a ray sees: composite 8-point
 * Gauss-Legendre (nodes and weights to 16 digits, e.g. M. Abramowitz and I. A. Stegun, Handbook of Mathematical
 * Functions, table 25.4) over the traced range in z and, on open sides, over the far-field tails in the compact
 * variable s = 1/|z - z0| out to infinity (dz = ds/s^2; the integrands of rays that leave the lens along straight
 * asymptotes fall off like 1/|z|^2 there, so the s-form is finite: issue 23, {@link FarTail}). Beyond an ended
 * side (a tube plane, a given plane) the field is taken as zero and nothing is integrated. The panels of every
 * part are doubled from 64 until each integral changes by less than 1e-10 of the largest integral of its group
 * (at most 8192 panels; the change reached is reported). {@link AberrationIntegrals}, {@link AberrationPolynomials}
 * and {@link OffAxisAberrations} all integrate through here, so the tails are handled in this one place.
 */
final class AberrationQuadrature {

    static final double[] GL_X = {
        -0.9602898564975363, -0.7966664774136267, -0.5255324099163290, -0.1834346424956498,
        0.1834346424956498, 0.5255324099163290, 0.7966664774136267, 0.9602898564975363};
    static final double[] GL_W = {
        0.1012285362903763, 0.2223810344533745, 0.3137066557661458, 0.3626837833783620,
        0.3626837833783620, 0.3137066557661458, 0.2223810344533745, 0.1012285362903763};

    /** Relative change of the integrals at which the panel doubling stops. */
    static final double TOLERANCE = 1e-10;

    private AberrationQuadrature() {
    }

    /** The integrand: adds w times its values at z to acc (one slot per integral). */
    interface Integrand {
        void add(double z_m, double w, double[] acc);
    }

    /**
     * The integrals and the relative change at the last refinement.
     *
     * @param values the integrals (as many as the integrand has slots)
     * @param change largest relative change (against its group's scale) at the last panel doubling
     */
    record Result(double[] values, double change) {
    }

    /**
     * Integrates from fromZ (negative infinity: the whole axis, through the object-side tail of an open lens) to
     * infinity on the image side (through its tail when open, else to the image-side plane).
     *
     * @param groups for each slot, the group whose largest |integral| scales its convergence test (slots of one
     *               quantity over several rays share a group, so a small member is judged against the others)
     */
    static Result integrate(ParaxialOptics optics, double fromZ, int[] groups, Integrand f) {
        List<double[]> parts = parts(optics, fromZ);
        int size = groups.length;
        double[] prev = null;
        double change = Double.POSITIVE_INFINITY;
        for (int panels = 64; panels <= 8192; panels *= 2) {
            double[] sum = new double[size];
            for (double[] part : parts) {
                double h = (part[1] - part[0]) / panels;
                for (int k = 0; k < panels; k++) {
                    double mid = part[0] + (k + 0.5) * h;
                    for (int j = 0; j < GL_X.length; j++) {
                        double t = mid + 0.5 * h * GL_X[j];
                        double w = 0.5 * h * GL_W[j];
                        double z = t;
                        if (part[2] == 1) {
                            z = part[3] + part[4] / t;
                            w /= t * t;
                        }
                        f.add(z, w, sum);
                    }
                }
            }
            if (prev != null) {
                change = change(sum, prev, groups);
                if (change < TOLERANCE) {
                    return new Result(sum, change);
                }
            }
            prev = sum;
        }
        return new Result(prev, change);
    }

    /** The parts {t0, t1, kind (0: z, 1: s), centre, side}. */
    private static List<double[]> parts(ParaxialOptics optics, double fromZ) {
        List<double[]> parts = new ArrayList<>();
        double a = Math.max(fromZ, optics.zStart_m());
        double b = optics.zEnd_m();
        if (a < b) {
            parts.add(new double[] {a, b, 0, 0, 0});
        }
        FarTail in = optics.objectTail();
        if (in != null && fromZ < optics.zStart_m()) {
            double sFrom = Double.isFinite(fromZ) ? 1 / Math.abs(fromZ - in.centreZ_m()) : 0;
            parts.add(new double[] {sFrom, 1 / Math.abs(optics.zStart_m() - in.centreZ_m()), 1, in.centreZ_m(), -1});
        }
        FarTail out = optics.imageTail();
        if (out != null) {
            double sFrom = fromZ > optics.zEnd_m() ? 1 / Math.abs(fromZ - out.centreZ_m()) : Double.POSITIVE_INFINITY;
            double sTo = Math.min(sFrom, 1 / Math.abs(optics.zEnd_m() - out.centreZ_m()));
            parts.add(new double[] {0, sTo, 1, out.centreZ_m(), +1});
        }
        return parts;
    }

    private static double change(double[] now, double[] before, int[] groups) {
        int groupCount = 0;
        for (int g : groups) {
            groupCount = Math.max(groupCount, g + 1);
        }
        double[] scale = new double[groupCount];
        for (int i = 0; i < now.length; i++) {
            scale[groups[i]] = Math.max(scale[groups[i]], Math.abs(now[i]));
        }
        double change = 0;
        for (int i = 0; i < now.length; i++) {
            change = Math.max(change, Math.abs(now[i] - before[i]) / Math.max(scale[groups[i]], Double.MIN_NORMAL));
        }
        return change;
    }
}
