package org.axistack.verify;

/**
 * Imaginary error function erfi(x) = -i erf(ix) = (2/sqrt(pi)) sum_n x^(2n+1) / (n! (2n+1)), the
 * Maclaurin series of erf (Abramowitz and Stegun, Handbook of Mathematical Functions, eq. 7.1.5) with
 * z = ix. All terms are positive, so the sum has no cancellation; it is checked against direct
 * quadrature of (2/sqrt(pi)) Integral_0^x exp(t^2) dt in the tests (ErfiTest).
 */
public final class Erfi {
    private Erfi() {
    }

    public static double erfi(double x) {
        double x2 = x * x;
        double term = x; // x^(2n+1)/n!
        double sum = 0;
        for (int n = 0; n < 500; n++) {
            double add = term / (2 * n + 1);
            sum += add;
            if (add < 1e-17 * sum) {
                break;
            }
            term *= x2 / (n + 1);
        }
        return 2 / Math.sqrt(Math.PI) * sum;
    }
}
