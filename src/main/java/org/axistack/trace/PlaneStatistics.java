package org.axistack.trace;

/**
 * The beam on one observation plane, over the rays that reached it. SI units.
 *
 * @param z_m          plane position, m
 * @param rays         rays that reached the plane
 * @param centroidX_m  mean x, m
 * @param centroidY_m  mean y, m
 * @param rmsRadius_m  sqrt(mean r^2), m (r from the axis)
 * @param maxRadius_m  largest r, m
 * @param meanEnergy_eV mean kinetic energy, eV
 */
public record PlaneStatistics(double z_m, int rays, double centroidX_m, double centroidY_m, double rmsRadius_m,
        double maxRadius_m, double meanEnergy_eV) {
}
