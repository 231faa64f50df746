package org.axistack.trace;

import java.math.BigDecimal;
import java.math.MathContext;

/** Number formatting for messages: six significant digits, no trailing zeros. */
final class Fmt {
    private Fmt() {
    }

    static String num(double v) {
        if (!Double.isFinite(v)) {
            return Double.toString(v);
        }
        if (v == 0) {
            return "0";
        }
        return new BigDecimal(v).round(new MathContext(6)).stripTrailingZeros().toPlainString();
    }

    /** A length given in metres, written in millimetres. */
    static String mm(double v_m) {
        return num(v_m * 1e3) + " mm";
    }
}
