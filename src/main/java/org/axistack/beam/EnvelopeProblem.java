package org.axistack.beam;

import org.axistack.model.PhysicsMessage;

/**
 * One envelope integration: start plane, end plane, start envelope and the beam's current and
 * normalised edge emittance. SI units.
 *
 * @param zStart_m                 start plane, m
 * @param zEnd_m                   end plane, m, &gt; zStart_m
 * @param radius_m                 edge radius R at the start plane, m (&gt; 0 unless current and emittance are both 0)
 * @param slope_rad                R' at the start plane, rad
 * @param current_A                beam current magnitude, A, &gt;= 0
 * @param normalisedEmittance_m_rad normalised edge emittance, m rad, &gt;= 0
 */
public record EnvelopeProblem(double zStart_m, double zEnd_m, double radius_m, double slope_rad, double current_A,
        double normalisedEmittance_m_rad) {

    public EnvelopeProblem {
        if (!Double.isFinite(current_A) || current_A < 0) {
            throw PhysicsMessage.CURRENT_NEGATIVE.exception("current", current_A);
        }
        if (!Double.isFinite(normalisedEmittance_m_rad) || normalisedEmittance_m_rad < 0) {
            throw PhysicsMessage.EMITTANCE_NEGATIVE.exception("emittance", normalisedEmittance_m_rad * 1e6);
        }
        if (!Double.isFinite(zStart_m) || !Double.isFinite(zEnd_m) || !(zEnd_m > zStart_m)) {
            throw PhysicsMessage.ENVELOPE_RANGE.exception("from", zStart_m * 1e3, "to", zEnd_m * 1e3);
        }
        if (!Double.isFinite(slope_rad)) {
            throw PhysicsMessage.START_SLOPE.exception("slope", slope_rad * 1e3);
        }
        boolean linear = current_A == 0 && normalisedEmittance_m_rad == 0;
        if (!Double.isFinite(radius_m) || radius_m < 0 || (!linear && radius_m == 0)) {
            throw PhysicsMessage.START_RADIUS.exception("radius", radius_m * 1e3);
        }
    }

    /** True when current and emittance are both zero: the envelope is then a paraxial ray. */
    public boolean isLinear() {
        return current_A == 0 && normalisedEmittance_m_rad == 0;
    }

    public EnvelopeProblem withCurrent_A(double i) {
        return new EnvelopeProblem(zStart_m, zEnd_m, radius_m, slope_rad, i, normalisedEmittance_m_rad);
    }

    public EnvelopeProblem withNormalisedEmittance_m_rad(double e) {
        return new EnvelopeProblem(zStart_m, zEnd_m, radius_m, slope_rad, current_A, e);
    }
}
