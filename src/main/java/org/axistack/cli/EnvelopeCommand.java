package org.axistack.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.OptionalDouble;
import java.util.concurrent.Callable;
import org.axistack.model.PhysicsException;
import org.axistack.beam.CurrentScan;
import org.axistack.beam.Emittance;
import org.axistack.beam.EnvelopeProblem;
import org.axistack.beam.EnvelopeRequest;
import org.axistack.beam.EnvelopeSolver;
import org.axistack.beam.EnvelopeStart;
import org.axistack.beam.EnvelopeStudy;
import org.axistack.beam.EnvelopeStudyResult;
import org.axistack.beam.ScanResult;
import org.axistack.field.BemSolver;
import org.axistack.field.BiasedField;
import org.axistack.io.StackInputException;
import org.axistack.model.Units;
import org.axistack.model.Stack;
import org.axistack.plan.PlanAnalysis;
import org.axistack.report.ChartFiles;
import org.axistack.report.EnvelopeChart;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code envelope STACK --current A --emittance MM_MRAD [--json]}: beam envelope with emittance and space charge. */
@Command(name = "envelope", mixinStandardHelpOptions = true,
        header = "Beam envelope with emittance and space charge; bore fill.",
        description = {"Beam envelope through the solved lens with emittance and space charge"
            + " (round-beam envelope equation), compared with zero current and with zero"
            + " emittance; bore fill per electrode; optionally the waist against current.",
            "Emittance: edge (full) unless --rms, geometric at the start plane unless"
            + " --normalised. Without --radius-mm or --source-radius-mm the beam starts"
            + " parallel with a quarter of the narrowest open bore. Without STACK: the"
            + " built-in demo lens.", "Exit 1 when the beam hits an electrode or reflects."})
