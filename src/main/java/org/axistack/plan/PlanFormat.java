package org.axistack.plan;

import org.axistack.model.Numbers;

/** Numbers in the plan's words: whole numbers as they are, others to five significant digits, trailing zeros cut. */
public final class PlanFormat {
    private PlanFormat() {
    }

    /** A number for text ("-1200", "48.881", "0.00012346"). */
    public static String num(double x) {
        return Numbers.text(x);
    }
}
