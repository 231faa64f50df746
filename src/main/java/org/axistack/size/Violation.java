package org.axistack.size;

/**
 * A limit a design breaks (or, with excess &lt;= 0, meets), SI values.
 *
 * @param limit   which limit
 * @param value   the design's value (V, V/m or m)
 * @param allowed the limit (V, V/m or m)
 * @param excess  relative excess, positive when broken (value/allowed - 1 for upper limits,
 *                allowed/value - 1 for lower limits)
 */
public record Violation(Limit limit, double value, double allowed, double excess) {

    public static Violation upper(Limit l, double value, double allowed) {
        return new Violation(l, value, allowed, value / allowed - 1);
    }

    public static Violation lower(Limit l, double value, double allowed) {
        return new Violation(l, value, allowed, value > 0 ? allowed / value - 1 : Double.POSITIVE_INFINITY);
    }

    public boolean broken() {
        return excess > 1e-9;
    }
}
