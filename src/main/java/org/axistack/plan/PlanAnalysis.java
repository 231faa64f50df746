package org.axistack.plan;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.concurrent.CancellationException;

import org.axistack.model.PhysicsException;
import org.axistack.beam.Emittance;
import org.axistack.beam.EnvelopeRequest;
import org.axistack.beam.EnvelopeStart;
import org.axistack.beam.EnvelopeStudy;
import org.axistack.beam.EnvelopeStudyResult;
import org.axistack.beam.EnvelopeWarning;
import org.axistack.field.BemSolver;
import org.axistack.field.BiasedField;
import org.axistack.field.FieldSolution;
import org.axistack.field.SolveProgress;
import org.axistack.model.Units;
import org.axistack.model.Electrode;
import org.axistack.model.Stack;
import org.axistack.optics.Aberrations;
import org.axistack.optics.CardinalElements;
import org.axistack.optics.Imaging;
import org.axistack.optics.ParaxialOptics;
import org.axistack.optics.ReflectionException;
import org.axistack.optics.SpotSizeBudget;
import org.axistack.optics.OffAxisAberrations;
import org.axistack.optics.OffAxisEffects;
import org.axistack.optics.OpticsAccuracy;
import org.axistack.optics.StartPlaneException;
import org.axistack.probe.ProbeSource;
import org.axistack.probe.ProbeStudy;
import org.axistack.trace.Trajectory;
import org.axistack.tune.BiasRange;
import org.axistack.tune.BiasSweep;
import org.axistack.tune.FocusSensitivity;
import org.axistack.tune.GapMargins;
import org.axistack.tune.SurfaceFieldCheck;
import org.axistack.tune.SurfaceFields;
import org.axistack.tune.SweepPoint;
import org.axistack.tune.TuneResult;
import org.axistack.verify.CheckResult;
import org.axistack.verify.VerificationSuite;

/**
 * Runs every step of a lens plan on one field solution: paraxial optics and aberrations, the spot-size budget, a
 * ray fan, the envelope, the biases that focus on the screen with their supply-stability budget, a focus-bias
 * sweep, the probe size against current (when a source brightness is given) and the verification cases. The {@code plan} command solves the field first ({@link #solveAndRun}); the
 * desktop window hands over the solution it already has ({@link #run}), so its report costs no second solve. Each
 * stage is announced to a {@link Progress}, which may cancel.
 */
public final class PlanAnalysis {

    /** Intervals of the focus-bias sweep in the report. */
    public static final int SWEEP_STEPS = 80;

    /** Aperture half-angles of the spot-size budget table, rad. */
    /**
     * Start heights of the parallel rays drawn in the plan's ray figure and in the window, as fractions of the
     * narrowest bore (one place, so the report and the window draw the same rays).
     */
    public static final List<Double> RAY_HEIGHTS_OF_BORE = List.of(0.1, 0.2, 0.3, 0.4, 0.5);

    private static final double[] SPOT_ANGLES_RAD = {0.5e-3, 1e-3, 2e-3, 5e-3, 10e-3, 20e-3};

