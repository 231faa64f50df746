package org.axistack.model;

import java.util.Map;

/**
 * A physics failure a user can meet, with its catalogue entry ({@link PhysicsMessage}): the message says what
 * went wrong and how to fix it. Unchecked, like the input-file exception; the command line prints the message and
 * exits 2 for a {@link PhysicsMessage.Kind#REQUEST} and 3 for an {@link PhysicsMessage.Kind#OUTCOME}, and the
 * window shows it in a dialog.
 */
public final class PhysicsException extends RuntimeException {

    private static final long serialVersionUID = 1L;

    private final transient PhysicsMessage entry;

    PhysicsException(PhysicsMessage entry, Map<String, ?> values) {
        super(entry.format(values));
        this.entry = entry;
    }

    /** The catalogue entry. */
    public PhysicsMessage entry() {
        return entry;
    }

    /** Whether the request was impossible or the physics ended the work. */
    public PhysicsMessage.Kind kind() {
        return entry.kind();
    }
}
