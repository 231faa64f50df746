package org.axistack.verify;

import java.util.Arrays;

import org.axistack.field.AxialField;
import org.hipparchus.special.BesselJ;

/**
 * Reference axial potential of two coaxial, infinitely long tubes of equal radius R at biases V1 (z &lt; 0) and
 * V2 (z &gt; 0), separated by a gap g centred on z = 0 across which the wall potential varies linearly
 * (classical Bessel-integral solution; e.g. E. Harting and F. H. Read, Electrostatic Lenses, Elsevier 1976, and
 * P. W. Hawkes and E. Kasper, Principles of Electron Optics, vol. 2, ch. 35, cited from memory):
 * V(z) = (V1+V2)/2 + (V2-V1)/pi Integral_0^inf sin(kz)/(k I0(kR)) sinc(kg/2) dk, sinc(x) = sin(x)/x.
 * Derivatives by differentiating under the integral: d^n/dz^n sin(kz) = k^n sin(kz + n pi/2).
 *
 * <p>Computed independently of the project's field solver, in two exact forms. Near the gap
 * (|z| &lt; g/2 + 0.75 R) the integral by composite Gauss-Legendre (kR up to 60, where 1/I0 has fallen below
 * 1e-24; I0 by its power series, Abramowitz and Stegun 9.6.12, which has only positive terms). Further out the
 * equivalent eigenfunction series (separation of variables inside the tube, the poles of the integrand at
 * k = i j_n / R): V(z) = V2 - (V2-V1) Sum_n exp(-j_n z/R) S_n / (j_n J1(j_n)) for z &gt; g/2, over the zeros j_n
 * of J0, with the gap factor S_n = sinh(j_n g/(2R)) / (j_n g/(2R)) (the zero-gap series averaged over the linear
 * wall ramp); J0, J1 from Hipparchus BesselJ. Both forms agree to 1e-11 where both converge (tested).
 * Slow and simple on purpose: a reference for the verification cases and the tests, not for design work.
 */
public final class TwoTubeBesselPotential implements AxialField {

    static final double[] GL_X = { // 12-point Gauss-Legendre rule; recomputed in src/test/resources/reference
        -0.9815606342467192, -0.9041172563704749, -0.7699026741943047, -0.5873179542866175,
        -0.3678314989981802, -0.1252334085114689, 0.1252334085114689, 0.3678314989981802,
        0.5873179542866175, 0.7699026741943047, 0.9041172563704749, 0.9815606342467192};
    static final double[] GL_W = {
        0.0471753363865118, 0.1069393259953184, 0.1600783285433462, 0.2031674267230659,
        0.2334925365383548, 0.2491470458134028, 0.2491470458134028, 0.2334925365383548,
        0.2031674267230659, 0.1600783285433462, 0.1069393259953184, 0.0471753363865118};
    private static final int SERIES_TERMS = 80;

    private final double radius;
    private final double gap;
    private final double v1;
    private final double v2;
    private final double switchZ;
    private final double[] nodes;
    private final double[] weights; // w sinc(kg/2) / I0(kR)
    private final double[] zeros;
    private final double[] coefficients; // S_n / (j_n J1(j_n))

    /** Zero gap. */
    public TwoTubeBesselPotential(double radius_m, double v1_V, double v2_V) {
        this(radius_m, v1_V, v2_V, 0.0);
    }

    /** Gap g (m) with a linear wall potential across it. */
    public TwoTubeBesselPotential(double radius_m, double v1_V, double v2_V, double gap_m) {
        this(radius_m, v1_V, v2_V, gap_m, gap_m / 2 + 0.75 * radius_m);
    }