    /**
     * @param energySpread_eV  full energy spread for the chromatic disc, eV
     * @param current_A        envelope beam current, A
     * @param emittance_m_rad  envelope edge emittance (geometric, at the start), m rad
     * @param tuneElectrode    electrode to tune for focus on the screen (null: the one with the largest |bias|)
     * @param runChecks        whether to run the verification cases
     * @param depth_m          the supply-stability budget keeps the focus within +/- this, m
     * @param probeBrightness_A_per_m2_sr_V reduced brightness of the source for the probe section (empty: no probe
     *                         plan); the energy spread above is taken as its FWHM
     * @param objectHeight_m   object height for the off-axis aberrations' effects (a stack with a finite object;
     *                         empty: the coefficients only)
     * @param aperture_rad     object-side aperture half-angle for their blur (needs the height; empty: none)
     * @param misalignment     whether to add the misalignment section (decentre and tilt budget of every electrode,
     *                         as {@code misalign} computes it with its defaults)
     */
    public record Settings(double energySpread_eV, double current_A, double emittance_m_rad, String tuneElectrode,
            boolean runChecks, double depth_m, OptionalDouble probeBrightness_A_per_m2_sr_V, OptionalDouble objectHeight_m,
            OptionalDouble aperture_rad, boolean misalignment) {
        public Settings {
            objectHeight_m = objectHeight_m == null ? OptionalDouble.empty() : objectHeight_m;
            aperture_rad = aperture_rad == null ? OptionalDouble.empty() : aperture_rad;
            OffAxisEffects.requireValid(objectHeight_m, aperture_rad);
            probeBrightness_A_per_m2_sr_V = probeBrightness_A_per_m2_sr_V == null ? OptionalDouble.empty()
                    : probeBrightness_A_per_m2_sr_V;
            if (probeBrightness_A_per_m2_sr_V.isPresent() && !(probeBrightness_A_per_m2_sr_V.getAsDouble() > 0
                    && Double.isFinite(probeBrightness_A_per_m2_sr_V.getAsDouble()))) {
                throw new IllegalArgumentException("the source brightness must be a positive number of A/(m^2 sr V)");
            }
            if (!(energySpread_eV >= 0) || !(current_A >= 0) || !(emittance_m_rad >= 0)
                    || !Double.isFinite(energySpread_eV + current_A + emittance_m_rad)) {
                throw new IllegalArgumentException("the energy spread, current and emittance must be finite and >= 0");
            }
            if (!(depth_m > 0) || !Double.isFinite(depth_m)) {
                throw new IllegalArgumentException("the depth of focus must be a positive length");
            }
        }

        /**
         * The plan command's defaults: 1 eV energy spread, 10 uA, 1 mm mrad, the strongest electrode tuned,
         * verification run, focus held within +/- {@link FocusSensitivity#DEFAULT_DEPTH_M}.
         */
        public static Settings defaults() {
            return new Settings(1, 1e-5, 1e-6, null, true, FocusSensitivity.DEFAULT_DEPTH_M);
        }

        /** Settings without object height or aperture for the off-axis effects. */
        public Settings(double energySpread_eV, double current_A, double emittance_m_rad, String tuneElectrode,
                boolean runChecks, double depth_m, OptionalDouble probeBrightness_A_per_m2_sr_V) {
            this(energySpread_eV, current_A, emittance_m_rad, tuneElectrode, runChecks, depth_m,
                    probeBrightness_A_per_m2_sr_V, OptionalDouble.empty(), OptionalDouble.empty(), false);
        }

        /** Settings without the misalignment section. */
        public Settings(double energySpread_eV, double current_A, double emittance_m_rad, String tuneElectrode,
                boolean runChecks, double depth_m, OptionalDouble probeBrightness_A_per_m2_sr_V,
                OptionalDouble objectHeight_m, OptionalDouble aperture_rad) {
            this(energySpread_eV, current_A, emittance_m_rad, tuneElectrode, runChecks, depth_m,
                    probeBrightness_A_per_m2_sr_V, objectHeight_m, aperture_rad, false);
        }

        /** The same settings with or without the misalignment section. */
        public Settings withMisalignment(boolean on) {
            return new Settings(energySpread_eV, current_A, emittance_m_rad, tuneElectrode, runChecks, depth_m,
                    probeBrightness_A_per_m2_sr_V, objectHeight_m, aperture_rad, on);
        }

        /** The same settings with an object height and aperture angle for the off-axis effects (either may be empty). */
        public Settings withOffAxis(OptionalDouble height_m, OptionalDouble alpha_rad) {
            return new Settings(energySpread_eV, current_A, emittance_m_rad, tuneElectrode, runChecks, depth_m,
                    probeBrightness_A_per_m2_sr_V, height_m, alpha_rad, misalignment);
        }

        /** Settings without a probe plan. */
        public Settings(double energySpread_eV, double current_A, double emittance_m_rad, String tuneElectrode,
                boolean runChecks, double depth_m) {
            this(energySpread_eV, current_A, emittance_m_rad, tuneElectrode, runChecks, depth_m, OptionalDouble.empty());
        }

        /** The same settings with another envelope beam. */
        public Settings withEnvelope(double newCurrent_A, double newEmittance_m_rad) {
            return new Settings(energySpread_eV, newCurrent_A, newEmittance_m_rad, tuneElectrode, runChecks, depth_m,
                    probeBrightness_A_per_m2_sr_V, objectHeight_m, aperture_rad, misalignment);
        }

        /** The same settings with or without the verification cases. */
        public Settings withChecks(boolean run) {
            return new Settings(energySpread_eV, current_A, emittance_m_rad, tuneElectrode, run, depth_m,
                    probeBrightness_A_per_m2_sr_V, objectHeight_m, aperture_rad, misalignment);
        }

        /** The same settings with a probe plan for a source of this reduced brightness, A/(m^2 sr V). */
        public Settings withProbeBrightness(double brightness_A_per_m2_sr_V) {
            return new Settings(energySpread_eV, current_A, emittance_m_rad, tuneElectrode, runChecks, depth_m,
                    OptionalDouble.of(brightness_A_per_m2_sr_V), objectHeight_m, aperture_rad, misalignment);
        }
    }

