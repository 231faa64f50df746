package org.axistack.model;

/**
 * Limits for vacuum breakdown warnings: electrode surface fields, V/m, and the voltage across a gap
 * ({@link GapRule}). Common practice, no single source: polished electrodes in good vacuum are usually kept
 * below about 5 kV/mm for comfort, and 10 kV/mm is aggressive. User settings, not constants of nature.
 *
 * @param comfort_V_per_m    above this a warning is given
 * @param aggressive_V_per_m above this the design is flagged as likely to break down
 * @param gapRule            the voltage a gap may hold against its width
 */
public record SurfaceFieldLimits(double comfort_V_per_m, double aggressive_V_per_m, GapRule gapRule) {
    public static final double DEFAULT_COMFORT_V_PER_M = 5e6;
    public static final double DEFAULT_AGGRESSIVE_V_PER_M = 10e6;

    public SurfaceFieldLimits {
        gapRule = gapRule == null ? GapRule.defaults() : gapRule;
        if (!(comfort_V_per_m > 0) || !(aggressive_V_per_m >= comfort_V_per_m) || !Double.isFinite(aggressive_V_per_m)) {
            throw new IllegalArgumentException("surface field limits need 0 < comfort <= aggressive");
        }
    }

    /** Surface-field limits with the default gap rule. */
    public SurfaceFieldLimits(double comfort_V_per_m, double aggressive_V_per_m) {
        this(comfort_V_per_m, aggressive_V_per_m, GapRule.defaults());
    }

    public static SurfaceFieldLimits defaults() {
        return new SurfaceFieldLimits(DEFAULT_COMFORT_V_PER_M, DEFAULT_AGGRESSIVE_V_PER_M);
    }

    /** The same surface-field limits with another gap rule. */
    public SurfaceFieldLimits withGapRule(GapRule rule) {
        return new SurfaceFieldLimits(comfort_V_per_m, aggressive_V_per_m, rule);
    }
}
