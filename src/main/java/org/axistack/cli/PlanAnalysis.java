package org.axistack.cli;

import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.OptionalDouble;

import org.axistack.beam.Emittance;
import org.axistack.beam.EnvelopeRequest;
import org.axistack.beam.EnvelopeStart;
import org.axistack.beam.EnvelopeStudy;
import org.axistack.beam.EnvelopeStudyResult;
import org.axistack.beam.EnvelopeWarning;
import org.axistack.field.BemSolver;
import org.axistack.field.BiasedField;
import org.axistack.field.FieldSolution;
import org.axistack.io.Units;
import org.axistack.model.Electrode;
import org.axistack.model.Stack;
import org.axistack.optics.Aberrations;
import org.axistack.optics.CardinalElements;
import org.axistack.optics.Imaging;
import org.axistack.optics.ParaxialOptics;
import org.axistack.optics.ReflectionException;
import org.axistack.optics.SpotSizeBudget;
import org.axistack.optics.StartPlaneException;
import org.axistack.report.LensPlan;
import org.axistack.trace.Trajectory;
import org.axistack.tune.BiasRange;
import org.axistack.tune.BiasSweep;
import org.axistack.tune.BiasTuner;
import org.axistack.tune.SurfaceFieldCheck;
import org.axistack.tune.SweepPoint;
import org.axistack.tune.TuneResult;
import org.axistack.verify.CheckResult;
import org.axistack.verify.VerificationSuite;

/** Runs every step of a lens plan on one field solution, reporting each stage on the error stream. */
final class PlanAnalysis {

    /** Aperture half-angles of the spot-size budget table, rad. */
    /** Intervals of the focus-bias sweep in the report. */
    static final int SWEEP_STEPS = 80;

    static final double[] SPOT_ANGLES_RAD = {0.5e-3, 1e-3, 2e-3, 5e-3, 10e-3, 20e-3};

    /**
     * @param energySpread_eV  full energy spread for the chromatic disc, eV
     * @param current_A        envelope beam current, A
     * @param emittance_m_rad  envelope edge emittance (geometric, at the start), m rad
     * @param tuneElectrode    electrode to tune for focus on the screen (null: the one with the largest |bias|)
     * @param runChecks        whether to run the verification cases
     */
    record Settings(double energySpread_eV, double current_A, double emittance_m_rad, String tuneElectrode,
            boolean runChecks) {
    }

    private PlanAnalysis() {
    }

