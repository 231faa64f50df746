package org.axistack.field;

import static org.assertj.core.api.Assertions.assertThat;

import org.hipparchus.special.elliptic.legendre.LegendreEllipticIntegral;
import org.junit.jupiter.api.Test;

/** The elliptic integrals and the ring kernel against independent references. */
class EllipticAndKernelTest {

    /** Reference: Hipparchus LegendreEllipticIntegral.bigK/bigE (a general-purpose library, Carlson forms). */
    @Test
    void ellipticIntegralsMatchHipparchus() {
        double worst = 0;
        for (int i = 0; i <= 4000; i++) {
            // dense in m, and log-dense toward m = 1 down to 1 - m = 1e-12
            double m = i <= 2000 ? i / 2001.0 : 1 - Math.pow(10, -12.0 * (i - 2000) / 2000);
            double[] o = new double[3];
            EllipticIntegrals.kAndE(m, 1 - m, o);
            double k = LegendreEllipticIntegral.bigK(m);
            double e = LegendreEllipticIntegral.bigE(m);
            worst = Math.max(worst, Math.abs(o[0] - k) / k);
            worst = Math.max(worst, Math.abs(o[1] - e) / e);
            assertThat(Math.abs(o[2] - (k - e))).isLessThanOrEqualTo(1e-13 * k);
        }
        assertThat(worst).isLessThan(1e-13);
    }

    /** E = -grad phi, checked by central differences of the kernel's own potential (Laplace consistency). */
    @Test
    void ringFieldIsMinusGradientOfPotential() {
        double a = 0.01;
        double[][] points = {{0.003, 0.004}, {-0.02, 0.012}, {0.0005, 0.0099}, {0.01, 0}, {0.0, 1e-7}, {0.05, 0.03}};
        for (double[] p : points) {
            double z = p[0], r = p[1];
            double[] acc = new double[3];
            RingKernel.accumulate(z, r, 0, a, 1.0, acc, new double[3]);
            double h = 1e-6 * a;
            double ez = -(RingKernel.potential(z + h, r, 0, a) - RingKernel.potential(z - h, r, 0, a)) / (2 * h);
            assertThat(acc[0]).isCloseTo(RingKernel.potential(z, r, 0, a), org.assertj.core.data.Offset.offset(1e-12 * Math.abs(acc[0])));
            assertThat(acc[1]).isCloseTo(ez, org.assertj.core.data.Offset.offset(1e-6 * Math.abs(acc[0]) / a + 1e-9 * Math.abs(ez)));
            if (r > 1e-5) {
                double er = -(RingKernel.potential(z, r + h, 0, a) - RingKernel.potential(z, r - h, 0, a)) / (2 * h);
                assertThat(acc[2]).isCloseTo(er, org.assertj.core.data.Offset.offset(1e-6 * Math.abs(acc[0]) / a));
            } else {
                // near the axis E_r = -(r/2) V''(z)... must vanish linearly: |E_r| tiny
                assertThat(Math.abs(acc[2])).isLessThan(1e-3 * Math.abs(acc[0]) / a);
            }
        }
    }

    /**
     * On the axis the ring potential is 1/sqrt(a^2 + d^2) (Coulomb's law for a ring, textbook); its z-derivatives
     * from the Legendre form are checked against the closed-form first and second derivatives.
     */
    @Test
    void axialLegendreFormMatchesClosedForms() {
        double a = 0.02;
        for (double d : new double[] {-0.05, -0.001, 0, 0.013, 0.2}) {
            double[] out = new double[17];
            RingKernel.accumulateAxial(d, 0, a, 1.0, 16, out);
            double rho2 = a * a + d * d;
            double rho = Math.sqrt(rho2);
            assertThat(out[0]).isCloseTo(1 / rho, org.assertj.core.data.Offset.offset(1e-15 / rho));
            assertThat(out[1]).isCloseTo(-d / (rho2 * rho), org.assertj.core.data.Offset.offset(1e-14 / rho2));
            assertThat(out[2]).isCloseTo((2 * d * d - a * a) / (rho2 * rho2 * rho), org.assertj.core.data.Offset.offset(1e-13 / (rho2 * rho)));
            // and the potential from the full elliptic kernel at r = 0 agrees
            assertThat(RingKernel.potential(d, 0, 0, a)).isCloseTo(1 / rho, org.assertj.core.data.Offset.offset(1e-15 / rho));
        }
    }
}
