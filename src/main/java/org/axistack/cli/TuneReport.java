package org.axistack.cli;

import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

import org.axistack.model.Units;
import org.axistack.model.Stack;
import org.axistack.model.Rounding;
import org.axistack.report.SafetyNotice;
import org.axistack.tune.BiasRange;
import org.axistack.tune.FocusRanking;
import org.axistack.tune.FocusSensitivity;
import org.axistack.tune.FocusSolution;
import org.axistack.tune.FocusTarget;
import org.axistack.tune.PairTuner;
import org.axistack.tune.SecondCondition;
import org.axistack.tune.SurfaceFieldCheck;
import org.axistack.tune.TuneResult;


/** Text and JSON output of the {@code tune} command (keys of interface.md, plus more). */
final class TuneReport {

    private final String shownAs;
    private final Stack stack;
    private final FocusTarget target;
    private final double depth_m;
    private final boolean defaultRange;

    TuneReport(String shownAs, Stack stack, FocusTarget target, double depth_m, boolean defaultRange) {
        this.shownAs = shownAs;
        this.stack = stack;
        this.target = target;
        this.depth_m = depth_m;
        this.defaultRange = defaultRange;
    }

    void single(PrintWriter w, TuneResult r, List<FocusSensitivity> budgets, double seconds, boolean json) {
        Map<String, Object> out = header(seconds, r.evaluations());
        out.put("electrode", r.electrode());
        rangeKeys(out, "", r.range());
        out.put("reflecting_from_V", finite(r.reflectingFrom_V()));
        out.put("reflecting_to_V", finite(r.reflectingTo_V()));
        List<Map<String, Object>> sols = new ArrayList<>();
        for (int i = 0; i < r.solutions().size(); i++) {
            sols.add(solution(r.solutions().get(i), budgets.get(i)));
        }
        out.put("solutions", sols);
        out.put("nearest", r.nearest().map(n -> {
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("bias_V", n.bias_V());
            m.put("image_z_mm", mm(n.imageZ_m()));
            m.put("miss_mm", mm(n.missZ_m()));
            return m;
        }).orElse(null));
        out.put("warnings", warnings(r.solutions()));
        if (json) {
            printJson(w, out);
            return;
        }
        w.println("Bias tuning of electrode '" + r.electrode() + "' in " + shownAs);
        intro(w, r.range(), "", seconds, r.evaluations());
        if (!Double.isNaN(r.reflectingFrom_V())) {
            w.printf(Locale.ROOT, "  the beam turns back (a mirror) for biases between %s and %s V (scan points)%n",
                    PlanCommand.num(r.reflectingFrom_V()), PlanCommand.num(r.reflectingTo_V()));
        }
        if (r.solutions().isEmpty()) {
            w.println("  NO SOLUTION in the range.");
            r.nearest().ifPresent(n -> w.printf(Locale.ROOT, "  nearest approach: bias %.3f V puts the image at z = %.4f mm"
                    + " (%+.4f mm from the plane)%n", n.bias_V(), Units.mToMm(n.imageZ_m()), Units.mToMm(n.missZ_m())));
        } else {
            table(w, r.solutions(), budgets);
        }
        footer(w, out);
    }

