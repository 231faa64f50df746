package org.axistack.field;

/**
 * The field cannot be solved as given: the stack cannot be meshed, the mesh is too large for the heap, the
 * collocation system is singular or misses its residual, or the solved capacitance matrix breaks reciprocity or
 * the sign law. A failure of the input geometry or settings, not of the program: the command line turns it into
 * a message and exit 2, the window into a dialog, sizing into a rejected candidate. The message says which setting
 * or electrode to change; {@link #reason()} says which check failed and {@link #harmonic()} in which solve.
 */
public final class SolveException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    /** Which check failed. */
    public enum Reason {
        /** The electrodes cannot be meshed (degenerate element, bad settings). */
        MESH,
        /** More unknowns than the heap can hold. */
        TOO_LARGE,
        /** The collocation matrix is singular (electrodes coincide or overlap). */
        SINGULAR,
        /** A solve missed its residual limit. */
        RESIDUAL,
        /** The capacitance matrix breaks reciprocity or the sign law (near-touching electrodes). */
        CAPACITANCE
    }

    private final Reason reason;
    private final int harmonic;

    /** A failure of the round (harmonic 0) solve. */
    public SolveException(Reason reason, String message) {
        this(reason, 0, message);
    }

    /**
     * @param reason   which check failed
     * @param harmonic the azimuthal harmonic of the failed solve (0: the round solve)
     * @param message  what is wrong and what to change
     */
    public SolveException(Reason reason, int harmonic, String message) {
        super(message);
        this.reason = reason;
        this.harmonic = harmonic;
    }

    public Reason reason() {
        return reason;
    }

    /** The azimuthal harmonic of the failed solve (0 for the round solve). */
    public int harmonic() {
        return harmonic;
    }
}
