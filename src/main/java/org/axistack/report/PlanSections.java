package org.axistack.report;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import org.axistack.model.Numbers;
import org.axistack.field.FieldSolution;
import org.axistack.model.Rounding;
import org.axistack.model.Units;
import org.axistack.model.Stack;
import org.axistack.optics.Aberrations;
import org.axistack.optics.CardinalElements;
import org.axistack.optics.Imaging;
import org.axistack.optics.SpotSizeBudget;
import org.axistack.plan.LensPlan;
import org.axistack.tune.FocusRanking;
import org.axistack.tune.FocusSensitivity;
import org.axistack.tune.FocusSolution;
import org.axistack.tune.GapMargins;
import org.axistack.tune.SurfaceFields;
import org.axistack.tune.TuneResult;

/** The report's table sections (optics, spot budget, tuning, surface fields, capacitance, method). */
final class PlanSections {
    private PlanSections() {
    }

    static void optics(StringBuilder b, LensPlan plan) {
        b.append("<h2>Cardinal elements</h2>\n");
        if (plan.reflection().isPresent()) {
            b.append("<p class=\"warn\">").append(Html.esc(plan.reflection().get())).append("</p>\n");
            return;
        }
        if (plan.cardinal().isEmpty()) {
            b.append("<p class=\"warn\">").append(Html.esc(plan.optics())).append("</p>\n");
            return;
        }
        CardinalElements c = plan.cardinal().get();
        List<List<String>> rows = new ArrayList<>();
        rows.add(List.of("focal length f1, f2 (mm)", HtmlReport.mm(c.focalLengthObject_m()), HtmlReport.mm(c.focalLengthImage_m())));
        rows.add(List.of("focal point F1, F2 (z, mm)", HtmlReport.mm(c.focalPointObjectZ_m()), HtmlReport.mm(c.focalPointImageZ_m())));
        rows.add(List.of("principal plane H1, H2 (z, mm)", HtmlReport.mm(c.principalPlaneObjectZ_m()),
                HtmlReport.mm(c.principalPlaneImageZ_m())));
        rows.add(List.of("real axis crossing (z, mm)", c.realFocusObjectZ_m().isPresent()
                ? HtmlReport.mm(c.realFocusObjectZ_m().getAsDouble()) : "-", c.realFocusImageZ_m().isPresent()
                ? HtmlReport.mm(c.realFocusImageZ_m().getAsDouble()) : "-"));
        rows.add(List.of("acceleration potential U (V)", Html.g(c.uObject_V()), Html.g(c.uImage_V())));
        b.append("<p>Lens ").append(c.kind().name().toLowerCase(Locale.ROOT)).append(" (asymptotic cardinal elements "
                + "in the stack's z coordinates; focal lengths positive when converging).</p>\n");
        b.append(Html.table(List.of("", "object side", "image side"), rows));
        if (plan.imaging().isPresent()) {
            Imaging im = plan.imaging().get();
            b.append(Html.table(List.of("object z (mm)", "real image z (mm)", "magnification there",
                    "asymptotic image z (mm)", "lateral magnification", "angular magnification"),
                    List.of(List.of(HtmlReport.mm(im.objectZ_m()),
                            im.realImageZ_m().isPresent() ? HtmlReport.mm(im.realImageZ_m().getAsDouble()) : "-",
                            Html.g(im.realLateralMagnification()), HtmlReport.mm(im.imageZ_m()),
                            Html.g(im.lateralMagnification()), Html.g(im.angularMagnification())))));
            b.append("<p class=\"note\">The real image is where the object's axial ray, traced in the full field, crosses"
                    + " the axis; the asymptotic image is where its straight asymptote does.</p>\n");
        } else {
            b.append("<p class=\"note\">Object at infinity (parallel beam): the image is the focal point F2.</p>\n");
        }
        b.append("<h2>Aberrations</h2>\n");
        if (plan.aberrations().isEmpty()) {
            b.append("<p class=\"note\">Undefined for an afocal lens.</p>\n");
            return;
        }
        Aberrations a = plan.aberrations().get();
        List<List<String>> ab = new ArrayList<>();
        ab.add(List.of("spherical Cs (mm)", HtmlReport.mm(a.sphericalImage_m()),
                a.sphericalObject_m().isPresent() ? HtmlReport.mm(a.sphericalObject_m().getAsDouble()) : "-"));
        ab.add(List.of("chromatic Cc (mm)", HtmlReport.mm(a.chromaticImage_m()),
                a.chromaticObject_m().isPresent() ? HtmlReport.mm(a.chromaticObject_m().getAsDouble()) : "-"));
        b.append(Html.table(List.of("", "image side (object at infinity)", "object side (finite object)"), ab));
        b.append("<p class=\"note\">Convention: ").append(Html.esc(a.convention()))
                .append(". Quadrature change at the last refinement ").append(Numbers.estimate(a.quadratureChange())).append(".")
                .append("</p>\n");
    }

