package org.axistack.reference;

import org.hipparchus.analysis.integration.gauss.GaussIntegrator;
import org.hipparchus.analysis.integration.gauss.GaussIntegratorFactory;

/**
 * Axial potential of two coaxial tubes of equal radius R at biases V1 (z &lt; 0) and V2 (z &gt; 0), infinitely
 * long, separated by a gap g across which the wall potential varies linearly:
 * V(z) = (V1+V2)/2 + (V2-V1)/pi Int_0^inf sin(kz)/(k I0(kR)) * sinc(kg/2) dk
 * (classical Bessel-integral solution; e.g. E. Harting and F. H. Read, Electrostatic Lenses, Elsevier 1976,
 * and P. W. Hawkes and E. Kasper, Principles of Electron Optics, vol. 2, ch. 35; the zero-gap form also in
 * Szilagyi, Electron and Ion Optics, 1988). Computed here independently of the project's field solver: I0 by
 * its power series (Abramowitz and Stegun 9.6.10), the k-integral by composite Gauss-Legendre (Hipparchus) up
 * to kR = 60 where the integrand is below 1e-24. Derivatives by differentiating under the integral.
 * A slow, simple reference for tests only.
 */
public final class TwoTubeBesselPotential {

    private final double v1;
    private final double v2;
    private final double radius;
    private final double gap;
    private final double[] k;
    private final double[] w;

    public TwoTubeBesselPotential(double v1_V, double v2_V, double radius_m, double gap_m) {
        this.v1 = v1_V;
        this.v2 = v2_V;
        this.radius = radius_m;
        this.gap = gap_m;
        int intervals = 1200;
        double kMax = 60 / radius_m;
        GaussIntegrator g = new GaussIntegratorFactory().legendre(16, 0, 1);
        k = new double[intervals * 16];
        w = new double[intervals * 16];
        for (int i = 0; i < intervals; i++) {
            double a = kMax * i / intervals;
            double b = kMax * (i + 1) / intervals;
            for (int q = 0; q < 16; q++) {
                k[i * 16 + q] = a + (b - a) * g.getPoint(q);
                w[i * 16 + q] = (b - a) * g.getWeight(q);
            }
        }
    }

    /** Modified Bessel function I0 by its power series (all terms positive, no cancellation). */
    public static double besselI0(double x) {
        double t = 1;
        double s = 1;
        double q = x * x / 4;
        for (int n = 1; n < 500; n++) {
            t *= q / ((double) n * n);
            s += t;
            if (t < 1e-17 * s) {
                break;
            }
        }
        return s;
    }

    /** d^n V / dz^n at z (n = 0 is the potential), V/m^n. */
    public double derivative(double z, int n) {
        double sum = 0;
        for (int i = 0; i < k.length; i++) {
            double kk = k[i];
            double sinc = gap == 0 ? 1 : Math.sin(kk * gap / 2) / (kk * gap / 2);
            // d^n/dz^n sin(kz) = k^n sin(kz + n pi/2)
            double f = Math.pow(kk, n - 1) * Math.sin(kk * z + n * Math.PI / 2) / besselI0(kk * radius) * sinc;
            sum += w[i] * f;
        }
        double val = (v2 - v1) / Math.PI * sum;
        return n == 0 ? val + 0.5 * (v1 + v2) : val;
    }
}
