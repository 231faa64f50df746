package org.axistack.tune;

import org.axistack.field.BemSolver;
import org.axistack.field.FieldSolution;
import org.axistack.field.SolveProgress;
import org.axistack.io.BuiltInStacks;
import org.axistack.io.StackInputException;
import org.axistack.model.Stack;

/** The built-in demo lens (demo data), solved once per test JVM and shared by the tune tests. */
final class SolvedDemo {
    static final Stack STACK;
    static final FieldSolution SOLUTION;

    static {
        try {
            STACK = BuiltInStacks.demo();
        } catch (StackInputException e) {
            throw new IllegalStateException(e);
        }
        SOLUTION = BemSolver.solve(STACK.electrodes(), STACK.mesh(), SolveProgress.NONE);
    }

    private SolvedDemo() {
    }
}