    static void spot(StringBuilder b, LensPlan plan) {
        if (plan.spotInputs().isEmpty()) {
            return;
        }
        SpotSizeBudget.Inputs in = plan.spotInputs().get();
        b.append("<h2>Spot-size budget</h2>\n");
        List<List<String>> rows = new ArrayList<>();
        for (SpotSizeBudget.Row r : plan.spotRows()) {
            rows.add(List.of(Html.trim(Units.radToMrad(r.alpha_rad())), um(r.spherical_m()), um(r.chromatic_m()),
                    um(r.total_m())));
        }
        b.append(Html.table(List.of("half-angle alpha (mrad)", "spherical disc Cs a^3/2 (um)",
                "chromatic disc Cc a dT/T (um)", "total, in quadrature (um)"), rows));
        b.append(String.format(Locale.ROOT, "<p class=\"note\">Diameters at the image focus, image-side coefficients, "
                + "full relative energy spread dT/T = %.3g (set with --energy-spread); the source image is not included "
                + "(a point source); contributions added in quadrature, an approximation (common practice). Diffraction "
                + "is not included.</p>%n", in.energySpread()));
    }

    /** A disc diameter in um to three significant digits: an estimate (discs added in quadrature). */
    private static String um(double m) {
        return Rounding.sig(m * 1e6, 3);
    }

    static void tuning(StringBuilder b, LensPlan plan) {
        b.append("<h2>Focusing bias</h2>\n<p class=\"note\">").append(Html.esc(plan.tuneNote())).append("</p>\n");
        if (plan.tune().isEmpty()) {
            return;
        }
        TuneResult t = plan.tune().get();
        if (!t.found()) {
            b.append("<p class=\"warn\">No bias in the searched range focuses on the screen");
            t.nearest().ifPresent(n -> b.append(String.format(Locale.ROOT, "; closest: %s V puts the image at %s mm",
                    HtmlReport.num(n.bias_V()), HtmlReport.mm(n.imageZ_m()))));
            b.append(".</p>\n");
            return;
        }
        List<List<String>> rows = new ArrayList<>();
        boolean budgets = plan.budgets().size() == t.solutions().size();
        for (int i = 0; i < t.solutions().size(); i++) {
            FocusSolution f = t.solutions().get(i);
            boolean mirror = FocusRanking.nearMirror(f);
            String shift = "-";
            String hold = "-";
            if (budgets) {
                FocusSensitivity s = plan.budgets().get(i);
                shift = Rounding.sig(Math.abs(Units.mToMm(FocusRanking.tunedShift_m_per_V(f, s))), Rounding.SENSITIVITY_DIGITS);
                hold = "+/- " + Rounding.volts(FocusRanking.tunedTolerance_V(f, s));
            }
            rows.add(List.of(String.valueOf(i + 1), HtmlReport.num(f.bias_V()), f.mode().name().toLowerCase(Locale.ROOT),
                    HtmlReport.mm(f.imageZ_m()), Html.g(f.magnification()),
                    HtmlReport.field(f.maxSurfaceField_V_per_m(), f.surfaceFieldCheck()), f.worstElectrode(),
                    (mirror ? "!!" : "") + f.axisCrossings() + (mirror ? " (near a mirror)" : " (direct)"),
                    (mirror ? "!!" : "") + shift, (mirror ? "!!" : "") + hold));
        }
        String depth = plan.budgets().isEmpty() ? "the depth" : Html.trim(Units.mToMm(plan.budgets().get(0).depth_m()))
                + " mm";
        b.append(Html.table(List.of("rank", "bias (V)", "mode", "image z (mm)", "magnification", "max surface field (V/mm)",
                "on electrode", "crossovers before the image", "image shift per volt of " + t.electrode() + " (mm/V)",
                t.electrode() + " must hold within (focus +/- " + depth + ")"), rows));
        b.append("<p class=\"note\">Most useful first: direct images before near-mirror ones (the beam crosses over "
                + "inside the lens, the image moves far per volt), then the least touchy. Dark red: near a mirror, "
                + "usable only with the supply stability shown.</p>\n");
    }

