package org.axistack.beam;

/**
 * The envelope at one plane.
 *
 * @param z_m          axial position, m
 * @param radius_m     edge radius R &gt;= 0, m
 * @param slope_rad    dR/dz, rad
 * @param perveance    local generalised perveance K (dimensionless)
 * @param emittance_m_rad local geometric edge emittance eps = eps_n/(beta gamma), m rad
 */
public record EnvelopePoint(double z_m, double radius_m, double slope_rad, double perveance, double emittance_m_rad) {
}