    void pair(PrintWriter w, PairTuner.PairResult r, List<FocusSensitivity> budgets, double seconds, boolean json) {
        Map<String, Object> out = header(seconds, r.evaluations());
        out.put("electrode", r.first());
        out.put("second_electrode", r.second());
        rangeKeys(out, "", r.firstRange());
        rangeKeys(out, "second_", r.secondRange());
        boolean mag = r.condition() instanceof SecondCondition.Magnification;
        out.put("condition", mag ? "magnification" : "focal_length_image");
        out.put(mag ? "target_magnification" : "target_focal_length_image_mm",
                mag ? r.condition().value() : Units.mToMm(r.condition().value()));
        List<Map<String, Object>> sols = new ArrayList<>();
        for (int i = 0; i < r.solutions().size(); i++) {
            PairTuner.PairSolution s = r.solutions().get(i);
            Map<String, Object> m = solution(s.focus(), budgets.get(i));
            m.put("second_bias_V", s.secondBias_V());
            m.put("residual", s.residual());
            sols.add(m);
        }
        out.put("solutions", sols);
        out.put("nearest", r.nearest().map(n -> {
            Map<String, Object> m = solution(n.focus(), null);
            m.put("second_bias_V", n.secondBias_V());
            m.put(mag ? "achieved_magnification" : "achieved_focal_length_image_mm",
                    mag ? n.achieved() : Units.mToMm(n.achieved()));
            m.put("residual", n.residual());
            return m;
        }).orElse(null));
        out.put("warnings", warnings(r.solutions().stream().map(PairTuner.PairSolution::focus).toList()));
        if (json) {
            printJson(w, out);
            return;
        }
        w.println("Two-condition tuning of '" + r.first() + "' and '" + r.second() + "' in " + shownAs);
        intro(w, r.firstRange(), "'" + r.first() + "' ", seconds, r.evaluations());
        w.printf(Locale.ROOT, "  and '%s' within %s .. %s V; second condition: %s%n", r.second(),
                PlanCommand.num(r.secondRange().from_V()), PlanCommand.num(r.secondRange().to_V()),
                mag ? "lateral magnification " + PlanCommand.num(r.condition().value())
                        : "image-side focal length " + PlanCommand.num(Units.mToMm(r.condition().value())) + " mm");
        if (r.solutions().isEmpty()) {
            w.println("  NO SOLUTION in the ranges.");
            r.nearest().ifPresent(n -> w.printf(Locale.ROOT, "  nearest approach: %s = %.3f V, %s = %.3f V: image at z = %.4f mm,"
                    + " %s %.5g (residual %.3g)%n", r.first(), n.firstBias_V(), r.second(), n.secondBias_V(),
                    Units.mToMm(n.focus().imageZ_m()), mag ? "magnification" : "focal length (mm)",
                    mag ? n.achieved() : Units.mToMm(n.achieved()), n.residual()));
        } else {
            for (PairTuner.PairSolution s : r.solutions()) {
                w.printf(Locale.ROOT, "  %s = %.4f V, %s = %.4f V: image z = %.4f mm, magnification %s, f2 = %.4f mm%n",
                        r.first(), s.firstBias_V(), r.second(), s.secondBias_V(), Units.mToMm(s.focus().imageZ_m()),
                        Double.isNaN(s.focus().magnification()) ? "-" : String.format(Locale.ROOT, "%.5f", s.focus().magnification()),
                        Units.mToMm(s.focus().cardinal().focalLengthImage_m()));
            }
            w.println();
            table(w, r.solutions().stream().map(PairTuner.PairSolution::focus).toList(), budgets);
        }
        footer(w, out);
    }

    private Map<String, Object> header(double seconds, int evaluations) {
        Map<String, Object> out = new LinkedHashMap<>();
        out.put("stack", shownAs);
        out.put("particle", stack.beam().particle().label());
        out.put("kinetic_energy_eV", stack.beam().energy_eV());
        out.put("object_z_mm", target.objectAtInfinity() ? null : Units.mToMm(target.objectZ_m().getAsDouble()));
        out.put("image_z_mm", Units.mToMm(target.imageZ_m()));
        out.put("depth_mm", Units.mToMm(depth_m));
        out.put("comfort_surface_field_V_per_mm", Units.vPerMToVPerMm(stack.limits().comfort_V_per_m()));
        out.put("aggressive_surface_field_V_per_mm", Units.vPerMToVPerMm(stack.limits().aggressive_V_per_m()));
        out.put("optics_evaluations", evaluations);
        out.put("tune_seconds", seconds);
        return out;
    }

    private void rangeKeys(Map<String, Object> out, String prefix, BiasRange range) {
        out.put(prefix + "range_from_V", range.from_V());
        out.put(prefix + "range_to_V", range.to_V());
        out.put(prefix + "range_rule", defaultRange ? rule() : "set by the user");
    }

    private static String rule() {
        return String.format(Locale.ROOT, "+/- %s x the beam energy per charge, at most +/- %s V, at least +/- %s V",
                PlanCommand.num(BiasRange.ENERGY_MULTIPLE), PlanCommand.num(BiasRange.CAP_V), PlanCommand.num(BiasRange.FLOOR_V));
    }

