package org.axistack.cli;

import java.io.PrintWriter;
import java.util.Locale;

import org.axistack.field.SolveProgress;

/** Field-solve progress on the terminal's error stream (a line per quarter), silent when asked. */
final class SolveReporter {
    private SolveReporter() {
    }

    static SolveProgress to(PrintWriter err, boolean quiet) {
        if (quiet) {
            return SolveProgress.NONE;
        }
        int[] last = {-100};
        return (stage, fraction) -> {
            int percent = (int) Math.floor(fraction * 100);
            if (percent >= last[0] + 25 || percent == 100 && last[0] < 100) {
                last[0] = percent;
                err.printf(Locale.ROOT, "field solve: %s, %d%%%n", stage, percent);
                err.flush();
            }
            return true;
        };
    }
}
