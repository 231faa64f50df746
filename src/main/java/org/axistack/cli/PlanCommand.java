package org.axistack.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.axistack.io.StackInputException;
import org.axistack.model.Units;
import org.axistack.model.Beam;
import org.axistack.model.Electrode;
import org.axistack.model.GeometryCheck;
import org.axistack.model.Stack;
import org.axistack.optics.CardinalElements;
import org.axistack.plan.PlanAnalysis;
import org.axistack.report.PlanFolder;
import org.axistack.plan.PlanFormat;
import org.axistack.plan.LensPlan;
import org.axistack.report.SafetyNotice;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/**
 * {@code plan [STACK] [--out DIR]}: the main job. Solves the field once, then the paraxial optics, aberrations,
 * spot-size budget, surface fields, a ray fan, the envelope, the focusing bias and the verification cases; prints a
 * summary and writes the HTML report with figures and CSV tables to DIR. Exit 1 when the beam is reflected or the
 * lens has no real focus (the report is still written).
 */
@Command(name = "plan", mixinStandardHelpOptions = true,
        header = "The main job: a complete lens plan with its own verification.",
        description = {"Solves STACK (the built-in demo lens when omitted) and reports the cardinal elements, the image of the"
            + " stack's object, Cs and Cc, a spot-size budget, the bias of the strongest electrode that focuses on the"
            + " screen, electrode surface fields against the limits, the beam envelope and warnings; runs the built-in"
            + " verification cases; writes DIR/report.html with figures (PNG, SVG) and CSV tables beside it.",
            "Exit 1 when the beam is reflected or the lens does not focus (the report is still written)."})
