package org.axistack.size;

import java.util.List;
import java.util.Optional;

/**
 * Why the winner wins, as facts for the report to put in words.
 *
 * @param runnerUp         the best feasible search design of another geometry (empty if none)
 * @param otherBranch      the same geometry's design on the other bias branch (empty if it has none)
 * @param activeLimits     limits the winner is within 3% of (loosening them would let the objective improve)
 * @param lowerBounds      varied parameters at (within 1% of) their lower bound
 * @param upperBounds      varied parameters at their upper bound
 * @param feasibleDesigns  feasible designs found
 * @param geometries       geometries evaluated
 */
public record Reasons(Optional<Design> runnerUp, Optional<Design> otherBranch, List<Violation> activeLimits,
        List<String> lowerBounds, List<String> upperBounds, long feasibleDesigns, int geometries) {
    public Reasons {
        activeLimits = List.copyOf(activeLimits);
        lowerBounds = List.copyOf(lowerBounds);
        upperBounds = List.copyOf(upperBounds);
    }
}
