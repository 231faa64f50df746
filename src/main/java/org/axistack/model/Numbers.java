package org.axistack.model;

import java.math.BigDecimal;
import java.math.MathContext;
import java.util.Locale;

/**
 * The one number formatter: every figure the tool writes (terminal, report, window, CSV, TOML, messages) is
 * rounded here, and the digits each output shows are named here, so that one figure reads the same wherever the
 * same precision is asked for. Plain notation is used wherever it stays short; trailing zeros are cut where a
 * style says so. The callers' own helpers (plan text, window, tables, stack writer, messages) only pick a style.
 */
public final class Numbers {
    private Numbers() {
    }

    /** Digits of figures in messages and notes (six: far beyond any input's accuracy, no round-off noise). */
    public static final int MESSAGE_DIGITS = 6;
    /** Digits of figures in the window's property table and charts. */
    public static final int WINDOW_DIGITS = 4;
    /** Digits of figures in the plan's text. */
    public static final int TEXT_DIGITS = 5;
    /** Digits of figures in the HTML report's tables. */
    public static final int REPORT_DIGITS = 6;
    /** Digits of numbers in CSV tables (more than any result's accuracy, so nothing is lost to rounding). */
    public static final int TABLE_DIGITS = 10;
    /** Digits of a bias typed back into a number field (far below any supply's resolution). */
    public static final int BIAS_DIGITS = 10;
    /** Digits of numbers in values echoed in input messages. */
    public static final int INPUT_DIGITS = 12;
    /** Decimals of error estimates, residuals and relative changes ("3.8e-08": their size, not their digits, matters). */
    public static final int ESTIMATE_DECIMALS = 1;
    /** Decimals of elapsed times in seconds. */
    public static final int SECONDS_DECIMALS = 2;
    /** Digits of floats written into stack files (a round trip keeps every digit that matters). */
    public static final int TOML_DIGITS = 15;

    /**
     * {@code x} rounded to {@code digits} significant digits in plain notation, trailing zeros cut ("0.00012346",
     * "1600", "-3.5"); "0" for zero (also for -0). The caller decides what non-finite values read as.
     */
    public static String plain(double x, int digits) {
        if (x == 0) {
            return "0";
        }
        String s = new BigDecimal(x).round(new MathContext(digits)).stripTrailingZeros().toPlainString();
        return s.equals("-0") ? "0" : s;
    }

    /** {@code x} in the "%.{digits}g" style of java.util.Formatter (fixed width of digits, exponent when large). */
    public static String general(double x, int digits) {
        return String.format(Locale.ROOT, "%." + digits + "g", x);
    }

    /** {@code x} in the "%.{decimals}e" style (for error estimates, residuals). */
    public static String scientific(double x, int decimals) {
        return String.format(Locale.ROOT, "%." + decimals + "e", x);
    }

    /** An error estimate, residual or relative change ("3.8e-08"), with {@link #ESTIMATE_DECIMALS}. */
    public static String estimate(double x) {
        return scientific(x, ESTIMATE_DECIMALS);
    }

    /** A tolerance or accuracy asked for, as its order of magnitude ("1e-05"). */
    public static String tolerance(double x) {
        return scientific(x, 0);
    }

    /** An elapsed time in seconds, without the unit ("0.28"), with {@link #SECONDS_DECIMALS}. */
    public static String seconds(double s) {
        return String.format(Locale.ROOT, "%." + SECONDS_DECIMALS + "f", s);
    }

    /** Trailing zeros of a decimal fraction cut, also before an exponent ("1.2300e-05" to "1.23e-05", "2.0" to "2"). */
    public static String trimZeros(String s) {
        return s.replaceAll("(\\.\\d*?)0+(e|$)", "$1$2").replaceAll("\\.(e|$)", "$1");
    }

    /**
     * A number in running text (plan text, surface-field words): a whole number as it is ("-1200"), others to
     * {@link #TEXT_DIGITS} significant digits with trailing zeros cut ("48.881", "0.00012346").
     */
    public static String text(double x) {
        if (whole(x, 1e12)) {
            return String.valueOf((long) x);
        }
        return trimZeros(general(x, TEXT_DIGITS));
    }

    /** Whether x is a whole number small enough to print as one ("-1200", not "-1200.0"). */
    public static boolean whole(double x, double below) {
        return x == Math.rint(x) && Math.abs(x) < below;
    }
}
