package org.axistack.field;

import static org.assertj.core.api.Assertions.assertThat;

import org.hipparchus.linear.Array2DRowRealMatrix;
import org.hipparchus.linear.ArrayRealVector;
import org.hipparchus.linear.LUDecomposition;
import org.hipparchus.linear.RealVector;
import org.junit.jupiter.api.Test;

/**
 * How good the linear-ramp model of finite slits is ({@link org.axistack.model.Sectors#slitFactor}): against a
 * two-dimensional reference, the cross-section of a long four-sector electrode (thin sectors of radius R cut by
 * open slits of arc width w) inside a grounded round enclosure of radius R_o, solved here by a first-kind boundary
 * integral equation with the plane kernel -(1/2 pi) ln|x - x'| (piecewise-constant densities on panels graded
 * toward the sector edges, where the density has its inverse-square-root singularity; the logarithm of each
 * panel's own collocation point subtracted and integrated in closed form, the rest by 16-point Gauss-Legendre;
 * common practice, no source). The reference lets the enclosure's potential in through the slits, which the
 * model (a prescribed potential on the whole circle, a ramp across each slit) leaves out. Measured quantity: the
 * cos(m phi) amplitude of the interior potential at r = 0.2 R (m = 1 for the x differential pattern, m = 2 for the
 * 0-degree quadrupole pattern), relative to the model's a_m (r/R)^m with and without the slit factor. The
 * reference's own discretisation error is shown by doubling the panels.
 */
class SlitModelTest {

    static final double R = 1;

    /** Interior cos(m phi) amplitude at r = 0.2 R for sector biases cos(m theta_s) (four sectors), slits w. */
    static double reference(int m, double w, double ro, int perSector) {
        int outer = 4 * perSector;
        int n = 4 * perSector + outer;
        double[] t0 = new double[n];
        double[] t1 = new double[n];
        double[] rad = new double[n];
        double[] bias = new double[n];
        double half = Math.PI / 4 - w / (2 * R);
        int k = 0;
        for (int s = 0; s < 4; s++) {
            double c = s * Math.PI / 2;
            for (int p = 0; p < perSector; p++) {
                // cosine grading toward both edges
                double a = c - half + half * (1 - Math.cos(Math.PI * p / perSector));
                double b = c - half + half * (1 - Math.cos(Math.PI * (p + 1) / perSector));
                t0[k] = a;
                t1[k] = b;
                rad[k] = R;
                bias[k] = Math.cos(m * c);
                k++;
            }
        }
        for (int p = 0; p < outer; p++) {
            t0[k] = 2 * Math.PI * p / outer;
            t1[k] = 2 * Math.PI * (p + 1) / outer;
            rad[k] = ro;
            bias[k] = 0;
            k++;
        }
        org.hipparchus.analysis.integration.gauss.GaussIntegrator g =
                new org.hipparchus.analysis.integration.gauss.GaussIntegratorFactory().legendre(16, 0, 1);
        Array2DRowRealMatrix a = new Array2DRowRealMatrix(n, n);
        ArrayRealVector rhs = new ArrayRealVector(n);
        for (int i = 0; i < n; i++) {
            double ti = 0.5 * (t0[i] + t1[i]);
            double xi = rad[i] * Math.cos(ti);
            double yi = rad[i] * Math.sin(ti);
            rhs.setEntry(i, bias[i]);
            for (int j = 0; j < n; j++) {
                double len = rad[j] * (t1[j] - t0[j]);
                double sum = 0;
                boolean self = i == j;
                for (int q = 0; q < g.getNumberOfPoints(); q++) {
                    double t = t0[j] + (t1[j] - t0[j]) * g.getPoint(q);
                    double d = Math.hypot(xi - rad[j] * Math.cos(t), yi - rad[j] * Math.sin(t));
                    double f = Math.log(d);
                    if (self) {
                        f -= Math.log(Math.abs(rad[j] * (t - ti)));
                    }
                    sum += g.getWeight(q) * len * f;
                }
                if (self) {
                    sum += len * (Math.log(len / 2) - 1);
                }
                a.setEntry(i, j, -sum / (2 * Math.PI));
            }
        }
        RealVector sigma = new LUDecomposition(a).getSolver().solve(rhs);
        double r = 0.2 * R;
        int points = 64;
        double amp = 0;
        for (int p = 0; p < points; p++) {
            double phi = 2 * Math.PI * p / points;
            double x = r * Math.cos(phi);
            double y = r * Math.sin(phi);
            double u = 0;
            for (int j = 0; j < n; j++) {
                double len = rad[j] * (t1[j] - t0[j]);
                for (int q = 0; q < g.getNumberOfPoints(); q++) {
                    double t = t0[j] + (t1[j] - t0[j]) * g.getPoint(q);
                    u -= sigma.getEntry(j) * g.getWeight(q) * len
                            * Math.log(Math.hypot(x - rad[j] * Math.cos(t), y - rad[j] * Math.sin(t))) / (2 * Math.PI);
                }
            }
            amp += u * Math.cos(m * phi);
        }
        return 2 * amp / points;
    }

    /** The model's interior amplitude: a_m (r/R)^m, a_m of four sectors at cos(m theta_s), times the slit factor. */
    static double model(int m, double w) {
        org.axistack.model.Sectors s = new org.axistack.model.Sectors(4, 0, w,
                java.util.List.of(Math.cos(0.0), Math.cos(m * Math.PI / 2), Math.cos(m * Math.PI), Math.cos(1.5 * m * Math.PI)));
        return s.harmonic(m)[0] * s.slitFactor(m, R) * Math.pow(0.2, m);
    }

    /**
     * Measured (printed): the reference lies below the ramp model by about 0.32 (w/R)^2 (m = 1, enclosure at 1.5 R),
     * 0.18 (w/R)^2 (m = 1, enclosure at 3 R) and 0.085 (w/R)^2 (m = 2, either), against 0.37, 0.22 and 0.25
     * (w/R)^2 for the zero-width model: the slits let the enclosure's potential in (for the dipole most), which the
     * ramp does not model. Asserted: the error bounds stated in harmonic-field.md, and the ramp never worse than
     * ignoring the slit.
     */
    @Test
    void rampModelAgainstOpenSlits() {
        // the reference's own error: panels doubled in the widest case
        double coarse = reference(1, 0.2, 1.5, 32);
        double check = reference(1, 0.2, 1.5, 64);
        System.out.printf("reference, panels doubled: %.1e%n", check / coarse - 1);
        assertThat(Math.abs(check / coarse - 1)).as("reference converged").isLessThan(2e-4);
        for (int m : new int[] {1, 2}) {
            for (double w : new double[] {0.1, 0.2}) {
                for (double ro : new double[] {1.5, 3.0}) {
                    double ref = m == 1 && w == 0.2 && ro == 1.5 ? check : reference(m, w, ro, 64);
                    double ramp = model(m, w);
                    double zero = model(m, 0);
                    double rampError = ref / ramp - 1;
                    double zeroError = ref / zero - 1;
                    double q = (w / R) * (w / R);
                    System.out.printf("m=%d w/R=%.2f Ro/R=%.1f: ramp model %.2e = %.3f (w/R)^2, zero-width model %.2e = %.3f"
                            + " (w/R)^2, ramp effect %.2e%n", m, w, ro, rampError, rampError / q, zeroError, zeroError / q,
                            ramp / zero - 1);
                    assertThat(Math.abs(rampError)).isLessThan((m == 1 ? 0.35 : 0.1) * q);
                    assertThat(Math.abs(rampError)).isLessThan(Math.abs(zeroError));
                }
            }
        }
    }
}
