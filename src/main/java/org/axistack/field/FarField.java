package org.axistack.field;

/**
 * The axial potential far from a solved stack as the exterior multipole (Legendre) expansion of its ring
 * charges. A ring of strength lambda = Q/(4 pi eps0) at distance rho from the centre z0, seen under the
 * polar angle theta, has on the axis 1/|zeta e_z - x| = sum_l rho^l P_l(cos theta) / zeta^(l+1) for
 * zeta = z - z0 &gt; rho (the generating function of the Legendre polynomials, e.g. J. D. Jackson, Classical
 * Electrodynamics, 3rd ed., eq. 3.38), and P_l(-x) = (-1)^l P_l(x) on the other side. Summing the rings,
 * with s = 1/|zeta|, side = sign(zeta), x = side R s and the scaled moments
 * m_l = sum_j lambda_j (rho_j/R)^l P_l(cos theta_j):
 * <pre>
 *   V(zeta)     = s sum_l m_l x^l                        (m_0 = total charge / (4 pi eps0))
 *   V^(n)(zeta) = (-side)^n s^(n+1) sum_l m_l (l+1)(l+2)..(l+n) x^l
 * </pre>
 * R is the largest distance of a charge ring from (z0, 0); the series is used from |zeta| =
 * {@link #FACTOR} R outward, where |x| &lt;= 1/FACTOR and {@link #TERMS} terms leave a remainder below
 * 1e-16 of sum |lambda_j| / |zeta| for every order up to {@link AxialExpansion#ORDER}. The moments are
 * those of the same node rings the exact sum uses for far panels, so the series is that sum rearranged.
 * Immutable.
 */
public final class FarField {

    /** The series is used where |z - z0| &gt;= FACTOR x R. */
    public static final double FACTOR = 2.0;
    /** Terms kept: 2^-TERMS x TERMS^8 &lt; 1e-16. */
    static final int TERMS = 110;

    private final double centreZ;
    private final double radius;
    private final double[] moments;
    private final double absoluteStrength;

    FarField(double centreZ, double radius, double[] moments, double absoluteStrength) {
        this.centreZ = centreZ;
        this.radius = radius;
        this.moments = moments;
        this.absoluteStrength = absoluteStrength;
    }

    /**
     * A far field given by its axial multipole strengths about z0: V = sum_l q_l / zeta^(l+1) for zeta &gt; 0
     * (q_0 the monopole Q/(4 pi eps0), V m; q_l in V m^(l+1)), charges within radius R of (z0, 0).
     */
    public static FarField ofMoments(double centreZ_m, double radius_m, double... q) {
        double[] m = new double[TERMS + 1];
        double abs = 0;
        for (int l = 0; l < Math.min(q.length, TERMS + 1); l++) {
            m[l] = q[l] / Math.pow(radius_m, l);
            abs += Math.abs(m[l]);
        }
        return new FarField(centreZ_m, radius_m, m, abs);
    }

    /** Scaled moments of one charge vector about z0 with radius R. */
    static double[] moments(double[] z, double[] r, double[] strength, double z0, double radius) {
        double[] m = new double[TERMS + 1];
        for (int j = 0; j < strength.length; j++) {
            double lambda = strength[j];
            if (lambda == 0) {
                continue;
            }
            double dz = z[j] - z0;
            double rho = Math.hypot(dz, r[j]);
            double t = rho / radius;
            double c = rho > 0 ? dz / rho : 1;
            double pPrev = 1;
            double p = c;
            double tl = 1;
            m[0] += lambda;
            for (int l = 1; l <= TERMS; l++) {
                tl *= t;
                m[l] += lambda * tl * p;
                double next = ((2 * l + 1) * c * p - l * pPrev) / (l + 1);
                pPrev = p;
                p = next;
            }
        }
        return m;
    }

    /** The far field of a linear combination of unit solutions. */
    static FarField combine(double centreZ, double radius, double[][] unitMoments, double[] unitAbs, double[] biases) {
        double[] m = new double[TERMS + 1];
        double abs = 0;
        for (int e = 0; e < biases.length; e++) {
            double b = biases[e];
            if (b == 0) {
                continue;
            }
            for (int l = 0; l <= TERMS; l++) {
                m[l] += b * unitMoments[e][l];
            }
            abs += Math.abs(b) * unitAbs[e];
        }
        return new FarField(centreZ, radius, m, abs);
    }

    /** Centre z0 of the expansion, m. */
    public double centreZ_m() {
        return centreZ;
    }

    /** Largest distance of a charge ring from (z0, 0), m. */
    public double chargeRadius_m() {
        return radius;
    }

    /** Distance from z0 beyond which the series is used, m. */
    public double startDistance_m() {
        return FACTOR * radius;
    }

    /** Whether z lies where the series holds (|z - z0| &gt;= FACTOR R). */
    public boolean covers(double z_m) {
        return Math.abs(z_m - centreZ) >= FACTOR * radius;
    }

    /** Total charge over 4 pi eps0 (the monopole strength: V -&gt; m0/|z - z0| far away), V m. */
    public double monopole_V_m() {
        return moments[0];
    }

    /** Dipole strength m1 R (V -&gt; ... + side m1 R / zeta^2), V m^2. */
    public double dipole_V_m2() {
        return moments[1] * radius;
    }

    /** Sum of |lambda| over the charge rings, V m: the scale of the truncation bound. */
    public double absoluteStrength_V_m() {
        return absoluteStrength;
    }

    /** Axial potential and derivatives 0..order (order &lt;= {@link AxialExpansion#ORDER}) at z (covered). */
    public void axial(double z_m, int order, double[] out) {
        double zeta = z_m - centreZ;
        double side = zeta >= 0 ? 1 : -1;
        double s = 1 / Math.abs(zeta);
        double x = side * radius * s;
        for (int n = 0; n <= order; n++) {
            // sum_l m_l (l+1)_n x^l by Horner
            double sum = 0;
            for (int l = TERMS; l >= 0; l--) {
                double rising = 1;
                for (int k = 1; k <= n; k++) {
                    rising *= l + k;
                }
                sum = sum * x + moments[l] * rising;
            }
            double pre = Math.pow(s, n + 1) * ((n & 1) == 0 ? 1 : -side);
            out[n] = pre * sum;
        }
    }

    /**
     * The potential in the compactified variable s = 1/|z - z0| on one side (side = +1 beyond the stack, -1
     * before it), regular at s = 0 (infinity): out[0] = V, out[1] = V' / s^2 (V' = dV/dz).
     */
    public void compact(int side, double s, double[] out) {
        double x = side * radius * s;
        double v = 0;
        double d = 0;
        for (int l = TERMS; l >= 0; l--) {
            v = v * x + moments[l];
            d = d * x + moments[l] * (l + 1);
        }
        out[0] = s * v;
        out[1] = -side * d;
    }
}