    static LensPlan run(Stack stack, String source, Settings s, PrintWriter err, boolean quiet) {
        long t0 = System.nanoTime();
        List<String> warnings = new ArrayList<>();
        stage(err, quiet, "solving the field (" + stack.mesh().targetElements() + " boundary elements)");
        FieldSolution solution = BemSolver.solve(stack.electrodes(), stack.mesh(), SolveReporter.to(err, quiet));
        BiasedField field = solution.withBiases(stack.biases_V());
        surfaceFieldWarnings(stack, field, warnings);

        stage(err, quiet, "paraxial optics and aberrations");
        Optional<String> reflection = Optional.empty();
        Optional<CardinalElements> cardinal = Optional.empty();
        Optional<Imaging> imaging = Optional.empty();
        Optional<Aberrations> aberrations = Optional.empty();
        String opticsNote;
        ParaxialOptics optics = null;
        try {
            optics = ParaxialOptics.of(field, stack);
            CardinalElements c = optics.cardinal();
            cardinal = Optional.of(c);
            opticsNote = String.format(Locale.ROOT, "relativistic paraxial ray equation (relative tolerance %.0e) between "
                    + "reference planes z = %s and %s mm taken as field-free; moving them 10%% inward changes the cardinal "
                    + "elements by %.1e (relative)", optics.settings().relativeTolerance(),
                    PlanCommand.num(Units.mToMm(c.zStart_m())), PlanCommand.num(Units.mToMm(c.zEnd_m())),
                    c.planeSensitivity());
            if (c.planeSensitivity() > 1e-4) {
                warnings.add(String.format(Locale.ROOT, "the reference planes are not quite field-free: the cardinal "
                        + "elements carry a relative error of about %.1e; lengthen the outer electrodes or move the beam "
                        + "start outward for better", c.planeSensitivity()));
            }
            OptionalDouble obj = stack.beam().objectZ_m();
            if (obj.isPresent() && obj.getAsDouble() < optics.zEnd_m()) {
                Imaging im = optics.imaging(obj.getAsDouble());
                imaging = Optional.of(im);
            }
            if (c.kind() != CardinalElements.Kind.AFOCAL) {
                aberrations = Optional.of(imaging.isPresent() && Double.isFinite(imaging.get().imageZ_m())
                        ? optics.aberrations(imaging.get().objectZ_m()) : optics.aberrations());
            }
            if (c.kind() != CardinalElements.Kind.CONVERGING && c.realFocusImageZ_m().isEmpty()) {
                warnings.add("the lens does not focus (" + c.kind().name().toLowerCase(Locale.ROOT)
                        + "): change the biases (e.g. with --set) to get a real focus");
            }
        } catch (ReflectionException e) {
            reflection = Optional.of(e.getMessage());
            opticsNote = "no optics: the beam is reflected on the axis";
            warnings.add(e.getMessage() + "; lower the retarding bias or raise the beam energy");
        } catch (StartPlaneException e) {
            opticsNote = "no optics: the beam start plane lies inside the lens field";
            warnings.add(String.format(Locale.ROOT, "[beam] start_z_mm = %s mm lies inside the lens (usable %s .. %s mm); "
                    + "move it into the field-free entrance region", PlanCommand.num(Units.mToMm(e.startZ_m())),
                    PlanCommand.num(Units.mToMm(e.usableFromZ_m())), PlanCommand.num(Units.mToMm(e.usableToZ_m()))));
        }

        Optional<SpotSizeBudget.Inputs> spotInputs = Optional.empty();
        List<SpotSizeBudget.Row> spotRows = new ArrayList<>();
        if (aberrations.isPresent() && cardinal.isPresent()) {
            double tImage = cardinal.get().uImage_V() * Math.abs(stack.beam().particle().chargeNumber());
            SpotSizeBudget.Inputs in = new SpotSizeBudget.Inputs(aberrations.get().sphericalImage_m(),
                    aberrations.get().chromaticImage_m(), s.energySpread_eV() / tImage, 0, 0);
            spotInputs = Optional.of(in);
            for (double a : SPOT_ANGLES_RAD) {
                spotRows.add(SpotSizeBudget.at(in, a));
            }
        }

        stage(err, quiet, "tracing a meridional fan of rays for the picture");
        List<Trajectory> rays = List.of();
        String rayNote;
        try {
            PlanRays.Fan fan = PlanRays.trace(stack, field);
            rays = fan.rays();
            rayNote = fan.note();
        } catch (IllegalArgumentException e) {
            rayNote = "no rays drawn: " + e.getMessage();
            warnings.add(rayNote);
        }

        stage(err, quiet, "beam envelope");
        Optional<EnvelopeStudyResult> envelope = Optional.empty();
        double r0 = EnvelopeCommand.defaultRadius_m(stack);
        String envNote = String.format(Locale.ROOT, "round beam of %s uA, edge radius %s mm (a quarter of the smallest "
                + "bore), parallel, edge emittance %s mm mrad (geometric, at the start); set with --current and "
                + "--emittance", PlanCommand.num(s.current_A() * 1e6), PlanCommand.num(Units.mToMm(r0)),
                PlanCommand.num(s.emittance_m_rad() * 1e6));
        if (reflection.isEmpty()) {
            try {
                EnvelopeStudyResult env = new EnvelopeStudy().run(stack, field, new EnvelopeRequest(s.current_A(),
                        new EnvelopeStart.RadiusSlope(r0, 0, Emittance.edge(s.emittance_m_rad()))));
                envelope = Optional.of(env);
                for (EnvelopeWarning w : env.warnings()) {
                    warnings.add("envelope: " + w.message());
                }
            } catch (IllegalArgumentException | IllegalStateException e) {
                envNote += "; not computed: " + e.getMessage();
            }
        }

        Optional<TuneResult> tune = Optional.empty();
        String tuneNote;
        String name = s.tuneElectrode() != null ? s.tuneElectrode() : strongest(stack);
        if (stack.screenZ_m().isEmpty()) {
            tuneNote = "no [screen] plane in the stack: add one to get the focusing bias";
        } else if (name == null) {
            tuneNote = "every electrode is at 0 V: give one a bias (or --tune NAME) to get the focusing bias";
        } else {
            stage(err, quiet, "finding the biases of electrode " + name + " that focus on the screen");
            TuneResult t = new BiasTuner(solution, stack).focus(name, stack.screenZ_m().getAsDouble());
            tune = Optional.of(t);
            tuneNote = "biases of electrode " + name + " that image the " + (stack.beam().objectZ_m().isPresent()
                    ? "object point" : "parallel beam") + " onto the screen at z = "
                    + PlanCommand.num(Units.mToMm(stack.screenZ_m().getAsDouble())) + " mm (other biases as given), searched "
                    + PlanCommand.num(t.range().from_V()) + " .. " + PlanCommand.num(t.range().to_V()) + " V";
            if (!t.found()) {
                warnings.add("no bias of " + name + " in " + PlanCommand.num(t.range().from_V()) + " .. "
                        + PlanCommand.num(t.range().to_V()) + " V focuses on the screen");
            }
        }

        List<SweepPoint> sweep = List.of();
        if (name != null) {
            BiasRange range = tune.map(TuneResult::range).orElse(BiasRange.supplyDefault(stack.beam()));
            stage(err, quiet, "sweeping the bias of " + name + " over " + PlanCommand.num(range.from_V()) + " .. "
                    + PlanCommand.num(range.to_V()) + " V");
            sweep = BiasSweep.run(solution, stack, name, range.from_V(), range.to_V(), SWEEP_STEPS,
                    stack.beam().objectZ_m(), BiasSweep.Progress.NONE);
        }

        List<CheckResult> checks = List.of();
        if (s.runChecks()) {
            checks = VerificationSuite.run((i, n, caseName) -> {
                stage(err, quiet, String.format(Locale.ROOT, "verification %d/%d: %s", i + 1, n, caseName));
                return true;
            });
            if (!VerificationSuite.allPassed(checks)) {
                warnings.add("a built-in verification case is outside its tolerance: do not trust these numbers");
            }
        }
        return new LensPlan(stack, source, solution, field, reflection, cardinal, opticsNote, imaging, aberrations,
                spotInputs, spotRows, rays, rayNote, envelope, envNote, tune, tuneNote, Optional.ofNullable(name), sweep, checks, warnings,
                (System.nanoTime() - t0) * 1e-9);
    }

    /** The electrode with the largest |bias| relative to its neighbours' common potential (null if all are 0 V). */
    static String strongest(Stack stack) {
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
        double[] max = field.maxSurfaceFieldPerElectrode_V_per_m();
        for (int i = 0; i < max.length; i++) {
            SurfaceFieldCheck c = SurfaceFieldCheck.of(max[i], stack.limits());
            if (c.warning()) {
                warnings.add(String.format(Locale.ROOT, "electrode %s: surface field %s V/mm is above the %s limit "
                        + "(%s V/mm): round its edges, widen the gap or lower the bias", stack.electrodes().get(i).name(),
                        PlanCommand.num(Units.vPerMToVPerMm(max[i])),
                        c == SurfaceFieldCheck.ABOVE_AGGRESSIVE ? "aggressive" : "comfort",
                        PlanCommand.num(Units.vPerMToVPerMm(c == SurfaceFieldCheck.ABOVE_AGGRESSIVE
                                ? stack.limits().aggressive_V_per_m() : stack.limits().comfort_V_per_m()))));
            }
        }
    }

    private static void stage(PrintWriter err, boolean quiet, String what) {
        if (!quiet) {
            err.println("plan: " + what + " ...");
            err.flush();
        }
    }
}
