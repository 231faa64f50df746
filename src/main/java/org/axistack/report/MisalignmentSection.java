package org.axistack.report;

import java.util.ArrayList;
import java.util.List;

import org.axistack.optics.MisalignmentBudget;
import org.axistack.optics.MisalignmentStudy;
import org.axistack.plan.LensPlan;

/**
 * The report's misalignment section: per electrode, the central ray's shift and slope at the screen per 0.01 mm
 * decentre and per mrad tilt, the spot walk per volt of the focus bias, the axial coma's spot growth at the beam's
 * aperture, the decentre and tilt tolerances of the budget (and which limit sets them) and the tightest electrode
 * ({@link MisalignmentStudy}, first order, the numbers of the {@code misalign} command with its defaults). Without
 * the study the section says how to get it.
 */
final class MisalignmentSection {

    private MisalignmentSection() {
    }

    static void html(StringBuilder b, LensPlan plan) {
        b.append("<h2>Decentre and tilt budget</h2>\n");
        if (plan.misalignment().isEmpty()) {
            b.append("<p class=\"note\">Not computed: run <code>plan --misalign</code> for the machining budget of every"
                    + " electrode (or <code>misalign</code> for it alone, with the bench table).</p>\n");
            return;
        }
        MisalignmentStudy study = plan.misalignment().get();
        MisalignmentBudget m = study.budget();
        List<List<String>> rows = new ArrayList<>();
        for (MisalignmentBudget.Row r : m.rows()) {
            rows.add(List.of(Html.esc(r.name()), Html.g(r.decentreShift() * 10), Html.g(r.decentreSlope() * 10),
                    Html.g(r.tiltShift() * 1e3), Html.g(r.tiltSlope() * 1e3), Html.g(r.decentreWalk_per_V() * 10),
                    Html.g(r.tiltWalk_per_V() * 1e3), Html.g(r.coma().decentreGrowth() * 10),
                    Html.g(r.coma().tiltGrowth() * 1e3),
                    tol(r.decentreTolerance_m() * 1e3, r.decentreLimitedByGrowth()),
                    tol(r.tiltTolerance_rad() * 1e3, r.tiltLimitedByGrowth())));
        }
        b.append(Html.table(List.of("electrode", "shift per 0.01 mm decentre (um)", "slope per 0.01 mm decentre (urad)",
                "shift per mrad tilt (um)", "slope per mrad tilt (urad)", "walk per V, decentre (um per 0.01 mm)",
                "walk per V, tilt (um per mrad)", "spot growth per 0.01 mm decentre (um)", "spot growth per mrad tilt (um)",
                "decentre tolerance (mm)", "tilt tolerance (mrad)"), rows));
        b.append("<p>Tightest: decentre of <strong>").append(Html.esc(m.rows().get(m.tightestDecentre()).name()))
                .append("</strong> (").append(Html.g(m.rows().get(m.tightestDecentre()).decentreTolerance_m() * 1e3))
                .append(" mm), tilt of <strong>").append(Html.esc(m.rows().get(m.tightestTilt()).name()))
                .append("</strong> (").append(Html.g(m.rows().get(m.tightestTilt()).tiltTolerance_rad() * 1e3))
                .append(" mrad).</p>\n");
        StringBuilder note = new StringBuilder();
        note.append("Screen at z = ").append(Html.trim(m.screenZ_m() * 1e3)).append(" mm, allowed spot shift ")
                .append(Html.trim(m.allowed_m() * 1e3)).append(" mm; ");
        if (m.hasGrowth()) {
            note.append("spot growth (length of the axial-coma figure at the beam's image z = ")
                    .append(Html.trim(m.imageZ_m() * 1e3)).append(" mm, ").append(study.comaNote()).append(") allowed ")
                    .append(Html.trim(m.allowedGrowth_m() * 1e3)).append(" mm; a tolerance marked * is set by the growth. ");
        } else {
            note.append(study.comaNote()).append(". ");
        }
        note.append("Budget: ").append(MisalignmentBudget.assumption()).append(". ");
        if (m.hasGrowth()) {
            String g = MisalignmentBudget.growthAssumption();
            note.append(Character.toUpperCase(g.charAt(0))).append(g.substring(1)).append(". ");
        }
        note.append("Tilts turn about a transverse axis through the middle of each electrode; the walk is the change of the"
                + " shift per volt of the focus bias. Method: src/site/markdown/misalignment.md; the command misalign"
                + " prints the same figures with the monitors, cancelling steerer biases and the bench CSV.");
        b.append("<p class=\"note\">").append(Html.esc(note.toString())).append("</p>\n");
    }

    private static String tol(double v, boolean growth) {
        return Html.g(v) + (growth ? " *" : "");
    }
}
