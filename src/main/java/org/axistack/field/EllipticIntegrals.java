package org.axistack.field;

/**
 * Complete elliptic integrals of the first and second kind, K(m) and E(m), by the arithmetic-geometric
 * mean (Abramowitz and Stegun, Handbook of Mathematical Functions, 17.6). The parameter is passed
 * together with its complement m1 = 1 - m, so that callers who know m1 without cancellation (the ring
 * kernel does: m1 = rho_minus^2 / rho_plus^2) keep full relative accuracy as m approaches 1. The
 * difference K - E is returned without cancellation as well (it is the sum of the AGM's c_n terms).
 */
public final class EllipticIntegrals {

    private EllipticIntegrals() {
    }

    /**
     * Fills out[0] = K(m), out[1] = E(m), out[2] = K(m) - E(m).
     *
     * @param m  parameter, 0 &lt;= m &lt; 1
     * @param m1 complement 1 - m, &gt; 0, as accurate as the caller can make it
     */
    public static void kAndE(double m, double m1, double[] out) {
        double a = 1.0;
        double b = Math.sqrt(m1);
        // c0^2 = m ; c_{n+1} = (a_n - b_n)/2, computed as c_n^2 / (4 a_{n+1}) to avoid cancellation.
        double cSq = m;
        double sum = 0.5 * m; // sum of 2^(n-1) c_n^2, starting with n = 0
        double pow = 0.5;
        for (int i = 0; i < 40; i++) {
            double an = 0.5 * (a + b);
            double bn = Math.sqrt(a * b);
            double c = cSq / (4 * an); // c_{n+1}
            pow *= 2;
            double cn1Sq = c * c;
            sum += pow * cn1Sq;
            a = an;
            b = bn;
            cSq = cn1Sq;
            if (cn1Sq <= 1e-34 * a * a) {
                break;
            }
        }
        double k = Math.PI / (2 * a);
        double kme = k * sum;
        out[0] = k;
        out[1] = k - kme;
        out[2] = kme;
    }

    /** K(m) for 0 &lt;= m &lt; 1. */
    public static double k(double m) {
        double[] o = new double[3];
        kAndE(m, 1 - m, o);
        return o[0];
    }

    /** E(m) for 0 &lt;= m &lt;= 1. */
    public static double e(double m) {
        if (m == 1) {
            return 1;
        }
        double[] o = new double[3];
        kAndE(m, 1 - m, o);
        return o[1];
    }
}
