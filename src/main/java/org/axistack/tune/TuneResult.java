package org.axistack.tune;

import java.util.List;
import java.util.Optional;

/**
 * Every bias of one electrode within a range that images the object onto the target plane.
 *
 * @param electrode   the varied electrode
 * @param target      object and image planes
 * @param range       the bias range searched
 * @param solutions   all solutions found, in increasing bias (or most useful first, as ranked by {@link FocusRanking})
 * @param nearest     when there is no solution: the bias that came nearest (empty when solutions exist or when
 *                    every bias in the range reflects the beam)
 * @param evaluations optics evaluations used (scan plus root finding)
 * @param reflectingFrom_V, reflectingTo_V the part of the range where the beam turns back (NaN when none), V
 */
public record TuneResult(String electrode, FocusTarget target, BiasRange range, List<FocusSolution> solutions,
        Optional<NearestApproach> nearest, int evaluations, double reflectingFrom_V, double reflectingTo_V) {

    public TuneResult {
        solutions = List.copyOf(solutions);
    }

    public boolean found() {
        return !solutions.isEmpty();
    }

    /** The bias that came closest to the target when nothing hits it. */
    public record NearestApproach(double bias_V, double imageZ_m, double missZ_m) {
    }
}
