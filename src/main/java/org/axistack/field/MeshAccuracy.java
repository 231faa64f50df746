package org.axistack.field;

import java.util.List;

/**
 * How well the mesh of an accuracy-driven solve resolves the potential: the requested accuracy, the estimate of
 * the solved mesh and the meshes solved on the way (see {@link AccurateSolve}).
 *
 * @param requested relative accuracy asked for (of the largest bias difference)
 * @param estimate  estimated error of the solved mesh's axial potential, relative to the largest bias difference
 *                  and valid for any biases; NaN when only one mesh fitted under the cap
 * @param rungs     the meshes solved, coarse to fine (the last one is the solution)
 * @param capped    whether refinement stopped at the element cap before meeting the request
 */
public record MeshAccuracy(double requested, double estimate, List<Rung> rungs, boolean capped) {

    public MeshAccuracy {
        rungs = List.copyOf(rungs);
    }

    /** One mesh of the refinement: its scale, unknowns, the change from the coarser mesh and the solve time. */
    public record Rung(double scale, int unknowns, double change, double seconds) {
    }

    /** Whether the estimate meets the request. */
    public boolean met() {
        return estimate <= requested;
    }

    /** Total seconds of all the solves of the refinement. */
    public double seconds() {
        return rungs.stream().mapToDouble(Rung::seconds).sum();
    }
}