    static void surfaceFields(StringBuilder b, LensPlan plan) {
        Stack s = plan.stack();
        double[] q = plan.field().charges_C();
        List<List<String>> rows = new ArrayList<>();
        List<SurfaceFields.Row> assessed = SurfaceFields.of(s, plan.field());
        for (int i = 0; i < assessed.size(); i++) {
            SurfaceFields.Row r = assessed.get(i);
            double max = r.peak().field_V_per_m();
            rows.add(List.of(r.name(), HtmlReport.num(s.electrodes().get(i).bias_V()),
                    r.peak().sharp() ? r.describe() : HtmlReport.field(max, r.check()),
                    r.peak().sharp() ? "-" : Html.g(max / s.limits().comfort_V_per_m() * 100),
                    r.verdict() + r.convergence().map(c -> "; " + c).orElse(""), Html.g(r.peak().z_m() * 1e3),
                    Html.g(r.peak().r_m() * 1e3), Html.g(q[i] * 1e12)));
        }
        b.append("<h2>Electrode surface fields</h2>\n");
        b.append(Html.table(List.of("electrode", "bias (V)", "largest surface field (V/mm)", "% of comfort limit",
                "against the limits", "at z (mm)", "at r (mm)", "charge (pC)"), rows));
        b.append(String.format(Locale.ROOT, "<p class=\"note\">Surface field sigma/eps0 from the solved charge density, "
                + "largest over each electrode (between the collocation nodes by the element's polynomial on solid "
                + "electrodes; sheets: per face at the nodes). Limits from the stack: comfort %s V/mm, "
                + "aggressive %s V/mm (common practice for polished electrodes in good vacuum, no single source; large "
                + "gaps hold less per mm). On rounded edges (edge_radius_mm) the value converges as the mesh is refined "
                + "(with [mesh] accuracy the value on the next coarser mesh and the change are shown); "
                + "at a sharp corner the field has no finite limit and the table says so instead of giving a number.</p>%n",
                HtmlReport.num(Units.vPerMToVPerMm(s.limits().comfort_V_per_m())),
                HtmlReport.num(Units.vPerMToVPerMm(s.limits().aggressive_V_per_m()))));
    }

