package org.axistack.trace;

/**
 * The state of a ray at one point. SI units; u = gamma beta is the momentum divided by m c.
 *
 * @param z_m              axial position, m
 * @param x_m              x, m
 * @param y_m              y, m
 * @param uX               gamma beta_x
 * @param uY               gamma beta_y
 * @param uZ               gamma beta_z
 * @param kineticEnergy_eV kinetic energy, eV
 * @param time_s           time since the start, s
 */
public record RayPoint(double z_m, double x_m, double y_m, double uX, double uY, double uZ, double kineticEnergy_eV,
        double time_s) {

    /** Distance from the axis, m. */
    public double r_m() {
        return Math.hypot(x_m, y_m);
    }

    /** dx/dz (infinite for a ray moving across the axis at right angles). */
    public double slopeX() {
        return uX / uZ;
    }

    /** dy/dz. */
    public double slopeY() {
        return uY / uZ;
    }

    /**
     * Radial slope dr/dz: positive moving away from the axis. On the axis, where dr/dz is not
     * defined, the magnitude of the transverse slope.
     */
    public double radialSlope() {
        double r = r_m();
        if (r == 0) {
            return Math.hypot(uX, uY) / uZ;
        }
        return (x_m * uX + y_m * uY) / (r * uZ);
    }
}
