package org.axistack.beam;

import org.axistack.model.PhysicsMessage;
import java.util.OptionalDouble;

/**
 * What the user asks of an envelope study of a stack.
 *
 * @param current_A beam current magnitude, A, &gt;= 0
 * @param start     the envelope at the start plane
 * @param fromZ_m   start plane, m (empty: the beam's start plane, else ahead of the first electrode)
 * @param toZ_m     end plane, m (empty: the screen, else well beyond the last electrode)
 */
public record EnvelopeRequest(double current_A, EnvelopeStart start, OptionalDouble fromZ_m, OptionalDouble toZ_m) {

    public EnvelopeRequest {
        if (!Double.isFinite(current_A) || current_A < 0) {
            throw PhysicsMessage.CURRENT_NEGATIVE.exception("current", current_A);
        }
        if (start == null) {
            throw new IllegalArgumentException("an envelope request needs a start envelope");
        }
        fromZ_m = fromZ_m == null ? OptionalDouble.empty() : fromZ_m;
        toZ_m = toZ_m == null ? OptionalDouble.empty() : toZ_m;
    }

    public EnvelopeRequest(double current_A, EnvelopeStart start) {
        this(current_A, start, OptionalDouble.empty(), OptionalDouble.empty());
    }

    public EnvelopeRequest withCurrent_A(double i) {
        return new EnvelopeRequest(i, start, fromZ_m, toZ_m);
    }
}
