package org.axistack.beam;

import java.util.Locale;

/**
 * The beam package's warning texts (the envelope runs on and says what to look at). Failures that stop the work
 * are in the physics catalogue, {@link org.axistack.model.PhysicsMessage}.
 */
public final class BeamMessages {

    private BeamMessages() {
    }

    static String fmt(String f, Object... a) {
        return String.format(Locale.ROOT, f, a);
    }

    public static String startOutsideBore(String electrode, double radius_m, double wall_m) {
        return fmt("start radius %.4g mm is larger than the bore of electrode '%s' (%.4g mm) at the start: "
                + "the beam is clipped; reduce the start radius below %.4g mm", radius_m * 1e3, electrode,
                wall_m * 1e3, wall_m * 1e3);
    }
}
