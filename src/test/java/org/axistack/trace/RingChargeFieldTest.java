package org.axistack.trace;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.axistack.model.Codata2018;
import org.junit.jupiter.api.Test;

/** Checks of the ring-charge test fixture itself, so that the tracer tests stand on firm ground. */
class RingChargeFieldTest {

    private final double a = 5e-3;
    private final double q = RingChargeField.chargeForCentrePotential(a, -500);
    private final RingChargeField ring = new RingChargeField(new double[] {0}, new double[] {a}, new double[] {q});

    @Test
    void axialPotentialIsTheTextbookRingFormula() {
        // Source: on-axis potential of a ring, q / (4 pi eps0 sqrt(a^2 + z^2)) (any electrostatics text).
        for (double zz : new double[] {-0.02, -0.003, 0, 0.001, 0.04}) {
            double expected = q / (4 * Math.PI * Codata2018.EPSILON0_F_PER_M * Math.hypot(a, zz));
            assertEquals(expected, ring.axialPotential_V(zz), 1e-13 * Math.abs(expected));
            // the elliptic-integral branch (r just above the series switch) approaches the same value
            assertEquals(expected, ring.potential_V(zz, 1.0001e-3 * a), 1e-6 * Math.abs(expected));
        }
    }

    @Test
    void ellipticFormulaAgreesWithTheSeriesOfTheAxialDerivatives() {
        // Two independent computations: Hipparchus elliptic integrals versus the near-axis series of
        // the Legendre-generating-function derivatives. At r = 0.05 a, 1.5 a from the ring plane, the
        // first omitted series term is about 1e-13 of the potential and (r / rho)^6 ~ 5e-10 of E_r.
        double zz = 1.5 * a, r = 0.05 * a;
        double[] v = new double[9];
        ring.axial(zz, 8, v);
        double[] fs = new double[2], fe = new double[2];
        double ps = NearAxisField.series(v, r, fs);
        double pe = ring.evaluate(zz, r, fe);
        assertEquals(ps, pe, 1e-10 * Math.abs(ps));
        assertEquals(fs[0], fe[0], 1e-9 * Math.abs(fs[0]));
        assertEquals(fs[1], fe[1], 1e-9 * Math.abs(fs[1]));
    }

    @Test
    void fieldIsMinusTheGradientOfThePotential() {
        // Central finite differences, step 1e-6 m: truncation ~ h^2 phi''' ~ 1e-12 relative; round-off ~ 1e-10.
        double h = 1e-6;
        for (double[] p : new double[][] {{0.002, 0.003}, {-0.004, 0.0045}, {0.01, 0.008}, {0.0, 0.002}}) {
            double[] f = new double[2];
            ring.evaluate(p[0], p[1], f);
            double ez = -(ring.potential_V(p[0] + h, p[1]) - ring.potential_V(p[0] - h, p[1])) / (2 * h);
            double er = -(ring.potential_V(p[0], p[1] + h) - ring.potential_V(p[0], p[1] - h)) / (2 * h);
            double scale = Math.hypot(f[0], f[1]);
            assertEquals(ez, f[0], 1e-7 * scale);
            assertEquals(er, f[1], 1e-7 * scale);
        }
    }
}
