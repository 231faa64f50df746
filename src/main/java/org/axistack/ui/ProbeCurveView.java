package org.axistack.ui;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;

import org.axistack.field.FieldSolution;
import org.axistack.model.Stack;
import org.axistack.probe.ProbeLens;
import org.axistack.probe.ProbePoint;
import org.axistack.probe.ProbeSource;
import org.axistack.probe.ProbeStudy;

/**
 * The probe-current curve the window shows for the biases set there: {@link ProbeStudy} for the biases as shown
 * (no tuning; the default angle range and currents of the probe command and the plan) and a few lines of text
 * (lens data at the probe, FW50 at each decade of current, the dominant terms, whether diffraction matters, notes).
 * Nothing is computed here but the study itself and the wording. Immutable.
 *
 * @param biases_V   the biases the curve is for, V (stack order)
 * @param study      the probe study at those biases
 * @param summary    the lines shown under the curve
 * @param compute_ms wall-clock time of the study (off the event thread)
 */
record ProbeCurveView(double[] biases_V, ProbeStudy study, List<String> summary, double compute_ms) {

    ProbeCurveView {
        biases_V = biases_V.clone();
        summary = List.copyOf(summary);
    }

    @Override
    public double[] biases_V() {
        return biases_V.clone();
    }

    /** The curve for the biases of a stack as shown, on the window's solution. */
    static ProbeCurveView of(FieldSolution solution, Stack shown, ProbeSource source) {
        long t0 = System.nanoTime();
        ProbeStudy study = ProbeStudy.of(solution, shown, ProbeStudy.Settings.standard(source), Optional.empty());
        List<String> lines = new ArrayList<>();
        for (ProbeStudy.Curve c : study.curves()) {
            ProbeLens lens = c.workingPoint().lens();
            lines.add(String.format(Locale.ROOT, "probe at z = %s mm%s; image side Cs = %s mm, Cc = %s mm; %s eV at the"
                    + " probe, wavelength %s pm", UiFormat.num(c.workingPoint().probeZ_m() * 1e3),
                    Double.isFinite(lens.magnification()) ? ", magnification " + UiFormat.num(lens.magnification())
                            : " (object at infinity)",
                    UiFormat.num(lens.sphericalImage_m() * 1e3), UiFormat.num(lens.chromaticImage_m() * 1e3),
                    UiFormat.num(lens.imageEnergy_eV()), UiFormat.num(lens.wavelength_m() * 1e12)));
            for (ProbePoint p : decades(c.points())) {
                lines.add(String.format(Locale.ROOT, "  %s A: FW50 %s nm at %s mrad (quadrature %s nm), %s dominates%s",
                        String.format(Locale.ROOT, "%.2g", p.current_A()), UiFormat.num(p.fw50_m() * 1e9), UiFormat.num(p.alpha_rad() * 1e3),
                        UiFormat.num(p.quadrature_m() * 1e9), p.dominant().words(),
                        p.interior() || c.model().fixedMagnification() ? "" : " (angle at the range end)"));
            }
            if (c.points().isEmpty()) {
                lines.add("  no current in the range can pass the aperture angles");
            } else {
                lines.add("  " + c.dominanceInWords());
                lines.add(c.diffractionNegligible() ? "  diffraction negligible (below 1 % of the squared size everywhere)"
                        : String.format(Locale.ROOT, "  diffraction matters: up to %.0f %% of the squared size",
                                100 * c.diffractionShare()));
                lines.add("  " + c.offAxisInWords());
            }
        }
        lines.addAll(study.notes());
        return new ProbeCurveView(shown.biases_V(), study, lines, (System.nanoTime() - t0) / 1e6);
    }

    /** The curve points nearest to each decade of current (at most one per decade). */
    static List<ProbePoint> decades(List<ProbePoint> points) {
        List<ProbePoint> out = new ArrayList<>();
        long last = Long.MIN_VALUE;
        for (ProbePoint p : points) {
            long decade = Math.round(Math.log10(p.current_A()));
            if (decade != last && Math.abs(Math.log10(p.current_A()) - decade) < 0.07) {
                out.add(p);
                last = decade;
            }
        }
        return out;
    }
}
