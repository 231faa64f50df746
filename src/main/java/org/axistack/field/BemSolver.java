package org.axistack.field;

import java.util.List;
import java.util.concurrent.CancellationException;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.stream.IntStream;

import org.axistack.mesh.BoundaryMesh;
import org.axistack.mesh.Mesher;
import org.axistack.mesh.Panel;
import org.axistack.model.Electrode;
import org.axistack.model.MeshSettings;
import org.ejml.data.DMatrixRMaj;

/**
 * Boundary-element (surface-charge) solver for axially symmetric conductors held at fixed potentials:
 * the first-kind integral equation phi(x) = (1/pi) Int sigma'(s) r(s) K(m)/rho_plus ds = V_electrode on
 * every conductor surface, sigma' = sigma/eps0, discretised by Nystrom collocation at the Gauss nodes of
 * polynomial panels (e.g. Atkinson, The Numerical Solution of Integral Equations of the Second Kind,
 * ch. 4; for the axisymmetric ring kernel, the surface-charge method of electron optics as described in
 * P. W. Hawkes and E. Kasper, Principles of Electron Optics, vol. 1, ch. 13). The dense matrix is
 * assembled in parallel, factored once by block elimination on all cores from EJML's LU and matrix
 * products ({@link SchurLuSolver}; one pivoted EJML LU of the whole matrix for small systems or as the
 * fallback), and solved for one unit-bias right-hand side per electrode.
 */
public final class BemSolver {

    private BemSolver() {
    }

    /**
     * Largest |A x - b| (unit-bias right-hand sides, so volts per volt) accepted from the parallel block
     * elimination before falling back to one pivoted LU; well-posed meshes give 1e-14 .. 1e-12.
     */
    static final double RESIDUAL_TOLERANCE = 1e-10;

    /** Bytes of heap needed per unknown squared (matrix, its tiled copy or the LU's copy, workspace). */
    static final double BYTES_PER_N2 = 8 * 2.2;

    /** Largest number of unknowns the current heap can take. */
    public static int maxUnknownsForHeap() {
        long max = Runtime.getRuntime().maxMemory();
        int byHeap = (int) Math.sqrt(0.6 * max / BYTES_PER_N2);
        return Math.min(byHeap, MeshSettings.MAX_ELEMENTS);
    }

    /**
     * Meshes and solves: to the settings' element count, or refining until the settings' accuracy is met
     * ({@link AccurateSolve}) when they have one.
     *
     * @throws SolveException if the stack cannot be meshed, the system is singular, or the solved capacitance
     *                       matrix breaks reciprocity or the sign law badly ({@link CapacitanceCheck#refused()})
     */
    public static FieldSolution solve(List<Electrode> electrodes, MeshSettings settings, SolveProgress progress) {
        if (settings.accuracyDriven()) {
            return AccurateSolve.solve(electrodes, settings, progress);
        }
        long t0 = System.nanoTime();
        BoundaryMesh mesh;
        try {
            mesh = Mesher.mesh(electrodes, settings);
        } catch (IllegalArgumentException e) {
            throw new SolveException(SolveException.Reason.MESH, e.getMessage());
        }
        return solveMesh(electrodes, mesh, progress, t0);
    }

    /** Solves on a given mesh of the electrodes (from {@link Mesher}). */
    public static FieldSolution solveMesh(List<Electrode> electrodes, BoundaryMesh mesh, SolveProgress progress) {
        return solveMesh(electrodes, mesh, progress, System.nanoTime());
    }

