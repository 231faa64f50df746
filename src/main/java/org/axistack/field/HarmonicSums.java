package org.axistack.field;

import java.util.List;

import org.axistack.mesh.BoundaryMesh;
import org.axistack.mesh.Panel;

/**
 * Sums of harmonic ring kernels over the mesh for one density vector (amplitude of cos(m phi)): far panels by
 * their Gauss nodes, near panels by the graded rule of {@link PanelQuadrature} on the interpolated density,
 * as {@link RingSums} does for m = 0.
 */
final class HarmonicSums {

    private HarmonicSums() {
    }

    /** Potential amplitude at (z, r), volts, of density amplitudes sigma/eps0 (V/m) at every node. */
    static double potential(FieldSolution sol, int m, double[] density, double z, double r) {
        BoundaryMesh mesh = sol.mesh();
        List<Panel> panels = mesh.panels();
        int order = mesh.order();
        PanelQuadrature quad = sol.quadrature();
        PanelQuadrature.Rule rule = new PanelQuadrature.Rule();
        double[] basis = new double[order];
        double sum = 0;
        for (int p = 0; p < panels.size(); p++) {
            int base = p * order;
            if (sol.bounds(p).near(z, r)) {
                quad.build(panels.get(p), z, r, Double.NaN, rule);
                for (int q = 0; q < rule.size; q++) {
                    quad.basis(rule.t[q], basis);
                    double f = 0;
                    for (int j = 0; j < order; j++) {
                        f += basis[j] * density[base + j] * mesh.nodeJacobian(base + j);
                    }
                    sum += 0.5 * rule.w[q] * f * rule.r[q] * HarmonicKernel.potential(m, z, r, rule.z[q], rule.r[q]);
                }
            } else {
                for (int j = base; j < base + order; j++) {
                    sum += 0.5 * mesh.nodeWeight(j) * mesh.nodeJacobian(j) * mesh.nodeR(j) * density[j]
                            * HarmonicKernel.potential(m, z, r, mesh.nodeZ(j), mesh.nodeR(j));
                }
            }
        }
        return sum;
    }

    /**
     * Axial multipole function of harmonic m and its z-derivatives for one density vector: the coefficient
     * Phi_m(z) of r^m cos(m phi) in the potential near the axis, out[n] = d^n Phi_m / dz^n for n = 0..order.
     * A ring (strength s, radius a) contributes s c_m a^m / rho^(2m+1), c_m = binom(2m, m)/4^m (the r -&gt; 0
     * limit of {@link HarmonicKernel}: Q_{m-1/2}(chi) ~ sqrt(pi) Gamma(m+1/2)/(m! (2 chi)^(m+1/2))), and
     * d^n/dz^n rho^(-2 lambda) = (-1)^n n! C_n^lambda(cos t) / rho^(n + 2 lambda), lambda = m + 1/2, cos t = (z - z')/rho
     * (generating function of the Gegenbauer polynomials; Abramowitz and Stegun 22.9.3 for the recurrence).
     */
    static void axial(FieldSolution sol, int m, double[] density, double z, int order, double[] out) {
        java.util.Arrays.fill(out, 0, order + 1, 0);
        BoundaryMesh mesh = sol.mesh();
        List<Panel> panels = mesh.panels();
        int nodes = mesh.order();
        PanelQuadrature quad = sol.quadrature();
        PanelQuadrature.Rule rule = new PanelQuadrature.Rule();
        double[] basis = new double[nodes];
        double cm = 1;
        for (int j = 1; j <= m; j++) {
            cm *= (2 * j - 1) / (2.0 * j);
        }
        for (int p = 0; p < panels.size(); p++) {
            int base = p * nodes;
            if (sol.bounds(p).near(z, 0)) {
                quad.build(panels.get(p), z, 0, Double.NaN, rule);
                for (int q = 0; q < rule.size; q++) {
                    quad.basis(rule.t[q], basis);
                    double f = 0;
                    for (int j = 0; j < nodes; j++) {
                        f += basis[j] * density[base + j] * mesh.nodeJacobian(base + j);
                    }
                    ring(m, cm, z, rule.z[q], rule.r[q], 0.5 * rule.w[q] * f * rule.r[q], order, out);
                }
            } else {
                for (int j = base; j < base + nodes; j++) {
                    double sj = 0.5 * mesh.nodeWeight(j) * mesh.nodeJacobian(j) * mesh.nodeR(j) * density[j];
                    ring(m, cm, z, mesh.nodeZ(j), mesh.nodeR(j), sj, order, out);
                }
            }
        }
    }

    private static void ring(int m, double cm, double z, double zRing, double a, double strength, int order, double[] out) {
        if (!(a > 0)) {
            return;
        }
        double d = z - zRing;
        double rho = Math.sqrt(a * a + d * d);
        double x = d / rho;
        double lambda = m + 0.5;
        double am = 1;
        for (int j = 0; j < m; j++) {
            am *= a / rho;
        }
        // term_n = strength cm a^m (-1)^n n! C_n(x) / rho^(n + 2m + 1)
        double scale = strength * cm * am / rho; // (a/rho)^m / rho, then / rho^m: a^m / rho^(2m+1)
        for (int j = 0; j < m; j++) {
            scale /= rho;
        }
        double cPrev = 1;
        double c = 2 * lambda * x;
        out[0] += scale;
        double fac = scale;
        for (int n = 1; n <= order; n++) {
            if (n >= 2) {
                double next = (2 * x * (n + lambda - 1) * c - (n + 2 * lambda - 2) * cPrev) / n;
                cPrev = c;
                c = next;
            }
            fac = -fac * n / rho;
            out[n] += fac * c;
        }
    }
}
