package org.axistack.hygiene;

import java.util.Comparator;
import org.junit.jupiter.api.ClassOrderer;
import org.junit.jupiter.api.ClassOrdererContext;

/**
 * The suite's class order (junit-platform.properties): JUnit's own order, except that the guard
 * {@link WorkingTreeUntouchedTest} runs after every other test class.
 */
public final class GuardLast implements ClassOrderer {

    @Override
    public void orderClasses(ClassOrdererContext context) {
        // a stable sort: every other class keeps its place
        context.getClassDescriptors().sort(Comparator.comparingInt(
                d -> d.getTestClass() == WorkingTreeUntouchedTest.class ? 1 : 0));
    }
}
