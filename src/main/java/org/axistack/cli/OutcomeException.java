package org.axistack.cli;

/**
 * A physics outcome the user must act on (no focus in range, reflection, electrode hit, surface field
 * over the limit with --strict). Commands throw it after printing their results; the tool exits 1.
 */
public final class OutcomeException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    public OutcomeException(String message) {
        super(message);
    }
}
