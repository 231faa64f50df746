package org.axistack.mesh;

import org.axistack.model.Segment;
import org.axistack.model.ZR;

/**
 * One boundary element: a piece [t0, t1] of an outline segment, carrying a charge density that is a
 * polynomial in the local coordinate tau in [0, 1]. On a panel that touches an edge or a convex corner
 * the map from tau to the segment parameter is a power law, t = t0 + (t1 - t0) tau^p (or mirrored),
 * with p = 1/(1 + beta) for the density's singular exponent beta (density ~ d^beta at distance d from
 * the edge). Then sigma * |dy/dtau| is smooth in tau and Gauss-Legendre nodes in tau integrate it
 * accurately: the classical singular-basis treatment of edges in boundary-element methods.
 *
 * @param electrode   index of the electrode this panel belongs to
 * @param segment     the outline segment
 * @param t0          segment parameter at tau = 0
 * @param t1          segment parameter at tau = 1
 * @param singularEnd 0: linear map; -1: power map singular at tau = 0; +1: singular at tau = 1
 * @param power       the power p of the map (1 for a linear map)
 * @param sheet       whether the panel belongs to a zero-thickness sheet (charge on both faces)
 * @param contour     index of the contour (electrode outline) within the mesh, for neighbourhood tests
 */
public record Panel(int electrode, Segment segment, double t0, double t1, int singularEnd, double power,
        boolean sheet, int contour) {

    public Panel {
        if (!(t1 > t0)) {
            throw new IllegalArgumentException("degenerate panel: t0 = " + t0 + ", t1 = " + t1);
        }
        if (singularEnd != 0 && !(power >= 1)) {
            throw new IllegalArgumentException("power map needs p >= 1, got " + power);
        }
    }

    /** Segment parameter at local coordinate tau. */
    public double t(double tau) {
        return switch (singularEnd) {
            case -1 -> t0 + (t1 - t0) * Math.pow(tau, power);
            case 1 -> t1 - (t1 - t0) * Math.pow(1 - tau, power);
            default -> t0 + (t1 - t0) * tau;
        };
    }

    /** dt/dtau at tau. */
    public double dtdtau(double tau) {
        return switch (singularEnd) {
            case -1 -> (t1 - t0) * power * Math.pow(tau, power - 1);
            case 1 -> (t1 - t0) * power * Math.pow(1 - tau, power - 1);
            default -> t1 - t0;
        };
    }

    /** Point at local coordinate tau. */
    public ZR at(double tau) {
        return segment.at(t(tau));
    }

    /** Arc-length density |dy/dtau| at tau, metres. */
    public double jacobian(double tau) {
        double[] d = segment.derivative(t(tau));
        return Math.hypot(d[0], d[1]) * dtdtau(tau);
    }

    /** Unit tangent (dz, dr) at tau, in the direction of increasing tau. */
    public double[] tangent(double tau) {
        double[] d = segment.derivative(t(tau));
        double n = Math.hypot(d[0], d[1]);
        return new double[] {d[0] / n, d[1] / n};
    }

    /** Local coordinate tau of segment parameter t (t in [t0, t1]). */
    public double tau(double t) {
        double u = Math.max(0, Math.min(1, (t - t0) / (t1 - t0)));
        return switch (singularEnd) {
            case -1 -> Math.pow(u, 1 / power);
            case 1 -> 1 - Math.pow(1 - u, 1 / power);
            default -> u;
        };
    }

    /** Local coordinate of the panel point nearest to (z, r). */
    public double closestTau(double z_m, double r_m) {
        double t = segment.closestParameter(z_m, r_m);
        if (t >= t0 && t <= t1) {
            return tau(t);
        }
        ZR p = new ZR(z_m, r_m);
        return segment.at(t0).distanceTo(p) <= segment.at(t1).distanceTo(p) ? 0 : 1;
    }

    /** Arc length of the panel, metres. */
    public double length_m() {
        return segment.length_m() * (t1 - t0);
    }
}
