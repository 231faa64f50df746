package org.axistack.field;

import java.util.List;

import org.axistack.mesh.BoundaryMesh;
import org.axistack.model.Codata2018;
import org.axistack.model.Electrode;
import org.axistack.model.GeometryKey;
import org.axistack.model.Stack;

/**
 * The solved stack: one unit-bias surface-charge solution per electrode on a fixed mesh. By linearity any
 * bias set is a weighted sum of these, so re-biasing ({@link #withBiases}) never solves again. Immutable
 * and thread-safe.
 */
public final class FieldSolution {

    private final List<Electrode> electrodes;
    private final BoundaryMesh mesh;
    private final PanelQuadrature quad;
    private final PanelQuadrature.Bounds[] bounds;
    /** sigma/eps0 (V/m) at every node, one row per unit-biased electrode. */
    private final double[][] unitDensity;
    /** Node ring strengths lambda_j = Q_j/(4 pi eps0) (V m), one row per unit-biased electrode. */
    private final double[][] unitStrength;
    private final double residual;
    private final double solveSeconds;
    private final double assembleSeconds;
    private final boolean mirrorHalves;
    private final double[][] capacitance;
    private volatile AxialExpansion axialExpansion;
    /** Set by an accuracy-driven solve (null for a fixed mesh). */
    private MeshAccuracy meshAccuracy;
    /** The next coarser mesh's solution of an accuracy-driven solve (null for a fixed mesh or a single rung). */
    private FieldSolution coarser;

    FieldSolution(List<Electrode> electrodes, BoundaryMesh mesh, PanelQuadrature quad, PanelQuadrature.Bounds[] bounds,
            double[][] unitDensity, double residual, double solveSeconds, double assembleSeconds, boolean mirrorHalves) {
        this.electrodes = List.copyOf(electrodes);
        this.mesh = mesh;
        this.quad = quad;
        this.bounds = bounds;
        this.unitDensity = unitDensity;
        this.residual = residual;
        this.solveSeconds = solveSeconds;
        this.assembleSeconds = assembleSeconds;
        this.mirrorHalves = mirrorHalves;
        int ne = electrodes.size();
        int n = mesh.size();
        unitStrength = new double[ne][n];
        for (int e = 0; e < ne; e++) {
            for (int j = 0; j < n; j++) {
                unitStrength[e][j] = 0.5 * mesh.nodeWeight(j) * mesh.nodeJacobian(j) * mesh.nodeR(j) * unitDensity[e][j];
            }
        }
        capacitance = new double[ne][ne];
        for (int k = 0; k < ne; k++) {
            double[] q = electrodeCharges_C(unitStrength[k]);
            for (int i = 0; i < ne; i++) {
                capacitance[i][k] = q[i];
            }
        }
    }

    /**
     * Charge on each electrode, C, from node ring strengths lambda_j = Q_j/(4 pi eps0) (V m): the one place
     * where ring strengths become coulombs.
     */
    double[] electrodeCharges_C(double[] strength) {
        double fourPiEps0 = 4 * Math.PI * Codata2018.EPSILON0_F_PER_M;
        double[] q = new double[electrodes.size()];
        for (int j = 0; j < strength.length; j++) {
            q[mesh.electrodeOf(j)] += fourPiEps0 * strength[j];
        }
        return q;
    }

    /** This solution with the record of the accuracy-driven refinement that produced it. */
    FieldSolution withMeshAccuracy(MeshAccuracy accuracy, FieldSolution coarserRung) {
        FieldSolution s = new FieldSolution(electrodes, mesh, quad, bounds, unitDensity, residual, accuracy.seconds(),
                assembleSeconds, mirrorHalves);
        s.meshAccuracy = accuracy;
        s.coarser = coarserRung;
        return s;
    }

    /**
     * The solution on the next coarser mesh of an accuracy-driven solve (for convergence checks such as the peak
     * surface field's); empty for a fixed mesh or when only one mesh was solved.
     */
    public java.util.Optional<FieldSolution> coarserRung() {
        return java.util.Optional.ofNullable(coarser);
    }

