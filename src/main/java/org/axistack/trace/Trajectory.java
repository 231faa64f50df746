package org.axistack.trace;

import java.util.List;
import java.util.Optional;

/**
 * One traced ray. SI units.
 *
 * @param start                the start
 * @param status               how the trace ended
 * @param end                  the last state (on the screen, at the impact, at the turning point...)
 * @param crossings            first crossings of the observation planes that the ray reached
 * @param hit                  the electrode impact when status is {@link TraceStatus#HIT}
 * @param maxEnergyError       largest |(T + q phi) - (T0 + q phi0)| / E0 seen at the step ends, with E0
 *                             the kinetic energy where phi = 0: the energy conservation achieved
 * @param evaluations          right-hand-side evaluations spent
 * @param path                 the path at every integrator step (empty unless recording was asked for)
 */
public record Trajectory(RayStart start, TraceStatus status, RayPoint end, List<PlaneCrossing> crossings,
        Optional<ElectrodeHit> hit, double maxEnergyError, int evaluations, List<RayPoint> path) {

    public Trajectory {
        crossings = List.copyOf(crossings);
        path = List.copyOf(path);
        hit = hit == null ? Optional.empty() : hit;
    }

    public int id() {
        return start.id();
    }

    /** The ray's state on plane i, if it got there. */
    public Optional<RayPoint> at(int planeIndex) {
        for (PlaneCrossing c : crossings) {
            if (c.planeIndex() == planeIndex) {
                return Optional.of(c.point());
            }
        }
        return Optional.empty();
    }

    /** Status word for tables: the status, with the electrode's name for a hit. */
    public String statusLabel() {
        return hit.map(h -> status.label() + ":" + h.electrode()).orElse(status.label());
    }
}
