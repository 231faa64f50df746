package org.axistack.size;

/** Progress of a sizing search, called from worker threads; return false to cancel. */
@FunctionalInterface
public interface SizingProgress {

    /**
     * @param stage       short description ("initial sample", "local search", "final designs", ...)
     * @param done        candidate geometries evaluated so far
     * @param budget      candidate geometries the search may evaluate
     * @param bestSoFar   objective value of the best feasible design so far (SI), NaN if none yet
     * @return true to go on, false to cancel (the search then throws {@link java.util.concurrent.CancellationException})
     */
    boolean update(String stage, int done, int budget, double bestSoFar);

    SizingProgress NONE = (stage, done, budget, best) -> true;
}