    /** The accuracy-driven refinement that produced this solution, if any (empty for a fixed mesh). */
    public java.util.Optional<MeshAccuracy> meshAccuracy() {
        return java.util.Optional.ofNullable(meshAccuracy);
    }

    /**
     * What is known of the mesh's error, in words for every output: the estimate of an accuracy-driven solve
     * (relative to the largest bias difference, for any biases), or that a fixed mesh's error is not estimated.
     */
    public String meshErrorStatement() {
        if (meshAccuracy == null) {
            return "mesh error not estimated (fixed mesh of [mesh] target_elements; give [mesh] accuracy or --mesh-accuracy"
                    + " to refine until an estimate meets it)";
        }
        MeshAccuracy a = meshAccuracy;
        String est = Double.isNaN(a.estimate()) ? "not estimated (only one mesh fits under the element cap)"
                : org.axistack.model.Numbers.estimate(a.estimate()) + " of the largest bias difference";
        String how = a.rungs().size() + " meshes refined by 1/sqrt(2), three times the change of the axial potential from the"
                + " next coarser one";
        if (a.met()) {
            return "mesh error estimate " + est + " (requested " + org.axistack.model.Numbers.tolerance(a.requested())
                    + "; " + how + ")";
        }
        return "mesh error estimate " + est + ", ABOVE the requested " + org.axistack.model.Numbers.tolerance(a.requested())
                + (a.capped() ? ": refinement stopped at the element cap ([mesh] target_elements " + unknowns()
                        + " unknowns solved); raise the cap or relax the accuracy" : "") + " (" + how + ")";
    }

    /** The field for the electrodes' own biases. */
    public BiasedField biased() {
        return withBiases(electrodes.stream().mapToDouble(Electrode::bias_V).toArray());
    }

    /** The field for the given biases (volts, electrode order), by superposition of the unit solutions. */
    public BiasedField withBiases(double[] biases_V) {
        if (biases_V.length != electrodes.size()) {
            throw new IllegalArgumentException("need " + electrodes.size() + " biases, got " + biases_V.length);
        }
        int n = mesh.size();
        double[] strength = new double[n];
        double[] density = new double[n];
        for (int e = 0; e < biases_V.length; e++) {
            double b = biases_V[e];
            if (b == 0) {
                continue;
            }
            double[] us = unitStrength[e];
            double[] ud = unitDensity[e];
            for (int j = 0; j < n; j++) {
                strength[j] += b * us[j];
                density[j] += b * ud[j];
            }
        }
        return new BiasedField(this, biases_V.clone(), strength, density);
    }

    public List<Electrode> electrodes() {
        return electrodes;
    }

    /** The geometry this solution was solved for (its electrodes at 0 V). */
    public GeometryKey geometryKey() {
        return new GeometryKey(electrodes);
    }

    /**
     * Throws unless this solution was solved for the stack's geometry (same names, shapes and positions; biases
     * may differ): the one check behind plan, tuning and sweeps.
     *
     * @throws IllegalArgumentException naming the remedy when the geometries differ
     */
    public void requireGeometryOf(Stack stack) {
        if (!geometryKey().equals(stack.geometryKey())) {
            throw new IllegalArgumentException("the field solution was made for other electrodes than the stack's;"
                    + " solve the stack's own geometry first");
        }
    }

    public BoundaryMesh mesh() {
        return mesh;
    }

    PanelQuadrature quadrature() {
        return quad;
    }

    PanelQuadrature.Bounds bounds(int panel) {
        return bounds[panel];
    }

    /** Number of unknowns (boundary-element nodes). */
    public int unknowns() {
        return mesh.size();
    }

    /**
     * Largest deviation of the collocation equations from their right-hand side over all unit solves,
     * volts per volt of bias (a measure of the linear solve, not of the discretisation).
     */
    public double residual() {
        return residual;
    }

    /** Whether the stack was found mirror-symmetric and solved as two half-size systems. */
    public boolean solvedAsMirrorHalves() {
        return mirrorHalves;
    }

    /** Wall-clock seconds for mesh, assembly, factorisation and unit solves. */
    public double solveSeconds() {
        return solveSeconds;
    }

    /** Wall-clock seconds of the matrix assembly alone (part of {@link #solveSeconds()}). */
    public double assembleSeconds() {
        return assembleSeconds;
    }

