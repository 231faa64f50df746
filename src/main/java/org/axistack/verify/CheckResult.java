package org.axistack.verify;

/**
 * Outcome of one built-in verification case: the project's computed value, the independent reference value,
 * the error (as defined by {@code errorMeasure}), the tolerance it must stay within, and where the reference
 * comes from. Values are in {@code unit}; the error is dimensionless.
 *
 * @param name         short name of the case
 * @param quantity     what is compared (with the point where the error is largest, if sampled)
 * @param unit         unit of computed and reference values as shown to the user
 * @param computed     project value, in {@code unit}
 * @param reference    closed-form or reference value, in {@code unit}
 * @param error        the error, dimensionless
 * @param tolerance    largest accepted error, dimensionless
 * @param errorMeasure how the error is measured (e.g. "relative", "max over z, of V2-V1")
 * @param source       where the reference comes from
 * @param method       how the project value was computed (mesh size, integrator)
 * @param seconds      wall time of the case, s
 */
public record CheckResult(String name, String quantity, String unit, double computed, double reference, double error,
        double tolerance, String errorMeasure, String source, String method, double seconds) {

    /** True when the error is finite and within the tolerance. */
    public boolean passed() {
        return Double.isFinite(error) && error <= tolerance;
    }
}
