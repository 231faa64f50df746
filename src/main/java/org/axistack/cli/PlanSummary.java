package org.axistack.cli;

import java.io.PrintWriter;
import java.util.List;
import java.util.Locale;

import org.axistack.model.Numbers;
import org.axistack.model.Units;
import org.axistack.model.Stack;
import org.axistack.optics.Aberrations;
import org.axistack.plan.PlanFormat;
import org.axistack.tune.GapMargins;
import org.axistack.tune.SurfaceFields;
import org.axistack.optics.CardinalElements;
import org.axistack.optics.Imaging;
import org.axistack.optics.SpotSizeBudget;
import org.axistack.plan.LensPlan;
import org.axistack.tune.FocusRanking;
import org.axistack.tune.FocusSolution;
import org.axistack.tune.TuneResult;
import org.axistack.verify.CheckResult;

/** The plan's console summary after the stack summary: optics, spot budget, tuning, surface fields, warnings. */
final class PlanSummary {
    private PlanSummary() {
    }

    static void print(PrintWriter w, LensPlan p) {
        w.println();
        w.println(String.format(Locale.ROOT, "Field: %d unknowns, collocation residual %s, axial expansion error %s",
                p.solution().unknowns(), Numbers.estimate(p.solution().residual()),
                Numbers.estimate(p.field().axialExpansionError())));
        w.println("  " + p.solution().meshErrorStatement());
        if (p.reflection().isPresent()) {
            w.println("REFLECTED: " + p.reflection().get());
        }
        p.cardinal().ifPresent(c -> cardinal(w, c, p));
        p.imaging().ifPresent(im -> imaging(w, im));
        p.aberrations().ifPresent(a -> aberrations(w, a));
        p.offAxis().ifPresent(o -> OffAxisOutput.print(w, OffAxisOutput.map(o.coefficients(),
                o.objectHeight_m().isPresent() ? o.objectHeight_m().getAsDouble() * 1e3 : null,
                o.aperture_rad().isPresent() ? o.aperture_rad().getAsDouble() * 1e3 : null)));
        spot(w, p);
        tuning(w, p);
        if (!p.sweep().isEmpty() && p.sweepElectrode().isPresent()) {
            w.println("Focus-bias sweep: optics at " + p.sweep().size() + " biases of " + p.sweepElectrode().get() + " from "
                    + g(p.sweep().get(0).bias_V()) + " to " + g(p.sweep().get(p.sweep().size() - 1).bias_V())
                    + " V, " + p.sweep().stream().filter(x -> x.ok()).count() + " usable (sweep.png, sweep.csv)");
        }
        p.probe().ifPresent(study -> probe(w, study));
        p.misalignment().ifPresent(study -> misalignment(w, study));
        surfaceFields(w, p);
        gaps(w, p);
        if (!p.checks().isEmpty()) {
            long passed = p.checks().stream().filter(CheckResult::passed).count();
            w.println("Verification: " + passed + " of " + p.checks().size() + " closed-form cases within tolerance"
                    + " (table in the report; 'check' prints it)");
        }
        w.println(p.warnings().isEmpty() ? "Warnings: none" : "Warnings:");
        for (String s : p.warnings()) {
            w.println("  ! " + s);
        }
    }

    private static void cardinal(PrintWriter w, CardinalElements c, LensPlan p) {
        w.println("Cardinal elements (lens " + c.kind().name().toLowerCase(Locale.ROOT) + "; mm, stack z coordinates):");
        w.println("                          object side    image side");
        row(w, "focal length f1, f2", c.focalLengthObject_m(), c.focalLengthImage_m());
        row(w, "focal point F1, F2", c.focalPointObjectZ_m(), c.focalPointImageZ_m());
        row(w, "principal plane H1, H2", c.principalPlaneObjectZ_m(), c.principalPlaneImageZ_m());
        row(w, "real axis crossing", c.realFocusObjectZ_m().orElse(Double.NaN), c.realFocusImageZ_m().orElse(Double.NaN));
        w.println("  " + p.optics());
    }

    private static void row(PrintWriter w, String label, double a, double b) {
        w.println(String.format(Locale.ROOT, "  %-22s %13s %13s", label, g(Units.mToMm(a)), g(Units.mToMm(b))));
    }

