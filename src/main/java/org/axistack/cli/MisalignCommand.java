package org.axistack.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;

import org.axistack.field.BemSolver;
import org.axistack.field.FieldSolution;
import org.axistack.io.AlignmentTableCsv;
import org.axistack.io.AtomicFiles;
import org.axistack.io.StackInputException;
import org.axistack.model.Units;
import org.axistack.model.Stack;
import org.axistack.optics.MisalignmentBudget;
import org.axistack.optics.MisalignmentStudy;
import org.axistack.optics.MonitorAlignment;
import org.axistack.optics.ReflectionException;
import org.axistack.optics.StartPlaneException;
import org.axistack.plan.PlanAnalysis;
import org.axistack.report.SafetyNotice;


import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/**
 * {@code misalign [STACK] [--allowed-shift MM] [--allowed-growth MM] [--aperture-mrad MRAD] [--focus NAME] [--screen-z Z] [--csv FILE] [--json]}: how far the
 * spot moves at the screen per 0.01 mm decentre and per mrad tilt of each electrode, how it walks when the focus
 * bias changes, and the machining tolerance budget (first-order harmonic-1 responses, misalignment.md).
 */
@Command(name = "misalign", mixinStandardHelpOptions = true,
        header = "Electrode decentre and tilt sensitivity and the tolerance budget.",
        description = {"For every electrode: the displacement and slope of the central ray at the screen per 0.01 mm"
            + " decentre and per mrad tilt, the spot walk per volt of the focus bias, and the decentre and tilt"
            + " tolerances that keep the spot within the allowed displacement (errors independent, added in"
            + " quadrature).",
            "First-order (linear) responses of the solved field from one harmonic-1 factorisation; lengths in mm in"
            + " the stack's z coordinates."})
