package org.axistack.trace;

import java.util.Optional;

/**
 * One row of a trajectory table: one ray on one observation plane.
 *
 * @param rayId  the ray's number
 * @param z_m    the plane, m
 * @param point  the ray's state on the plane, if it got there
 * @param status "ok" when the ray reached the plane, otherwise how its trace ended (with the
 *               electrode's name after a colon for a hit)
 */
public record TableRow(int rayId, double z_m, Optional<RayPoint> point, String status) {
}