    private static void imaging(PrintWriter w, Imaging im) {
        w.println(String.format(Locale.ROOT, "Image of the object at z = %s mm: real image at z = %s mm (traced in the full"
                + " field), magnification %s; asymptotic image z = %s mm, lateral magnification %s",
                g(Units.mToMm(im.objectZ_m())), g(Units.mToMm(im.realImageZ_m().orElse(Double.NaN))),
                g(im.realLateralMagnification()), g(Units.mToMm(im.imageZ_m())), g(im.lateralMagnification())));
    }

    private static void aberrations(PrintWriter w, Aberrations a) {
        w.println(String.format(Locale.ROOT, "Aberrations: Cs = %s mm, Cc = %s mm (image side, object at infinity)",
                g(Units.mToMm(a.sphericalImage_m())), g(Units.mToMm(a.chromaticImage_m()))));
        if (a.objectZ_m().isPresent()) {
            w.println(String.format(Locale.ROOT, "  object side: Cs_o = %s mm, Cc_o = %s mm",
                    g(Units.mToMm(a.sphericalObject_m().getAsDouble())), g(Units.mToMm(a.chromaticObject_m().getAsDouble()))));
        }
        w.println("  convention: " + a.convention());
    }

    private static void spot(PrintWriter w, LensPlan p) {
        if (p.spotInputs().isEmpty()) {
            return;
        }
        w.println(String.format(Locale.ROOT, "Spot-size budget at the focus (diameters, um; dT/T = %.3g, point source):",
                p.spotInputs().get().energySpread()));
        w.println("  alpha_mrad   spherical   chromatic       total");
        for (SpotSizeBudget.Row r : p.spotRows()) {
            w.println(String.format(Locale.ROOT, "  %10s %11s %11s %11s", g(Units.radToMrad(r.alpha_rad())),
                    g(r.spherical_m() * 1e6), g(r.chromatic_m() * 1e6), g(r.total_m() * 1e6)));
        }
    }

    private static void tuning(PrintWriter w, LensPlan p) {
        w.println("Focusing bias: " + p.tuneNote());
        if (p.tune().isEmpty()) {
            return;
        }
        TuneResult t = p.tune().get();
        for (FocusSolution f : t.solutions()) {
            w.println(String.format(Locale.ROOT, "  %s = %s V (%s): image at %s mm, magnification %s, max surface field "
                    + "%s V/mm on %s%s", f.electrode(), g(f.bias_V()), f.mode().name().toLowerCase(Locale.ROOT),
                    g(Units.mToMm(f.imageZ_m())), f.magnification() == 0 || !Double.isFinite(f.magnification()) ? "- (object at infinity)" : g(f.magnification()), g(Units.vPerMToVPerMm(f.maxSurfaceField_V_per_m())),
                    f.worstElectrode(), (f.surfaceFieldCheck().warning() ? " (" + f.surfaceFieldCheck().words() + ")" : "")
                            + (FocusRanking.nearMirror(f) ? "; NEAR A MIRROR (" + f.axisCrossings()
                                    + " crossover(s) inside the lens)" : "")));
        }
        if (!p.budgets().isEmpty()) {
            TuneReport.budget(w, t.solutions(), p.budgets(),
                    p.budgets().get(0).depth_m());
        } else if (t.found()) {
            w.println("  Supply-stability budget: " + p.budgetNote());
        }
        if (!t.found()) {
            w.println("  none in range" + t.nearest().map(n -> String.format(Locale.ROOT,
                    "; closest: %s V puts the image at %s mm", g(n.bias_V()), g(Units.mToMm(n.imageZ_m())))).orElse(""));
        }
    }

    private static void surfaceFields(PrintWriter w, LensPlan p) {
        Stack s = p.stack();
        w.println(String.format(Locale.ROOT, "Surface fields (limits: comfort %s V/mm, aggressive %s V/mm):",
                g(Units.vPerMToVPerMm(s.limits().comfort_V_per_m())), g(Units.vPerMToVPerMm(s.limits().aggressive_V_per_m()))));
        for (SurfaceFields.Row r : SurfaceFields.of(s, p.field())) {
            if (r.peak().sharp()) {
                w.println(String.format(Locale.ROOT, "  %-14s %s", r.name(), r.describe()));
            } else {
                w.println(String.format(Locale.ROOT, "  %-14s %12s V/mm  %5.1f%% of comfort  %s  (at z = %s, r = %s mm)",
                        r.name(), g(Units.vPerMToVPerMm(r.peak().field_V_per_m())),
                        100 * r.peak().field_V_per_m() / s.limits().comfort_V_per_m(), r.verdict(),
                        PlanFormat.num(Units.mToMm(r.peak().z_m())), PlanFormat.num(Units.mToMm(r.peak().r_m()))));
                r.convergence().ifPresent(c -> w.println("  " + " ".repeat(14) + " " + c));
            }
        }
    }

