package org.axistack.cli;

import java.io.PrintWriter;
import java.util.Locale;
import java.util.function.DoublePredicate;

/**
 * Progress of one long stage after the field solve (the envelope, for one) on the error stream: the share done at
 * most once a second, silent when asked; false (cancel) once the thread that started the stage is interrupted.
 */
final class StageReporter {
    private StageReporter() {
    }

    static DoublePredicate to(PrintWriter err, boolean quiet, String stage) {
        Thread owner = Thread.currentThread();
        long[] last = {System.nanoTime()};
        return fraction -> {
            long now = System.nanoTime();
            if (!quiet && now - last[0] > 1_000_000_000L) {
                last[0] = now;
                err.printf(Locale.ROOT, "%s: %d %% done%n", stage, (int) Math.floor(100 * fraction));
                err.flush();
            }
            return !owner.isInterrupted();
        };
    }
}
