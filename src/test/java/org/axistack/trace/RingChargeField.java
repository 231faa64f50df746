package org.axistack.trace;

import org.axistack.field.AxialField;
import org.axistack.field.Field;
import org.axistack.model.Codata2018;
import org.hipparchus.special.elliptic.legendre.LegendreEllipticIntegral;

/**
 * Test fixture: the field of a few coaxial rings of charge. Off the axis by the classical ring
 * formula with complete elliptic integrals K and E (Jackson, "Classical Electrodynamics", 3rd ed.,
 * section 3.3 and problem 5.33; Smythe, "Static and Dynamic Electricity", 5.06), evaluated with the
 * Hipparchus LegendreEllipticIntegral (parameter m = k^2). On the axis, V^(n) from the Legendre
 * generating function d^n/dz^n (1/rho) = (-1)^n n! P_n(cos t) / rho^(n+1). Very near the axis
 * (r below 1e-3 of the ring radius) the off-axis formulas lose digits to cancellation, so there the
 * power series of the exact axial derivatives is used (its first omitted term is below 1e-24 relative).
 */
final class RingChargeField implements Field, AxialField {

    private final double[] z;
    private final double[] a;
    private final double[] k; // q / (4 pi eps0)

    /** Rings at z[i] with radius a[i] and charge q[i] (C). */
    RingChargeField(double[] z, double[] a, double[] q) {
        this.z = z.clone();
        this.a = a.clone();
        this.k = new double[q.length];
        for (int i = 0; i < q.length; i++) {
            k[i] = q[i] / (4 * Math.PI * Codata2018.EPSILON0_F_PER_M);
        }
    }

    /** Charge of a ring of radius a whose own potential at its centre is v0 (V). */
    static double chargeForCentrePotential(double a_m, double v0_V) {
        return v0_V * 4 * Math.PI * Codata2018.EPSILON0_F_PER_M * a_m;
    }

    @Override
    public double evaluate(double zz, double r, double[] out) {
        double phi = 0, ez = 0, er = 0;
        double[] tmp = new double[2];
        for (int i = 0; i < z.length; i++) {
            phi += ring(i, zz, r, tmp);
            ez += tmp[0];
            er += tmp[1];
        }
        out[0] = ez;
        out[1] = er;
        return phi;
    }

    private double ring(int i, double zz, double r, double[] out) {
        double dz = zz - z[i], ai = a[i];
        if (r < 1e-3 * ai) {
            double[] v = new double[9];
            axialOne(i, zz, 8, v);
            return NearAxisField.series(v, r, out);
        }
        double d2 = (r + ai) * (r + ai) + dz * dz;
        double e2 = (r - ai) * (r - ai) + dz * dz;
        double m = 4 * ai * r / d2;
        double kk = LegendreEllipticIntegral.bigK(m);
        double ee = LegendreEllipticIntegral.bigE(m);
        double d = Math.sqrt(d2);
        double c = k[i] * 2 / Math.PI;
        out[0] = c * dz * ee / (d * e2);
        out[1] = c / (2 * r * d) * (kk - (ai * ai - r * r + dz * dz) / e2 * ee);
        return c * kk / d;
    }

    private void axialOne(int i, double zz, int order, double[] out) {
        double dz = zz - z[i];
        double rho = Math.hypot(a[i], dz);
        double x = dz / rho;
        // Legendre polynomials by the three-term recurrence
        double p0 = 1, p1 = x;
        double fact = 1, rp = rho;
        for (int n = 0; n <= order; n++) {
            double pn;
            if (n == 0) {
                pn = p0;
            } else if (n == 1) {
                pn = p1;
            } else {
                pn = ((2 * n - 1) * x * p1 - (n - 1) * p0) / n;
                p0 = p1;
                p1 = pn;
            }
            if (n > 0) {
                fact *= n;
                rp *= rho;
            }
            out[n] = k[i] * ((n % 2 == 0) ? 1 : -1) * fact * pn / rp;
        }
    }

    @Override
    public void axial(double zz, int order, double[] out) {
        double[] t = new double[order + 1];
        java.util.Arrays.fill(out, 0, order + 1, 0.0);
        for (int i = 0; i < z.length; i++) {
            axialOne(i, zz, order, t);
            for (int n = 0; n <= order; n++) {
                out[n] += t[n];
            }
        }
    }
}
