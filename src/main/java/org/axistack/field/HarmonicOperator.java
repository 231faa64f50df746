package org.axistack.field;

import java.util.List;
import java.util.concurrent.CancellationException;

import org.axistack.mesh.BoundaryMesh;
import org.axistack.mesh.Panel;
import org.ejml.data.DMatrixRMaj;

/**
 * The boundary-element operator of azimuthal harmonic m on a solved stack's meridian mesh, factored once.
 *
 * <p>A surface density sigma(s) cos(m phi) on the electrodes (bodies of revolution) makes the potential
 * u(z, r) cos(m phi) with u(z, r) = (1/2) Int (sigma/eps0)(s') r' H_m(z, r; z', r') ds', H_m the
 * {@link HarmonicKernel} (for m = 0 this is the round solve's equation). Holding the boundary at
 * V_m(s) cos(m phi) is then one first-kind equation on the meridian mesh per m, collocated at the same nodes
 * with the same panel rules as m = 0; a sin(m phi) pattern has the same solution (rotate by pi/(2m)).
 * By linearity every boundary potential V(s, phi) = sum_m [a_m(s) cos(m phi) + b_m(s) sin(m phi)] is
 * the sum of the solutions for each coefficient.
 *
 * <p>Use: {@link #factor} once per m (assembly on all cores, then the factorisation, kept); then
 * {@link #solve(double[][])} for any number of right-hand sides (boundary amplitude at every node, volts)
 * at the cost of two triangular solves each. The unit solutions, amplitude 1 V on one electrode and 0 on
 * the others, are solved at construction ({@link #unitDensity}). Immutable after construction and
 * thread-safe.
 */
public final class HarmonicOperator {

    /** Largest residual |A x - b| per volt of right-hand side accepted from a solve. */
    static final double RESIDUAL_LIMIT = 1e-6;

    private final FieldSolution round;
    private final int m;
    private final FactoredSystem system;
    private final double[][] unitDensity;
    private final double residual;
    private final double seconds;

    private HarmonicOperator(FieldSolution round, int m, FactoredSystem system, double[][] unitDensity,
            double residual, double seconds) {
        this.round = round;
        this.m = m;
        this.system = system;
        this.unitDensity = unitDensity;
        this.residual = residual;
        this.seconds = seconds;
    }

    /**
     * Assembles and factors harmonic m on the round solution's mesh and solves the unit electrode amplitudes.
     * Progress runs 0..1 over assembly (70 %) and factorisation; cancelling throws CancellationException.
     *
     * @param m harmonic order, 0..{@link HarmonicKernel#MAX_ORDER}
     */
    public static HarmonicOperator factor(FieldSolution round, int m, SolveProgress progress) {
        if (m < 0 || m > HarmonicKernel.MAX_ORDER) {
            throw new IllegalArgumentException("harmonic order " + m + " outside 0.." + HarmonicKernel.MAX_ORDER);
        }
        long t0 = System.nanoTime();
        BoundaryMesh mesh = round.mesh();
        int n = mesh.size();
        List<Panel> panels = mesh.panels();
        PanelQuadrature.Bounds[] bounds = new PanelQuadrature.Bounds[panels.size()];
        for (int p = 0; p < bounds.length; p++) {
            bounds[p] = round.bounds(p);
        }
        BemSolver.Kernel kernel = m == 0 ? RingKernel::potential
                : (z, r, zr, ar) -> HarmonicKernel.potential(m, z, r, zr, ar);
        String stage = "assembling harmonic " + m + " (" + n + " unknowns)";
        DMatrixRMaj a = BemSolver.assemble(mesh, round.quadrature(), bounds, kernel, stage, 0, 0.7, progress);
        if (!progress.update("factoring harmonic " + m, 0.7)) {
            throw new CancellationException("harmonic solve cancelled");
        }
        FactoredSystem system = FactoredSystem.factor(mesh, a);
        int ne = round.electrodes().size();
        DMatrixRMaj rhs = new DMatrixRMaj(n, ne);
        for (int i = 0; i < n; i++) {
            rhs.set(i, mesh.electrodeOf(i), 1.0);
        }
        SchurLuSolver.Solution sol = system.solve(rhs);
        if (!(sol.residual() < RESIDUAL_LIMIT)) {
            throw new SolveException(SolveException.Reason.SINGULAR, m, "the harmonic-" + m + " collocation matrix is singular (residual " + sol.residual()
                    + "): two electrodes coincide or overlap; separate them");
        }
        double[][] unit = new double[ne][n];
        for (int e = 0; e < ne; e++) {
            for (int i = 0; i < n; i++) {
                unit[e][i] = sol.x().get(i, e);
            }
        }
        progress.update("harmonic " + m + " done", 1.0);
        return new HarmonicOperator(round, m, system, unit, sol.residual(), (System.nanoTime() - t0) * 1e-9);
    }

