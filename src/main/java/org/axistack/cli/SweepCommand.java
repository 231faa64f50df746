package org.axistack.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.OptionalDouble;
import java.util.concurrent.Callable;

import org.axistack.field.BemSolver;
import org.axistack.field.FieldSolution;
import org.axistack.io.AtomicFiles;
import org.axistack.io.StackInputException;
import org.axistack.io.SweepTableCsv;
import org.axistack.model.Units;
import org.axistack.model.Stack;
import org.axistack.report.ChartFiles;
import org.axistack.report.SafetyNotice;
import org.axistack.report.SweepChart;
import org.axistack.tune.BiasSweep;
import org.axistack.tune.SweepPoint;


import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/**
 * {@code sweep STACK --vary NAME --from V1 --to V2 --steps N [--csv FILE] [--png FILE]}: optical properties against
 * one bias, computed as the optics command does, in parallel, with a progress bar on standard error. One field
 * solve, then re-biasing only.
 */
@Command(name = "sweep", mixinStandardHelpOptions = true,
        header = "Optics against one electrode's bias: table, CSV and chart.",
        description = {"Focal lengths, focal points, principal planes, image position and magnification, Cs and Cc"
            + " against the bias of electrode NAME (N steps from V1 to V2), as a table, a CSV file and a PNG chart.",
            "The field is solved once; every point re-biases the stored unit solutions."})
