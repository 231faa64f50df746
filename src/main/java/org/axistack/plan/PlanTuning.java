package org.axistack.plan;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

import org.axistack.field.FieldSolution;
import org.axistack.model.Units;
import org.axistack.model.Stack;
import org.axistack.tune.BiasTuner;
import org.axistack.model.Rounding;
import org.axistack.tune.FocusRanking;
import org.axistack.tune.FocusSensitivity;
import org.axistack.tune.FocusSolution;
import org.axistack.tune.TuneResult;

/**
 * The plan's tuning step: the biases of one electrode that focus the beam on the screen ({@link BiasTuner}) and,
 * for each, the supply-stability budget of the tuning package ({@link FocusSensitivity}: image shift per volt of
 * every bias and per relative change of the beam energy, and the relative supply stability that holds the focus on
 * the screen within +/- the depth).
 *
 * @param tune       the focusing biases, when a screen and a biased electrode exist
 * @param note       what was tuned, or why not
 * @param budgets    one budget per focusing solution, in the same order (empty when there are none)
 * @param budgetNote what the budgets assume, or why they are missing
 */
record PlanTuning(Optional<TuneResult> tune, String note, List<FocusSensitivity> budgets, String budgetNote) {

    PlanTuning {
        budgets = List.copyOf(budgets);
    }

    static PlanTuning run(Stack stack, FieldSolution solution, String name, double depth_m,
            PlanAnalysis.Progress progress, double share, List<String> warnings) {
        if (stack.screenZ_m().isEmpty()) {
            return new PlanTuning(Optional.empty(), "no [screen] plane in the stack: add one to get the focusing bias",
                    List.of(), "no budget: there is no focusing bias");
        }
        if (name == null) {
            return new PlanTuning(Optional.empty(), "every electrode is at 0 V: give one a bias (or name one with --tune) to get "
                    + "the focusing bias", List.of(), "no budget: there is no focusing bias");
        }
        PlanAnalysis.announce(progress, "finding the biases of electrode " + name + " that focus on the screen", share);
        TuneResult t = new BiasTuner(solution, stack).focus(name, stack.screenZ_m().getAsDouble());
        String note = "biases of electrode " + name + " that image the " + (stack.beam().objectZ_m().isPresent()
                ? "object point" : "parallel beam") + " onto the screen at z = "
                + PlanFormat.num(Units.mToMm(stack.screenZ_m().getAsDouble())) + " mm (other biases as given), searched "
                + PlanFormat.num(t.range().from_V()) + " .. " + PlanFormat.num(t.range().to_V()) + " V";
        if (!t.found()) {
            warnings.add("no bias of " + name + " in " + PlanFormat.num(t.range().from_V()) + " .. "
                    + PlanFormat.num(t.range().to_V()) + " V focuses on the screen");
            return new PlanTuning(Optional.of(t), note, List.of(), "no budget: no bias focuses on the screen");
        }
        List<FocusSensitivity> budgets = new ArrayList<>();
        String budgetNote = "focus held on the screen within +/- " + PlanFormat.num(Units.mToMm(depth_m)) + " mm (set "
                + "with plan --depth-mm); image shift from the first-variation equations of the paraxial ray (linear in the "
                + "change); a supply of relative stability e moves the image by e |V dZ/dV|; 'all supplies' assumes the "
                + "same stability for every biased supply, drifting independently (added in quadrature)";
        try {
            for (FocusSolution f : t.solutions()) {
                budgets.add(FocusSensitivity.of(solution, stack, f.biases_V(), t.target(), depth_m));
            }
        } catch (RuntimeException e) {
            budgets.clear();
            budgetNote = "no budget: the linearised optics failed at a focusing bias (" + e.getMessage() + ")";
            warnings.add(budgetNote);
        }
        FocusRanking.Ranked ranked = FocusRanking.rank(t, budgets);
        for (int i = 0; i < ranked.result().solutions().size(); i++) {
            FocusSolution f = ranked.result().solutions().get(i);
            if (FocusRanking.nearMirror(f)) {
                warnings.add(nearMirrorWarning(f, ranked.budgets().isEmpty() ? null : ranked.budgets().get(i)));
            }
        }
        return new PlanTuning(Optional.of(ranked.result()), note + "; listed most useful first (direct images before "
                + "near-mirror ones, then the least touchy)", ranked.budgets(), budgetNote);
    }

    /** The warning for a near-mirror focusing bias, with the stability it would need. */
    static String nearMirrorWarning(FocusSolution f, FocusSensitivity b) {
        String need = b == null ? "" : ": the image moves " + Rounding.sig(Math.abs(Units.mToMm(
                FocusRanking.tunedShift_m_per_V(f, b))), Rounding.SENSITIVITY_DIGITS) + " mm per volt, so the supply of " + f.electrode()
                + " must hold within +/- " + Rounding.volts(FocusRanking.tunedTolerance_V(f, b)) + " for +/- "
                + PlanFormat.num(Units.mToMm(b.depth_m())) + " mm of focus";
        return "focusing bias " + PlanFormat.num(f.bias_V()) + " V of " + f.electrode() + " is near a mirror (the beam "
                + "crosses the axis " + f.axisCrossings() + " time(s) inside the lens before the image)" + need
                + "; prefer a direct focus";
    }
}
