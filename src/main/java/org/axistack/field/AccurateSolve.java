package org.axistack.field;

import java.util.ArrayList;
import java.util.List;

import org.axistack.mesh.BoundaryMesh;
import org.axistack.mesh.Mesher;
import org.axistack.model.Electrode;
import org.axistack.model.MeshSettings;
import org.axistack.model.Stack;

/**
 * Accuracy-driven meshing: solves a ladder of meshes in which every panel size shrinks by 1/sqrt(2) per rung
 * ({@link Mesher#meshAtScale}: the uniform size, arc panels, the smallest panel across a gap and the graded levels
 * scale together), and stops at the first rung whose estimated error meets the requested accuracy or before the
 * rung that would pass the element cap. The estimate of rung k is {@link #SAFETY} times the largest change of the
 * axial potential from rung k-1, summed over the unit-bias solutions, max_z sum_e |u_e,k(z) - u_e,k-1(z)|, on
 * {@link #AXIS_POINTS} points over the stack's fringe range: a relative error of the potential for any biases
 * (|sum_e V_e du_e| <= max|V| sum_e |du_e| and max|V| is at most the largest bias difference with ground). It is
 * the classical difference to the next coarser mesh; why this estimator and not the collocation residual between
 * nodes, and how it compares with the true error, is measured in src/site/markdown/meshing.md.
 */
public final class AccurateSolve {

    /** Coarsest rung's scale (panel sizes relative to the reference mesh of {@link Mesher#meshAtScale}). */
    static final double START_SCALE = 8;
    /** Panel size ratio between rungs. */
    static final double RATIO = Math.sqrt(2);
    /**
     * Factor on the change from the coarser rung (the change alone measures the coarser rung's error; a factor 2 let
     * the estimate fall to 0.7 of the true error on two library stacks, meshing.md).
     */
    static final double SAFETY = 3;
    /** Axis points the change is measured on. */
    static final int AXIS_POINTS = 97;

    private AccurateSolve() {
    }

    /**
     * Refines until the estimate meets {@code settings.accuracy()} or the next rung would pass
     * {@code settings.targetElements()} (or the heap's limit).
     */
    public static FieldSolution solve(List<Electrode> electrodes, MeshSettings settings, SolveProgress progress) {
        int cap = Math.min(settings.targetElements(), BemSolver.maxUnknownsForHeap());
        int levels = settings.edgeLevels();
        double scale = START_SCALE;
        // start coarser if even the coarsest rung does not fit (the cap is an expert's limit)
        while (unknowns(electrodes, levels, scale) > cap && scale < 512) {
            scale *= RATIO;
        }
        double[] range = Stack.fringeRange_m(electrodes);
        List<MeshAccuracy.Rung> rungs = new ArrayList<>();
        FieldSolution current = null;
        FieldSolution before = null;
        double[][] previous = null;
        double estimate = Double.NaN;
        boolean capped = false;
        for (int k = 0; ; k++) {
            int n = unknowns(electrodes, levels, scale);
            if (k > 0 && n > cap) {
                capped = true;
                break;
            }
            BoundaryMesh mesh;
            try {
                mesh = Mesher.meshAtScale(electrodes, levels, scale);
            } catch (IllegalArgumentException e) {
                throw new SolveException(SolveException.Reason.MESH, e.getMessage());
            }
            String stage = "mesh " + (k + 1) + " (" + mesh.size() + " unknowns)";
            long t0 = System.nanoTime();
            FieldSolution s = BemSolver.solveMesh(electrodes, mesh,
                    (what, f) -> progress.update(stage + ": " + what, Math.min(0.99, f)));
            double[][] axis = axis(s, range);
            double seconds = (System.nanoTime() - t0) * 1e-9;
            double change = previous == null ? Double.NaN : change(axis, previous);
            rungs.add(new MeshAccuracy.Rung(scale, s.unknowns(), change, seconds));
            before = current;
            current = s;
            previous = axis;
            estimate = SAFETY * change;
            if (estimate <= settings.accuracy()) {
                break;
            }
            scale /= RATIO;
        }
        progress.update("done", 1.0);
        return current.withMeshAccuracy(new MeshAccuracy(settings.accuracy(), estimate, rungs, capped), before);
    }

    private static int unknowns(List<Electrode> electrodes, int levels, double scale) {
        try {
            return Mesher.meshAtScale(electrodes, levels, scale).size();
        } catch (IllegalArgumentException e) {
            throw new SolveException(SolveException.Reason.MESH, e.getMessage());
        }
    }

    /** Unit axial potentials on the axis points: out[e][i]. */
    static double[][] axis(FieldSolution s, double[] range) {
        int ne = s.electrodes().size();
        double[][] out = new double[ne][AXIS_POINTS];
        double[][] one = new double[ne][1];
        for (int i = 0; i < AXIS_POINTS; i++) {
            double z = range[0] + (range[1] - range[0]) * i / (AXIS_POINTS - 1);
            s.unitAxial(z, 0, one);
            for (int e = 0; e < ne; e++) {
                out[e][i] = one[e][0];
            }
        }
        return out;
    }

    /** max over the points of sum over the unit solutions of the change. */
    static double change(double[][] a, double[][] b) {
        double worst = 0;
        for (int i = 0; i < a[0].length; i++) {
            double sum = 0;
            for (int e = 0; e < a.length; e++) {
                sum += Math.abs(a[e][i] - b[e][i]);
            }
            worst = Math.max(worst, sum);
        }
        return worst;
    }
}
