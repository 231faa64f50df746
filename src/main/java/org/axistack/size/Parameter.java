package org.axistack.size;

/**
 * One sizing parameter of a family: fixed (min == max) or varied between bounds. Metres.
 *
 * @param name  as in {@link Family#parameters()}
 * @param min_m lower bound, m, &gt; 0
 * @param max_m upper bound, m, &gt;= min
 */
public record Parameter(String name, double min_m, double max_m) {
    public Parameter {
        if (!(min_m > 0) || !(max_m >= min_m) || !Double.isFinite(max_m)) {
            throw new IllegalArgumentException("parameter " + name + ": need 0 < min <= max");
        }
    }

    public boolean varied() {
        return max_m > min_m;
    }

    public Parameter scaled(double k) {
        return new Parameter(name, min_m * k, max_m * k);
    }
}
