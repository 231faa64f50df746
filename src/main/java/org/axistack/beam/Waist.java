package org.axistack.beam;

/**
 * A local minimum of the envelope.
 *
 * @param z_m      position, m
 * @param radius_m radius there, m (0 for a paraxial-ray axis crossing)
 * @param kind     how it was found
 */
public record Waist(double z_m, double radius_m, Kind kind) {

    /** How the waist was found. */
    public enum Kind {
        /** R' = 0 located by the integrator's event detection. */
        SMOOTH,
        /** A crossover deeper than the floor radius, passed with the analytic invariant (see EnvelopeSolver). */
        CROSSOVER,
        /** Zero current and emittance: the ray crosses the axis. */
        AXIS_CROSSING
    }
}
