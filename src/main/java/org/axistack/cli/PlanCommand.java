package org.axistack.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.axistack.io.AtomicFiles;
import org.axistack.io.StackInputException;
import org.axistack.io.Units;
import org.axistack.model.Beam;
import org.axistack.model.Electrode;
import org.axistack.model.GeometryCheck;
import org.axistack.model.Stack;
import org.axistack.report.ChartFiles;
import org.axistack.report.GeometryChart;
import org.axistack.report.SafetyNotice;
import org.jfree.chart.JFreeChart;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code plan [STACK] [--out DIR]}: the main job. So far: load, validate, summarise, draw the geometry. */
@Command(name = "plan", mixinStandardHelpOptions = true,
        description = {"The main job: check a lens stack, summarise it, draw its geometry.",
            "",
            "Loads and validates STACK (the built-in demo lens when omitted), prints the beam, the electrodes "
                    + "and the largest voltage per gap length, and the high-voltage cautions. With --out it "
                    + "writes the meridian cross-section to DIR/geometry.png and DIR/geometry.svg."})
final class PlanCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Mixin
    StackInput input;

    @Option(names = "--out", paramLabel = "DIR", description = "Folder for the output files (created if missing).")
    Path out;

    @Override
    public Integer call() throws StackInputException {
        Stack stack = input.loadOrDemo();
        PrintWriter w = spec.commandLine().getOut();
        summary(w, stack, input.shownAs());
        if (out != null) {
            writeGeometry(stack, w);
        }
        w.println();
        w.println(SafetyNotice.text());
        return 0;
    }

    private void writeGeometry(Stack stack, PrintWriter w) {
        try {
            if (Files.exists(out) && !Files.isDirectory(out)) {
                throw new IOException("it exists and is not a folder");
            }
            Files.createDirectories(out);
            JFreeChart chart = GeometryChart.create(stack);
            int[] size = GeometryChart.preferredSize(stack);
            Path png = AtomicFiles.inside(out, "geometry.png");
            Path svg = AtomicFiles.inside(out, "geometry.svg");
            ChartFiles.writePng(chart, size[0], size[1], png);
            ChartFiles.writeSvg(chart, size[0], size[1], svg);
            w.println();
            w.println("Geometry picture: " + png + " and " + svg);
        } catch (IOException e) {
            throw new CommandLine.ParameterException(spec.commandLine(),
                    "--out " + out + ": cannot write there (" + e.getMessage() + "); choose a folder you can write to");
        }
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
        if (x == Math.rint(x) && Math.abs(x) < 1e12) {
            return String.valueOf((long) x);
        }
        return String.format(Locale.ROOT, "%.5g", x).replaceAll("(\\.\\d*?)0+$", "$1").replaceAll("\\.$", "");
    }
}
