package org.axistack.report;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import org.axistack.io.Units;
import org.axistack.tune.FocusSensitivity;
import org.axistack.tune.TuneResult;

/**
 * The supply-stability budget of the plan's focusing biases ({@link FocusSensitivity} from the tuning package): how
 * far the image moves per volt of each bias and per relative change of the beam energy, and the relative stability
 * (ppm) of each supply alone, of all supplies together and of the beam energy that keeps the focus within +/- the
 * depth. As an HTML section and as the rows of supply_budget.csv.
 */
final class BudgetSection {

    /** Columns of supply_budget.csv. */
    static final List<String> CSV_HEADER = List.of("tuned_bias_V", "quantity", "name", "bias_V",
            "image_shift_mm_per_V", "image_shift_mm_per_unit_relative_change", "stability_ppm", "depth_mm");

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
        for (int i = 0; i < plan.budgets().size(); i++) {
            FocusSensitivity s = plan.budgets().get(i);
            String tuned = Html.g(t.solutions().get(i).bias_V());
            double[] bias = s.biases_V();
            double[] shift = s.imageShift_m_per_V();
            double[] alone = s.stabilityPerSupply();
            for (int e = 0; e < bias.length; e++) {
                rows.add(List.of(tuned, "supply " + s.electrodes().get(e), HtmlReport.num(bias[e]),
                        Html.g(Units.mToMm(shift[e])), Html.trim(relative(bias[e], shift[e])), ppm(alone[e])));
            }
            rows.add(List.of(tuned, "all biased supplies together", "", "", "", ppm(s.stabilityAllSupplies())));
            rows.add(List.of(tuned, "beam energy (T dZ/dT per unit dT/T)", "", "",
                    Html.g(Units.mToMm(s.imageShiftPerRelativeEnergy_m())), ppm(s.stabilityEnergy())));
        }
        double depth = plan.budgets().get(0).depth_m();
        b.append(Html.table(List.of("focusing bias of " + t.electrode() + " (V)", "source of drift", "bias (V)",
                "image shift per volt dZ/dV (mm/V)", "image shift per unit relative change V dZ/dV (mm)",
                "stability for +/- " + Html.trim(Units.mToMm(depth)) + " mm (ppm)"), rows));
        b.append("<p class=\"note\">").append(Html.esc(plan.budgetNote())).append(". A supply at 0 V has no relative "
                + "drift (any stability). Table: supply_budget.csv.</p>\n");
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
            for (int e = 0; e < bias.length; e++) {
                rows.add(List.of(tuned, "supply", s.electrodes().get(e), bias[e], Units.mToMm(shift[e]),
                        relative(bias[e], shift[e]), csvPpm(alone[e]), depth));
            }
            rows.add(List.of(tuned, "all_supplies", "", "", "", "", csvPpm(s.stabilityAllSupplies()), depth));
            rows.add(List.of(tuned, "beam_energy", "", "", "", Units.mToMm(s.imageShiftPerRelativeEnergy_m()),
                    csvPpm(s.stabilityEnergy()), depth));
        }
        return rows;
    }

    /** V dZ/dV in mm (0 for a grounded supply, never -0). */
    private static double relative(double bias_V, double shift_m_per_V) {
        return bias_V == 0 ? 0 : Units.mToMm(bias_V * shift_m_per_V);
    }

    private static String ppm(double relative) {
        return Double.isFinite(relative) ? String.format(Locale.ROOT, "%.3g", relative * 1e6) : "any";
    }

    private static Object csvPpm(double relative) {
        return Double.isFinite(relative) ? (Object) (relative * 1e6) : "";
    }
}