final class PlanCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Mixin
    StackInput input;

    @Option(names = "--out", paramLabel = "DIR", defaultValue = "plan-out",
            description = "Folder for the report and its files (created if missing; default ${DEFAULT-VALUE}).")
    Path out;

    @Option(names = "--energy-spread", paramLabel = "EV", defaultValue = "1",
            description = "Full energy spread of the beam for the chromatic disc, eV (default ${DEFAULT-VALUE}).")
    double energySpread_eV;

    @Option(names = "--current", paramLabel = "A", defaultValue = "1e-5",
            description = "Beam current for the envelope, A (default ${DEFAULT-VALUE}).")
    double current_A;

    @Option(names = "--emittance", paramLabel = "MM_MRAD", defaultValue = "1",
            description = "Edge emittance for the envelope, mm mrad, geometric at the start (default ${DEFAULT-VALUE}).")
    double emittance_mm_mrad;

    @Option(names = "--tune", paramLabel = "NAME",
            description = "Electrode whose bias is tuned to focus on the screen (default: the one with the largest |bias|).")
    String tune;

    @Option(names = "--depth-mm", paramLabel = "D", defaultValue = "0.1",
            description = "Depth of focus for the supply-stability budget: the focus is held on the screen within"
                    + " +/- D mm (default ${DEFAULT-VALUE}).")
    double depth_mm;

    @Option(names = "--brightness", paramLabel = "B",
            description = "Reduced brightness of the source, A/(m^2 sr V): adds the probe size against current (FW50 at the"
                    + " optimum aperture angle, dominant term) at the given and the focusing biases to the plan; the"
                    + " energy spread is taken as the source's FWHM.")
    Double brightness;

    @Mixin
    OffAxisOptions offAxis;

    @Option(names = "--misalign", description = "Add the decentre and tilt budget of every electrode (as 'misalign'"
            + " computes it with its defaults: 0.05 mm at the screen, 0.01 mm spot growth) to the plan.")
    boolean misalign;

    @Option(names = "--no-check", description = "Skip the built-in verification cases (faster; the report says so).")
    boolean noCheck;

    @Option(names = {"-q", "--quiet"}, description = "No progress lines on the error stream.")
    boolean quiet;

    @Override
    public Integer call() throws StackInputException {
        Stack stack = input.loadOrDemo();
        CommandLine cl = spec.commandLine();
        if (!(energySpread_eV >= 0) || !(current_A >= 0) || !(emittance_mm_mrad >= 0) || !Double.isFinite(
                energySpread_eV + current_A + emittance_mm_mrad)) {
            throw new CommandLine.ParameterException(cl, "--energy-spread, --current and --emittance must be finite "
                    + "and >= 0");
        }
        if (!(depth_mm > 0) || !Double.isFinite(depth_mm)) {
            throw new CommandLine.ParameterException(cl, "--depth-mm must be a positive number of mm");
        }
        if (brightness != null && !(brightness > 0 && Double.isFinite(brightness))) {
            throw new CommandLine.ParameterException(cl, "--brightness must be a positive number of A/(m^2 sr V), got "
                    + brightness);
        }
        offAxis.check(cl);
        if (tune != null && stack.indexOf(tune) < 0) {
            throw new CommandLine.ParameterException(cl, "--tune " + tune + ": no electrode of that name; the stack has "
                    + String.join(", ", stack.names()));
        }
        OutputCheck.folder(cl, "--out", out, org.axistack.report.HtmlReport.FILE);
        PrintWriter w = cl.getOut();
        PrintWriter err = cl.getErr();
        LensPlan plan = PlanAnalysis.solveAndRun(stack, input.shownAs(), new PlanAnalysis.Settings(energySpread_eV,
                current_A, emittance_mm_mrad * 1e-6, tune, !noCheck, Units.mmToM(depth_mm),
                brightness == null ? java.util.OptionalDouble.empty() : java.util.OptionalDouble.of(brightness),
                offAxis.height_m(), offAxis.aperture_rad(), misalign),
                SolveReporter.to(err, quiet), progressLines(err, quiet));
        summary(w, stack, input.shownAs());
        PlanSummary.print(w, plan);
        if (offAxis.given() && plan.offAxis().isEmpty()) {
            w.println("Off-axis aberrations: " + plan.offAxisNote());
        }
        Path html;
        try {
            html = PlanFolder.write(plan, out);
        } catch (org.axistack.io.OutputPathException e) {
            throw new CommandLine.ParameterException(cl, "--out: " + e.getMessage());
        } catch (IOException | java.io.UncheckedIOException e) {
            throw new CommandLine.ParameterException(cl,
                    "--out " + out + ": cannot write there (" + e.getMessage() + "); choose a folder you can write to");
        }
        w.println();
        w.println("Report: " + html.toAbsolutePath().normalize() + " (figures and CSV tables beside it)");
        w.println();
        w.println(SafetyNotice.text());
        if (plan.needsAction()) {
            throw new OutcomeException(plan.reflection().isPresent()
                    ? "the beam is reflected (see the report): lower the retarding bias or raise the beam energy"
                    : plan.cardinal().map(CardinalElements::notFocusingStatement).orElse(plan.optics())
                            + "; change the biases (e.g. with --set) to get a real focus");
        }
        return 0;
    }

    static void summary(PrintWriter w, Stack s, String source) {
        w.println("Stack: " + (s.title().isBlank() ? "(untitled)" : s.title()));
        w.println("  from " + source);
        Beam b = s.beam();
        w.println(String.format(Locale.ROOT, "Beam: %s, kinetic energy %s eV where the potential is 0 V", b.particle().label(),
                num(b.energy_eV())));
        w.println("  object: " + (b.objectZ_m().isPresent()
                ? "axial point at z = " + num(Units.mToMm(b.objectZ_m().getAsDouble())) + " mm"
                : "at infinity (parallel beam)")
                + "; rays start at " + (b.startZ_m().isPresent()
                ? "z = " + num(Units.mToMm(b.startZ_m().getAsDouble())) + " mm" : "the stack's left end"));
        w.println("Electrodes (" + s.electrodes().size() + "):");
        w.println(String.format(Locale.ROOT, "  %-14s %-9s %10s %10s %10s %9s %9s", "name", "shape", "bias_V",
                "z_from_mm", "z_to_mm", "r_min_mm", "r_max_mm"));
        for (Electrode e : s.electrodes()) {
            w.println(String.format(Locale.ROOT, "  %-14s %-9s %10s %10s %10s %9s %9s", e.name(), e.shape(),
                    num(e.bias_V()), num(Units.mToMm(e.contour().minZ_m())), num(Units.mToMm(e.contour().maxZ_m())),
                    num(Units.mToMm(e.contour().minR_m())), num(Units.mToMm(e.contour().maxR_m()))));
        }
        gaps(w, s);
        w.println("Screen: " + (s.screenZ_m().isPresent()
                ? "z = " + num(Units.mToMm(s.screenZ_m().getAsDouble())) + " mm" : "none"));
        w.println("Mesh: about " + s.mesh().targetElements() + " boundary elements, " + s.mesh().edgeLevels()
                + " refinement levels toward edges");
        w.println("Surface-field limits: comfort " + num(Units.vPerMToVPerMm(s.limits().comfort_V_per_m()))
                + " V/mm, aggressive " + num(Units.vPerMToVPerMm(s.limits().aggressive_V_per_m())) + " V/mm");
    }

    /** The neighbouring pair at different biases with the largest gap voltage per gap length. */
    private static void gaps(PrintWriter w, Stack s) {
        double worst = -1, gapMm = 0, dv = 0;
        String pair = null;
        for (int i = 0; i < s.electrodes().size(); i++) {
            for (int j = i + 1; j < s.electrodes().size(); j++) {
                Electrode a = s.electrodes().get(i), c = s.electrodes().get(j);
                double v = Math.abs(a.bias_V() - c.bias_V());
                if (v == 0) {
                    continue;
                }
                double g = Units.mToMm(GeometryCheck.gap_m(a, c));
                if (v / g > worst) {
                    worst = v / g;
                    gapMm = g;
                    dv = v;
                    pair = a.name() + " / " + c.name();
                }
            }
        }
        if (pair != null) {
            w.println(String.format(Locale.ROOT,
                    "Largest gap stress: %s, %s V across %s mm = %s V/mm (voltage over the shortest gap; "
                            + "edge fields are higher)", pair, num(dv), num(gapMm), num(worst)));
        }
    }

    static String num(double x) {
        return PlanFormat.num(x);
    }

    /**
     * Plan progress on the error stream: a line per stage, and inside a long stage the share of the plan done at most
     * once a second; cancels (the plan throws CancellationException) when this thread is interrupted.
     */
    static PlanAnalysis.Progress progressLines(PrintWriter err, boolean quiet) {
        Thread owner = Thread.currentThread();
        long[] last = {System.nanoTime()};
        return new PlanAnalysis.Progress() {
            @Override
            public boolean stage(String what, double fraction) {
                if (!quiet) {
                    err.println("plan: " + what + " ...");
                    err.flush();
                }
                last[0] = System.nanoTime();
                return !owner.isInterrupted();
            }

            @Override
            public boolean within(double fraction) {
                long now = System.nanoTime();
                if (!quiet && now - last[0] > 1_000_000_000L) {
                    last[0] = now;
                    err.printf(java.util.Locale.ROOT, "plan: %d %% done%n", (int) Math.floor(100 * fraction));
                    err.flush();
                }
                return !owner.isInterrupted();
            }
        };
    }
}
