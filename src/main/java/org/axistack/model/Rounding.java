package org.axistack.model;

/**
 * Figures rounded to what their accuracy supports, for every front end (report, window, command line): a
 * sensitivity or tolerance from a linearisation carries two significant digits, a surface field three, an
 * optical length from a converged solve six ({@link #sig}). Plain notation where it stays short, powers of ten
 * only beyond 1e7 or below 1e-5; trailing zeros cut.
 */
public final class Rounding {
    private Rounding() {
    }

    /** Significant digits of a linearised sensitivity or a tolerance derived from one. */
    public static final int SENSITIVITY_DIGITS = 2;

    /** {@code x} to {@code digits} significant digits ("0.00019", "1600", "2.5e+09"); "" for NaN. */
    public static String sig(double x, int digits) {
        if (!Double.isFinite(x)) {
            return Double.isNaN(x) ? "" : (x > 0 ? "unlimited" : "-unlimited");
        }
        if (x == 0) {
            return "0";
        }
        double a = Math.abs(x);
        if (a >= 1e7 || a < 1e-5) {
            return Numbers.trimZeros(Numbers.scientific(x, digits - 1));
        }
        return Numbers.plain(x, digits);
    }

    /** A voltage tolerance to two significant digits in V, mV or uV ("12 V", "3.4 mV", "0.52 uV"). */
    public static String volts(double v) {
        if (!Double.isFinite(v)) {
            return "any voltage (it does not move the image)";
        }
        double a = Math.abs(v);
        if (a >= 1) {
            return sig(v, SENSITIVITY_DIGITS) + " V";
        }
        if (a >= 1e-3) {
            return sig(v * 1e3, SENSITIVITY_DIGITS) + " mV";
        }
        return sig(v * 1e6, SENSITIVITY_DIGITS) + " uV";
    }
}