    /** @param switchZ_m use the integral for |z| below this, the series above (must exceed g/2) */
    public TwoTubeBesselPotential(double radius_m, double v1_V, double v2_V, double gap_m, double switchZ_m) {
        if (!(radius_m > 0) || !(gap_m >= 0) || !(switchZ_m > gap_m / 2) || !Double.isFinite(v1_V + v2_V)) {
            throw new IllegalArgumentException("need radius > 0, gap >= 0, switch beyond the gap, finite biases");
        }
        this.radius = radius_m;
        this.gap = gap_m;
        this.v1 = v1_V;
        this.v2 = v2_V;
        this.switchZ = switchZ_m;
        int panels = 60;
        double width = 1.0 / radius_m;
        nodes = new double[panels * GL_X.length];
        weights = new double[nodes.length];
        for (int p = 0; p < panels; p++) {
            double mid = (p + 0.5) * width;
            for (int j = 0; j < GL_X.length; j++) {
                double k = mid + 0.5 * width * GL_X[j];
                double x = k * gap_m / 2;
                double sinc = x == 0 ? 1 : Math.sin(x) / x;
                nodes[p * GL_X.length + j] = k;
                weights[p * GL_X.length + j] = 0.5 * width * GL_W[j] * sinc / besselI0(k * radius_m);
            }
        }
        zeros = new double[SERIES_TERMS];
        coefficients = new double[SERIES_TERMS];
        for (int n = 1; n <= SERIES_TERMS; n++) {
            double b = (n - 0.25) * Math.PI;
            double x = b + 1 / (8 * b); // McMahon's asymptotic zero, then Newton (J0' = -J1)
            for (int it = 0; it < 20; it++) {
                double dx = BesselJ.value(0, x) / BesselJ.value(1, x);
                x += dx;
                if (Math.abs(dx) < 1e-16 * x) {
                    break;
                }
            }
            zeros[n - 1] = x;
            double h = x * gap_m / (2 * radius_m);
            double gapFactor = h == 0 ? 1 : Math.sinh(h) / h;
            coefficients[n - 1] = gapFactor / (x * BesselJ.value(1, x));
        }
    }

    /** Modified Bessel function I0 by its power series sum (x/2)^(2k)/(k!)^2 (Abramowitz and Stegun 9.6.12). */
    public static double besselI0(double x) {
        double q = x * x / 4;
        double term = 1;
        double sum = 1;
        for (int k = 1; k < 500; k++) {
            term *= q / ((double) k * k);
            sum += term;
            if (term < 1e-17 * sum) {
                break;
            }
        }
        return sum;
    }

    /** Tube radius, m. */
    public double radius_m() {
        return radius;
    }

    /** Gap, m. */
    public double gap_m() {
        return gap;
    }

    @Override
    public void axial(double z_m, int order, double[] out) {
        if (Math.abs(z_m) < switchZ) {
            integral(z_m, order, out);
        } else {
            series(z_m, order, out);
        }
    }

    /** d^n V / dz^n at z (n = 0 is the potential), V/m^n. */
    public double derivative(double z_m, int n) {
        double[] out = new double[n + 1];
        axial(z_m, n, out);
        return out[n];
    }

    /** The integral form (accurate for |z| up to about g/2 + R). */
    public void integral(double z, int order, double[] out) {
        Arrays.fill(out, 0, order + 1, 0.0);
        for (int i = 0; i < nodes.length; i++) {
            double k = nodes[i];
            double s = Math.sin(k * z);
            double c = Math.cos(k * z);
            double w = weights[i] / k;
            for (int n = 0; n <= order; n++) {
                // sin(kz + n pi/2) cycles s, c, -s, -c
                double trig = switch (n & 3) {
                    case 0 -> s;
                    case 1 -> c;
                    case 2 -> -s;
                    default -> -c;
                };
                out[n] += w * trig;
                w *= k;
            }
        }
        double scale = (v2 - v1) / Math.PI;
        for (int n = 0; n <= order; n++) {
            out[n] *= scale;
        }
        out[0] += 0.5 * (v1 + v2);
    }

    /** The eigenfunction series (valid for |z| &gt; g/2; fast convergence from about 0.3 R beyond the gap). */
    public void series(double z, int order, double[] out) {
        double sign = z >= 0 ? 1 : -1;
        double a = Math.abs(z);
        Arrays.fill(out, 0, order + 1, 0.0);
        for (int i = 0; i < zeros.length; i++) {
            double kappa = zeros[i] / radius;
            double term = coefficients[i] * Math.exp(-kappa * a);
            for (int n = 0; n <= order; n++) {
                out[n] += term;
                term *= -kappa;
            }
        }
        // z > 0: V - mean = half - (V2 - V1) S(z); the part about the mean is odd in z
        double mean = 0.5 * (v1 + v2);
        double half = 0.5 * (v2 - v1);
        for (int n = 0; n <= order; n++) {
            double odd = (n == 0 ? half : 0) - (v2 - v1) * out[n];
            // d^n/dz^n of f(|z|) sign(z) = sign^(n+1) f^(n)(|z|)
            out[n] = ((n % 2 == 0) ? sign : 1) * odd;
        }
        out[0] += mean;
    }
}
