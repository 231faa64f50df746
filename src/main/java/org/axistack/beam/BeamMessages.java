package org.axistack.beam;

import java.util.Locale;

/**
 * The beam package's user-facing error and warning texts, one place, with units in every
 * placeholder. Callers at the edge (CLI, file reader) prefix the file, line and field.
 */
public final class BeamMessages {

    private BeamMessages() {
    }

    static String fmt(String f, Object... a) {
        return String.format(Locale.ROOT, f, a);
    }

    public static String negativeCurrent(double current_A) {
        return fmt("beam current must be a finite number >= 0 A, got %s A; give the magnitude of the current "
                + "(the sign of the charge comes from the particle)", current_A);
    }

    public static String negativeEmittance(double value_m_rad) {
        return fmt("emittance must be a finite number >= 0, got %s mm mrad; give the edge (or rms) emittance "
                + "as a positive number", value_m_rad * 1e6);
    }

    public static String badRadius(double radius_m) {
        return fmt("start radius of the envelope must be finite and > 0 when current or emittance is non-zero, "
                + "got %s mm; give the beam radius at the start plane", radius_m * 1e3);
    }

    public static String badSlope(double slope_rad) {
        return fmt("start slope of the envelope must be finite, got %s mrad", slope_rad * 1e3);
    }

    public static String badRange(double from_m, double to_m) {
        return fmt("envelope range must run forward with finite ends: from %s mm to %s mm; "
                + "choose an end plane after the start plane", from_m * 1e3, to_m * 1e3);
    }

    public static String notReachingStart(double z_m, double u_V) {
        return fmt("the beam cannot reach the start plane z = %s mm: its kinetic energy there would be "
                + "%s eV per unit charge (<= 0); move the start plane or raise the beam energy", z_m * 1e3, u_V);
    }

    public static String startOutsideBore(String electrode, double radius_m, double wall_m) {
        return fmt("start radius %.4g mm is larger than the bore of electrode '%s' (%.4g mm) at the start: "
                + "the beam is clipped; reduce the start radius below %.4g mm", radius_m * 1e3, electrode,
                wall_m * 1e3, wall_m * 1e3);
    }
}
