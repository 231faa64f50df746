package org.axistack.probe;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;

import org.axistack.model.PhysicsMessage;
import org.axistack.model.PhysicsException;
import org.axistack.field.FieldSolution;
import org.axistack.model.Stack;
import org.axistack.optics.OffAxisAberrations;
import org.axistack.optics.ParaxialOptics;
import org.axistack.optics.ReflectionException;
import org.axistack.tune.BiasTuner;
import org.axistack.tune.FocusSolution;
import org.axistack.tune.TuneResult;

/**
 * The probe plan of a stack on one field solution: the probe-current curve (optimum angle and FW50 at each current)
 * for the biases as given and, when the stack has a screen and an electrode to tune, for every bias of that electrode
 * that {@link BiasTuner} finds to focus on the screen.
 *
 * @param settings the source, angle range and currents
 * @param curves   one curve per working point (the given biases first)
 * @param notes    what was skipped and why (a lens that does not focus, no focusing bias, ...)
 */
public record ProbeStudy(Settings settings, List<Curve> curves, List<String> notes) {

    /** Default smallest current on the curve, A (the probe command's and the plan's; picocli needs the text). */
    public static final String DEFAULT_CURRENT_FROM_A = "1e-12";
    /** Default largest current, A. */
    public static final String DEFAULT_CURRENT_TO_A = "1e-6";
    /** Default number of currents on the curve. */
    public static final String DEFAULT_POINTS = "50";
    /** Default smallest image-side aperture half-angle, mrad. */
    public static final String DEFAULT_ALPHA_FROM_MRAD = "0.1";
    /** Default largest image-side aperture half-angle, mrad. */
    public static final String DEFAULT_ALPHA_TO_MRAD = "50";

    /**
     * A term whose share of the squared probe size stays below this everywhere on a curve is called negligible
     * (1 %: it changes the quadrature size by under 0.5 %; common practice, no source).
     */
    public static final double NEGLIGIBLE_SHARE = 0.01;

    public ProbeStudy {
        curves = List.copyOf(curves);
        notes = List.copyOf(notes);
    }

    /**
     * @param source        the source
     * @param alphaMin_rad  smallest image-side aperture half-angle
     * @param alphaMax_rad  largest
     * @param currentMin_A  smallest probe current
     * @param currentMax_A  largest probe current
     * @param points        currents on the curve (log-spaced)
     */
    public record Settings(ProbeSource source, double alphaMin_rad, double alphaMax_rad, double currentMin_A,
            double currentMax_A, int points) {
        public Settings {
            if (!(alphaMin_rad > 0) || !(alphaMax_rad > alphaMin_rad) || !Double.isFinite(alphaMax_rad)) {
                throw PhysicsMessage.PROBE_ANGLE_RANGE.exception("min", alphaMin_rad * 1e3, "max", alphaMax_rad * 1e3);
            }
            if (!(currentMin_A > 0) || !(currentMax_A > currentMin_A) || !Double.isFinite(currentMax_A)) {
                throw PhysicsMessage.PROBE_CURRENT_RANGE.exception("min", currentMin_A, "max", currentMax_A);
            }
            if (points < 2 || points > 10_000) {
                throw PhysicsMessage.PROBE_CURVE_POINTS.exception("points", points);
            }
        }

        /** The default angle range, currents and points (the DEFAULT_ constants) for a source. */
        public static Settings standard(ProbeSource source) {
            return new Settings(source, Double.parseDouble(DEFAULT_ALPHA_FROM_MRAD) * 1e-3,
                    Double.parseDouble(DEFAULT_ALPHA_TO_MRAD) * 1e-3, Double.parseDouble(DEFAULT_CURRENT_FROM_A),
                    Double.parseDouble(DEFAULT_CURRENT_TO_A), Integer.parseInt(DEFAULT_POINTS));
        }
    }