    /** Where the plan is. Return false from either method to cancel (the plan then throws {@link CancellationException}). */
    public interface Progress {
        /**
         * A stage begins.
         *
         * @param what     the stage in words ("beam envelope")
         * @param fraction the share of the plan done before it, 0..1
         */
        boolean stage(String what, double fraction);

        /** Progress inside a long stage: the share of the whole plan done, 0..1. */
        default boolean within(double fraction) {
            return true;
        }

        Progress NONE = (what, fraction) -> true;
    }

    private PlanAnalysis() {
    }

    /** Solves the stack's field (progress to solveProgress), then runs the plan on it. */
    public static LensPlan solveAndRun(Stack stack, String source, Settings s, SolveProgress solveProgress,
            Progress progress) {
        long t0 = System.nanoTime();
        announce(progress, "solving the field (" + stack.mesh().targetElements() + " boundary elements)", 0);
        FieldSolution solution = BemSolver.solve(stack.electrodes(), stack.mesh(), solveProgress);
        return analyse(stack, source, s, solution, progress, t0);
    }

    /**
     * Runs the plan at the stack's biases on a solution of the stack's geometry (re-biased, never solved again).
     *
     * @throws IllegalArgumentException when the solution belongs to other electrodes
     * @throws CancellationException    when progress cancels
     */
    public static LensPlan run(Stack stack, String source, Settings s, FieldSolution solution, Progress progress) {
        solution.requireGeometryOf(stack);
        return analyse(stack, source, s, solution, progress, System.nanoTime());
    }

