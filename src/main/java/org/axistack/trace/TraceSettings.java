package org.axistack.trace;

import org.axistack.model.PhysicsMessage;

/**
 * Settings of the exact tracer. Immutable.
 *
 * @param relativeTolerance    relative local error tolerance of the Dormand-Prince 8(5,3) integrator
 *                             (positions also get an absolute tolerance of this times the region size)
 * @param maxEvaluations       largest number of right-hand-side evaluations per ray
 * @param checkFraction        largest distance a ray moves between event checks and the chord length
 *                             of the electrode-hit test, as a fraction of the region size
 * @param recordPath           whether to keep the ray's path (every integrator step) for plots
 */
public record TraceSettings(double relativeTolerance, int maxEvaluations, double checkFraction, boolean recordPath) {

    public TraceSettings {
        if (!(relativeTolerance >= 1e-15 && relativeTolerance <= 1e-3)) {
            throw PhysicsMessage.TRACE_TOLERANCE.exception("tolerance", relativeTolerance);
        }
        if (maxEvaluations < 100) {
            throw new IllegalArgumentException("max evaluations must be at least 100: " + maxEvaluations);
        }
        if (!(checkFraction > 0 && checkFraction <= 0.5)) {
            throw new IllegalArgumentException("check fraction must lie in (0, 0.5]: " + checkFraction);
        }
    }

    public static TraceSettings defaults() {
        return new TraceSettings(1e-11, 2_000_000, 1.0 / 400, false);
    }

    public TraceSettings withRelativeTolerance(double tol) {
        return new TraceSettings(tol, maxEvaluations, checkFraction, recordPath);
    }

    public TraceSettings withRecordPath(boolean record) {
        return new TraceSettings(relativeTolerance, maxEvaluations, checkFraction, record);
    }
}
