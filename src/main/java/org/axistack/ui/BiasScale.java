package org.axistack.ui;

import java.util.Locale;

/**
 * The range and step of one bias slider and the reading of its number field. The slider runs in whole
 * steps between -limit and +limit volts; the number field takes any value (the slider then pins at its end).
 *
 * @param limit_V largest |bias| the slider reaches, V
 * @param steps   slider positions on each side of zero
 */
public record BiasScale(double limit_V, int steps) {

    public BiasScale {
        if (!(limit_V > 0) || steps < 1) {
            throw new IllegalArgumentException("slider limit must be > 0 V and steps >= 1");
        }
    }

    /**
     * The scale for an electrode: a round limit at or above 1.5 times the largest |bias| of the stack and at
     * least the beam's energy per charge (the biases that matter for focusing are of that order), 1000 steps
     * a side.
     */
    public static BiasScale forStack(double maxAbsBias_V, double energyPerCharge_V) {
        double raw = Math.max(Math.max(1.5 * maxAbsBias_V, Math.abs(energyPerCharge_V)), 10);
        return new BiasScale(Isolines.roundStep(raw), 1000);
    }

    /** Volts per slider step. */
    public double step_V() {
        return limit_V / steps;
    }

    /** Slider position for a bias (clamped to the ends). */
    public int position(double bias_V) {
        long p = Math.round(bias_V / step_V());
        return (int) Math.max(-steps, Math.min(steps, p));
    }

    /** Bias at a slider position, V. */
    public double bias_V(int position) {
        return Math.rint(position * step_V() * 1e9) / 1e9;
    }

    /**
     * Reads a bias typed into the number field: a plain number of volts, optionally followed by "V".
     *
     * @throws IllegalArgumentException with a message that says what to type
     */
    public static double parse(String electrode, String typed) {
        String t = typed.trim();
        if (t.endsWith("V") || t.endsWith("v")) {
            t = t.substring(0, t.length() - 1).trim();
        }
        double v;
        try {
            v = Double.parseDouble(t.replace(',', '.'));
        } catch (NumberFormatException e) {
            throw new IllegalArgumentException(String.format(Locale.ROOT,
                    "bias of %s: \"%s\" is not a number of volts; type a number such as -120 or 250.5", electrode,
                    typed));
        }
        if (!Double.isFinite(v) || Math.abs(v) > org.axistack.io.Limits.MAX_BIAS_V) {
            throw new IllegalArgumentException(String.format(Locale.ROOT,
                    "bias of %s: %s V is out of range; type a value between -%s and %s V", electrode, typed,
                    UiFormat.num(org.axistack.io.Limits.MAX_BIAS_V), UiFormat.num(org.axistack.io.Limits.MAX_BIAS_V)));
        }
        return v;
    }
}
