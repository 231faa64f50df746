package org.axistack.size;

import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * The outcome of a sizing study. Designs in {@link #best()} and the winner are the fine-mesh re-solves; the front
 * and the candidate list carry the search-mesh values.
 *
 * @param requirements the requirements
 * @param candidates   every geometry evaluated, in evaluation order
 * @param winner       the best feasible design for the requirements' objective (fine mesh), if any
 * @param best         the best feasible design per objective (fine mesh)
 * @param front        trade-off front of the feasible search designs (Cs, bias, surface field)
 * @param tolerances   image shifts of the winner per 0.01 mm and per volt
 * @param meshCheck    what the coarse mesh costs, measured on the winner
 * @param infeasible   why nothing met the requirements, when so
 * @param reasons      the facts behind the winner (runner-up, limits it sits against, parameters at bounds)
 * @param seconds      wall time of the study
 */
public record SizingResult(Requirements requirements, List<DesignEvaluator.Candidate> candidates,
        Optional<Design> winner, Map<Objective, Design> best, List<Design> front, List<Tolerance> tolerances,
        Optional<MeshCheck> meshCheck, Optional<Infeasibility> infeasible, Optional<Reasons> reasons,
        double seconds) {
    public SizingResult {
        candidates = List.copyOf(candidates);
        best = Map.copyOf(best);
        front = List.copyOf(front);
        tolerances = List.copyOf(tolerances);
    }

    public int designCount() {
        return candidates.stream().mapToInt(c -> c.designs().size()).sum();
    }

    public long feasibleCount() {
        return candidates.stream().flatMap(c -> c.designs().stream()).filter(Design::feasible).count();
    }
}
