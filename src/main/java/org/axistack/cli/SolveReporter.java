package org.axistack.cli;

import java.io.PrintWriter;
import java.util.Locale;

import org.axistack.field.SolveProgress;

/**
 * Field-solve progress on the terminal's error stream (a line per quarter), silent when asked; either way the solve
 * is cancelled when the thread that asked for it is interrupted (the solver's workers run on other threads, so the
 * reporter watches the caller's flag). Ctrl-C ends the process: output files are written atomically, so none is
 * left half-written.
 */
final class SolveReporter {
    private SolveReporter() {
    }

    static SolveProgress to(PrintWriter err, boolean quiet) {
        Thread owner = Thread.currentThread();
        int[] last = {-100};
        return (stage, fraction) -> {
            if (owner.isInterrupted()) {
                return false;
            }
            if (quiet) {
                return true;
            }
            int percent = (int) Math.floor(fraction * 100);
            synchronized (last) {
                if (percent >= last[0] + 25 || percent == 100 && last[0] < 100) {
                    last[0] = percent;
                    err.printf(Locale.ROOT, "field solve: %s, %d%%%n", stage, percent);
                    err.flush();
                }
            }
            return true;
        };
    }
}
