package org.axistack.trace;

/**
 * A ray's first crossing of an observation plane.
 *
 * @param planeIndex index of the plane in the trace targets
 * @param point      the ray's state on the plane
 */
public record PlaneCrossing(int planeIndex, RayPoint point) {
}
