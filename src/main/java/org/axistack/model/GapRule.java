package org.axistack.model;

/**
 * The rule of thumb that a vacuum gap holds less field the wider it is: the voltage a gap g may carry is
 * V(g) = V1 (g / 1 mm)^alpha, with V1 the voltage allowed across a 1 mm gap and 0 &lt; alpha &lt;= 1 (alpha = 1 is
 * a constant average field). Common practice, no single source; the defaults are from memory: alpha = 1/2 is
 * the exponent usually quoted for the total-voltage effect of gaps above about a millimetre (breakdown
 * voltage growing about as the square root of the gap; the same exponent follows from the clump model of
 * vacuum breakdown), and V1 is chosen so that the rule meets the surface-field limits of
 * {@link SurfaceFieldLimits} at a 1 mm gap (5 kV comfort, 10 kV aggressive), so the two checks agree where a
 * uniform field and the gap rule meet. Below about a millimetre the surface-field check is the one that binds.
 * User settings, not constants of nature.
 *
 * @param comfortAt1mm_V    voltage allowed across a 1 mm gap for comfort, V
 * @param aggressiveAt1mm_V voltage across a 1 mm gap above which breakdown is likely, V
 * @param exponent          alpha, in (0, 1]
 */
public record GapRule(double comfortAt1mm_V, double aggressiveAt1mm_V, double exponent) {
    public static final double DEFAULT_COMFORT_AT_1MM_V = 5000;
    public static final double DEFAULT_AGGRESSIVE_AT_1MM_V = 10000;
    public static final double DEFAULT_EXPONENT = 0.5;

    private static final double MM = 1e-3;

    public GapRule {
        if (!(comfortAt1mm_V > 0) || !(aggressiveAt1mm_V >= comfortAt1mm_V) || !Double.isFinite(aggressiveAt1mm_V)) {
            throw new IllegalArgumentException("gap rule needs 0 < comfort <= aggressive");
        }
        if (!(exponent > 0) || !(exponent <= 1)) {
            throw new IllegalArgumentException("gap rule exponent must be in (0, 1]: " + exponent);
        }
    }

    public static GapRule defaults() {
        return new GapRule(DEFAULT_COMFORT_AT_1MM_V, DEFAULT_AGGRESSIVE_AT_1MM_V, DEFAULT_EXPONENT);
    }

    /** The comfort voltage of a gap of gap_m metres, V. */
    public double comfort_V(double gap_m) {
        return comfortAt1mm_V * Math.pow(gap_m / MM, exponent);
    }

    /** The aggressive voltage of a gap of gap_m metres, V. */
    public double aggressive_V(double gap_m) {
        return aggressiveAt1mm_V * Math.pow(gap_m / MM, exponent);
    }
}
