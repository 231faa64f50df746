package org.axistack.cli;

import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;

import org.axistack.model.Numbers;
import org.axistack.size.Design;
import org.axistack.size.Infeasibility;
import org.axistack.size.Limit;
import org.axistack.size.MeshCheck;
import org.axistack.size.Objective;
import org.axistack.size.Reasons;
import org.axistack.size.Requirements;
import org.axistack.size.SizingResult;
import org.axistack.size.Tolerance;
import org.axistack.size.Tolerances;
import org.axistack.size.Violation;

/** The text of the {@code size} command: designs, the reasons the winner wins, tolerances, or what binds. */
final class SizeText {
    private SizeText() {
    }

    static String mm(double m) {
        return String.format(Locale.ROOT, "%.4g mm", m * 1e3);
    }

    static String value(Limit l, double si) {
        return switch (l) {
            case BIAS -> String.format(Locale.ROOT, "%.0f V", si);
            case SURFACE_FIELD -> String.format(Locale.ROOT, "%.0f V/mm", si / 1e3);
            case GAP -> Double.isInfinite(si) ? "no limit (no facing gap under voltage)" : String.format(Locale.ROOT, "%.0f V", si);
            default -> mm(si);
        };
    }

    static void design(PrintWriter w, Design d, int chargeSign) {
        w.printf(Locale.ROOT, "  %s, bias of %s %.1f V (%s)%n", d.family().description(),
                d.family().biasedElectrodes().get(0), d.bias_V(), d.decelerating(chargeSign) ? "decelerating" : "accelerating");
        StringBuilder dims = new StringBuilder("  dimensions:");
        for (Map.Entry<String, Double> e : d.dimensions_m().entrySet()) {
            dims.append(String.format(Locale.ROOT, " %s %.4g mm,", e.getKey(), e.getValue() * 1e3));
        }
        w.println(dims.substring(0, dims.length() - 1));
        w.printf(Locale.ROOT, "  real image z %.4f mm, focal length f2 %.4g mm%s (optics error estimate %s of f)%n",
                d.imageZ_m() * 1e3, d.focalLength_m() * 1e3,
                Double.isNaN(d.magnification()) ? "" : String.format(Locale.ROOT, ", magnification %.4g", d.magnification()),
                Numbers.estimate(d.opticsError()));
        for (String warning : d.planWarnings()) {
            w.printf(Locale.ROOT, "  WARNING (plan on the written stack says the same): %s%n", warning);
        }
        w.printf(Locale.ROOT, "  Cs %.4g mm, Cc %.4g mm, largest surface field %.0f V/mm (margin %.2f), length %.4g mm%n",
                d.spherical_m() * 1e3, d.chromatic_m() * 1e3, d.maxSurfaceField_V_per_m() / 1e3, d.fieldMargin(),
                d.length_m() * 1e3);
    }

    static void checks(PrintWriter w, Design d) {
        w.println("Requirements, re-checked on the fine mesh:");
        for (Violation v : d.checks()) {
            String verdict = v.broken() ? "NOT MET" : "met";
            if (v.limit() == Limit.PLACEMENT) {
                w.printf(Locale.ROOT, "  %-62s %s%n", v.limit().label(), verdict);
            } else {
                w.printf(Locale.ROOT, "  %-62s %s (%s %s %s)%n", v.limit().label(), verdict, value(v.limit(), v.value()),
                        v.limit() == Limit.BORE ? ">=" : "<=", value(v.limit(), v.allowed()));
            }
        }
    }

    /** Why the winner wins, in sentences. */
    static List<String> why(Requirements req, Design w, Reasons r) {
        Objective o = req.objective();
        List<String> s = new ArrayList<>();
        s.add(String.format(Locale.ROOT, "Objective: %s. Of %d focusing designs that meet every limit (from %d geometries),"
                + " this one scores best: %s.", o.description(), r.feasibleDesigns(), r.geometries(), score(o, w)));
        r.runnerUp().ifPresent(u -> s.add(String.format(Locale.ROOT,
                "The best design of any other geometry scores %s (%s).", score(o, u), ratio(o, w, u))));
        r.otherBranch().ifPresent(b -> s.add(String.format(Locale.ROOT,
                "The same geometry also focuses at %.0f V, where it scores %s: the %s branch wins here.", b.bias_V(),
                score(o, b), w.decelerating(req.beam().particle().chargeSign()) ? "decelerating" : "accelerating")));
        if (!r.upperBounds().isEmpty() || !r.lowerBounds().isEmpty()) {
            List<String> b = new ArrayList<>();
            r.upperBounds().forEach(n -> b.add(n + " at its upper bound"));
            r.lowerBounds().forEach(n -> b.add(n + " at its lower bound"));
            s.add("It sits against the search bounds (" + String.join(", ", b)
                    + "): widening them in the requirements may improve it further.");
        }
        for (Violation v : r.activeLimits()) {
            s.add(String.format(Locale.ROOT, "It is held back by the %s limit (%s of %s).", v.limit().label(),
                    value(v.limit(), v.value()), value(v.limit(), v.allowed())));
        }
        if (r.activeLimits().isEmpty() && r.upperBounds().isEmpty() && r.lowerBounds().isEmpty()) {
            s.add("No limit or bound is active: it is an interior optimum of the family within the search tolerance.");
        }
        return s;
    }

