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
        String s = String.format(Locale.ROOT, "%.4g", v);
        if (s.contains("e")) {
            return s;
        }
        if (s.contains(".")) {
            s = s.replaceAll("0+$", "").replaceAll("\\.$", "");
        }
        return s.equals("-0") ? "0" : s;
    }

    /** A bias in volts as typed back into the number field (full precision, no exponent). */
    public static String volts(double v) {
        String s = new java.math.BigDecimal(Double.toString(v)).stripTrailingZeros().toPlainString();
        return s.equals("-0") ? "0" : s;
    }
}