    private static void gaps(PrintWriter w, LensPlan p) {
        Stack s = p.stack();
        List<GapMargins.Row> rows = GapMargins.of(s);
        w.println("Gaps between facing electrodes (gap rule: " + GapMargins.ruleWords(s.limits().gapRule())
                + "; common practice, no single source):");
        if (rows.isEmpty()) {
            w.println("  no facing electrodes with a voltage between them");
        }
        for (GapMargins.Row r : rows) {
            w.println(String.format(Locale.ROOT, "  %-24s gap %s mm, %s V across (%s V/mm average), %5.1f%% of the "
                    + "comfort voltage %s V: %s  (at z = %s, r = %s mm)", r.pair(), PlanFormat.num(r.gap().gap_m() * 1e3),
                    PlanFormat.num(r.voltage_V()), PlanFormat.num(Units.vPerMToVPerMm(r.averageField_V_per_m())),
                    r.percentOfComfort(), PlanFormat.num(Math.rint(r.comfort_V())), r.check().words(),
                    PlanFormat.num(0.5e3 * (r.gap().from().z_m() + r.gap().to().z_m())),
                    PlanFormat.num(0.5e3 * (r.gap().from().r_m() + r.gap().to().r_m()))));
        }
    }

    /** Six significant digits, trailing zeros cut ("5000", "-1200", "44.9812"); "-" for a missing value. */
    private static String g(double x) {
        return Double.isFinite(x) ? org.axistack.model.Numbers.trimZeros(org.axistack.model.Numbers.general(x,
                org.axistack.model.Numbers.MESSAGE_DIGITS)) : "-";
    }

    /** The decentre and tilt budget in two lines: the tightest electrode and every tolerance. */
    private static void misalignment(PrintWriter w, org.axistack.optics.MisalignmentStudy study) {
        org.axistack.optics.MisalignmentBudget m = study.budget();
        org.axistack.optics.MisalignmentBudget.Row d = m.rows().get(m.tightestDecentre());
        org.axistack.optics.MisalignmentBudget.Row t = m.rows().get(m.tightestTilt());
        w.println("Decentre and tilt budget (spot within " + g(m.allowed_m() * 1e3) + " mm at the screen"
                + (m.hasGrowth() ? ", growth within " + g(m.allowedGrowth_m() * 1e3) + " mm" : "")
                + "; errors in quadrature): tightest decentre " + d.name() + " " + g(d.decentreTolerance_m() * 1e3)
                + " mm, tightest tilt " + t.name() + " " + g(t.tiltTolerance_rad() * 1e3) + " mrad (misalignment.csv)");
        StringBuilder sb = new StringBuilder("  tolerances (mm / mrad):");
        for (org.axistack.optics.MisalignmentBudget.Row r : m.rows()) {
            sb.append(' ').append(r.name()).append(' ').append(g(r.decentreTolerance_m() * 1e3)).append(" / ")
                    .append(g(r.tiltTolerance_rad() * 1e3)).append(';');
        }
        sb.setLength(sb.length() - 1);
        w.println(sb);
    }

    /** One line per probe curve: the probe at the smallest and the largest current, and what dominates. */
    private static void probe(PrintWriter w, org.axistack.probe.ProbeStudy study) {
        for (org.axistack.probe.ProbeStudy.Curve c : study.curves()) {
            if (c.points().isEmpty()) {
                w.println("Probe (" + c.workingPoint().label() + "): no current in the range passes the aperture angles");
                continue;
            }
            org.axistack.probe.ProbePoint a = c.points().get(0);
            org.axistack.probe.ProbePoint z = c.points().get(c.points().size() - 1);
            boolean pinned = !c.model().fixedMagnification() && c.points().stream().anyMatch(q -> !q.interior());
            w.println(String.format(Locale.ROOT, "Probe (%s): FW50 %s nm at %s A, %s nm at %s A; %s%s (probe.png, probe.csv)",
                    c.workingPoint().label(), g(a.fw50_m() * 1e9), g(a.current_A()), g(z.fw50_m() * 1e9), g(z.current_A()),
                    c.dominanceInWords(), pinned ? "; the best aperture angle lies at the end of the range for some currents"
                            : ""));
            if (c.offAxis().isPresent()) {
                w.println("  " + c.offAxisInWords());
            }
        }
        for (String n : study.notes()) {
            w.println("Probe note: " + n);
        }
    }
}
