package org.axistack.ui;

import org.axistack.model.Numbers;

/** Number formats of the window: plain decimals with a sensible number of significant digits. */
public final class UiFormat {
    private UiFormat() {
    }

    /** Four significant digits, no exponent for everyday magnitudes. */
    public static String num(double v) {
        if (Double.isNaN(v)) {
            return "-";
        }
        if (Double.isInfinite(v)) {
            return v > 0 ? "infinite" : "-infinite";
        }
        double a = Math.abs(v);
        if (a != 0 && (a < 1e-3 || a >= 1e6)) {
            return Numbers.general(v, Numbers.WINDOW_DIGITS);
        }
        return Numbers.plain(v, Numbers.WINDOW_DIGITS);
    }

    /**
     * A bias in volts as typed back into the number field: ten significant digits (far below any supply's
     * resolution, and free of binary round-off such as -161.28000000000003), no exponent.
     */
    public static String volts(double v) {
        return Numbers.plain(v, Numbers.BIAS_DIGITS);
    }
}