    private Map<String, Object> solution(FocusSolution s, FocusSensitivity b) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("bias_V", s.bias_V());
        m.put("image_z_mm", Units.mToMm(s.imageZ_m()));
        m.put("magnification", finite(s.magnification()));
        m.put("max_surface_field_V_per_mm", Units.vPerMToVPerMm(s.maxSurfaceField_V_per_m()));
        m.put("max_surface_field_electrode", s.worstElectrode());
        m.put("surface_field_check", s.surfaceFieldCheck().name().toLowerCase(Locale.ROOT));
        m.put("mode", s.mode().name().toLowerCase(Locale.ROOT));
        m.put("axis_crossings_before_image", s.axisCrossings());
        m.put("near_mirror", FocusRanking.nearMirror(s));
        m.put("focal_length_image_mm", mm(s.cardinal().focalLengthImage_m()));
        m.put("focal_point_image_z_mm", mm(s.cardinal().focalPointImageZ_m()));
        m.put("optics_error_estimate", s.cardinal().errorEstimate());
        m.put("field_ends", org.axistack.optics.OpticsAccuracy.ends(s.cardinal()));
        Map<String, Double> biases = new LinkedHashMap<>();
        for (int i = 0; i < stack.electrodes().size(); i++) {
            biases.put(stack.electrodes().get(i).name(), s.biases_V()[i]);
        }
        m.put("biases_V", biases);
        if (b != null) {
            Map<String, Double> shift = new LinkedHashMap<>();
            Map<String, Double> volts = new LinkedHashMap<>();
            Map<String, Double> ppm = new LinkedHashMap<>();
            for (int i = 0; i < b.electrodes().size(); i++) {
                shift.put(b.electrodes().get(i), Units.mToMm(b.imageShift_m_per_V()[i]));
                volts.put(b.electrodes().get(i), finite(b.tolerance_V()[i]));
                ppm.put(b.electrodes().get(i), finite(b.stabilityPerSupply()[i] * 1e6));
            }
            m.put("image_shift_mm_per_V", shift);
            m.put("noise_drift_tolerance_V", volts);
            m.put("image_shift_mm_per_relative_energy", Units.mToMm(b.imageShiftPerRelativeEnergy_m()));
            m.put("supply_stability_ppm", ppm);
            m.put("supply_stability_all_ppm", finite(b.stabilityAllSupplies() * 1e6));
            m.put("energy_stability_ppm", finite(b.stabilityEnergy() * 1e6));
        }
        return m;
    }

    private List<String> warnings(List<FocusSolution> sols) {
        List<String> w = new ArrayList<>();
        for (FocusSolution s : sols) {
            if (s.surfaceFieldCheck() != SurfaceFieldCheck.WITHIN) {
                w.add(String.format(Locale.ROOT, "bias %.3f V: surface field %.0f V/mm on '%s' is above the %s limit (%.0f V/mm)",
                        s.bias_V(), Units.vPerMToVPerMm(s.maxSurfaceField_V_per_m()), s.worstElectrode(),
                        s.surfaceFieldCheck() == SurfaceFieldCheck.ABOVE_AGGRESSIVE ? "aggressive" : "comfort",
                        Units.vPerMToVPerMm(s.surfaceFieldCheck() == SurfaceFieldCheck.ABOVE_AGGRESSIVE
                                ? stack.limits().aggressive_V_per_m() : stack.limits().comfort_V_per_m())));
            }
            org.axistack.optics.OpticsAccuracy.shortfall(s.cardinal(), org.axistack.optics.OpticsAccuracy.DEFAULT_REQUESTED)
                    .map(t -> String.format(Locale.ROOT, "bias %.3f V: %s", s.bias_V(), t)).ifPresent(w::add);
            org.axistack.optics.OpticsAccuracy.closeTheLens(s.cardinal())
                    .filter(t -> w.stream().noneMatch(x -> x.endsWith(t))).map(t -> "at the focus: " + t).ifPresent(w::add);
            if (s.axisCrossings() > 0) {
                w.add(String.format(Locale.ROOT, "bias %.3f V: the beam crosses the axis %d time(s) inside the lens before"
                        + " the image (a very strong lens, near a mirror): extremely sensitive to the supply", s.bias_V(),
                        s.axisCrossings()));
            }
        }
        return w;
    }

    private void intro(PrintWriter w, BiasRange range, String who, double seconds, int evaluations) {
        w.printf(Locale.ROOT, "  %s, %s eV where the potential is 0 V; %s; image plane z = %s mm%n",
                stack.beam().particle().label(), PlanCommand.num(stack.beam().energy_eV()),
                target.objectAtInfinity() ? "object at infinity (parallel beam)"
                        : "object at z = " + PlanCommand.num(Units.mToMm(target.objectZ_m().getAsDouble())) + " mm",
                PlanCommand.num(Units.mToMm(target.imageZ_m())));
        w.printf(Locale.ROOT, "  searched %s%s .. %s V (%s); %d optics runs, %.3f s after the field solve%n", who,
                PlanCommand.num(range.from_V()), PlanCommand.num(range.to_V()), defaultRange ? "default: " + rule()
                        : "set by the user", evaluations, seconds);
    }

    private void table(PrintWriter w, List<FocusSolution> sols, List<FocusSensitivity> budgets) {
        w.println("  Most useful first: direct images before near-mirror ones (crossings > 0), then the least touchy.");
        w.printf(Locale.ROOT, "  %12s  %-12s  %10s  %10s  %10s  %9s  %10s  %-10s %s%n", "bias_V", "mode", "image_z_mm",
                "magnif.", "f2_mm", "crossings", "E_max_V/mm", "on", "check");
        for (FocusSolution s : sols) {
            w.printf(Locale.ROOT, "  %12.4f  %-12s  %10.4f  %10s  %10.4f  %9d  %10.0f  %-10s %s%n", s.bias_V(),
                    s.mode().name().toLowerCase(Locale.ROOT), Units.mToMm(s.imageZ_m()),
                    Double.isNaN(s.magnification()) ? "-" : String.format(Locale.ROOT, "%.5f", s.magnification()),
                    Units.mToMm(s.cardinal().focalLengthImage_m()), s.axisCrossings(),
                    Units.vPerMToVPerMm(s.maxSurfaceField_V_per_m()), s.worstElectrode(),
                    s.surfaceFieldCheck().words());
        }
        w.println();
        budget(w, sols, budgets, depth_m);
    }

    /**
     * The supply-stability budget lines: for each solution (bias of the tuned electrode), every electrode (grounded
     * ones too) with the image shift per volt, the volts of noise and drift it may carry alone, and for a biased
     * electrode the relative (ppm) stability; then all supplies together and the beam energy. Two significant
     * digits (a linearisation).
     */
    static void budget(PrintWriter w, List<FocusSolution> tuned, List<FocusSensitivity> budgets, double depth_m) {
        w.printf(Locale.ROOT, "  Supply-stability budget (focus held within +/- %s mm; linearised, first-variation equations):%n",
                PlanCommand.num(Units.mToMm(depth_m)));
        int d = Rounding.SENSITIVITY_DIGITS;
        for (int i = 0; i < tuned.size(); i++) {
            FocusSensitivity b = budgets.get(i);
            FocusSolution f = tuned.get(i);
            w.printf(Locale.ROOT, "  %s = %s V%s:%n", f.electrode(), PlanCommand.num(f.bias_V()),
                    FocusRanking.nearMirror(f) ? " (NEAR A MIRROR)" : "");
            double[] volts = b.tolerance_V();
            for (int e = 0; e < b.electrodes().size(); e++) {
                double bias = b.biases_V()[e];
                w.printf(Locale.ROOT, "    %-12s %8s V  %9s mm/V  noise/drift +/- %-10s  %s%n", b.electrodes().get(e),
                        PlanCommand.num(bias), Rounding.sig(Units.mToMm(b.imageShift_m_per_V()[e]), d),
                        Rounding.volts(volts[e]), bias == 0 ? "grounded: no relative figure, the volts count"
                                : "or " + ppm(b.stabilityPerSupply()[e]) + " ppm of the bias");
            }
            w.printf(Locale.ROOT, "    all biased supplies together %s ppm; beam energy %s mm per unit dT/T (%s ppm)%n",
                    ppm(b.stabilityAllSupplies()), Rounding.sig(Units.mToMm(b.imageShiftPerRelativeEnergy_m()), d),
                    ppm(b.stabilityEnergy()));
        }
        w.println("  (volts: noise, ripple or drift on that electrode alone, a ground offset for a grounded one; ppm: the"
                + " same as a fraction of the bias; 'all together' assumes that fraction for every biased supply,"
                + " drifting independently, added in quadrature)");
    }

    private static String ppm(double relative) {
        return Double.isFinite(relative) ? Rounding.sig(relative * 1e6, Rounding.SENSITIVITY_DIGITS) : "-";
    }

    @SuppressWarnings("unchecked")
    private void footer(PrintWriter w, Map<String, Object> out) {
        List<String> warnings = (List<String>) out.get("warnings");
        if (!warnings.isEmpty()) {
            w.println();
            for (String s : warnings) {
                w.println("  WARNING: " + s);
            }
        }
        w.println("  Surface fields are computed on the boundary-element mesh; sharp electrode corners concentrate the"
                + " field and their values grow as the mesh is refined: round the edges on real parts.");
        w.println();
        w.println(SafetyNotice.text());
    }

    private static void printJson(PrintWriter w, Map<String, Object> out) {
        w.println(JsonOption.text(out));
    }

    private static Double mm(double m) {
        return finite(Units.mToMm(m));
    }

    private static Double finite(double x) {
        return Double.isFinite(x) ? x : null;
    }
}
