package org.axistack.field;

import static org.assertj.core.api.Assertions.assertThat;

import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;

import org.hipparchus.analysis.integration.gauss.GaussIntegrator;
import org.hipparchus.analysis.integration.gauss.GaussIntegratorFactory;
import org.junit.jupiter.api.Test;

/**
 * The harmonic ring kernel H_m = (1/2pi) Int_0^2pi cos(m u) / |x - x'| du against the azimuthal integral
 * itself, computed two independent ways (no library on Maven Central that resolves here offers Legendre
 * functions of the second kind of half-integer degree or a general 2F1; Hipparchus and Commons Math do not):
 * <ul>
 * <li>the trapezoid rule on the periodic integrand in 30..140-digit BigDecimal arithmetic (exponentially
 *   convergent for periodic analytic integrands: Trefethen and Weideman, SIAM Review 56 (2014) 385), with
 *   enough points that the aliased Fourier coefficients fall below 1e-20 of the result, and enough digits
 *   that the cancellation of cos(m u) (the result is ~e^{-m eta} of the integrand) is exact;</li>
 * <li>close to the ring, where the integrand peaks in a width sqrt(chi - 1), a composite 20-point
 *   Gauss-Legendre rule on intervals halving toward the peak (double precision).</li>
 * </ul>
 */
class HarmonicKernelTest {

    private static final double[] CHI = {1 + 1e-12, 1 + 1e-9, 1 + 1e-6, 1 + 1e-4, 1.001, 1.01, 1.1, 1.5, 2, 5, 20,
        50, 1000, 1e6};

    @Test
    void matchesHighPrecisionTrapezoidAcrossChiAndOrders() {
        double worst = 0;
        for (double chi : CHI) {
            double eta = Math.log(chi + Math.sqrt(chi * chi - 1));
            if (eta < 0.01) {
                continue;
            }
            for (double[] ra : new double[][] {{1, 1}, {0.3, 2.5}, {4e-3, 1e-3}}) {
                double r = ra[0];
                double a = ra[1];
                // chi = (r^2 + a^2 + d^2) / (2 r a)
                double d2 = 2 * r * a * chi - r * r - a * a;
                if (d2 < 0) {
                    continue;
                }
                double d = Math.sqrt(d2);
                double[] ref = trapezoid(r, a, d, 16, eta);
                for (int m = 0; m <= 16; m++) {
                    double h = HarmonicKernel.potential(m, d, r, 0, a);
                    double rel = Math.abs(h - ref[m]) / Math.abs(ref[m]);
                    worst = Math.max(worst, rel);
                    assertThat(rel).as("m = %d, chi = %s, r = %s, a = %s", m, chi, r, a).isLessThan(1e-12);
                }
            }
        }
        assertThat(worst).isLessThan(1e-12);
    }

    @Test
    void matchesGradedQuadratureNearTheRing() {
        for (double chi : CHI) {
            if (chi > 1.02) { // beyond, the double-precision reference itself cancels (the trapezoid test covers it)
                continue;
            }
            double r = 1.3;
            double a = 1.3;
            double d = Math.sqrt(2 * r * a * (chi - 1));
            for (int m = 0; m <= 16; m++) {
                double ref = graded(r, a, d, m);
                double h = HarmonicKernel.potential(m, d, r, 0, a);
                assertThat(Math.abs(h - ref) / Math.abs(ref)).as("m = %d, chi - 1 = %s", m, chi - 1).isLessThan(1e-12);
            }
            // also a radial offset (rho_- from r - a, not from d)
            double r2 = 1.3 * (1 + Math.sqrt(2 * (chi - 1)) * 0.5);
            for (int m = 0; m <= 16; m++) {
                double ref = graded(r2, a, 0.0, m);
                double h = HarmonicKernel.potential(m, 0.0, r2, 0, a);
                assertThat(Math.abs(h - ref) / Math.abs(ref)).as("radial, m = %d, chi - 1 = %s", m, chi - 1)
                        .isLessThan(1e-12);
            }
        }
    }

    @Test
    void orderZeroIsTheRingKernelAndHigherOrdersVanishOnTheAxis() {
        assertThat(HarmonicKernel.potential(0, 0.3, 0.2, 0.1, 0.5)).isEqualTo(RingKernel.potential(0.3, 0.2, 0.1, 0.5));
        assertThat(HarmonicKernel.potential(3, 0.3, 0, 0.1, 0.5)).isZero();
        assertThat(HarmonicKernel.potential(1, 0.3, 0.4, 0.1, 0)).isZero();
    }

    @Test
    void logarithmicSingularityHasTheSameLogForEveryOrder() {
        // Q_{m-1/2}(chi) + (1/2) ln((chi - 1)/2) -> -gamma - psi(m + 1/2) (DLMF 14.8.9 with the digamma of
        // half-integers, psi(m + 1/2) = -gamma - 2 ln 2 + 2 sum_{k=1..m} 1/(2k - 1), DLMF 5.4.15):
        // the difference Q_m - Q_0 tends to -2 sum_{k=1..m} 1/(2k - 1).
        double r = 1;
        double a = 1;
        double chi = 1 + 1e-12;
        double d = Math.sqrt(2 * r * a * (chi - 1));
        double q0 = Math.PI * HarmonicKernel.potential(0, d, r, 0, a);
        double sum = 0;
        for (int m = 1; m <= 8; m++) {
            sum += 1.0 / (2 * m - 1);
            double qm = Math.PI * HarmonicKernel.potential(m, d, r, 0, a);
            assertThat(qm - q0).as("m = %d", m).isCloseTo(-2 * sum, org.assertj.core.data.Offset.offset(1e-9));
        }
    }

