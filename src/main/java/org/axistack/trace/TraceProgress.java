package org.axistack.trace;

/** Progress and cancellation for long traces. Called from worker threads; implementations must be thread-safe. */
public interface TraceProgress {

    /** Called after each finished ray. */
    void raysDone(int done, int total);

    /** Polled between rays and between integration steps; true stops the work. */
    default boolean isCancelled() {
        return false;
    }

    /** A listener that ignores progress and never cancels. */
    static TraceProgress none() {
        return (done, total) -> { };
    }
}
