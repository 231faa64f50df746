package org.axistack.report;

import java.util.ArrayList;
import java.util.List;

import org.axistack.model.Rounding;
import org.axistack.model.Units;
import org.axistack.plan.LensPlan;
import org.axistack.tune.FocusRanking;
import org.axistack.tune.FocusSensitivity;
import org.axistack.tune.TuneResult;

/**
 * The supply-stability budget of the plan's focusing biases ({@link FocusSensitivity} from the tuning package): how
 * far the image moves per volt of each bias and per relative change of the beam energy; in absolute terms the volts
 * of noise and drift every electrode (grounded ones too: ground offsets, ripple on the return) may carry alone, and
 * beside it the relative stability (ppm) of each biased supply alone, of all supplies together and of the beam
 * energy that keeps the focus within +/- the depth. As an HTML section and as the rows of supply_budget.csv.
 * Sensitivities and tolerances are shown to two significant digits (a linearisation; the CSV keeps full digits).
 */
final class BudgetSection {

    /** Columns of supply_budget.csv. */
    static final List<String> CSV_HEADER = List.of("tuned_bias_V", "quantity", "name", "bias_V",
            "image_shift_mm_per_V", "tolerance_V", "image_shift_mm_per_unit_relative_change", "stability_ppm", "depth_mm");

    private BudgetSection() {
    }

    static void html(StringBuilder b, LensPlan plan) {
        if (plan.tune().isEmpty() || !plan.tune().get().found()) {
            return;
        }
        b.append("<h2>Supply-stability budget</h2>\n");
        if (plan.budgets().isEmpty()) {
            b.append("<p class=\"warn\">").append(Html.esc(plan.budgetNote())).append("</p>\n");
            return;
        }
        TuneResult t = plan.tune().get();
        List<List<String>> rows = new ArrayList<>();
        int d = Rounding.SENSITIVITY_DIGITS;
        for (int i = 0; i < plan.budgets().size(); i++) {
            FocusSensitivity s = plan.budgets().get(i);
            String mirror = FocusRanking.nearMirror(t.solutions().get(i)) ? "!!" : "";
            String tuned = mirror + HtmlReport.num(t.solutions().get(i).bias_V())
                    + (mirror.isEmpty() ? "" : " (near a mirror)");
            double[] bias = s.biases_V();
            double[] shift = s.imageShift_m_per_V();
            double[] volts = s.tolerance_V();
            double[] alone = s.stabilityPerSupply();
            for (int e = 0; e < bias.length; e++) {
                rows.add(List.of(tuned, "electrode " + s.electrodes().get(e) + (bias[e] == 0 ? " (grounded)" : ""),
                        HtmlReport.num(bias[e]), Rounding.sig(Units.mToMm(shift[e]), d), "+/- " + Rounding.volts(volts[e]),
                        bias[e] == 0 ? "-" : Rounding.sig(relative(bias[e], shift[e]), d),
                        bias[e] == 0 ? "- (0 V: see volts)" : ppm(alone[e])));
            }
            rows.add(List.of(tuned, "all biased supplies together", "", "", "", "", ppm(s.stabilityAllSupplies())));
            rows.add(List.of(tuned, "beam energy (T dZ/dT per unit dT/T)", "", "", "",
                    Rounding.sig(Units.mToMm(s.imageShiftPerRelativeEnergy_m()), d), ppm(s.stabilityEnergy())));
        }
        double depth = plan.budgets().get(0).depth_m();
        String within = "+/- " + Html.trim(Units.mToMm(depth)) + " mm";
        b.append(Html.table(List.of("focusing bias of " + t.electrode() + " (V)", "source of drift", "bias (V)",
                "image shift per volt dZ/dV (mm/V)", "noise and drift allowed, absolute (for " + within + ")",
                "image shift per unit relative change V dZ/dV (mm)", "relative stability (ppm, for " + within + ")"),
                rows));
        b.append("<p class=\"note\">").append(Html.esc(plan.budgetNote())).append(". Absolute: the volts of noise, "
                + "ripple or drift on that electrode alone (for a grounded electrode: ground offsets and ripple on its "
                + "return) that move the image by the depth; relative: the same as a fraction of the bias, which a "
                + "grounded electrode does not have. Shifts and tolerances to two significant digits (linearised). "
                + "Table: supply_budget.csv.</p>\n");
    }

    /** Rows of supply_budget.csv (empty without budgets). */
    static List<List<Object>> csvRows(LensPlan plan) {
        List<List<Object>> rows = new ArrayList<>();
        if (plan.tune().isEmpty()) {
            return rows;
        }
        TuneResult t = plan.tune().get();
        for (int i = 0; i < plan.budgets().size(); i++) {
            FocusSensitivity s = plan.budgets().get(i);
            double tuned = t.solutions().get(i).bias_V();
            double depth = Units.mToMm(s.depth_m());
            double[] bias = s.biases_V();
            double[] shift = s.imageShift_m_per_V();
            double[] alone = s.stabilityPerSupply();
            double[] volts = s.tolerance_V();
            for (int e = 0; e < bias.length; e++) {
                rows.add(List.of(tuned, "electrode", s.electrodes().get(e), bias[e], Units.mToMm(shift[e]),
                        csvNumber(volts[e]), relative(bias[e], shift[e]), csvPpm(alone[e]), depth));
            }
            rows.add(List.of(tuned, "all_supplies", "", "", "", "", "", csvPpm(s.stabilityAllSupplies()), depth));
            rows.add(List.of(tuned, "beam_energy", "", "", "", "", Units.mToMm(s.imageShiftPerRelativeEnergy_m()),
                    csvPpm(s.stabilityEnergy()), depth));
        }
        return rows;
    }

    /** V dZ/dV in mm (0 for a grounded supply, never -0). */
    private static double relative(double bias_V, double shift_m_per_V) {
        return bias_V == 0 ? 0 : Units.mToMm(bias_V * shift_m_per_V);
    }

    private static String ppm(double relative) {
        return Double.isFinite(relative) ? Rounding.sig(relative * 1e6, Rounding.SENSITIVITY_DIGITS) : "-";
    }

    private static Object csvPpm(double relative) {
        return csvNumber(relative * 1e6);
    }

    /** A number, or a blank cell when there is none (the CSV convention for missing values). */
    private static Object csvNumber(double x) {
        return Double.isFinite(x) ? (Object) x : "";
    }
}