    /** Trapezoid sums of cos(m u)/|x - x'| for m = 0..mMax in BigDecimal; returns H_m. */
    static double[] trapezoid(double r, double a, double d, int mMax, double eta) {
        int n = (int) Math.ceil(2 * mMax + 50 / eta) + 8;
        int digits = 30 + (int) Math.ceil(mMax * eta / Math.log(10));
        MathContext mc = new MathContext(digits, RoundingMode.HALF_EVEN);
        BigDecimal pi = pi(mc);
        BigDecimal theta = pi.multiply(BigDecimal.valueOf(2), mc).divide(BigDecimal.valueOf(n), mc);
        BigDecimal[] cos = new BigDecimal[n];
        cos[0] = BigDecimal.ONE;
        cos[1] = cosine(theta, mc);
        BigDecimal two = BigDecimal.valueOf(2);
        for (int j = 2; j < n; j++) {
            cos[j] = two.multiply(cos[1], mc).multiply(cos[j - 1], mc).subtract(cos[j - 2], mc);
        }
        BigDecimal bigR = new BigDecimal(r);
        BigDecimal bigA = new BigDecimal(a);
        BigDecimal bigD = new BigDecimal(d);
        BigDecimal s = bigR.multiply(bigR, mc).add(bigA.multiply(bigA, mc), mc).add(bigD.multiply(bigD, mc), mc);
        BigDecimal b = two.multiply(bigR, mc).multiply(bigA, mc);
        BigDecimal[] f = new BigDecimal[n];
        for (int j = 0; j < n; j++) {
            f[j] = BigDecimal.ONE.divide(s.subtract(b.multiply(cos[j], mc), mc).sqrt(mc), mc);
        }
        double[] out = new double[mMax + 1];
        for (int m = 0; m <= mMax; m++) {
            BigDecimal sum = BigDecimal.ZERO;
            for (int j = 0; j < n; j++) {
                sum = sum.add(cos[(int) ((long) m * j % n)].multiply(f[j], mc), mc);
            }
            out[m] = sum.divide(BigDecimal.valueOf(n), mc).doubleValue();
        }
        return out;
    }

    /** pi by Machin's formula, pi = 16 atan(1/5) - 4 atan(1/239). */
    static BigDecimal pi(MathContext mc) {
        return atanInv(5, mc).multiply(BigDecimal.valueOf(16), mc).subtract(atanInv(239, mc).multiply(BigDecimal.valueOf(4), mc), mc);
    }

    private static BigDecimal atanInv(int x, MathContext mc) {
        BigDecimal x2 = BigDecimal.valueOf((long) x * x);
        BigDecimal term = BigDecimal.ONE.divide(BigDecimal.valueOf(x), mc);
        BigDecimal sum = term;
        BigDecimal eps = BigDecimal.ONE.movePointLeft(mc.getPrecision() + 5);
        for (int k = 1; term.abs().compareTo(eps) > 0; k++) {
            term = term.divide(x2, mc).negate();
            sum = sum.add(term.divide(BigDecimal.valueOf(2L * k + 1), mc), mc);
        }
        return sum;
    }

    private static BigDecimal cosine(BigDecimal x, MathContext mc) {
        BigDecimal x2 = x.multiply(x, mc);
        BigDecimal term = BigDecimal.ONE;
        BigDecimal sum = BigDecimal.ONE;
        BigDecimal eps = BigDecimal.ONE.movePointLeft(mc.getPrecision() + 5);
        for (int k = 1; term.abs().compareTo(eps) > 0; k++) {
            term = term.multiply(x2, mc).divide(BigDecimal.valueOf((2L * k - 1) * (2L * k)), mc).negate();
            sum = sum.add(term, mc);
        }
        return sum;
    }

    /** (1/pi) Int_0^pi cos(m u) / sqrt(rho_-^2 + 4 r a sin^2(u/2)) du on intervals halving toward u = 0. */
    static double graded(double r, double a, double d, int m) {
        GaussIntegrator g = new GaussIntegratorFactory().legendre(20, 0, 1);
        double rm2 = (r - a) * (r - a) + d * d;
        double width = Math.sqrt(rm2 / (r * a));
        double sum = 0;
        double hi = Math.PI;
        while (true) {
            double lo = hi / 2;
            if (hi < 1e-3 * width) {
                lo = 0;
            }
            for (int k = 0; k < 20; k++) {
                double u = lo + (hi - lo) * g.getPoint(k);
                double sn = Math.sin(0.5 * u);
                sum += (hi - lo) * g.getWeight(k) * Math.cos(m * u) / Math.sqrt(rm2 + 4 * r * a * sn * sn);
            }
            if (lo == 0) {
                break;
            }
            hi = lo;
        }
        return sum / Math.PI;
    }
}