final class SweepCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Mixin
    StackInput input;

    @Option(names = "--vary", paramLabel = "NAME", required = true, description = "Electrode whose bias is swept.")
    String vary;

    @Option(names = "--from", paramLabel = "V1", required = true, description = "First bias, V.")
    double from_V;

    @Option(names = "--to", paramLabel = "V2", required = true, description = "Last bias, V.")
    double to_V;

    @Option(names = "--steps", paramLabel = "N", defaultValue = "50", description = "Number of steps (N + 1 points; default 50, at most 100000).")
    int steps;

    @Option(names = "--object-z", paramLabel = "Z",
            description = "Axial object position, mm, for image position and magnification (default: the stack's [beam] object).")
    Double objectZ_mm;

    @Option(names = "--csv", paramLabel = "FILE", description = "Write every point to this CSV file.")
    Path csv;

    @Option(names = "--png", paramLabel = "FILE", description = "Write a chart of the sweep to this PNG file.")
    Path png;

    @Mixin
    JsonOption json;

    @Mixin
    QuietOption quiet;

    @Override
    public Integer call() throws StackInputException, IOException {
        CommandLine cl = spec.commandLine();
        Stack stack = input.loadOrDemo();
        if (stack.indexOf(vary) < 0) {
            throw new CommandLine.ParameterException(cl, "--vary " + vary + ": no such electrode in " + input.shownAs()
                    + "; choose one of " + String.join(", ", stack.names()));
        }
        if (!Double.isFinite(from_V) || !Double.isFinite(to_V) || from_V == to_V) {
            throw new CommandLine.ParameterException(cl, "--from and --to must be different numbers of volts");
        }
        if (steps < 1 || steps > 100000) {
            throw new CommandLine.ParameterException(cl, "--steps must be 1..100000");
        }
        OutputCheck.file(cl, "--csv", csv);
        OutputCheck.file(cl, "--png", png);
        OptionalDouble objectZ = objectZ_mm != null ? OptionalDouble.of(Units.mmToM(objectZ_mm)) : stack.beam().objectZ_m();
        PrintWriter err = cl.getErr();
        boolean silent = quiet.on();
        FieldSolution sol = BemSolver.solve(stack.electrodes(), stack.mesh(), SolveReporter.to(err, silent));
        long t0 = System.nanoTime();
        ProgressBar bar = new ProgressBar(err, silent);
        List<SweepPoint> points = BiasSweep.run(sol, stack, vary, from_V, to_V, steps, objectZ, bar::update);
        bar.finish();
        double seconds = (System.nanoTime() - t0) * 1e-9;
        if (csv != null) {
            AtomicFiles.writeString(csv, SweepTableCsv.text(points));
        }
        if (png != null) {
            ChartFiles.writePng(SweepChart.of(stack, vary, points, "Sweep of " + vary + ": " + stack.title()), 1000, 720, png);
        }
        PrintWriter out = cl.getOut();
        if (json.on()) {
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("stack", input.shownAs());
            m.put("electrode", vary);
            m.put("object_z_mm", objectZ.isPresent() ? Units.mToMm(objectZ.getAsDouble()) : null);
            m.put("sweep_seconds", seconds);
            List<Map<String, Object>> rows = new ArrayList<>();
            for (SweepPoint p : points) {
                Object[] r = SweepTableCsv.row(p);
                Map<String, Object> row = new LinkedHashMap<>();
                for (int i = 0; i < SweepTableCsv.HEADER.size(); i++) {
                    row.put(SweepTableCsv.HEADER.get(i), r[i]);
                }
                rows.add(row);
            }
            m.put("points", rows);
            out.println(JsonOption.text(m));
        } else {
            text(out, stack, points, seconds, objectZ);
        }
        out.flush();
        return 0;
    }

    private void text(PrintWriter w, Stack stack, List<SweepPoint> points, double seconds, OptionalDouble objectZ) {
        long ok = points.stream().filter(SweepPoint::ok).count();
        w.printf(Locale.ROOT, "Sweep of '%s' in %s: %d points from %s to %s V in %.2f s after the field solve (%d cores)%n",
                vary, input.shownAs(), points.size(), PlanCommand.num(from_V), PlanCommand.num(to_V), seconds,
                Runtime.getRuntime().availableProcessors());
        w.printf(Locale.ROOT, "  %s, %s eV; %d points with optics, %d where the beam turns back or has no usable planes%n",
                stack.beam().particle().label(), PlanCommand.num(stack.beam().energy_eV()), ok, points.size() - ok);
        int every = Math.max(1, (points.size() + 39) / 40);
        w.printf(Locale.ROOT, "  %11s %10s %10s %10s %10s %10s %10s %12s %12s%s%n", "bias_V", "f1_mm", "f2_mm",
                "F1_z_mm", "F2_z_mm", "H1_z_mm", "H2_z_mm", "Cs_mm", "Cc_mm",
                objectZ.isPresent() ? "   image_z_mm  magnif." : "");
        for (int i = 0; i < points.size(); i += every) {
            SweepPoint p = points.get(i);
            if (!p.ok()) {
                w.printf(Locale.ROOT, "  %11.4f %s%n", p.bias_V(), p.status());
                continue;
            }
            w.printf(Locale.ROOT, "  %11.4f %10s %10s %10s %10s %10s %10s %12s %12s%s%n", p.bias_V(),
                    g(p.focalLengthObject_m()), g(p.focalLengthImage_m()), g(p.focalPointObjectZ_m()),
                    g(p.focalPointImageZ_m()), g(p.principalPlaneObjectZ_m()), g(p.principalPlaneImageZ_m()),
                    g(p.sphericalAberration_m()),
                    g(p.chromaticAberration_m()), objectZ.isPresent()
                            ? String.format(Locale.ROOT, " %12s %8s", g(p.imageZ_m()), f(p.magnification())) : "");
        }
        if (every > 1) {
            w.println("  (every " + every + "th point shown; --csv writes all)");
        }
        if (csv != null) {
            w.println("  CSV: " + csv);
        }
        if (png != null) {
            w.println("  chart: " + png);
        }
        w.println();
        w.println(SafetyNotice.text());
    }

    private static String g(double m) {
        return f(Units.mToMm(m));
    }

    private static String f(double x) {
        // five significant digits in plain notation up to 1e7 (one notation down the column)
        return Double.isFinite(x) ? org.axistack.model.Rounding.sig(x, 5) : "-";
    }

    /** A one-line progress bar on standard error, redrawn in place at each whole percent. */
    static final class ProgressBar {
        private final PrintWriter err;
        private final boolean silent;
        private int lastPercent = -1;

        ProgressBar(PrintWriter err, boolean silent) {
            this.err = err;
            this.silent = silent;
        }

        synchronized boolean update(int done, int total) {
            int percent = (int) (100L * done / total);
            if (!silent && percent != lastPercent) {
                lastPercent = percent;
                int filled = percent / 4;
                err.print("\rsweep [" + "#".repeat(filled) + ".".repeat(25 - filled) + "] " + percent + "% (" + done + "/" + total + ")");
                err.flush();
            }
            return true;
        }

        void finish() {
            if (!silent) {
                err.println();
                err.flush();
            }
        }
    }
}
