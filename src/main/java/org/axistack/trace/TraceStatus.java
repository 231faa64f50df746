package org.axistack.trace;

/** How a ray's trace ended. */
public enum TraceStatus {
    /** Reached the screen (the end plane). */
    SCREEN("screen"),
    /** Struck an electrode. */
    HIT("hit"),
    /** Turned back (axial velocity fell to zero): the lens acts as a mirror for it. */
    REFLECTED("reflected"),
    /** Left the traced region sideways or backwards. */
    LEFT_REGION("left_region"),
    /** Ran out of integrator evaluations before any other end. */
    STEP_LIMIT("step_limit");

    private final String label;

    TraceStatus(String label) {
        this.label = label;
    }

    /** The word used in tables and JSON. */
    public String label() {
        return label;
    }
}
