package org.axistack.tune;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;

/**
 * Orders the focusing biases of one electrode by usefulness on the bench: direct images before near-mirror ones
 * (the beam crosses over inside the lens before the image, {@link FocusSolution#axisCrossings()} > 0), then those
 * within the aggressive surface-field limit before those above it, and within each group the least touchy first, the one whose focus tolerates the most volts of the tuned supply
 * ({@link FocusSensitivity#tolerance_V()}). A near-mirror focus moves the image by hundreds to thousands of
 * millimetres per volt: usable only with a supply held to a few millivolts, so it is never the one to pick first.
 * Common practice, no source (the ordering is our choice; the sensitivities are computed).
 */
public final class FocusRanking {

    private FocusRanking() {
    }

    /** Solutions and their budgets in the same (ranked) order. */
    public record Ranked(TuneResult result, List<FocusSensitivity> budgets) {
        public Ranked {
            budgets = List.copyOf(budgets);
        }
    }

    /** The beam crosses the axis inside the lens before the image: a near-mirror focus, very touchy. */
    public static boolean nearMirror(FocusSolution s) {
        return s.axisCrossings() > 0;
    }

    /**
     * The solutions and budgets of a tuning result, most useful first. {@code budgets} is either empty (then only
     * the near-mirror flag orders, stable in bias) or one per solution in the result's order.
     */
    public static Ranked rank(TuneResult r, List<FocusSensitivity> budgets) {
        int n = r.solutions().size();
        if (!budgets.isEmpty() && budgets.size() != n) {
            throw new IllegalArgumentException("one budget per solution: " + budgets.size() + " for " + n);
        }
        List<Integer> order = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            order.add(i);
        }
        Comparator<Integer> byMirror = Comparator.<Integer, Boolean>comparing(i -> nearMirror(r.solutions().get(i)))
                .thenComparing(i -> r.solutions().get(i).surfaceFieldCheck() == SurfaceFieldCheck.ABOVE_AGGRESSIVE);
        Comparator<Integer> by = budgets.isEmpty() ? byMirror
                : byMirror.thenComparing(i -> -tunedTolerance_V(r.solutions().get(i), budgets.get(i)));
        order.sort(by);
        List<FocusSolution> sols = new ArrayList<>();
        List<FocusSensitivity> buds = new ArrayList<>();
        for (int i : order) {
            sols.add(r.solutions().get(i));
            if (!budgets.isEmpty()) {
                buds.add(budgets.get(i));
            }
        }
        return new Ranked(new TuneResult(r.electrode(), r.target(), r.range(), sols, r.nearest(), r.evaluations(),
                r.reflectingFrom_V(), r.reflectingTo_V()), buds);
    }

    /** Volts of drift of the tuned electrode that keep the focus within the budget's depth (infinite if none moves it). */
    public static double tunedTolerance_V(FocusSolution s, FocusSensitivity b) {
        int k = b.electrodes().indexOf(s.electrode());
        return b.tolerance_V()[k];
    }

    /** Image shift per volt of the tuned electrode, m/V. */
    public static double tunedShift_m_per_V(FocusSolution s, FocusSensitivity b) {
        return b.imageShift_m_per_V()[b.electrodes().indexOf(s.electrode())];
    }
}
