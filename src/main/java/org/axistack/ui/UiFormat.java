package org.axistack.ui;

import java.util.Locale;

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
            return String.format(Locale.ROOT, "%.4g", v);
        }
        if (v == 0) {
            return "0";
        }
        return new java.math.BigDecimal(v).round(new java.math.MathContext(4)).stripTrailingZeros().toPlainString();
    }

    /**
     * A bias in volts as typed back into the number field: ten significant digits (far below any supply's
     * resolution, and free of binary round-off such as -161.28000000000003), no exponent.
     */
    public static String volts(double v) {
        if (v == 0) {
            return "0";
        }
        String s = new java.math.BigDecimal(v).round(new java.math.MathContext(10)).stripTrailingZeros()
                .toPlainString();
        return s.equals("-0") ? "0" : s;
    }
}
