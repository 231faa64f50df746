package org.axistack.trace;

import org.axistack.model.PhysicsMessage;

/**
 * Where and how one ray starts. SI units. Rays travel towards +z.
 *
 * @param id        ray number (1-based within a ray set)
 * @param x_m       start x, m
 * @param y_m       start y, m
 * @param z_m       start z, m
 * @param dirX      direction cosine along x (the direction is normalised here)
 * @param dirY      direction cosine along y
 * @param dirZ      direction cosine along z, &gt; 0
 * @param energy_eV kinetic energy the particle would have where the potential is 0 V, eV (&gt; 0); its
 *                  kinetic energy at the start is this minus q phi(start)
 */
public record RayStart(int id, double x_m, double y_m, double z_m, double dirX, double dirY, double dirZ,
        double energy_eV) {

    public RayStart {
        for (double v : new double[] {x_m, y_m, z_m, dirX, dirY, dirZ, energy_eV}) {
            if (!Double.isFinite(v)) {
                throw PhysicsMessage.RAY_START_NOT_FINITE.exception("ray", id, "value", v);
            }
        }
        double norm = Math.sqrt(dirX * dirX + dirY * dirY + dirZ * dirZ);
        if (!(dirZ > 0) || norm == 0) {
            throw PhysicsMessage.RAY_START_BACKWARD.exception("ray", id);
        }
        dirX /= norm;
        dirY /= norm;
        dirZ /= norm;
        if (!(energy_eV > 0)) {
            throw PhysicsMessage.RAY_ENERGY.exception("ray", id, "energy", energy_eV);
        }
    }

    /** A ray from (x, y, z) with slopes dx/dz and dy/dz. */
    public static RayStart withSlopes(int id, double x_m, double y_m, double z_m, double slopeX, double slopeY,
            double energy_eV) {
        return new RayStart(id, x_m, y_m, z_m, slopeX, slopeY, 1.0, energy_eV);
    }

    public RayStart withId(int newId) {
        return new RayStart(newId, x_m, y_m, z_m, dirX, dirY, dirZ, energy_eV);
    }

    public RayStart withEnergy_eV(double newEnergy_eV) {
        return new RayStart(id, x_m, y_m, z_m, dirX, dirY, dirZ, newEnergy_eV);
    }

    /** Distance from the axis at the start, m. */
    public double r_m() {
        return Math.hypot(x_m, y_m);
    }
}