    /**
     * A working point and its probe curve.
     *
     * @param offAxis the off-axis third-order aberrations for the source plane (empty: source at infinity)
     */
    public record Curve(ProbeWorkingPoint workingPoint, ProbeModel model, List<ProbePoint> points,
            Optional<OffAxisAberrations> offAxis) {
        public Curve {
            points = List.copyOf(points);
            offAxis = offAxis == null ? Optional.empty() : offAxis;
        }

        /**
         * Off-axis blur at the edge of the source image for a curve point, m (NaN without off-axis coefficients): the
         * source point imaged at the FW50 radius of the source image sits at object height h = d_I/(2|M|) and sends a
         * pencil of object-side half-angle a_o = a / |s'(z_i)| (the axial ray's image slope per unit object slope);
         * at the Gaussian image its tangential coma is 3 |M K| h a_o^2 long and field curvature with astigmatism
         * spread it over 2 |M| max(|F + A|, |F - A|) h^2 a_o (the convention of {@link OffAxisAberrations}); the two
         * are added in quadrature. An estimate (third order, at the Gaussian image, the edge point only).
         */
        public double offAxisBlur_m(ProbePoint p) {
            if (offAxis.isEmpty()) {
                return Double.NaN;
            }
            OffAxisAberrations oa = offAxis.get();
            double m = Math.abs(oa.magnification());
            double h = p.source_m() / (2 * m);
            double ao = p.alpha_rad() / Math.abs(oa.imageSlopeRatio());
            double coma = 3 * m * Math.abs(oa.coma()) * h * ao * ao;
            double field = 2 * m * Math.max(Math.abs(oa.fieldCurvature_per_m() + oa.astigmatism_per_m()),
                    Math.abs(oa.fieldCurvature_per_m() - oa.astigmatism_per_m())) * h * h * ao;
            return Math.hypot(coma, field);
        }

        /** The largest (off-axis blur / quadrature size)^2 on the curve (NaN without off-axis coefficients). */
        public double offAxisShare() {
            if (offAxis.isEmpty()) {
                return Double.NaN;
            }
            return points.stream().mapToDouble(p -> Math.pow(offAxisBlur_m(p) / p.quadrature_m(), 2)).max().orElse(0);
        }

        /** When the off-axis blur matters, in words. */
        public String offAxisInWords() {
            if (offAxis.isEmpty()) {
                return "off-axis aberrations not evaluated: the source is at infinity (give [beam] object_z_mm)";
            }
            double share = offAxisShare();
            String what = "off-axis blur at the edge of the source image (coma, field curvature and astigmatism at the"
                    + " Gaussian image, third order)";
            return share < NEGLIGIBLE_SHARE
                    ? String.format(Locale.ROOT, "%s negligible: below %.2g %% of the squared probe size everywhere on the"
                            + " curve", what, Math.max(100 * share, 1e-6))
                    : String.format(Locale.ROOT, "%s matters: up to %.0f %% of the squared probe size; the probe is larger"
                            + " than given there", what, 100 * share);
        }

        /**
         * The largest share of diffraction in the squared probe size on the curve, (d_A/d)^2 with d the quadrature
         * sum (0..1; 0 for an empty curve).
         */
        public double diffractionShare() {
            return points.stream().mapToDouble(p -> p.share(ProbeTerm.DIFFRACTION)).max().orElse(0);
        }

        /** Whether diffraction is negligible on the whole curve: below {@link #NEGLIGIBLE_SHARE} of the squared size. */
        public boolean diffractionNegligible() {
            return diffractionShare() < NEGLIGIBLE_SHARE;
        }

        /** The curve point with the largest current whose FW50 does not exceed the given diameter. */
        public Optional<ProbePoint> largestCurrentWithin(double fw50_m) {
            return points.stream().filter(p -> p.fw50_m() <= fw50_m).reduce((a, b) -> b);
        }

        /** Which term dominates over which current range, in words ("dominant: spherical aberration from ... A"). */
        public String dominanceInWords() {
            StringBuilder b = new StringBuilder("dominant: ");
            int start = 0;
            for (int i = 1; i <= points.size(); i++) {
                if (i == points.size() || points.get(i).dominant() != points.get(start).dominant()) {
                    if (start > 0) {
                        b.append("; ");
                    }
                    b.append(points.get(start).dominant().words()).append(String.format(Locale.ROOT, " from %.3g to %.3g A",
                            points.get(start).current_A(), points.get(i - 1).current_A()));
                    start = i;
                }
            }
            return b.toString();
        }
    }