final class EnvelopeCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Mixin
    StackInput input;

    @Mixin
    QuietOption quiet;

    @Option(names = "--current", paramLabel = "A", required = true, description = "Beam current magnitude, A (>= 0).")
    double current_A;

    @Option(names = "--emittance", paramLabel = "MM_MRAD",
            description = "Emittance, mm mrad (edge, geometric at the start plane unless --rms/--normalised). "
                    + "Required unless --source-radius-mm gives it.")
    Double emittance_mm_mrad;

    @Option(names = "--rms", description = "The emittance is rms (edge = 4 x rms, KV-beam convention).")
    boolean rms;

    @Option(names = "--normalised", description = "The emittance is normalised (beta gamma x geometric).")
    boolean normalised;

    @Option(names = "--radius-mm", paramLabel = "MM", description = "Edge radius at the start plane, mm.")
    Double radius_mm;

    @Option(names = "--slope-mrad", paramLabel = "MRAD", description = "Envelope slope at the start plane, mrad (negative: converging). Default 0.")
    double slope_mrad;

    @Option(names = "--source-radius-mm", paramLabel = "MM",
            description = "Start from a source at the start plane: its radius, mm (a waist; emittance = radius x divergence).")
    Double sourceRadius_mm;

    @Option(names = "--divergence-mrad", paramLabel = "MRAD", description = "Source emission half-angle, mrad (with --source-radius-mm).")
    Double divergence_mrad;

    @Option(names = "--from-mm", paramLabel = "Z", description = "Start plane z, mm (default: the beam's start, else ahead of the first electrode).")
    Double from_mm;

    @Option(names = "--to-mm", paramLabel = "Z", description = "End plane z, mm (default: the screen, else well past the last electrode).")
    Double to_mm;

    @Option(names = "--near-fill", paramLabel = "FRACTION", description = "Warn when the envelope fills more than this fraction of a bore (default 0.7).")
    Double nearFill;

    @Option(names = "--scan-max-a", paramLabel = "A", description = "Scan the waist against current from 0 to this current, A (0: find the top automatically).")
    Double scanMax_A;

    @Option(names = "--scan-steps", paramLabel = "N", description = "Steps of the current scan (default 20).")
    int scanSteps = 20;

    @Option(names = "--scan-csv", paramLabel = "FILE", description = "Write the current scan as CSV.")
    Path scanCsv;

    @Option(names = "--scan-png", paramLabel = "FILE", description = "Draw the current scan as PNG.")
    Path scanPng;

    @Option(names = "--csv", paramLabel = "FILE", description = "Write the envelope table (all three cases) as CSV.")
    Path csv;

    @Option(names = "--png", paramLabel = "FILE", description = "Draw the envelope with the electrodes as PNG.")
    Path png;

    @Mixin
    JsonOption json;

    @Override
    public Integer call() throws StackInputException {
        CommandLine cl = spec.commandLine();
        Stack stack = input.loadOrDemo();
        OutputCheck.file(cl, "--csv", csv);
        OutputCheck.file(cl, "--png", png);
        OutputCheck.file(cl, "--scan-csv", scanCsv);
        OutputCheck.file(cl, "--scan-png", scanPng);
        EnvelopeRequest req = request(stack, cl);
        EnvelopeSolver solver = new EnvelopeSolver(nearFill == null ? org.axistack.beam.EnvelopeSettings.defaults()
                : checked(cl, () -> org.axistack.beam.EnvelopeSettings.defaults().withNearFill(nearFill)));
        PrintWriter err = cl.getErr();
        BiasedField field = BemSolver.solve(stack.electrodes(), stack.mesh(), SolveReporter.to(err, quiet.on())).withBiases(stack.biases_V());
        EnvelopeStudy study = new EnvelopeStudy(solver);
        EnvelopeStudyResult res = checked(cl, () -> study.run(stack, field, req, StageReporter.to(err, quiet.on(), "envelope")));
        ScanResult scan = null;
        if (scanMax_A != null || scanCsv != null || scanPng != null) {
            scan = scan(cl, stack, field, req, solver, err);
        }
        writeFiles(cl, stack, res, scan);
        PrintWriter out = cl.getOut();
        if (json.on()) {
            out.println(EnvelopeOutput.json(stack, res, scan));
        } else {
            EnvelopeOutput.text(out, input.shownAs(), stack, res, scan);
        }
        if (res.blocking()) {
            throw new OutcomeException("envelope: " + res.warnings().stream().filter(w -> w.kind().blocking())
                    .map(w -> w.message()).findFirst().orElse("see the warnings"));
        }
        return 0;
    }

    private ScanResult scan(CommandLine cl, Stack stack, BiasedField field, EnvelopeRequest req, EnvelopeSolver solver,
            PrintWriter err) {
        CurrentScan cs = new CurrentScan(solver);
        EnvelopeProblem base = EnvelopeStudy.problem(stack, field, req);
        var ch = EnvelopeStudy.channel(stack, field);
        double top;
        if (scanMax_A == null || scanMax_A == 0) {
            OptionalDouble bound = cs.findVanishingBound(ch, base, 1e3);
            if (bound.isEmpty()) {
                throw new CommandLine.ParameterException(cl, "--scan-max-a: the waist stays in the range up to 1000 A; "
                        + "give the top of the scan with --scan-max-a A");
            }
            top = bound.getAsDouble();
        } else {
            top = scanMax_A;
        }
        return checked(cl, () -> cs.scan(ch, base, top, scanSteps, f -> {
            if (!json.on()) {
                err.printf(java.util.Locale.ROOT, "\rcurrent scan %3.0f %%", 100 * f);
                if (f >= 1) {
                    err.println();
                }
                err.flush();
            }
        }));
    }

    private EnvelopeRequest request(Stack stack, CommandLine cl) {
        return checked(cl, () -> {
            EnvelopeStart start;
            if (sourceRadius_mm != null) {
                if (radius_mm != null || emittance_mm_mrad != null) {
                    throw new IllegalArgumentException("--source-radius-mm sets the start radius and the emittance "
                            + "(radius x divergence); drop --radius-mm and --emittance, or drop the source options");
                }
                if (divergence_mrad == null) {
                    throw new IllegalArgumentException("--source-radius-mm needs --divergence-mrad (the emission half-angle)");
                }
                start = new EnvelopeStart.Source(Units.mmToM(sourceRadius_mm), Units.mradToRad(divergence_mrad));
            } else {
                if (emittance_mm_mrad == null) {
                    throw new IllegalArgumentException("give --emittance MM_MRAD (0 for a laminar beam), "
                            + "or start from a source with --source-radius-mm and --divergence-mrad");
                }
                double r = radius_mm != null ? Units.mmToM(radius_mm) : PlanAnalysis.defaultEnvelopeRadius_m(stack);
                Emittance e = new Emittance(emittance_mm_mrad * 1e-6, rms ? Emittance.Measure.RMS : Emittance.Measure.EDGE,
                        normalised ? Emittance.Frame.NORMALISED : Emittance.Frame.GEOMETRIC_AT_START);
                start = new EnvelopeStart.RadiusSlope(r, Units.mradToRad(slope_mrad), e);
            }
            return new EnvelopeRequest(current_A, start,
                    from_mm == null ? OptionalDouble.empty() : OptionalDouble.of(Units.mmToM(from_mm)),
                    to_mm == null ? OptionalDouble.empty() : OptionalDouble.of(Units.mmToM(to_mm)));
        });
    }

    private void writeFiles(CommandLine cl, Stack stack, EnvelopeStudyResult res, ScanResult scan) {
        try {
            if (csv != null) {
                EnvelopeOutput.writeEnvelopeCsv(csv, res);
            }
            if (png != null) {
                ChartFiles.writePng(EnvelopeChart.envelope(stack, res), 1100, 600, png);
            }
            if (scan != null && scanCsv != null) {
                EnvelopeOutput.writeScanCsv(scanCsv, scan);
            }
            if (scan != null && scanPng != null) {
                ChartFiles.writePng(EnvelopeChart.scan(scan), 1000, 560, scanPng);
            }
        } catch (IOException e) {
            throw new CommandLine.ParameterException(cl, "cannot write an output file (" + e.getMessage()
                    + "); choose a path in a folder you can write to");
        }
    }

    /** Turns the physics layer's IllegalArgumentException into a usage error naming the fix. */
    private static <T> T checked(CommandLine cl, java.util.function.Supplier<T> s) {
        try {
            return s.get();
        } catch (IllegalArgumentException | PhysicsException e) {
            throw new CommandLine.ParameterException(cl, e.getMessage());
        }
    }
}
