package org.axistack.field;

/**
 * The stack cannot be meshed or solved as given (too many unknowns for the heap, a degenerate element,
 * coincident electrodes). The message says which setting or electrode to change.
 */
public final class MeshException extends IllegalArgumentException {
    private static final long serialVersionUID = 1L;

    public MeshException(String message) {
        super(message);
    }
}