    private static FieldSolution solveMesh(List<Electrode> electrodes, BoundaryMesh mesh, SolveProgress progress, long t0) {
        int n = mesh.size();
        int limit = maxUnknownsForHeap();
        if (n > limit) {
            throw new SolveException(SolveException.Reason.TOO_LARGE, "the mesh has " + n + " unknowns but this heap supports at most "
                    + limit + "; lower [mesh] target_elements or start Java with a larger -Xmx");
        }
        int ne = electrodes.size();
        PanelQuadrature quad = new PanelQuadrature(mesh);
        List<Panel> panels = mesh.panels();
        PanelQuadrature.Bounds[] bounds = new PanelQuadrature.Bounds[panels.size()];
        for (int p = 0; p < panels.size(); p++) {
            bounds[p] = PanelQuadrature.Bounds.of(panels.get(p));
        }
        DMatrixRMaj a = assemble(mesh, quad, bounds, RingKernel::potential, "assembling " + n + " unknowns", 0, 0.7,
                progress);
        double assembleSeconds = (System.nanoTime() - t0) * 1e-9;
        DMatrixRMaj rhs = new DMatrixRMaj(n, ne);
        for (int i = 0; i < n; i++) {
            rhs.set(i, mesh.electrodeOf(i), 1.0);
        }
        if (!progress.update("factoring", 0.7)) {
            throw new CancellationException("field solve cancelled");
        }
        // A mirror-symmetric stack first: two half-size systems (a quarter of the work), kept only if the
        // unfolded solution meets the residual in the full system.
        SchurLuSolver.Solution solved = null;
        DMatrixRMaj folded = MirrorFold.solve(mesh, a, rhs, RESIDUAL_TOLERANCE,
                f -> progress.update("factoring (mirror-symmetric halves)", 0.7 + 0.25 * f));
        if (folded != null) {
            double r = SchurLuSolver.residual(a, folded, rhs);
            if (r <= RESIDUAL_TOLERANCE) {
                solved = new SchurLuSolver.Solution(folded, r);
            }
        }
        boolean mirrorHalves = solved != null;
        if (solved == null) {
            solved = SchurLuSolver.solveOrPivot(a, rhs, RESIDUAL_TOLERANCE,
                    f -> progress.update("factoring", 0.7 + 0.25 * f));
        }
        if (solved == null) {
            throw new SolveException(SolveException.Reason.SINGULAR, "the collocation matrix is singular: two electrodes coincide or overlap; separate them");
        }
        DMatrixRMaj x = solved.x();
        double residual = solved.residual();
        if (!(residual < 1e-6)) {
            throw new SolveException(SolveException.Reason.RESIDUAL, "the collocation matrix is singular (residual " + residual
                    + "): two electrodes coincide or overlap; separate them");
        }
        double[][] unit = new double[ne][n];
        for (int e = 0; e < ne; e++) {
            for (int i = 0; i < n; i++) {
                unit[e][i] = x.get(i, e);
            }
        }
        double seconds = (System.nanoTime() - t0) * 1e-9;
        FieldSolution solution = new FieldSolution(electrodes, mesh, quad, bounds, unit, residual, seconds,
                assembleSeconds, mirrorHalves);
        CapacitanceCheck check = solution.capacitanceCheck();
        if (check.refused()) {
            throw new SolveException(SolveException.Reason.CAPACITANCE, check.message(electrodes));
        }
        progress.update("done", 1.0);
        return solution;
    }

    /** An azimuthally integrated ring kernel, (1/2pi) Int cos(m u)/|x - x'| du for one harmonic m, 1/m. */
    @FunctionalInterface
    interface Kernel {
        double at(double z, double r, double zRing, double aRing);
    }

    /**
     * The collocation matrix of a ring kernel on the mesh (entry i, j: potential at node i of node j's basis
     * density sigma/eps0 = 1), far panels by their own Gauss nodes, near ones (and the panel through the
     * node) by the graded rule; parallel over rows; progress from {@code from} to {@code from + span}.
     */
    static DMatrixRMaj assemble(BoundaryMesh mesh, PanelQuadrature quad, PanelQuadrature.Bounds[] bounds,
            Kernel kernel, String stage, double from, double span, SolveProgress progress) {
        int n = mesh.size();
        List<Panel> panels = mesh.panels();
        DMatrixRMaj a = new DMatrixRMaj(n, n);
        double[] data = a.data;
        int order = mesh.order();
        double[] w = mesh.nodeWeights();
        double[] tau = mesh.nodeTau();
        AtomicInteger done = new AtomicInteger();
        AtomicBoolean cancelled = new AtomicBoolean();
        ThreadLocal<PanelQuadrature.Rule> rules = ThreadLocal.withInitial(PanelQuadrature.Rule::new);
        IntStream.range(0, n).parallel().forEach(i -> {
            if (cancelled.get()) {
                return;
            }
            double zi = mesh.nodeZ(i);
            double ri = mesh.nodeR(i);
            int pi = i / order;
            PanelQuadrature.Rule rule = rules.get();
            double[] basis = new double[order];
            int row = i * n;
            for (int p = 0; p < panels.size(); p++) {
                int base = p * order;
                if (bounds[p].near(zi, ri)) {
                    Panel pan = panels.get(p);
                    quad.build(pan, zi, ri, p == pi ? tau[i % order] : Double.NaN, rule);
                    double[] c = new double[order];
                    for (int q = 0; q < rule.size; q++) {
                        quad.basis(rule.t[q], basis);
                        double k = 0.5 * rule.r[q] * kernel.at(zi, ri, rule.z[q], rule.r[q]) * rule.w[q];
                        for (int j = 0; j < order; j++) {
                            c[j] += basis[j] * k;
                        }
                    }
                    for (int j = 0; j < order; j++) {
                        data[row + base + j] = c[j] * mesh.nodeJacobian(base + j);
                    }
                } else {
                    for (int j = 0; j < order; j++) {
                        int col = base + j;
                        double rj = mesh.nodeR(col);
                        data[row + col] = 0.5 * w[j] * rj * mesh.nodeJacobian(col)
                                * kernel.at(zi, ri, mesh.nodeZ(col), rj);
                    }
                }
            }
            int d = done.incrementAndGet();
            if (d % 64 == 0 && !progress.update(stage, from + span * d / n)) {
                cancelled.set(true);
            }
        });
        if (cancelled.get()) {
            throw new CancellationException("field solve cancelled");
        }
        return a;
    }
}
