package org.axistack.trace;

import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;

/**
 * Every ray of a set, traced, in the set's order, with the targets they were traced to.
 *
 * @param rays         the ray set
 * @param targets      planes and screen
 * @param trajectories one per ray, same order
 * @param seconds      wall time spent, s
 */
public record BundleResult(RaySet rays, TraceTargets targets, List<Trajectory> trajectories, double seconds) {

    public BundleResult {
        trajectories = List.copyOf(trajectories);
    }

    /** Beam statistics on every observation plane, in plane order. */
    public List<PlaneStatistics> planeStatistics() {
        List<PlaneStatistics> out = new ArrayList<>();
        for (int i = 0; i < targets.planes_m().size(); i++) {
            int n = 0;
            double sx = 0, sy = 0, sr2 = 0, rmax = 0, se = 0;
            for (Trajectory t : trajectories) {
                var p = t.at(i);
                if (p.isEmpty()) {
                    continue;
                }
                RayPoint q = p.get();
                n++;
                sx += q.x_m();
                sy += q.y_m();
                double r = q.r_m();
                sr2 += r * r;
                rmax = Math.max(rmax, r);
                se += q.kineticEnergy_eV();
            }
            out.add(n == 0 ? new PlaneStatistics(targets.planes_m().get(i), 0, Double.NaN, Double.NaN, Double.NaN,
                    Double.NaN, Double.NaN)
                    : new PlaneStatistics(targets.planes_m().get(i), n, sx / n, sy / n, Math.sqrt(sr2 / n), rmax,
                            se / n));
        }
        return out;
    }

    /** Every ray on every observation plane, ray by ray, planes in order. */
    public List<TableRow> tableRows() {
        List<TableRow> rows = new ArrayList<>();
        for (Trajectory t : trajectories) {
            for (int i = 0; i < targets.planes_m().size(); i++) {
                var p = t.at(i);
                rows.add(new TableRow(t.id(), targets.planes_m().get(i), p, p.isPresent() ? "ok" : t.statusLabel()));
            }
        }
        return rows;
    }

    /** Rays that did not reach the screen. */
    public int lost() {
        return (int) trajectories.stream().filter(t -> t.status() != TraceStatus.SCREEN).count();
    }

    /** How many rays ended each way. */
    public Map<TraceStatus, Integer> statusCounts() {
        Map<TraceStatus, Integer> m = new EnumMap<>(TraceStatus.class);
        for (Trajectory t : trajectories) {
            m.merge(t.status(), 1, Integer::sum);
        }
        return m;
    }

    /** Worst energy conservation over all rays (relative). */
    public double maxEnergyError() {
        return trajectories.stream().mapToDouble(Trajectory::maxEnergyError).max().orElse(0);
    }
}