    static void gaps(StringBuilder b, LensPlan plan) {
        Stack s = plan.stack();
        List<List<String>> rows = new ArrayList<>();
        for (GapMargins.Row r : GapMargins.of(s)) {
            rows.add(List.of(r.pair(), Html.trim(r.gap().gap_m() * 1e3), HtmlReport.num(r.voltage_V()),
                    Html.trim(r.averageField_V_per_m() * 1e-3), HtmlReport.num(Math.rint(r.comfort_V())),
                    HtmlReport.num(Math.rint(r.aggressive_V())), HtmlReport.mark(r.check()) + Html.trim(r.percentOfComfort()),
                    r.check().words(),
                    Html.trim(0.5e3 * (r.gap().from().z_m() + r.gap().to().z_m())),
                    Html.trim(0.5e3 * (r.gap().from().r_m() + r.gap().to().r_m()))));
        }
        b.append("<h2>Gaps between facing electrodes</h2>\n");
        if (rows.isEmpty()) {
            b.append("<p>No facing electrodes have a voltage between them.</p>\n");
        } else {
            b.append(Html.table(List.of("electrodes", "gap (mm)", "voltage across (V)", "average field (V/mm)",
                    "comfort voltage (V)", "aggressive voltage (V)", "% of comfort voltage", "against the gap rule",
                    "middle of the gap z (mm)", "r (mm)"), rows));
        }
        b.append(String.format(Locale.ROOT, "<p class=\"note\">Gap: the shortest straight line between two electrodes "
                + "that no third electrode blocks (pairs shielded by another electrode and pairs at the same bias are left "
                + "out). A wide vacuum gap holds less field than a narrow one; the gap rule of the stack (%s; common "
                + "practice, no single source; set in [limits]) gives the voltage each gap may carry. Below about 1 mm the "
                + "surface-field limits above are the ones that bind.</p>%n", Html.esc(GapMargins.ruleWords(s.limits().gapRule()))));
    }

    static void capacitance(StringBuilder b, LensPlan plan) {
        double[][] c = plan.solution().capacitanceMatrix_F();
        List<String> head = new ArrayList<>();
        head.add("charge on \\ per volt on");
        for (var e : plan.stack().electrodes()) {
            head.add(e.name());
        }
        List<List<String>> rows = new ArrayList<>();
        for (int i = 0; i < c.length; i++) {
            List<String> r = new ArrayList<>();
            r.add(plan.stack().electrodes().get(i).name());
            for (double x : c[i]) {
                r.add(Html.g(x * 1e12));
            }
            rows.add(r);
        }
        b.append("<h2>Capacitance matrix (pF)</h2>\n").append(Html.table(head, rows))
                .append("<p class=\"note\">Maxwell capacitance coefficients of the electrodes in open space (potential 0 V "
                        + "at infinity), from the unit-bias solutions.</p>\n");
    }

    static void method(StringBuilder b, LensPlan plan) {
        FieldSolution sol = plan.solution();
        List<List<String>> rows = new ArrayList<>();
        rows.add(List.of("field", String.format(Locale.ROOT, "boundary elements (surface-charge method), %d unknowns, "
                + "graded toward edges (%d levels); collocation residual %s; solve %s s; %s", sol.unknowns(),
                plan.stack().mesh().edgeLevels(), Html.sci(sol.residual()), Numbers.seconds(sol.solveSeconds()),
                sol.meshErrorStatement()),
                "verification: thin disk, sphere and two-tube cases below"));
        rows.add(List.of("axial potential", "piecewise Chebyshev expansion of the exact element sums (V, V', V'' ...)",
                "largest relative error against the exact sums: " + Html.sci(plan.field().axialExpansionError())));
        rows.add(List.of("paraxial optics", plan.optics(), "Helmholtz-Lagrange and uniform-field cases below"));
        rows.add(List.of("aberrations", "third-order aberration integrals over the paraxial rays",
                plan.aberrations().map(a -> "quadrature change " + Html.sci(a.quadratureChange())).orElse("-")));
        rows.add(List.of("rays", plan.rayNote(), "energy conservation per ray in the trace command"));
        rows.add(List.of("envelope", "round-beam envelope equation with emittance and space charge", "beam-spread case below"));
        b.append("<h2>Method and stated accuracy</h2>\n").append(Html.table(List.of("step", "method", "accuracy"), rows));
    }
}