    private static LensPlan analyse(Stack stack, String source, Settings s, FieldSolution solution, Progress progress,
            long t0) {
        Shares share = new Shares(s.runChecks());
        List<String> warnings = new ArrayList<>();
        BiasedField field = solution.withBiases(stack.biases_V());
        if (solution.capacitanceCheck().warned()) {
            warnings.add(solution.capacitanceCheck().message(stack.electrodes()));
        }
        surfaceFieldWarnings(stack, field, warnings);
        for (GapMargins.Row g : GapMargins.of(stack)) {
            String w = GapMargins.warning(g);
            if (w != null) {
                warnings.add(w);
            }
        }

        announce(progress, "paraxial optics and aberrations", share.optics);
        Optics o = Optics.of(stack, field, warnings);
        Optional<OffAxisEffects> offAxis = o.offAxis.map(c -> new OffAxisEffects(c, s.objectHeight_m(), s.aperture_rad()));

        Optional<SpotSizeBudget.Inputs> spotInputs = Optional.empty();
        List<SpotSizeBudget.Row> spotRows = new ArrayList<>();
        if (o.aberrations.isPresent() && o.cardinal.isPresent()) {
            double tImage = o.cardinal.get().uImage_V() * Math.abs(stack.beam().particle().chargeNumber());
            SpotSizeBudget.Inputs in = new SpotSizeBudget.Inputs(o.aberrations.get().sphericalImage_m(),
                    o.aberrations.get().chromaticImage_m(), s.energySpread_eV() / tImage, 0, 0);
            spotInputs = Optional.of(in);
            for (double a : SPOT_ANGLES_RAD) {
                spotRows.add(SpotSizeBudget.at(in, a));
            }
        }

        announce(progress, "tracing a meridional fan of rays for the picture", share.rays);
        List<Trajectory> rays = List.of();
        String rayNote;
        try {
            PlanRays.Fan fan = PlanRays.trace(stack, field);
            rays = fan.rays();
            rayNote = fan.note();
        } catch (IllegalArgumentException | PhysicsException e) {
            rayNote = "no rays drawn: " + e.getMessage();
            warnings.add(rayNote);
        }

        announce(progress, "beam envelope", share.envelope);
        Optional<EnvelopeStudyResult> envelope = Optional.empty();
        double r0 = defaultEnvelopeRadius_m(stack);
        String envNote = String.format(Locale.ROOT, "round beam of %s uA, edge radius %s mm (a quarter of the smallest "
                + "bore), parallel, edge emittance %s mm mrad (geometric, at the start); set with --current and "
                + "--emittance, or in the window's beam envelope fields", PlanFormat.num(s.current_A() * 1e6), PlanFormat.num(Units.mToMm(r0)),
                PlanFormat.num(s.emittance_m_rad() * 1e6));
        if (o.reflection.isEmpty()) {
            try {
                EnvelopeStudyResult env = new EnvelopeStudy().run(stack, field, new EnvelopeRequest(s.current_A(),
                        new EnvelopeStart.RadiusSlope(r0, 0, Emittance.edge(s.emittance_m_rad()))),
                        f -> progress.within(share.envelope + (share.tune - share.envelope) * f));
                envelope = Optional.of(env);
                for (EnvelopeWarning w : env.warnings()) {
                    warnings.add("envelope: " + w.message());
                }
            } catch (IllegalArgumentException | PhysicsException | IllegalStateException e) {
                envNote += "; not computed: " + e.getMessage();
            }
        }

        String name = s.tuneElectrode() != null ? s.tuneElectrode() : strongest(stack);
        PlanTuning tuning = PlanTuning.run(stack, solution, name, s.depth_m(), progress, share.tune, warnings);

        List<SweepPoint> sweep = List.of();
        if (name != null) {
            BiasRange range = tuning.tune().map(TuneResult::range).orElse(BiasRange.supplyDefault(stack.beam()));
            announce(progress, "sweeping the bias of " + name + " over " + PlanFormat.num(range.from_V()) + " .. "
                    + PlanFormat.num(range.to_V()) + " V", share.sweep);
            sweep = BiasSweep.run(solution, stack, name, range.from_V(), range.to_V(), SWEEP_STEPS,
                    stack.beam().objectZ_m(), (done, total) -> progress.within(share.sweep
                            + (share.checks - share.sweep) * done / total));
        }

        Optional<ProbeStudy> probe = Optional.empty();
        if (s.probeBrightness_A_per_m2_sr_V().isPresent() && o.reflection.isEmpty()) {
            announce(progress, "probe size against current", share.checks);
            probe = Optional.of(ProbeStudy.of(solution, stack, ProbeStudy.Settings.standard(new ProbeSource(
                    s.probeBrightness_A_per_m2_sr_V().getAsDouble(), s.energySpread_eV(), OptionalDouble.empty())),
                    tuning.tune()));
        }

        Optional<org.axistack.optics.MisalignmentStudy> misalignment = Optional.empty();
        if (s.misalignment() && o.reflection.isEmpty()) {
            announce(progress, "decentre and tilt budget", share.checks);
            double screen = stack.screenZ_m().orElse(o.cardinal.map(CardinalElements::zEnd_m).orElse(Double.NaN));
            try {
                misalignment = Optional.of(org.axistack.optics.MisalignmentStudy.run(stack, solution, name, screen,
                        org.axistack.optics.MisalignmentStudy.DEFAULT_ALLOWED_SHIFT_M, Double.NaN,
                        org.axistack.optics.MisalignmentStudy.DEFAULT_ALLOWED_GROWTH_M, SolveProgress.NONE));
            } catch (RuntimeException e) {
                warnings.add("misalignment budget not computed: " + e.getMessage());
            }
        }

        List<CheckResult> checks = List.of();
        if (s.runChecks()) {
            boolean[] stopped = {false};
            checks = VerificationSuite.run((i, n, caseName) -> {
                boolean go = progress.stage(String.format(Locale.ROOT, "verification %d/%d: %s", i + 1, n, caseName),
                        share.checks + (1 - share.checks) * i / n);
                stopped[0] = !go;
                return go;
            });
            if (stopped[0]) {
                throw new CancellationException("plan cancelled");
            }
            if (!VerificationSuite.allPassed(checks)) {
                warnings.add("a built-in verification case is outside its tolerance: do not trust these numbers");
            }
            if (o.lensCheck.isPresent()) {
                // the accuracy claim for the lens at hand (its shortfall, if any, is already among the warnings)
                List<CheckResult> all = new ArrayList<>(checks);
                all.add(o.lensCheck.get());
                checks = List.copyOf(all);
            }
        }
        return new LensPlan(stack, source, solution, field, o.reflection, o.cardinal, o.note, o.imaging,
                o.aberrations, spotInputs, spotRows, rays, rayNote, envelope, envNote, tuning.tune(), tuning.note(),
                tuning.budgets(), tuning.budgetNote(), Optional.ofNullable(name), sweep, checks, warnings,
                (System.nanoTime() - t0) * 1e-9, probe, offAxis, o.offAxisNote, misalignment);
    }