final class MisalignCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Mixin
    StackInput input;

    @Option(names = "--allowed-shift", paramLabel = "MM",
            description = "Allowed spot displacement at the screen, mm (default 0.05).")
    double allowed_mm = Units.mToMm(MisalignmentStudy.DEFAULT_ALLOWED_SHIFT_M);

    @Option(names = "--focus", paramLabel = "NAME",
            description = "Electrode whose bias focuses, for the spot walk (default: the most strongly biased one).")
    String focus;

    @Option(names = "--screen-z", paramLabel = "Z",
            description = "Screen plane in mm (default: the stack's [screen], else the image-side reference plane).")
    Double screen_mm;

    @Option(names = "--allowed-growth", paramLabel = "MM",
            description = "Allowed spot growth (length of the axial-coma figure at the beam's image), mm (default 0.01).")
    double allowedGrowth_mm = Units.mToMm(MisalignmentStudy.DEFAULT_ALLOWED_GROWTH_M);

    @Option(names = "--aperture-mrad", paramLabel = "MRAD",
            description = "Image-side half-angle of the beam for the spot growth, mrad (default: the beam filling half"
                    + " the narrowest open bore).")
    Double aperture_mrad;

    @Option(names = "--csv", paramLabel = "FILE", description = "Write the bench alignment table to this CSV file.")
    Path csv;

    @Mixin
    JsonOption json;

    @Mixin
    QuietOption quiet;

    @Override
    public Integer call() throws StackInputException, IOException {
        CommandLine cl = spec.commandLine();
        Stack stack = input.loadOrDemo();
        if (!(allowed_mm > 0) || !Double.isFinite(allowed_mm)) {
            throw new CommandLine.ParameterException(cl, "--allowed-shift must be a positive number of mm, got "
                    + allowed_mm);
        }
        if (!(allowedGrowth_mm > 0) || !Double.isFinite(allowedGrowth_mm)) {
            throw new CommandLine.ParameterException(cl, "--allowed-growth must be a positive number of mm, got "
                    + allowedGrowth_mm);
        }
        if (aperture_mrad != null && !(aperture_mrad > 0 && Double.isFinite(aperture_mrad))) {
            throw new CommandLine.ParameterException(cl, "--aperture-mrad must be a positive angle in mrad, got "
                    + aperture_mrad);
        }
        if (screen_mm != null && !Double.isFinite(screen_mm)) {
            throw new CommandLine.ParameterException(cl, "--screen-z must be a number of mm");
        }
        String focusName = focus != null ? focus : PlanAnalysis.strongest(stack);
        if (focus != null && stack.indexOf(focus) < 0) {
            throw new CommandLine.ParameterException(cl, "--focus " + focus + ": no such electrode in " + input.shownAs()
                    + "; choose one of " + String.join(", ", stack.names()));
        }
        OutputCheck.file(cl, "--csv", csv);
        PrintWriter err = cl.getErr();
        boolean silent = quiet.on();
        FieldSolution sol = BemSolver.solve(stack.electrodes(), stack.mesh(), SolveReporter.to(err, silent));
        MisalignmentStudy study;
        double screen;
        String screenFrom;
        try {
            // the screen default needs the optics' image-side plane: a first pass finds it only when no plane is given
            if (screen_mm != null) {
                screen = Units.mmToM(screen_mm);
                screenFrom = "--screen-z";
            } else if (stack.screenZ_m().isPresent()) {
                screen = stack.screenZ_m().getAsDouble();
                screenFrom = "[screen] of the stack";
            } else {
                screen = org.axistack.optics.ParaxialOptics.of(sol.withBiases(stack.biases_V()), stack).zEnd_m();
                screenFrom = "image-side reference plane (no [screen] in the stack)";
            }
            study = MisalignmentStudy.run(stack, sol, focusName, screen, Units.mmToM(allowed_mm),
                    aperture_mrad == null ? Double.NaN : aperture_mrad * 1e-3, Units.mmToM(allowedGrowth_mm),
                    SolveReporter.to(err, silent));
        } catch (StartPlaneException e) {
            throw new CommandLine.ParameterException(cl, input.shownAs() + ": [beam] start_z_mm = "
                    + PlanCommand.num(Units.mToMm(e.startZ_m())) + " mm cannot be used: rays must start before the lens"
                    + " exit plane; set start_z_mm in the field-free entrance region or remove it");
        } catch (ReflectionException e) {
            throw new OutcomeException(e.getMessage() + "; lower the retarding bias or raise the beam energy");
        }
        MisalignmentBudget b = study.budget();
        MonitorAlignment bench = MonitorAlignment.of(stack, sol, study);
        if (csv != null) {
            AtomicFiles.writeString(csv, AlignmentTableCsv.text(b, bench));
        }
        PrintWriter out = cl.getOut();
        if (json.on()) {
            json(out, study, screenFrom, bench);
        } else {
            text(out, stack, study, screenFrom, bench);
        }
        out.flush();
        return 0;
    }

    private void json(PrintWriter out, MisalignmentStudy study, String screenFrom, MonitorAlignment bench) {
        MisalignmentBudget b = study.budget();
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("stack", input.shownAs());
        m.put("screen_z_mm", Units.mToMm(b.screenZ_m()));
        m.put("screen_from", screenFrom);
        m.put("allowed_shift_mm", Units.mToMm(b.allowed_m()));
        m.put("focus_electrode", b.focusElectrode() >= 0 ? b.rows().get(b.focusElectrode()).name() : null);
        m.put("assumption", MisalignmentBudget.assumption());
        m.put("tightest_decentre_electrode", b.rows().get(b.tightestDecentre()).name());
        m.put("tightest_tilt_electrode", b.rows().get(b.tightestTilt()).name());
        m.put("spot_growth", growthJson(study));
        List<Map<String, Object>> rows = new ArrayList<>();
        for (Object[] r : AlignmentTableCsv.rows(b)) {
            Map<String, Object> row = new LinkedHashMap<>();
            for (int i = 0; i < AlignmentTableCsv.HEADER.size(); i++) {
                row.put(AlignmentTableCsv.HEADER.get(i), r[i]);
            }
            rows.add(row);
        }
        m.put("rows", rows);
        List<Map<String, Object>> mon = new ArrayList<>();
        for (int i = 0; i < bench.monitorNames().size(); i++) {
            Map<String, Object> x = new LinkedHashMap<>();
            x.put("monitor", bench.monitorNames().get(i));
            x.put("z_mm", Units.mToMm(bench.monitorZ_m()[i]));
            List<Map<String, Object>> per = new ArrayList<>();
            for (int k = 0; k < b.rows().size(); k++) {
                Map<String, Object> r = new LinkedHashMap<>();
                r.put("electrode", b.rows().get(k).name());
                r.put("shift_um_per_0_01_mm_decentre", bench.shift()[k][0][i] * 1e-5 * 1e6);
                r.put("shift_um_per_mrad_tilt", bench.shift()[k][1][i] * 1e-3 * 1e6);
                per.add(r);
            }
            x.put("rows", per);
            mon.add(x);
        }
        m.put("monitors", mon);
        Map<String, Object> aligned = new LinkedHashMap<>();
        aligned.put("start_z_mm", Units.mToMm(bench.startZ_m()));
        aligned.put("note", ALIGNED_NOTE);
        List<Map<String, Object>> planes = new ArrayList<>();
        for (int p = 0; p < bench.aligned().length; p++) {
            Map<String, Object> x = new LinkedHashMap<>();
            x.put("plane", p == 0 ? "screen" : bench.monitorNames().get(p - 1));
            x.put("z_mm", Units.mToMm(p == 0 ? b.screenZ_m() : bench.monitorZ_m()[p - 1]));
            x.put("x_mm", Units.mToMm(bench.aligned()[p][0]));
            x.put("y_mm", Units.mToMm(bench.aligned()[p][1]));
            x.put("slope_x_mrad", bench.aligned()[p][2] * 1e3);
            x.put("slope_y_mrad", bench.aligned()[p][3] * 1e3);
            planes.add(x);
        }
        aligned.put("planes", planes);
        m.put("aligned_central_ray", aligned);
        List<Map<String, Object>> cancel = new ArrayList<>();
        for (int s = 0; s < bench.steerers().size(); s++) {
            Map<String, Object> x = new LinkedHashMap<>();
            x.put("steerer", bench.steerers().get(s));
            List<Map<String, Object>> per = new ArrayList<>();
            for (int k = 0; k < b.rows().size(); k++) {
                Map<String, Object> r = new LinkedHashMap<>();
                r.put("electrode", b.rows().get(k).name());
                r.put("x_bias_V_per_0_01_mm_decentre", finite(bench.cancelBias_V()[s][k][0] * 1e-5));
                r.put("x_bias_V_per_mrad_tilt", finite(bench.cancelBias_V()[s][k][1] * 1e-3));
                per.add(r);
            }
            x.put("rows", per);
            cancel.add(x);
        }
        m.put("cancelling_steerer_biases", cancel);
        m.put("factor_seconds", study.factorSeconds());
        m.put("response_seconds", study.responseSeconds());
        m.put("coma_seconds", study.comaSeconds());
        m.put("study_seconds", study.totalSeconds());
        out.println(JsonOption.text(m));
    }

    private static Map<String, Object> growthJson(MisalignmentStudy study) {
        MisalignmentBudget b = study.budget();
        Map<String, Object> g = new LinkedHashMap<>();
        g.put("computed", b.hasGrowth());
        g.put("note", study.comaNote());
        if (b.hasGrowth()) {
            g.put("image_z_mm", Units.mToMm(b.imageZ_m()));
            g.put("aperture_mrad", b.aperture_rad() * 1e3);
            g.put("allowed_growth_mm", Units.mToMm(b.allowedGrowth_m()));
            g.put("assumption", MisalignmentBudget.growthAssumption());
            g.put("convention", COMA_CONVENTION);
            List<Map<String, Object>> rows = new ArrayList<>();
            for (MisalignmentBudget.Row r : b.rows()) {
                Map<String, Object> x = new LinkedHashMap<>();
                x.put("electrode", r.name());
                x.put("decentre_coma_a_per_rad2", r.coma().decentreRound_m());
                x.put("decentre_coma_b_per_rad2", r.coma().decentreCircle_m());
                x.put("tilt_coma_a_m_per_rad3", r.coma().tiltRound_m());
                x.put("tilt_coma_b_m_per_rad3", r.coma().tiltCircle_m());
                x.put("growth_um_per_0_01_mm_decentre", r.coma().decentreGrowth() * 1e-5 * 1e6);
                x.put("growth_um_per_mrad_tilt", r.coma().tiltGrowth() * 1e-3 * 1e6);
                x.put("decentre_growth_tolerance_mm", finite(Units.mToMm(r.coma().decentreGrowthTolerance_m())));
                x.put("tilt_growth_tolerance_mrad", finite(r.coma().tiltGrowthTolerance_rad() * 1e3));
                x.put("decentre_limited_by", r.decentreLimitedByGrowth() ? "growth" : "shift");
                x.put("tilt_limited_by", r.tiltLimitedByGrowth() ? "growth" : "shift");
                rows.add(x);
            }
            g.put("rows", rows);
        }
        return g;
    }

    /** What the aligned central ray is, for JSON and text. */
    static final String ALIGNED_NOTE = "the central ray with every electrode aligned: the [beam] start offset and"
            + " slopes carried through the round lens and the stored steering (sector) biases, first order; each"
            + " misalignment's shift adds to it";

    /** The coma convention in words, for JSON and text. */
    static final String COMA_CONVENTION = "a ray of image-side aperture slope alpha (complex, x + i y) lands at"
            + " eps [A alpha conj(alpha) + B alpha^2] from the central ray, eps the misalignment along x (per metre of"
            + " decentre, per radian of tilt): a cone of half-angle beta draws circles of radius |B| eps beta^2 centred"
            + " at A eps beta^2; first order in the misalignment (no axial astigmatism at that order)";

    private static Double finite(double x) {
        return Double.isFinite(x) ? x : null;
    }

    private void text(PrintWriter w, Stack stack, MisalignmentStudy study, String screenFrom, MonitorAlignment bench) {
        MisalignmentBudget b = study.budget();
        w.println("Misalignment of " + stack.title() + " (" + input.shownAs() + ")");
        w.println("Screen: z = " + num(Units.mToMm(b.screenZ_m())) + " mm (" + screenFrom + "); allowed spot shift "
                + num(Units.mToMm(b.allowed_m())) + " mm");
        String focusName = b.focusElectrode() >= 0 ? b.rows().get(b.focusElectrode()).name() : null;
        w.println("Central ray: enters on the mechanical axis at z = " + num(Units.mToMm(study.optics().zStart_m()))
                + " mm; focus electrode for the walk: " + (focusName == null ? "none (every bias is 0 V)" : focusName));
        w.println();
        w.println(String.format(Locale.ROOT, "%-12s %14s %14s %14s %14s %16s %16s %12s %12s", "electrode",
                "shift um", "slope urad", "shift um", "slope urad", "walk um/V", "walk um/V", "decentre", "tilt"));
        w.println(String.format(Locale.ROOT, "%-12s %29s %29s %33s %25s", "",
                "per 0.01 mm decentre", "per mrad tilt", "(decentre, tilt)", "tolerance mm, mrad"));
        for (MisalignmentBudget.Row r : b.rows()) {
            w.println(String.format(Locale.ROOT, "%-12s %14s %14s %14s %14s %16s %16s %12s %12s", r.name(),
                    num(r.decentreShift() * 1e-5 * 1e6), num(r.decentreSlope() * 1e-5 * 1e6),
                    num(r.tiltShift() * 1e-3 * 1e6), num(r.tiltSlope() * 1e-3 * 1e6),
                    num(r.decentreWalk_per_V() * 1e-5 * 1e6), num(r.tiltWalk_per_V() * 1e-3 * 1e6),
                    num(Units.mToMm(r.decentreTolerance_m())), num(r.tiltTolerance_rad() * 1e3)));
        }
        w.println();
        w.println("Tightest: decentre of " + b.rows().get(b.tightestDecentre()).name() + " ("
                + num(Units.mToMm(b.rows().get(b.tightestDecentre()).decentreTolerance_m())) + " mm), tilt of "
                + b.rows().get(b.tightestTilt()).name() + " ("
                + num(b.rows().get(b.tightestTilt()).tiltTolerance_rad() * 1e3) + " mrad).");
        w.println("Tolerances alone (only that error present): "
                + String.join(", ", b.rows().stream().map(r -> r.name() + " " + num(Units.mToMm(r.decentreAlone_m()))
                        + " mm / " + num(r.tiltAlone_rad() * 1e3) + " mrad").toList()) + ".");
        w.println("Budget: " + MisalignmentBudget.assumption() + ".");
        growthText(w, study);
        w.println("Tilts turn about a transverse axis through the middle of each electrode's z extent. Walk: change of");
        w.println("the shift per volt of the focus bias (central difference over +-"
                + num(MisalignmentStudy.FOCUS_STEP_V) + " V): an electrode whose walk is large moves the spot as the");
        w.println("beam is refocused. Method and accuracy: misalignment.md (first order; neglected terms of relative");
        w.println("size misalignment / electrode scale). Harmonic-1 factorisation " + num(study.factorSeconds())
                + " s, responses " + num(study.responseSeconds()) + " s, coma " + num(study.comaSeconds()) + " s.");
        if (!bench.monitorNames().isEmpty()) {
            w.println();
            w.println("At the monitors: central-ray shift in um per 0.01 mm decentre / per mrad tilt of each electrode");
            for (int i = 0; i < bench.monitorNames().size(); i++) {
                StringBuilder sb = new StringBuilder(String.format(Locale.ROOT, "  %-12s z = %s mm:",
                        bench.monitorNames().get(i), num(Units.mToMm(bench.monitorZ_m()[i]))));
                for (int k = 0; k < b.rows().size(); k++) {
                    sb.append("  ").append(b.rows().get(k).name()).append(' ')
                            .append(num(bench.shift()[k][0][i] * 10)).append(" / ").append(num(bench.shift()[k][1][i] * 1e3));
                }
                w.println(sb);
            }
        }
        w.println();
        StringBuilder al = new StringBuilder("Aligned central ray from z = " + num(Units.mToMm(bench.startZ_m()))
                + " mm (x, y in mm):");
        for (int p = 0; p < bench.aligned().length; p++) {
            al.append("  ").append(p == 0 ? "screen" : bench.monitorNames().get(p - 1)).append(' ')
                    .append(num(Units.mToMm(bench.aligned()[p][0]))).append(", ")
                    .append(num(Units.mToMm(bench.aligned()[p][1])));
        }
        w.println(al);
        w.println("  (" + ALIGNED_NOTE + ")");
        for (int s = 0; s < bench.steerers().size(); s++) {
            if (s == 0) {
                w.println();
                w.println("Steering that cancels each misalignment at the screen (x bias in V per 0.01 mm decentre / per"
                        + " mrad tilt; the y bias alike for y; first order):");
            }
            StringBuilder sb = new StringBuilder("  " + bench.steerers().get(s) + ":");
            for (int k = 0; k < b.rows().size(); k++) {
                sb.append("  ").append(b.rows().get(k).name()).append(' ')
                        .append(num(bench.cancelBias_V()[s][k][0] * 1e-5)).append(" / ")
                        .append(num(bench.cancelBias_V()[s][k][1] * 1e-3));
            }
            w.println(sb);
        }
        if (csv != null) {
            w.println("CSV: " + csv);
        }
        w.println();
        w.println(SafetyNotice.text());
    }

    private static void growthText(PrintWriter w, MisalignmentStudy study) {
        MisalignmentBudget b = study.budget();
        w.println();
        if (!b.hasGrowth()) {
            w.println("Spot growth: " + study.comaNote() + ".");
            return;
        }
        w.println("Spot growth (axial coma at the beam's image z = " + num(Units.mToMm(b.imageZ_m())) + " mm, "
                + study.comaNote() + "; allowed growth " + num(Units.mToMm(b.allowedGrowth_m())) + " mm):");
        w.println(String.format(Locale.ROOT, "%-12s %14s %14s %14s %14s %12s %12s %10s %10s", "electrode", "A", "B",
                "growth um", "growth um", "decentre", "tilt", "decentre", "tilt"));
        w.println(String.format(Locale.ROOT, "%-12s %29s %29s %25s %21s", "", "um/mrad^2 per 0.01 mm",
                "0.01 mm, mrad", "growth tolerance mm, mrad", "limited by"));
        for (MisalignmentBudget.Row r : b.rows()) {
            MisalignmentBudget.Coma c = r.coma();
            w.println(String.format(Locale.ROOT, "%-12s %14s %14s %14s %14s %12s %12s %10s %10s", r.name(),
                    num(c.decentreRound_m() * 1e-5 * 1e-6 * 1e6), num(c.decentreCircle_m() * 1e-5 * 1e-6 * 1e6),
                    num(c.decentreGrowth() * 1e-5 * 1e6), num(c.tiltGrowth() * 1e-3 * 1e6),
                    num(Units.mToMm(c.decentreGrowthTolerance_m())), num(c.tiltGrowthTolerance_rad() * 1e3),
                    r.decentreLimitedByGrowth() ? "growth" : "shift", r.tiltLimitedByGrowth() ? "growth" : "shift"));
        }
        w.println("Coma: " + COMA_CONVENTION + ".");
        w.println("Growth budget: " + MisalignmentBudget.growthAssumption() + ".");
    }

    static String num(double x) {
        if (!Double.isFinite(x)) {
            return Double.isNaN(x) ? "-" : "unlimited";
        }
        return org.axistack.model.Numbers.general(x, org.axistack.model.Numbers.WINDOW_DIGITS);
    }
}
