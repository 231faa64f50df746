package org.axistack.optics;

/**
 * The axial acceleration potential reaches zero: the particle turns back (an electrostatic mirror).
 *
 * @param turningZ_m where U(z) = 0 on the axis first, counted in the direction of travel, m
 * @param startZ_m   where the particle started, m
 */
public record Reflection(double turningZ_m, double startZ_m) {

    /** A sentence for the user (SI values converted to mm). */
    public String describe() {
        return String.format(java.util.Locale.ROOT,
                "the beam is reflected: its kinetic energy reaches zero on the axis at z = %.4f mm (a mirror, not a lens)",
                turningZ_m * 1e3);
    }
}