    /**
     * Runs the study.
     *
     * @param tuneElectrode the electrode to tune for focus on the screen (null: no tuning)
     */
    public static ProbeStudy run(FieldSolution solution, Stack stack, Settings settings, String tuneElectrode) {
        Optional<TuneResult> tuned = Optional.empty();
        if (tuneElectrode != null && stack.screenZ_m().isPresent()) {
            tuned = Optional.of(new BiasTuner(solution, stack).focus(tuneElectrode, stack.screenZ_m().getAsDouble()));
        }
        return of(solution, stack, settings, tuned);
    }

    /**
     * The study for the biases as given and for the focusing biases of a tune already run (the plan hands over its
     * own, so nothing is tuned twice).
     */
    public static ProbeStudy of(FieldSolution solution, Stack stack, Settings settings, Optional<TuneResult> tuned) {
        List<Curve> curves = new ArrayList<>();
        List<String> notes = new ArrayList<>();
        add(curves, notes, solution, stack, stack.biases_V(), "biases as given", settings);
        if (tuned.isPresent()) {
            TuneResult t = tuned.get();
            if (!t.found()) {
                notes.add(String.format(Locale.ROOT, "no bias of %s in %.6g .. %.6g V focuses on the screen", t.electrode(),
                        t.range().from_V(), t.range().to_V()));
            }
            for (FocusSolution f : t.solutions()) {
                add(curves, notes, solution, stack, f.biases_V(), String.format(Locale.ROOT,
                        "focus on the screen, %s = %.6g V", t.electrode(), f.bias_V()), settings);
            }
        }
        return new ProbeStudy(settings, curves, notes);
    }

    private static void add(List<Curve> curves, List<String> notes, FieldSolution solution, Stack stack, double[] biases,
            String label, Settings s) {
        try {
            ParaxialOptics optics = ParaxialOptics.of(solution.withBiases(biases), stack);
            ProbeWorkingPoint wp = ProbeWorkingPoint.of(label, biases, optics, stack.beam().objectZ_m(),
                    stack.beam().particle());
            ProbeModel model = new ProbeModel(wp.lens(), s.source(), s.alphaMin_rad(), s.alphaMax_rad());
            if (model.fixedMagnification() && !Double.isFinite(wp.lens().magnification())) {
                notes.add(label + ": a virtual source size needs an object position ([beam] object_z_mm); the "
                        + "magnification is taken as free instead");
                model = new ProbeModel(wp.lens(), new ProbeSource(s.source().reducedBrightness_A_per_m2_sr_V(),
                        s.source().energySpread_eV(), java.util.OptionalDouble.empty()), s.alphaMin_rad(), s.alphaMax_rad());
            }
            List<ProbePoint> points = model.curve(s.currentMin_A(), s.currentMax_A(), s.points());
            if (points.isEmpty()) {
                notes.add(label + ": no current in the range can pass the aperture angles at this magnification");
            }
            Optional<OffAxisAberrations> offAxis = Optional.empty();
            if (stack.beam().objectZ_m().isPresent()) {
                offAxis = Optional.of(optics.offAxisAberrations(stack.beam().objectZ_m().getAsDouble()));
            }
            curves.add(new Curve(wp, model, points, offAxis));
        } catch (ReflectionException e) {
            notes.add(label + ": the beam is reflected (" + e.getMessage() + ")");
        } catch (IllegalArgumentException | PhysicsException | IllegalStateException e) {
            notes.add(label + ": " + e.getMessage());
        }
    }
}
