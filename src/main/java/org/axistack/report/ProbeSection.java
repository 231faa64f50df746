package org.axistack.report;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import org.axistack.plan.LensPlan;
import org.axistack.probe.ProbeLens;
import org.axistack.probe.ProbePoint;
import org.axistack.probe.ProbeStudy;

/**
 * The report's probe section: probe diameter (FW50) against beam current at the optimum aperture angle, for the
 * stack's biases and the biases that focus on the screen, with the contribution that dominates (the same study as
 * the probe command, org.axistack.probe).
 */
final class ProbeSection {

    private ProbeSection() {
    }

    static void html(StringBuilder b, LensPlan plan) {
        b.append("<h2>Probe size against current</h2>\n");
        if (plan.probe().isEmpty()) {
            b.append("<p class=\"note\">Not planned: give the source's reduced brightness (plan --brightness B, in"
                    + " A/(m^2 sr V)) to plan the smallest probe at each current here, or run the probe command.</p>\n");
            return;
        }
        ProbeStudy study = plan.probe().get();
        if (study.curves().stream().anyMatch(c -> !c.points().isEmpty())) {
            b.append("<img src=\"probe.png\" alt=\"probe current against probe diameter\">\n");
        }
        b.append(String.format(Locale.ROOT, "<p class=\"note\">Source: reduced brightness %s A/(m^2 sr V), energy spread"
                + " %s eV FWHM; magnification %s. Probe diameter FW50 (half the current inside) from the root-power-sum"
                + " of Barth and Kruit (Optik 101 (1996) 101; stated by its authors to be within about 10 %% of wave-optical"
                + " results) at the optimum aperture angle for each current; the quadrature sum beside it for comparison."
                + " Table: probe.csv.</p>%n",
                Html.g(study.settings().source().reducedBrightness_A_per_m2_sr_V()),
                Html.g(study.settings().source().energySpread_eV()),
                study.settings().source().virtualSourceSize_m().isPresent() ? "the lens's own (virtual source given)"
                        : "free (chosen for each current)"));
        for (ProbeStudy.Curve c : study.curves()) {
            ProbeLens lens = c.workingPoint().lens();
            b.append("<p><b>").append(Html.esc(c.workingPoint().label())).append("</b>: probe at z = ")
                    .append(HtmlReport.mm(c.workingPoint().probeZ_m())).append(" mm; image side Cs = ")
                    .append(HtmlReport.mm(lens.sphericalImage_m())).append(" mm, Cc = ")
                    .append(HtmlReport.mm(lens.chromaticImage_m())).append(" mm.</p>\n");
            if (c.points().isEmpty()) {
                b.append("<p class=\"note\">No current in the range can pass the aperture angles here.</p>\n");
                continue;
            }
            List<List<String>> rows = new ArrayList<>();
            int every = Math.max(1, (c.points().size() + 7) / 8);
            for (int i = 0; i < c.points().size(); i++) {
                if (i % every != 0 && i != c.points().size() - 1) {
                    continue;
                }
                ProbePoint p = c.points().get(i);
                rows.add(List.of(Html.sci(p.current_A()), Html.g(p.alpha_rad() * 1e3), Html.g(p.fw50_m() * 1e9),
                        Html.g(p.quadrature_m() * 1e9), Html.g(p.source_m() * 1e9), Html.g(p.diffraction_m() * 1e9),
                        Html.g(p.spherical_m() * 1e9), Html.g(p.chromatic_m() * 1e9), p.dominant().words()
                                + (p.interior() || c.model().fixedMagnification() ? "" : " (angle at the range end)")));
            }
            b.append(Html.table(List.of("current (A)", "aperture half-angle (mrad)", "probe FW50 (nm)", "quadrature (nm)",
                    "source (nm)", "diffraction (nm)", "spherical (nm)", "chromatic (nm)", "dominant"), rows));
            double diffr = c.diffractionShare();
            b.append("<p class=\"note\">").append(Html.esc(c.dominanceInWords())).append(c.diffractionNegligible()
                    ? "; diffraction negligible (below 1 % of the squared size everywhere)"
                    : String.format(Locale.ROOT, "; diffraction up to %.0f %% of the squared size", 100 * diffr))
                    .append("; ").append(Html.esc(c.offAxisInWords())).append(".</p>\n");
        }
        for (String n : study.notes()) {
            b.append("<p class=\"note\">").append(Html.esc(n)).append("</p>\n");
        }
    }
}