    /** The capacitance matrix held against reciprocity and the sign law (worst pair). */
    public CapacitanceCheck capacitanceCheck() {
        return CapacitanceCheck.of(capacitance);
    }

    /**
     * Capacitance matrix, F: entry [i][j] is the charge on electrode i per volt on electrode j, all others at
     * 0 V (potential 0 at infinity).
     */
    public double[][] capacitanceMatrix_F() {
        double[][] c = new double[capacitance.length][];
        for (int i = 0; i < c.length; i++) {
            c[i] = capacitance[i].clone();
        }
        return c;
    }

    /**
     * The piecewise Chebyshev expansion of the unit axial potentials, built on first use over the stack's
     * extent widened by half its length on each side. Safe to call first from any thread, a task of the common
     * fork-join pool included: the build runs in a pool of its own (AxialExpansion), so callers that go parallel
     * need not build it beforehand.
     */
    AxialExpansion axialExpansion() {
        AxialExpansion x = axialExpansion;
        if (x == null) {
            synchronized (this) {
                x = axialExpansion;
                if (x == null) {
                    double[] fringe = Stack.fringeRange_m(electrodes);
                    // as far as the far-field series starts, so the axis is covered without the exact sum
                    double reach = FarField.FACTOR * chargeRadius();
                    x = AxialExpansion.build(this, Math.min(fringe[0], chargeCentre() - reach),
                            Math.max(fringe[1], chargeCentre() + reach));
                    axialExpansion = x;
                }
            }
        }
        return x;
    }

    private volatile double[][] unitMoments;
    private volatile double[] unitAbsStrength;

    /** Centre of the far-field expansion: midway between the extreme charge rings in z, m. */
    double chargeCentre() {
        double lo = Double.POSITIVE_INFINITY, hi = Double.NEGATIVE_INFINITY;
        for (int j = 0; j < mesh.size(); j++) {
            lo = Math.min(lo, mesh.nodeZ(j));
            hi = Math.max(hi, mesh.nodeZ(j));
        }
        return 0.5 * (lo + hi);
    }

    /** Largest distance of a charge ring from (chargeCentre, 0), m. */
    double chargeRadius() {
        double z0 = chargeCentre();
        double rad = 0;
        for (int j = 0; j < mesh.size(); j++) {
            rad = Math.max(rad, Math.hypot(mesh.nodeZ(j) - z0, mesh.nodeR(j)));
        }
        return rad;
    }

    /** The far-field multipole expansion for the given biases (unit moments computed once). */
    FarField farField(double[] biases) {
        double[][] m = unitMoments;
        double[] abs = unitAbsStrength;
        double z0 = chargeCentre();
        double rad = chargeRadius();
        if (m == null || abs == null) {
            int n = mesh.size();
            double[] z = new double[n];
            double[] r = new double[n];
            for (int j = 0; j < n; j++) {
                z[j] = mesh.nodeZ(j);
                r[j] = mesh.nodeR(j);
            }
            m = new double[unitStrength.length][];
            abs = new double[unitStrength.length];
            for (int e = 0; e < m.length; e++) {
                m[e] = FarField.moments(z, r, unitStrength[e], z0, rad);
                for (double l : unitStrength[e]) {
                    abs[e] += Math.abs(l);
                }
            }
            unitMoments = m;
            unitAbsStrength = abs;
        }
        return FarField.combine(z0, rad, m, abs, biases);
    }

    /** Axial derivatives of every unit solution at z: out[e][n], computed together (shared geometry). */
    void unitAxial(double z, int order, double[][] out) {
        RingSums.axial(this, z, order, unitStrength, unitDensityJac(), out);
    }

    private volatile double[][] unitDensityJac;

    private double[][] unitDensityJac() {
        double[][] d = unitDensityJac;
        if (d == null) {
            d = new double[unitDensity.length][mesh.size()];
            for (int e = 0; e < d.length; e++) {
                for (int j = 0; j < mesh.size(); j++) {
                    d[e][j] = unitDensity[e][j] * mesh.nodeJacobian(j);
                }
            }
            unitDensityJac = d;
        }
        return d;
    }
}
