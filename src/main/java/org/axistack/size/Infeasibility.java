package org.axistack.size;

import java.util.List;
import java.util.Map;

/**
 * Why no design of the family met the requirements.
 *
 * @param binding      the limits no evaluated design met even on its own (empty when each can be met alone but
 *                     not together, or when nothing focused)
 * @param conflicting  the limits the least-violating design breaks
 * @param closest      the least-violating design (null when no candidate focused at all)
 * @param bestValue    per limit, the best value any focusing design reached (SI)
 * @param noFocus      true when no candidate geometry focused within the supply limit
 */
public record Infeasibility(List<Limit> binding, List<Limit> conflicting, Design closest, Map<Limit, Double> bestValue,
        boolean noFocus) {
    public Infeasibility {
        binding = List.copyOf(binding);
        conflicting = List.copyOf(conflicting);
        bestValue = Map.copyOf(bestValue);
    }
}
