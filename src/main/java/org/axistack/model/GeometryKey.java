package org.axistack.model;

import java.util.List;

/**
 * What a field solution depends on besides its mesh: the electrodes' names, shapes and positions, not their biases
 * (every bias is set to 0 V in the key). Two stacks with equal keys share one solution at any biases; the plan, the
 * tuners and the window compare keys to tell whether a solution belongs to a stack (the one test for it).
 * Split electrodes' sector patterns are not part of the round solution and are not in the key.
 *
 * @param electrodes the electrodes at 0 V, in stack order
 */
public record GeometryKey(List<Electrode> electrodes) {

    public GeometryKey {
        electrodes = electrodes.stream().map(e -> e.withBias_V(0.0)).toList();
    }

    /** The key of a stack's electrodes. */
    public static GeometryKey of(Stack stack) {
        return new GeometryKey(stack.electrodes());
    }
}
