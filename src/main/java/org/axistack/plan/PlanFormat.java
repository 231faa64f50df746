package org.axistack.plan;

import java.util.Locale;

/** Numbers in the plan's words: whole numbers as they are, others to five significant digits, trailing zeros cut. */
public final class PlanFormat {
    private PlanFormat() {
    }

    /** A number for text ("-1200", "48.881", "0.00012346"). */
    public static String num(double x) {
        if (x == Math.rint(x) && Math.abs(x) < 1e12) {
            return String.valueOf((long) x);
        }
        return String.format(Locale.ROOT, "%.5g", x).replaceAll("(\\.\\d*?)0+$", "$1").replaceAll("\\.$", "");
    }
}
