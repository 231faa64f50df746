package org.axistack.trace;

import org.axistack.model.Numbers;

/** Number formatting for messages: six significant digits, no trailing zeros. */
final class Fmt {
    private Fmt() {
    }

    static String num(double v) {
        return Double.isFinite(v) ? Numbers.plain(v, Numbers.MESSAGE_DIGITS) : Double.toString(v);
    }

    /** A length given in metres, written in millimetres. */
    static String mm(double v_m) {
        return num(v_m * 1e3) + " mm";
    }
}
