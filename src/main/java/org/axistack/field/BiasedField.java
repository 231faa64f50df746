package org.axistack.field;

import java.util.List;

import org.axistack.mesh.BoundaryMesh;
import org.axistack.mesh.Panel;
import org.axistack.model.Codata2018;

/**
 * The field of a solved stack at one set of biases: potential and field anywhere by superposing the
 * rings of the surface charge (far panels by their Gauss nodes, near panels by the graded rule of
 * {@link PanelQuadrature}), the axial potential and its derivatives from the Legendre form, electrode
 * charges and surface fields. Immutable and thread-safe.
 */
public final class BiasedField implements Field, AxialField {

    private final FieldSolution solution;
    private final double[] biases;
    private final double[] strength;
    /** sigma/eps0 times |dy/dtau| at each node: the smooth quantity the near rule interpolates. */
    private final double[] densityJac;
    private final double[] density;
    private final ThreadLocal<Scratch> scratch;

    private static final class Scratch {
        final PanelQuadrature.Rule rule = new PanelQuadrature.Rule();
        final double[] basis = new double[64];
        final double[] ke = new double[3];
    }

    BiasedField(FieldSolution solution, double[] biases, double[] strength, double[] density) {
        this.solution = solution;
        this.biases = biases;
        this.strength = strength;
        this.density = density;
        BoundaryMesh mesh = solution.mesh();
        densityJac = new double[density.length];
        for (int j = 0; j < density.length; j++) {
            densityJac[j] = density[j] * mesh.nodeJacobian(j);
        }
        scratch = ThreadLocal.withInitial(Scratch::new);
    }

    public FieldSolution solution() {
        return solution;
    }

    /** Biases, volts, in electrode order. */
    public double[] biases_V() {
        return biases.clone();
    }

    @Override
    public double potential_V(double z_m, double r_m) {
        double[] acc = new double[3];
        accumulate(z_m, r_m, acc);
        return acc[0];
    }

    @Override
    public double evaluate(double z_m, double r_m, double[] fieldOut) {
        double[] acc = new double[3];
        accumulate(z_m, r_m, acc);
        fieldOut[0] = acc[1];
        fieldOut[1] = acc[2];
        return acc[0];
    }

    private void accumulate(double z, double r, double[] acc) {
        BoundaryMesh mesh = solution.mesh();
        List<Panel> panels = mesh.panels();
        int order = mesh.order();
        Scratch s = scratch.get();
        PanelQuadrature quad = solution.quadrature();
        for (int p = 0; p < panels.size(); p++) {
            int base = p * order;
            if (solution.bounds(p).near(z, r)) {
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

    @Override
    public void axial(double z_m, int order, double[] out) {
        if (order < 0 || order > MAX_ORDER) {
            throw new IllegalArgumentException("derivative order must be 0.." + MAX_ORDER);
        }
        java.util.Arrays.fill(out, 0, order + 1, 0.0);
        BoundaryMesh mesh = solution.mesh();
        List<Panel> panels = mesh.panels();
        int n = mesh.order();
        Scratch s = scratch.get();
        PanelQuadrature quad = solution.quadrature();
        for (int p = 0; p < panels.size(); p++) {
            int base = p * n;
            if (solution.bounds(p).near(z_m, 0)) {
                quad.build(panels.get(p), z_m, 0, Double.NaN, s.rule);
                PanelQuadrature.Rule rule = s.rule;
                for (int q = 0; q < rule.size; q++) {
                    quad.basis(rule.t[q], s.basis);
                    double f = 0;
                    for (int j = 0; j < n; j++) {
                        f += s.basis[j] * densityJac[base + j];
                    }
                    RingKernel.accumulateAxial(z_m, rule.z[q], rule.r[q], 0.5 * rule.w[q] * f * rule.r[q], order, out);
                }
            } else {
                for (int j = base; j < base + n; j++) {
                    RingKernel.accumulateAxial(z_m, mesh.nodeZ(j), mesh.nodeR(j), strength[j], order, out);
                }
            }
        }
    }

    /**
     * Distance from (z, r) to the nearest electrode surface, m (from panel bounding circles: a lower bound,
     * exact to within a panel's sagitta). The near-axis series converges inside this distance.
     */
    public double clearance_m(double z_m, double r_m) {
        double best = Double.POSITIVE_INFINITY;
        int panels = solution.mesh().panels().size();
        for (int p = 0; p < panels; p++) {
            PanelQuadrature.Bounds b = solution.bounds(p);
            best = Math.min(best, Math.hypot(z_m - b.zc(), r_m - b.rc()) - b.radius());
        }
        return Math.max(best, 0);
    }

    /** Charge on each electrode, C. */
    public double[] charges_C() {
        BoundaryMesh mesh = solution.mesh();
        double[] q = new double[solution.electrodes().size()];
        double fourPiEps0 = 4 * Math.PI * Codata2018.EPSILON0_F_PER_M;
        for (int j = 0; j < strength.length; j++) {
            q[mesh.electrodeOf(j)] += fourPiEps0 * strength[j];
        }
        return q;
    }

    /** sigma/eps0 at node j (total over both faces for a sheet), V/m. */
    public double nodeDensity_V_per_m(int j) {
        return density[j];
    }

    /**
     * Electrode surface field magnitude at every node, V/m: |sigma|/eps0 on closed conductors; for thin
     * sheets the larger of the two faces, each found by evaluating the field a ten-thousandth of the
     * element length off the face (error of that order relative to the field gradient's effect).
     */
    public double[] surfaceFields_V_per_m() {
        BoundaryMesh mesh = solution.mesh();
        int n = mesh.size();
        double[] out = new double[n];
        double[] tau = mesh.nodeTau();
        java.util.stream.IntStream.range(0, n).parallel().forEach(j -> {
            Panel p = mesh.panelOf(j);
            if (!p.sheet()) {
                out[j] = Math.abs(density[j]);
                return;
            }
            double[] t = p.tangent(tau[j % mesh.order()]);
            double dn = 1e-4 * p.length_m();
            double[] f = new double[2];
            double best = 0;
            for (int side = -1; side <= 1; side += 2) {
                double zq = mesh.nodeZ(j) - side * t[1] * dn;
                double rq = mesh.nodeR(j) + side * t[0] * dn;
                evaluate(zq, rq, f);
                best = Math.max(best, Math.hypot(f[0], f[1]));
            }
            out[j] = best;
        });
        return out;
    }

    /** Largest surface field on each electrode, V/m (see {@link #surfaceFields_V_per_m()}). */
    public double[] maxSurfaceFieldPerElectrode_V_per_m() {
        double[] all = surfaceFields_V_per_m();
        double[] max = new double[solution.electrodes().size()];
        BoundaryMesh mesh = solution.mesh();
        for (int j = 0; j < all.length; j++) {
            int e = mesh.electrodeOf(j);
            max[e] = Math.max(max[e], all[j]);
        }
        return max;
    }
}
