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
}
