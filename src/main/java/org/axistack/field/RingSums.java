package org.axistack.field;

import java.util.Arrays;
import java.util.List;

import org.axistack.mesh.BoundaryMesh;
import org.axistack.mesh.Panel;

/**
 * Sums over the surface-charge rings of a solution for one or several charge vectors at once (the unit
 * solutions share every geometric quantity, so they are summed together): far panels by their Gauss nodes,
 * near panels by the graded rule of {@link PanelQuadrature} applied to the interpolated density.
 */
final class RingSums {

    private RingSums() {
    }

    /** Per-thread work buffers. */
    static final class Scratch {
        final PanelQuadrature.Rule rule = new PanelQuadrature.Rule();
        final double[] basis = new double[64];
        final double[] ke = new double[3];
        final double[] one = new double[PanelQuadrature.MAX_ORDER_OUT];
    }

    static final ThreadLocal<Scratch> SCRATCH = ThreadLocal.withInitial(Scratch::new);

    /**
     * Axial derivatives 0..order at z for each charge vector k: out[k][n] = sum over rings.
     *
     * @param strength   node ring strengths lambda_j (V m) per vector
     * @param densityJac sigma/eps0 |dy/dtau| at nodes per vector (interpolated on near panels)
     */
    static void axial(FieldSolution sol, double z, int order, double[][] strength, double[][] densityJac, double[][] out) {
        int vectors = strength.length;
        for (int k = 0; k < vectors; k++) {
            Arrays.fill(out[k], 0, order + 1, 0.0);
        }
        BoundaryMesh mesh = sol.mesh();
        List<Panel> panels = mesh.panels();
        int n = mesh.order();
        Scratch s = SCRATCH.get();
        PanelQuadrature quad = sol.quadrature();
        double[] one = s.one;
        for (int p = 0; p < panels.size(); p++) {
            int base = p * n;
            if (sol.bounds(p).near(z, 0)) {
                quad.build(panels.get(p), z, 0, Double.NaN, s.rule);
                PanelQuadrature.Rule rule = s.rule;
                for (int q = 0; q < rule.size; q++) {
                    quad.basis(rule.t[q], s.basis);
                    Arrays.fill(one, 0, order + 1, 0.0);
                    RingKernel.accumulateAxial(z, rule.z[q], rule.r[q], 0.5 * rule.w[q] * rule.r[q], order, one);
                    for (int k = 0; k < vectors; k++) {
                        double[] dj = densityJac[k];
                        double f = 0;
                        for (int j = 0; j < n; j++) {
                            f += s.basis[j] * dj[base + j];
                        }
                        double[] o = out[k];
                        for (int m = 0; m <= order; m++) {
                            o[m] += f * one[m];
                        }
                    }
                }
            } else {
                for (int j = base; j < base + n; j++) {
                    Arrays.fill(one, 0, order + 1, 0.0);
                    RingKernel.accumulateAxial(z, mesh.nodeZ(j), mesh.nodeR(j), 1.0, order, one);
                    for (int k = 0; k < vectors; k++) {
                        double w = strength[k][j];
                        double[] o = out[k];
                        for (int m = 0; m <= order; m++) {
                            o[m] += w * one[m];
                        }
                    }
                }
            }
        }
    }

    /** Potential and field at (z, r) for one charge vector: acc[0] += phi, acc[1] += E_z, acc[2] += E_r. */
    static void field(FieldSolution sol, double z, double r, double[] strength, double[] densityJac, double[] acc) {
        BoundaryMesh mesh = sol.mesh();
        List<Panel> panels = mesh.panels();
        int order = mesh.order();
        Scratch s = SCRATCH.get();
        PanelQuadrature quad = sol.quadrature();
        for (int p = 0; p < panels.size(); p++) {
            int base = p * order;
            if (sol.bounds(p).near(z, r)) {
                quad.build(panels.get(p), z, r, Double.NaN, s.rule);
                PanelQuadrature.Rule rule = s.rule;
                for (int q = 0; q < rule.size; q++) {
                    quad.basis(rule.t[q], s.basis);
                    double f = 0;
                    for (int j = 0; j < order; j++) {
                        f += s.basis[j] * densityJac[base + j];
                    }
                    RingKernel.accumulate(z, r, rule.z[q], rule.r[q], 0.5 * rule.w[q] * f * rule.r[q], acc, s.ke);
                }
            } else {
                for (int j = base; j < base + order; j++) {
                    RingKernel.accumulate(z, r, mesh.nodeZ(j), mesh.nodeR(j), strength[j], acc, s.ke);
                }
            }
        }
    }
}
