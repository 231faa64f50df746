package org.axistack.field;

/**
 * Progress of a field solve, reported from worker threads; return false from {@link #update} to cancel.
 */
@FunctionalInterface
public interface SolveProgress {

    /**
     * @param stage    short description ("assembling", "factoring", ...)
     * @param fraction 0..1 within the whole solve
     * @return true to go on, false to cancel (the solver then throws {@link java.util.concurrent.CancellationException})
     */
    boolean update(String stage, double fraction);

    SolveProgress NONE = (stage, fraction) -> true;
}
