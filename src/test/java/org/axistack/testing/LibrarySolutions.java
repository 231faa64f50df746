package org.axistack.testing;

import java.nio.file.Path;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;

import org.axistack.field.BemSolver;
import org.axistack.field.FieldSolution;
import org.axistack.field.SolveProgress;
import org.axistack.io.StackInputException;
import org.axistack.io.StackReader;
import org.axistack.model.Stack;

/** The lens-library stacks, each read and solved once per test JVM on its own mesh and shared by the library tests. */
public final class LibrarySolutions {

    /** A library stack and its field solution. */
    public record Solved(Stack stack, FieldSolution solution) {
    }

    private static final Map<Path, Solved> CACHE = new ConcurrentHashMap<>();

    private LibrarySolutions() {
    }

    /** The stack of the file and its solution (solved on first use). */
    public static Solved of(Path file) {
        return CACHE.computeIfAbsent(file.toAbsolutePath().normalize(), f -> {
            try {
                Stack s = StackReader.read(f);
                return new Solved(s, BemSolver.solve(s.electrodes(), s.mesh(), SolveProgress.NONE));
            } catch (StackInputException e) {
                throw new IllegalStateException(e);
            }
        });
    }
}
