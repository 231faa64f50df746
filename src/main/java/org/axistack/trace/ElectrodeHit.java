package org.axistack.trace;

/**
 * Where a ray struck an electrode.
 *
 * @param electrode the electrode's name
 * @param z_m       axial position of the impact, m
 * @param r_m       radius of the impact, m
 */
public record ElectrodeHit(String electrode, double z_m, double r_m) {
}
