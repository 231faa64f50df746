package org.axistack.field;

import org.axistack.mesh.BoundaryMesh;
import org.axistack.mesh.Panel;
import org.axistack.model.ZR;
import org.hipparchus.analysis.integration.gauss.GaussIntegrator;
import org.hipparchus.analysis.integration.gauss.GaussIntegratorFactory;

/**
 * Quadrature over one panel for targets close to it (or on it). The panel's density is the Lagrange
 * interpolant through its Gauss nodes; the kernel's logarithmic (on the panel) or near-logarithmic
 * (close to it) peak at the nearest point tau* is resolved by a composite Gauss-Legendre rule on
 * intervals that shrink geometrically toward tau* (a standard graded-mesh treatment of weakly singular
 * integrals; e.g. K. E. Atkinson, The Numerical Solution of Integral Equations of the Second Kind,
 * Cambridge 1997, sec. 4.2 and 8.3). Instances are immutable and shared; {@link Rule} buffers are
 * per-thread.
 */
final class PanelQuadrature {

    /** A target closer than this many panel lengths to a panel is integrated with the graded rule. */
    static final double NEAR_FACTOR = 3.0;
    /** Size of per-thread buffers for axial derivative orders. */
    static final int MAX_ORDER_OUT = AxialField.MAX_ORDER + 1;
    private static final int SUB = 10;
    private static final double RATIO = 0.3;
    private static final double[] SUB_X = new double[SUB];
    private static final double[] SUB_W = new double[SUB];

    static {
        GaussIntegrator g = new GaussIntegratorFactory().legendre(SUB, 0, 1);
        for (int i = 0; i < SUB; i++) {
            SUB_X[i] = g.getPoint(i);
            SUB_W[i] = g.getWeight(i);
        }
    }

    private final double[] tau;
    private final double[] bary;

    PanelQuadrature(BoundaryMesh mesh) {
        tau = mesh.nodeTau();
        int n = tau.length;
        bary = new double[n];
        for (int j = 0; j < n; j++) {
            double w = 1;
            for (int k = 0; k < n; k++) {
                if (k != j) {
                    w *= tau[j] - tau[k];
                }
            }
            bary[j] = 1 / w;
        }
    }

    int order() {
        return tau.length;
    }

    /** Lagrange basis values l_j(t) at t (barycentric form, second kind). */
    void basis(double t, double[] out) {
        int n = tau.length;
        double sum = 0;
        for (int j = 0; j < n; j++) {
            double d = t - tau[j];
            if (d == 0) {
                java.util.Arrays.fill(out, 0, n, 0);
                out[j] = 1;
                return;
            }
            out[j] = bary[j] / d;
            sum += out[j];
        }
        for (int j = 0; j < n; j++) {
            out[j] /= sum;
        }
    }

    /** Geometry of a panel used to decide quickly whether a target is near. */
    record Bounds(double zc, double rc, double radius, double length) {
        static Bounds of(Panel p) {
            ZR mid = p.at(0.5);
            double rad = 0;
            for (int k = 0; k <= 16; k++) {
                rad = Math.max(rad, p.at(k / 16.0).distanceTo(mid));
            }
            return new Bounds(mid.z_m(), mid.r_m(), rad, p.length_m());
        }

        boolean near(double z, double r) {
            double d = Math.hypot(z - zc, r - rc);
            return d < radius + NEAR_FACTOR * length;
        }
    }

    /** Reusable buffers for a composite rule: sub-point coordinates, weights and positions on the panel. */
    static final class Rule {
        final double[] t = new double[2 * 64 * SUB];
        final double[] w = new double[2 * 64 * SUB];
        final double[] z = new double[2 * 64 * SUB];
        final double[] r = new double[2 * 64 * SUB];
        int size;
    }

    /**
     * Builds the graded rule on panel p for a target at (z, r): sub-points clustered at the nearest
     * point; fills positions too.
     *
     * @param tauStar local coordinate of the target's nearest point (NaN: find it)
     */
    void build(Panel p, double z, double r, double tauStar, Rule rule) {
        double ts = Double.isNaN(tauStar) ? p.closestTau(z, r) : tauStar;
        ZR near = p.at(ts);
        double d = Math.hypot(near.z_m() - z, near.r_m() - r);
        double len = p.length_m();
        // Grade down to the target's distance, but never below what the coordinates can resolve: sub-points
        // closer to the target than a few thousand ulps would see a distance made of round-off.
        double ulpScale = 4096 * Math.ulp(Math.max(Math.abs(z), Math.abs(r)) + len);
        double wmin = Math.max(Math.max(0.2 * d / len, 1e-10), ulpScale / len);
        rule.size = 0;
        side(ts, ts, wmin, rule, -1);
        side(ts, 1 - ts, wmin, rule, +1);
        for (int q = 0; q < rule.size; q++) {
            ZR pt = p.at(rule.t[q]);
            rule.z[q] = pt.z_m();
            rule.r[q] = pt.r_m();
        }
    }

    private static void side(double ts, double length, double wmin, Rule rule, int dir) {
        if (length <= 0) {
            return;
        }
        double outer = length;
        while (true) {
            double inner = outer * RATIO;
            if (inner < wmin || outer <= wmin) {
                inner = 0;
            }
            // interval of distances [inner, outer] from ts
            double a = ts + dir * inner;
            double b = ts + dir * outer;
            double lo = Math.min(a, b);
            double hi = Math.max(a, b);
            for (int k = 0; k < SUB; k++) {
                rule.t[rule.size] = lo + (hi - lo) * SUB_X[k];
                rule.w[rule.size] = (hi - lo) * SUB_W[k];
                rule.size++;
            }
            if (inner == 0) {
                return;
            }
            outer = inner;
        }
    }

}