    /** The default envelope beam's edge radius: a quarter of the narrowest open bore, m (plan and envelope commands). */
    public static double defaultEnvelopeRadius_m(Stack stack) {
        return 0.25 * stack.openBore_m();
    }

    /**
     * The electrode a user tunes for focus by default: the one with the largest |bias| among those whose bias
     * differs from the biases of the electrodes at both ends of the stack (the first and the last in z; they set the
     * beam's energy going in and coming out, so varying them changes the final energy rather than only the focus);
     * when there is none, the one with the largest |bias| (null if all are 0 V).
     */
    public static String strongest(Stack stack) {
        Electrode first = stack.electrodes().get(0), last = first;
        for (Electrode e : stack.electrodes()) {
            if (e.contour().minZ_m() < first.contour().minZ_m()) {
                first = e;
            }
            if (e.contour().maxZ_m() > last.contour().maxZ_m()) {
                last = e;
            }
        }
        String best = null;
        double max = 0;
        for (Electrode e : stack.electrodes()) {
            if (e.bias_V() != first.bias_V() && e.bias_V() != last.bias_V() && Math.abs(e.bias_V()) > max) {
                max = Math.abs(e.bias_V());
                best = e.name();
            }
        }
        return best != null ? best : largestBias(stack);
    }

    private static String largestBias(Stack stack) {
        String best = null;
        double max = 0;
        for (Electrode e : stack.electrodes()) {
            if (Math.abs(e.bias_V()) > max) {
                max = Math.abs(e.bias_V());
                best = e.name();
            }
        }
        return best;
    }

    private static void surfaceFieldWarnings(Stack stack, BiasedField field, List<String> warnings) {
        for (SurfaceFields.Row row : SurfaceFields.of(stack, field)) {
            SurfaceFieldCheck c = row.check();
            if (c.warning()) {
                double limit = c == SurfaceFieldCheck.ABOVE_AGGRESSIVE ? stack.limits().aggressive_V_per_m()
                        : stack.limits().comfort_V_per_m();
                String kind = c == SurfaceFieldCheck.ABOVE_AGGRESSIVE ? "aggressive" : "comfort";
                if (row.peak().sharp()) {
                    warnings.add(String.format(Locale.ROOT, "electrode %s: %s; already %s V/mm at the mesh's resolution, "
                            + "above the %s limit (%s V/mm)", row.name(), SurfaceFields.sharpStatement(row.peak()),
                            PlanFormat.num(Units.vPerMToVPerMm(row.peak().field_V_per_m())), kind,
                            PlanFormat.num(Units.vPerMToVPerMm(limit))));
                } else {
                    warnings.add(String.format(Locale.ROOT, "electrode %s: surface field %s is above the %s limit "
                            + "(%s V/mm): round its edges, widen the gap or lower the bias", row.name(), row.describe(),
                            kind, PlanFormat.num(Units.vPerMToVPerMm(limit))));
                }
            }
        }
    }

    static void announce(Progress progress, String what, double fraction) {
        if (!progress.stage(what, fraction)) {
            throw new CancellationException("plan cancelled");
        }
    }

    /** Where each stage starts, as a share of the whole plan (rough shares of the time on the demo lens). */
    private static final class Shares {
        final double optics;
        final double rays;
        final double envelope;
        final double tune;
        final double sweep;
        final double checks;

        Shares(boolean withChecks) {
            double k = withChecks ? 0.55 : 1;
            optics = 0;
            rays = 0.05 * k;
            envelope = 0.15 * k;
            tune = 0.25 * k;
            sweep = 0.45 * k;
            checks = k;
        }
    }

