package org.axistack.tune;

import org.axistack.model.SurfaceFieldLimits;

/**
 * Verdict on the largest electrode surface field of a bias set against the stack's settable limits
 * ({@link SurfaceFieldLimits}: common practice, no single source).
 */
public enum SurfaceFieldCheck {
    /** At or below the comfort limit. */
    WITHIN,
    /** Above the comfort limit, at or below the aggressive one: a warning. */
    ABOVE_COMFORT,
    /** Above the aggressive limit: breakdown is likely. */
    ABOVE_AGGRESSIVE;

    public static SurfaceFieldCheck of(double field_V_per_m, SurfaceFieldLimits limits) {
        if (field_V_per_m > limits.aggressive_V_per_m()) {
            return ABOVE_AGGRESSIVE;
        }
        return field_V_per_m > limits.comfort_V_per_m() ? ABOVE_COMFORT : WITHIN;
    }

    public boolean warning() {
        return this != WITHIN;
    }

    /** The verdict in the words every front end shows ("within the limits", "above the comfort limit", ...). */
    public String words() {
        return switch (this) {
            case WITHIN -> "within the limits";
            case ABOVE_COMFORT -> "above the comfort limit";
            case ABOVE_AGGRESSIVE -> "above the aggressive limit";
        };
    }
}