    /** The harmonic order m. */
    public int order() {
        return m;
    }

    /** The round solution whose mesh this operator lives on. */
    public FieldSolution round() {
        return round;
    }

    /** Number of unknowns (mesh nodes). */
    public int unknowns() {
        return round.mesh().size();
    }

    /** Largest residual of the unit solves, volts per volt. */
    public double residual() {
        return residual;
    }

    /** Wall-clock seconds for assembly, factorisation and the unit solves. */
    public double seconds() {
        return seconds;
    }

    /** Whether the matrix was factored as mirror-symmetric halves. */
    public boolean solvedAsMirrorHalves() {
        return system.mirrorHalves();
    }

    /**
     * Surface density amplitude sigma/eps0 (V/m per V) at every node for the boundary amplitude 1 V cos(m phi)
     * on electrode e and 0 on the others.
     */
    public double[] unitDensity(int electrode) {
        return unitDensity[electrode].clone();
    }

    /**
     * Solves for any right-hand sides: rows of {@code boundary_V} are boundary amplitudes (volts, the
     * coefficient of cos(m phi), or of sin(m phi)) at every mesh node; returns the density amplitudes
     * sigma/eps0 (V/m) at every node, one row per right-hand side.
     *
     * @throws SolveException if a solve misses the residual limit (a singular system)
     */
    public double[][] solve(double[][] boundary_V) {
        int n = unknowns();
        DMatrixRMaj b = new DMatrixRMaj(n, boundary_V.length);
        for (int c = 0; c < boundary_V.length; c++) {
            if (boundary_V[c].length != n) {
                throw new IllegalArgumentException("right-hand side " + c + " has " + boundary_V[c].length
                        + " values, the mesh " + n + " nodes");
            }
            for (int i = 0; i < n; i++) {
                b.set(i, c, boundary_V[c][i]);
            }
        }
        SchurLuSolver.Solution sol = system.solve(b);
        double scale = 1;
        for (double[] row : boundary_V) {
            for (double v : row) {
                scale = Math.max(scale, Math.abs(v));
            }
        }
        if (!(sol.residual() < RESIDUAL_LIMIT * scale)) {
            throw new SolveException(SolveException.Reason.RESIDUAL, m, "harmonic-" + m + " solve missed its residual (" + sol.residual() + ")");
        }
        double[][] out = new double[boundary_V.length][n];
        for (int c = 0; c < out.length; c++) {
            for (int i = 0; i < n; i++) {
                out[c][i] = sol.x().get(i, c);
            }
        }
        return out;
    }

    /** One right-hand side: {@link #solve(double[][])}. */
    public double[] solve(double[] boundary_V) {
        return solve(new double[][] {boundary_V})[0];
    }

    /**
     * Amplitude u(z, r) of the potential u cos(m phi) made by the density amplitudes {@code density}
     * (sigma/eps0 at every node, V/m), volts: far panels by their nodes, near ones by the graded rule on the
     * interpolated density, so it holds up to the electrode surface.
     */
    public double potential_V(double[] density, double z, double r) {
        return HarmonicSums.potential(round, m, density, z, r);
    }
}