    /** The paraxial part of the plan, or why it is missing. */
    private record Optics(Optional<String> reflection, Optional<CardinalElements> cardinal, String note,
            Optional<Imaging> imaging, Optional<Aberrations> aberrations, Optional<CheckResult> lensCheck,
            Optional<OffAxisAberrations> offAxis, String offAxisNote) {

        /**
         * The verification row for the lens at hand: its image-side focal length with the far-field traced range
         * doubled (open sides) as the reference; the error is the larger of that change and the elements' own
         * estimate, against the default accuracy.
         */
        static CheckResult lensCheck(Stack stack, BiasedField field, ParaxialOptics optics, CardinalElements c) {
            long t = System.nanoTime();
            double[] range = ParaxialOptics.searchRange_m(stack);
            CardinalElements doubled = ParaxialOptics.auto(new org.axistack.optics.AccelerationPotential(field,
                    stack.beam()), range[0], range[1], stack.beam().startZ_m(),
                    optics.settings().withFarFieldReach(2 * optics.settings().farFieldReach())).cardinal();
            double change = Math.abs(doubled.focalLengthImage_m() / c.focalLengthImage_m() - 1);
            double error = Math.max(change, c.errorEstimate());
            return new CheckResult("this lens: cardinal elements", "image-side focal length f2", "mm",
                    Units.mToMm(c.focalLengthImage_m()), Units.mToMm(doubled.focalLengthImage_m()), error,
                    OpticsAccuracy.DEFAULT_REQUESTED, "relative: the larger of the change when the traced range is doubled"
                            + " and the estimated error", "convergence of this lens's own optics (issue 23)",
                    "field ends: " + String.join("; ", OpticsAccuracy.ends(c)), (System.nanoTime() - t) * 1e-9);
        }

        static Optics of(Stack stack, BiasedField field, List<String> warnings) {
            Optional<String> reflection = Optional.empty();
            Optional<CardinalElements> cardinal = Optional.empty();
            Optional<Imaging> imaging = Optional.empty();
            Optional<Aberrations> aberrations = Optional.empty();
            Optional<CheckResult> lensCheck = Optional.empty();
            Optional<OffAxisAberrations> offAxis = Optional.empty();
            String offAxisNote = "the stack's object is at infinity ([beam] has no object_z_mm): the off-axis aberrations"
                    + " of a finite object are not computed";
            String note;
            try {
                ParaxialOptics optics = ParaxialOptics.of(field, stack);
                CardinalElements c = optics.cardinal();
                cardinal = Optional.of(c);
                note = String.format(Locale.ROOT, "relativistic paraxial ray equation (relative tolerance %.0e);"
                        + " asymptotic cardinal elements, the field's ends: %s; %s", optics.settings().relativeTolerance(),
                        String.join("; ", OpticsAccuracy.ends(c)), OpticsAccuracy.estimate(c));
                OpticsAccuracy.shortfall(c, OpticsAccuracy.DEFAULT_REQUESTED).ifPresent(warnings::add);
                OpticsAccuracy.closeTheLens(c).ifPresent(warnings::add);
                if (c.kind() != CardinalElements.Kind.AFOCAL) {
                    lensCheck = Optional.of(lensCheck(stack, field, optics, c));
                }
                OptionalDouble obj = stack.beam().objectZ_m();
                if (obj.isPresent()) {
                    imaging = Optional.of(optics.imaging(obj.getAsDouble()));
                }
                aberrations = optics.quotedAberrations(imaging);
                if (obj.isPresent()) {
                    try {
                        offAxis = Optional.of(optics.offAxisAberrations(obj.getAsDouble()));
                        offAxisNote = "";
                    } catch (IllegalArgumentException e) {
                        offAxisNote = e.getMessage();
                    }
                }
                if (!c.focuses()) {
                    warnings.add(c.notFocusingStatement() + "; change the biases (with --set or the window's bias controls) to get a real focus");
                }
            } catch (ReflectionException e) {
                reflection = Optional.of(e.getMessage());
                note = "no optics: the beam is reflected on the axis";
                warnings.add(e.getMessage() + "; lower the retarding bias or raise the beam energy");
            } catch (StartPlaneException e) {
                note = "no optics: the beam start plane lies inside the lens field";
                warnings.add(String.format(Locale.ROOT, "[beam] start_z_mm = %s mm lies inside the lens (usable %s .. "
                        + "%s mm); move it into the field-free entrance region", PlanFormat.num(Units.mToMm(e.startZ_m())),
                        PlanFormat.num(Units.mToMm(e.usableFromZ_m())), PlanFormat.num(Units.mToMm(e.usableToZ_m()))));
            }
            if (reflection.isPresent()) {
                offAxisNote = "the beam is reflected: no off-axis aberrations";
            }
            return new Optics(reflection, cardinal, note, imaging, aberrations, lensCheck, offAxis, offAxisNote);
        }
    }
}
