package org.axistack.field;

/**
 * The largest surface field on one electrode and where it sits. On a smooth outline (rounded edges) the
 * value converges as the mesh is refined; at a sharp corner or a thin sheet's free edge the charge density
 * grows without bound toward the corner (like d^beta, beta &lt; 0; J. D. Jackson, Classical
 * Electrodynamics, 3rd ed., sec. 2.11), so the sampled value only reflects how fine the mesh is there:
 * {@link #sharp()} then says so, and (z, r) is the corner itself.
 *
 * @param electrode     electrode index
 * @param field_V_per_m largest sampled surface field, V/m (mesh-dependent when sharp)
 * @param z_m           where it sits, m
 * @param r_m           where it sits, m
 * @param sharp         whether the largest field is at a sharp corner or free sheet edge (no finite limit)
 */
public record SurfacePeak(int electrode, double field_V_per_m, double z_m, double r_m, boolean sharp) {
}