    private static String score(Objective o, Design d) {
        return switch (o) {
            case SPHERICAL -> String.format(Locale.ROOT, "Cs = %.4g mm", d.spherical_m() * 1e3);
            case CHROMATIC -> String.format(Locale.ROOT, "Cc = %.4g mm", d.chromatic_m() * 1e3);
            case BIAS -> String.format(Locale.ROOT, "|bias| = %.0f V", d.maxAbsBias_V());
            case FIELD_MARGIN -> String.format(Locale.ROOT, "largest surface field %.0f V/mm", d.maxSurfaceField_V_per_m() / 1e3);
            case LENGTH -> String.format(Locale.ROOT, "length %.4g mm", d.length_m() * 1e3);
        };
    }

    private static String ratio(Objective o, Design w, Design u) {
        double k = o.score(u) / o.score(w);
        return String.format(Locale.ROOT, "%.3g times the winner's", k);
    }

    static void tolerances(PrintWriter w, List<Tolerance> ts) {
        w.println("Machining and supply tolerances of the chosen design (image shift at fixed bias):");
        Tolerance worst = Tolerances.mostCritical(ts);
        for (Tolerance t : ts) {
            if (t.bias()) {
                w.printf(Locale.ROOT, "  %-22s %+.4g mm per V%n", t.name(), t.imageShift_m() * 1e3);
            } else {
                w.printf(Locale.ROOT, "  %-22s %+.4g mm per 0.01 mm%s%n", t.name(), t.imageShift_m() * 1e3,
                        t == worst ? "   <- matters most" : "");
            }
        }
    }

    /** The chosen design's decentre and tilt budget (misalign's defaults), or that it could not be computed. */
    static void misalignment(PrintWriter w, org.axistack.optics.MisalignmentStudy study) {
        if (study == null) {
            w.println("Decentre and tilt budget: not computed for this design (run 'misalign chosen.toml').");
            return;
        }
        org.axistack.optics.MisalignmentBudget m = study.budget();
        w.printf(Locale.ROOT, "Decentre and tilt budget of the chosen design (as 'misalign': spot within %.3g mm at the"
                + " image%s; errors in quadrature):%n", m.allowed_m() * 1e3,
                m.hasGrowth() ? String.format(Locale.ROOT, ", coma growth within %.3g mm", m.allowedGrowth_m() * 1e3) : "");
        for (org.axistack.optics.MisalignmentBudget.Row r : m.rows()) {
            w.printf(Locale.ROOT, "  %-22s decentre %.3g mm%s, tilt %.3g mrad%s%n", r.name(), r.decentreTolerance_m() * 1e3,
                    r.decentreLimitedByGrowth() ? " (growth)" : "", r.tiltTolerance_rad() * 1e3,
                    r.tiltLimitedByGrowth() ? " (growth)" : "");
        }
        w.println("  tightest: decentre of " + m.rows().get(m.tightestDecentre()).name() + ", tilt of "
                + m.rows().get(m.tightestTilt()).name());
    }

    static void meshCheck(PrintWriter w, MeshCheck m) {
        w.printf(Locale.ROOT, "Search mesh accuracy (winner re-solved with %d instead of %d unknowns): bias %s, Cs %s,"
                + " Cc %s, surface field %s (relative changes).%n", m.fineUnknowns(), m.coarseUnknowns(),
                Numbers.estimate(m.biasChange()), Numbers.estimate(m.sphericalChange()),
                Numbers.estimate(m.chromaticChange()), Numbers.estimate(m.fieldChange()));
    }

    /** The answer when nothing is feasible; returns the one-line outcome message. */
    static String infeasible(PrintWriter w, Requirements req, SizingResult res, Infeasibility inf) {
        w.println("NO DESIGN of the " + req.family().description() + " meets the requirements.");
        if (inf.noFocus()) {
            String msg = String.format(Locale.ROOT, "the supply limit binds: none of the %d geometries tried focuses"
                    + " with a bias within +/- %.0f V; raise max_bias_V, move the image farther away, or choose another family",
                    res.candidates().size(), req.maxBias_V());
            w.println("  " + msg);
            return "no design: " + msg;
        }
        List<String> parts = new ArrayList<>();
        for (Limit l : inf.binding()) {
            String bestText = l == Limit.PLACEMENT ? "" : " (the best any focusing design reached: "
                    + value(l, inf.bestValue().get(l)) + ")";
            parts.add(l.label() + bestText);
        }
        String msg;
        if (!parts.isEmpty()) {
            msg = "binding limit" + (parts.size() > 1 ? "s" : "") + ": no design meets " + String.join("; nor ", parts);
        } else {
            List<String> c = inf.conflicting().stream().map(Limit::label).toList();
            msg = "each limit can be met alone, but not together: " + String.join(" and ", c) + " conflict";
        }
        w.println("  " + msg + ".");
        if (inf.closest() != null) {
            w.println("Closest design found (breaks " + inf.closest().broken().stream().map(v -> v.limit().label()
                    + " " + value(v.limit(), v.value()) + " against " + value(v.limit(), v.allowed())).toList() + "):");
            design(w, inf.closest(), req.beam().particle().chargeSign());
        }
        return "no design meets the requirements; " + msg;
    }
}
