package org.axistack.size;

import org.axistack.field.FieldSolution;
import org.axistack.model.Stack;

/**
 * Finds every bias of one electrode that meets a focusing condition, re-biasing one field solution (no new
 * solve). The sizer depends only on this interface.
 */
@FunctionalInterface
public interface FocusFinder {

    /**
     * @param solution       the field solution of the candidate geometry
     * @param stack          the candidate stack (beam and electrodes; its biases are the starting point)
     * @param electrode      index of the electrode whose bias is varied
     * @param target         the focusing condition
     * @param maxBias_V      biases are searched in [-maxBias, +maxBias]
     * @return every bias found, V, in increasing order (empty when none focuses)
     */
    double[] focusingBiases(FieldSolution solution, Stack stack, int electrode, FocusCondition target, double maxBias_V);
}
