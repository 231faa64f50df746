package org.axistack.tune;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import org.axistack.model.FacingGaps;
import org.axistack.model.GapRule;
import org.axistack.model.Stack;

/**
 * The plan's one assessment of the gaps between facing electrodes, shared by the text, the report, the CSV table
 * and the warnings: per facing pair with a voltage across it, the gap ({@link FacingGaps}), the voltage, the
 * average field, and the voltage against the stack's gap rule ({@link GapRule}: a wide gap holds less field
 * than a narrow one; common practice, no single source). Pairs at the same bias are left out.
 */
public final class GapMargins {

    /**
     * One facing pair.
     *
     * @param first     name of the first electrode
     * @param second    name of the second electrode
     * @param gap       the gap and where its ends sit
     * @param voltage_V |bias difference|, V
     * @param comfort_V the rule's comfort voltage for this gap, V
     * @param aggressive_V the rule's aggressive voltage for this gap, V
     * @param check     the verdict
     */
    public record Row(String first, String second, FacingGaps.Gap gap, double voltage_V, double comfort_V,
            double aggressive_V, SurfaceFieldCheck check) {

        /** The average field across the gap, V/m. */
        public double averageField_V_per_m() {
            return voltage_V / gap.gap_m();
        }

        /** The voltage as a percentage of the comfort voltage. */
        public double percentOfComfort() {
            return 100 * voltage_V / comfort_V;
        }

        /** "focus - outlet". */
        public String pair() {
            return first + " - " + second;
        }
    }

    private GapMargins() {
    }

    /** The last geometry assessed and its gaps (the text, report, table and warnings of one plan share them). */
    private static List<org.axistack.model.Electrode> lastGeometry = List.of();
    private static List<FacingGaps.Gap> lastGaps = List.of();

    /** The gaps of the stack's geometry (bias-independent; the last geometry's gaps are kept and reused). */
    public static List<FacingGaps.Gap> gaps(Stack stack) {
        List<org.axistack.model.Electrode> geometry = stack.electrodes().stream().map(e -> e.withBias_V(0)).toList();
        synchronized (GapMargins.class) {
            if (geometry.equals(lastGeometry)) {
                return lastGaps;
            }
        }
        List<FacingGaps.Gap> g = List.copyOf(FacingGaps.of(stack.electrodes()));
        synchronized (GapMargins.class) {
            lastGeometry = geometry;
            lastGaps = g;
        }
        return g;
    }

    /** The assessment at the stack's biases. */
    public static List<Row> of(Stack stack) {
        return of(stack, gaps(stack));
    }

    /** The assessment at the stack's biases on gaps computed before for the same geometry. */
    public static List<Row> of(Stack stack, List<FacingGaps.Gap> gaps) {
        GapRule rule = stack.limits().gapRule();
        List<Row> rows = new ArrayList<>();
        for (FacingGaps.Gap g : gaps) {
            double v = Math.abs(stack.electrodes().get(g.first()).bias_V() - stack.electrodes().get(g.second()).bias_V());
            if (v == 0) {
                continue;
            }
            double c = rule.comfort_V(g.gap_m()), a = rule.aggressive_V(g.gap_m());
            SurfaceFieldCheck check = v > a ? SurfaceFieldCheck.ABOVE_AGGRESSIVE
                    : v > c ? SurfaceFieldCheck.ABOVE_COMFORT : SurfaceFieldCheck.WITHIN;
            rows.add(new Row(stack.electrodes().get(g.first()).name(), stack.electrodes().get(g.second()).name(), g, v,
                    c, a, check));
        }
        return rows;
    }

    /** The rule in words: "comfort 5000 V x (g / 1 mm)^0.5, aggressive 10000 V x (g / 1 mm)^0.5". */
    public static String ruleWords(GapRule r) {
        return String.format(Locale.ROOT, "comfort %s V x (gap / 1 mm)^%s, aggressive %s V x (gap / 1 mm)^%s",
                SurfaceFields.num(r.comfortAt1mm_V()), SurfaceFields.num(r.exponent()),
                SurfaceFields.num(r.aggressiveAt1mm_V()), SurfaceFields.num(r.exponent()));
    }

    /** The warning for a row above a limit, or null. */
    public static String warning(Row r) {
        if (!r.check().warning()) {
            return null;
        }
        boolean agg = r.check() == SurfaceFieldCheck.ABOVE_AGGRESSIVE;
        return String.format(Locale.ROOT, "gap %s: %s V across %s mm (at z = %s, r = %s mm) is above the %s voltage of the "
                + "gap rule (%s V for this gap): widen the gap, lower the voltage across it or put an electrode at an "
                + "intermediate bias between them", r.pair(), SurfaceFields.num(r.voltage_V()),
                SurfaceFields.num(r.gap().gap_m() * 1e3), SurfaceFields.num(0.5e3 * (r.gap().from().z_m() + r.gap().to().z_m())),
                SurfaceFields.num(0.5e3 * (r.gap().from().r_m() + r.gap().to().r_m())), agg ? "aggressive" : "comfort",
                SurfaceFields.num(agg ? r.aggressive_V() : r.comfort_V()));
    }
}
