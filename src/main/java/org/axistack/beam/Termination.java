package org.axistack.beam;

/**
 * Why the envelope integration stopped.
 *
 * @param kind   reason
 * @param z_m    where, m
 * @param detail human-readable explanation
 */
public record Termination(Kind kind, double z_m, String detail) {

    /** The reason the integration stopped. */
    public enum Kind {
        /** The end plane was reached. */
        END_PLANE,
        /** The kinetic energy fell to (nearly) zero: the beam turns back (an electrostatic mirror). */
        REFLECTED,
        /** The integrator could not continue (the detail says why). */
        FAILED
    }

    public boolean reachedEnd() {
        return kind == Kind.END_PLANE;
    }
}
