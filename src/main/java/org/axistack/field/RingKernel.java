package org.axistack.field;

/**
 * Potential and field of a charged ring (circular line charge) about the z axis, from the complete
 * elliptic integrals (classical; e.g. W. R. Smythe, Static and Dynamic Electricity, ch. 5; J. D. Jackson,
 * Classical Electrodynamics, 3rd ed., sec. 3.3 and problem 5.33 for the analogous current loop).
 * Strength lambda = Q / (4 pi eps0) in V m: then phi = lambda (2/pi) K(m) / rho_plus with
 * rho_plus^2 = (r + a)^2 + d^2, rho_minus^2 = (r - a)^2 + d^2, m = 4 a r / rho_plus^2, d = z - z_ring.
 */
public final class RingKernel {

    private RingKernel() {
    }

    /**
     * A target exactly on the ring (rho_minus = 0 in floating point) gets no contribution. The kernel is
     * infinite there but integrable (logarithmic), so a quadrature point that coincides with the target
     * carries a vanishing share of the integral; near a panel's graded edge the sub-points of the near rule
     * can round onto the target, and the elliptic integral with m1 = 0 used to return about 1e12 there, which
     * moved the surface potential 13 nm from a tube edge by half the largest bias (found by
     * {@code properties.FieldInvariantProperties}; regression test {@code properties.OnRingQuadratureTest}).
     */
    static final String ON_RING = "no contribution";

    /** Potential of a ring of unit strength (lambda = 1 V m): (2/pi) K(m) / rho_plus, 1/m. */
    public static double potential(double z, double r, double zRing, double aRing) {
        double d = z - zRing;
        double rp2 = (r + aRing) * (r + aRing) + d * d;
        double rm2 = (r - aRing) * (r - aRing) + d * d;
        if (rm2 == 0) {
            return 0; // on the ring itself: see ON_RING
        }
        double rp = Math.sqrt(rp2);
        double m = 4 * aRing * r / rp2;
        double m1 = rm2 / rp2;
        double[] ke = new double[3];
        EllipticIntegrals.kAndE(m, m1, ke);
        return (2 / Math.PI) * ke[0] / rp;
    }

    /**
     * Potential and field of a unit-strength ring, accumulated: acc[0] += w phi, acc[1] += w E_z,
     * acc[2] += w E_r. Valid for every point off the ring itself, on the axis included.
     */
    public static void accumulate(double z, double r, double zRing, double aRing, double w, double[] acc,
            double[] scratch) {
        double d = z - zRing;
        double rp2 = (r + aRing) * (r + aRing) + d * d;
        double rm2 = (r - aRing) * (r - aRing) + d * d;
        if (rm2 == 0) {
            return; // on the ring itself: see ON_RING
        }
        double rp = Math.sqrt(rp2);
        double m = 4 * aRing * r / rp2;
        double m1 = rm2 / rp2;
        EllipticIntegrals.kAndE(m, m1, scratch);
        double k = scratch[0];
        double e = scratch[1];
        double kme = scratch[2];
        double c = w * (2 / Math.PI) / rp;
        acc[0] += c * k;
        acc[1] += c * d * e / rm2;
        if (r > 0) {
            // E_r = lambda/(pi r rho+) [K - (a^2 - r^2 + d^2)/rho-^2 E], rewritten as
            // lambda/(pi rho+) [ (K - E)/r - 2 (a - r) E / rho-^2 ] so that nothing is divided by a small r.
            acc[2] += 0.5 * c * (kme / r - 2 * (aRing - r) * e / rm2);
        }
    }

    /**
     * Axial potential of a unit-strength ring and its z-derivatives, accumulated:
     * d^n/dz^n (1/rho) = (-1)^n n! P_n(cos t) / rho^(n+1), cos t = (z - z_ring)/rho (Legendre generating
     * function; e.g. Jackson, Classical Electrodynamics, eq. 3.70 and the Legendre recurrence 3.29).
     * acc[n] += w d^n/dz^n (1/rho) for n = 0..order.
     */
    public static void accumulateAxial(double z, double zRing, double aRing, double w, int order, double[] acc) {
        double d = z - zRing;
        double rho2 = aRing * aRing + d * d;
        double rho = Math.sqrt(rho2);
        double inv = 1 / rho;
        double x = d * inv;
        double pPrev = 1; // P_0
        double p = x; // P_1
        double term = w * inv; // w / rho^(n+1) * (-1)^n n!
        acc[0] += term;
        if (order == 0) {
            return;
        }
        term = -term * inv; // n = 1: (-1)^1 1! / rho^2
        acc[1] += term * p;
        for (int n = 2; n <= order; n++) {
            double pNext = ((2 * n - 1) * x * p - (n - 1) * pPrev) / n;
            pPrev = p;
            p = pNext;
            term = -term * n * inv;
            acc[n] += term * p;
        }
    }
}
