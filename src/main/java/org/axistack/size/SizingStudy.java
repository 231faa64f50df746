package org.axistack.size;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.EnumMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

import org.axistack.field.SolveProgress;
import org.axistack.model.MeshSettings;

/**
 * A whole sizing study: the search ({@link Sizer}), then the best design per objective re-solved on the fine mesh
 * and re-focused, what the coarse mesh cost (measured on the winner), the winner's tolerances, the trade-off
 * front, and either the reasons the winner wins or the limits that bind when nothing is feasible.
 */
public final class SizingStudy {

    private SizingStudy() {
    }

    public static SizingResult run(Requirements req, FocusFinder finder, SizingProgress progress) {
        long t0 = System.nanoTime();
        SizingProgress p = progress == null ? SizingProgress.NONE : progress;
        Sizer sizer = new Sizer(req, finder, p);
        List<DesignEvaluator.Candidate> candidates = sizer.search();
        List<Design> all = new ArrayList<>();
        for (DesignEvaluator.Candidate c : candidates) {
            all.addAll(c.designs());
        }
        List<Design> feasible = all.stream().filter(Design::feasible).toList();
        if (feasible.isEmpty()) {
            return new SizingResult(req, candidates, Optional.empty(), Map.of(), List.of(), List.of(),
                    Optional.empty(), Optional.of(infeasibility(all)), Optional.empty(), seconds(t0));
        }
        SolveProgress cancel = (s, f) -> p.update("final designs", candidates.size(), req.search().evaluations(),
                Double.NaN);
        Map<Design, Design> refined = new LinkedHashMap<>();
        Map<Objective, Design> best = new EnumMap<>(Objective.class);
        for (Objective o : Objective.values()) {
            Design coarse = feasible.stream().min(Comparator.comparingDouble(o::score)).orElseThrow();
            Design fine = refined.computeIfAbsent(coarse, d -> refine(sizer.evaluator(), req, d, cancel));
            if (fine != null) {
                best.put(o, fine);
            }
        }
        Design coarseWinner = feasible.stream().min(Comparator.comparingDouble(req.objective()::score)).orElseThrow();
        Design winner = best.get(req.objective());
        Optional<MeshCheck> check = winner == null ? Optional.empty()
                : Optional.of(MeshCheck.of(coarseWinner, winner));
        Design forTolerances = winner == null ? coarseWinner : winner;
        List<Tolerance> tol = Tolerances.of(req, forTolerances,
                MeshSettings.defaults().withTargetElements(req.search().meshElements()), cancel);
        Reasons reasons = reasons(req, candidates, coarseWinner, feasible.size());
        return new SizingResult(req, candidates, Optional.ofNullable(winner), best, Front.of(all), tol, check,
                Optional.empty(), Optional.of(reasons), seconds(t0));
    }

    private static double seconds(long t0) {
        return (System.nanoTime() - t0) * 1e-9;
    }

    /** The design re-solved on the fine mesh, focused at the bias nearest the coarse one (null if it no longer focuses). */
    static Design refine(DesignEvaluator ev, Requirements req, Design coarse, SolveProgress progress) {
        DesignEvaluator.Candidate c = ev.evaluate(coarse.parameters_m(), coarse.dimensions_m(),
                req.search().finalElements(), progress, coarse.bias_V());
        return c.designs().isEmpty() ? null : c.designs().get(0);
    }

    static Infeasibility infeasibility(List<Design> all) {
        if (all.isEmpty()) {
            return new Infeasibility(List.of(Limit.BIAS), List.of(Limit.BIAS), null, Map.of(), true);
        }
        Map<Limit, Double> bestValue = new EnumMap<>(Limit.class);
        List<Limit> binding = new ArrayList<>();
        for (Limit l : Limit.values()) {
            Violation least = all.stream().map(d -> d.check(l)).min(Comparator.comparingDouble(Violation::excess))
                    .orElseThrow();
            bestValue.put(l, least.value());
            if (least.broken()) {
                binding.add(l);
            }
        }
        Design closest = all.stream().min(Comparator.comparingDouble(Design::totalExcess)).orElseThrow();
        List<Limit> conflicting = closest.broken().stream().map(Violation::limit).toList();
        return new Infeasibility(binding, conflicting, closest, bestValue, false);
    }

    static Reasons reasons(Requirements req, List<DesignEvaluator.Candidate> candidates, Design w, long feasible) {
        Objective o = req.objective();
        Optional<Design> runnerUp = candidates.stream().filter(c -> !c.designs().contains(w))
                .flatMap(c -> c.designs().stream()).filter(Design::feasible).min(Comparator.comparingDouble(o::score));
        Optional<Design> other = candidates.stream().filter(c -> c.designs().contains(w))
                .flatMap(c -> c.designs().stream()).filter(d -> d != w && Math.signum(d.bias_V()) != Math.signum(w.bias_V()))
                .findFirst();
        List<Violation> active = w.checks().stream().filter(v -> v.excess() > -0.03 && v.limit() != Limit.PLACEMENT)
                .toList();
        List<String> lower = new ArrayList<>(), upper = new ArrayList<>();
        for (int i : req.varied()) {
            Parameter q = req.parameters().get(i);
            double u = (w.parameters_m().get(i) - q.min_m()) / (q.max_m() - q.min_m());
            if (u < 0.01) {
                lower.add(q.name());
            } else if (u > 0.99) {
                upper.add(q.name());
            }
        }
        return new Reasons(runnerUp, other, active, lower, upper, feasible, candidates.size());
    }
}
