package org.axistack.mesh;

import java.util.List;

/**
 * Electrode outlines cut into panels, each with {@link #order()} collocation nodes (Gauss-Legendre in
 * the panel's local coordinate). Immutable: node data is copied out on request.
 */
public final class BoundaryMesh {

    private final List<Panel> panels;
    private final int order;
    private final double[] tau;
    private final double[] weight;
    private final double[] z;
    private final double[] r;
    private final double[] jac;

    BoundaryMesh(List<Panel> panels, int order, double[] tau, double[] weight) {
        this.panels = List.copyOf(panels);
        this.order = order;
        this.tau = tau.clone();
        this.weight = weight.clone();
        int n = panels.size() * order;
        z = new double[n];
        r = new double[n];
        jac = new double[n];
        for (int p = 0; p < panels.size(); p++) {
            Panel pn = panels.get(p);
            for (int j = 0; j < order; j++) {
                var pt = pn.at(tau[j]);
                z[p * order + j] = pt.z_m();
                r[p * order + j] = pt.r_m();
                jac[p * order + j] = pn.jacobian(tau[j]);
            }
        }
    }

    public List<Panel> panels() {
        return panels;
    }

    /** Nodes (unknowns) per panel. */
    public int order() {
        return order;
    }

    /** Total number of unknowns (collocation nodes). */
    public int size() {
        return z.length;
    }

    /** Local node coordinates tau_j in [0, 1] (shared by every panel). */
    public double[] nodeTau() {
        return tau.clone();
    }

    /** Gauss-Legendre weights on [0, 1] for the local nodes. */
    public double[] nodeWeights() {
        return weight.clone();
    }

    public double nodeZ(int i) {
        return z[i];
    }

    public double nodeR(int i) {
        return r[i];
    }

    /** |dy/dtau| at node i, metres. */
    public double nodeJacobian(int i) {
        return jac[i];
    }

    /** Gauss weight of node i within its panel. */
    public double nodeWeight(int i) {
        return weight[i % order];
    }

    public Panel panelOf(int node) {
        return panels.get(node / order);
    }

    public int electrodeOf(int node) {
        return panels.get(node / order).electrode();
    }
}
