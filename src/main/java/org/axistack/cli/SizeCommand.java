package org.axistack.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;

import org.axistack.io.AtomicFiles;
import org.axistack.io.RequirementsReader;
import org.axistack.io.StackInputException;
import org.axistack.io.StackWriter;
import org.axistack.model.MeshSettings;
import org.axistack.model.Stack;
import org.axistack.report.ChartFiles;
import org.axistack.report.SafetyNotice;
import org.axistack.report.SizingFrontChart;
import org.axistack.size.Design;
import org.axistack.size.DesignEvaluator;
import org.axistack.size.Objective;
import org.axistack.size.Requirements;
import org.axistack.size.SearchSettings;
import org.axistack.size.SizingProgress;
import org.axistack.size.SizingResult;
import org.axistack.size.SizingStudy;
import org.axistack.size.TunerFocusFinder;

import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/**
 * {@code size REQUIREMENTS [--out DIR]}: searches a lens family for the geometry and bias that meet the
 * requirements, prints the chosen design, why it wins, the best design per objective, the trade-off front and the
 * machining tolerances, and writes each design as a ready stack file plus a PNG of the front. Exit 1 (naming the
 * limit that binds) when no design of the family meets the requirements.
 */
@Command(name = "size", mixinStandardHelpOptions = true,
        header = "Sizes a lens from requirements and writes ready stack files.",
        description = {"Sizes a lens from requirements: searches the family's dimensions (boundary-element solve per"
            + " geometry, focusing bias by the tuner, derivative-free optimiser), writes ready stack files and a chart."})
final class SizeCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Parameters(index = "0", paramLabel = "REQUIREMENTS", description = "Requirements file (TOML, lengths in mm).")
    Path file;

    @Option(names = "--out", paramLabel = "DIR", description = "Folder for the stack files and the chart (default: NAME-sized next to the working folder).")
    Path out;

    @Option(names = "--objective", paramLabel = "NAME", description = "Override the objective: spherical, chromatic, bias, field_margin or length.")
    String objective;

    @Option(names = "--evaluations", paramLabel = "N", description = "Override the number of candidate geometries.")
    Integer evaluations;

    @Option(names = "--threads", paramLabel = "N", description = "Worker threads (default: all cores).")
    Integer threads;

    @Option(names = "--quiet", description = "No progress bar on stderr.")
    boolean quiet;

    @Override
    public Integer call() throws StackInputException, IOException {
        Requirements req = RequirementsReader.read(file);
        OutputCheck.folder(spec.commandLine(), "--out", out != null ? out : Path.of(stem(file) + "-sized"), null);
        if (objective != null) {
            Objective o = Objective.byKeyword(objective);
            if (o == null) {
                throw new picocli.CommandLine.ParameterException(spec.commandLine(), "--objective must be one of"
                        + " spherical, chromatic, bias, field_margin, length (found '" + objective + "')");
            }
            req = req.withObjective(o);
        }
        SearchSettings s = req.search();
        if (evaluations != null || threads != null) {
            int e = evaluations == null ? s.evaluations() : evaluations;
            int t = threads == null ? s.threads() : threads;
            if (e < 4 || e > 5000 || t < 1 || t > 256) {
                throw new picocli.CommandLine.ParameterException(spec.commandLine(),
                        "--evaluations must be 4..5000 and --threads 1..256");
            }
            req = req.withSearch(new SearchSettings(e, s.meshElements(), s.finalElements(), s.biasSamples(), t));
        }
        PrintWriter w = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        SizingResult res = SizingStudy.run(req, new TunerFocusFinder(req.search().biasSamples() / 2), progress(err));
        Path dir = out != null ? out : Path.of(stem(file) + "-sized");
        w.printf(Locale.ROOT, "Sizing: %s%n  %s, %s at %.6g eV; %s; %d geometries in %.1f s, %d focusing designs, %d meet every limit%n",
                req.title(), req.family().description(), req.beam().particle().label(), req.beam().energy_eV(),
                target(req), res.candidates().size(), res.seconds(), res.designCount(), res.feasibleCount());
        if (res.infeasible().isPresent()) {
            String msg = SizeText.infeasible(w, req, res, res.infeasible().get());
            w.println();
            w.println(SafetyNotice.text());
            w.flush();
            throw new OutcomeException(msg);
        }
        if (res.winner().isEmpty()) {
            throw new OutcomeException("the best search design no longer focuses on the fine mesh; raise [search] mesh_elements");
        }
        Design win = res.winner().get();
        int sign = req.beam().particle().chargeSign();
        w.println();
        w.println("Chosen design (" + req.objective().description() + "):");
        w.println(req.objectZ_m().isPresent()
                ? "  (Cs and Cc are the object-side coefficients for this object, as 'optics' reports them)"
                : "  (Cs and Cc are the image-side coefficients for a parallel beam, as 'optics' reports them)");
        SizeText.design(w, win, sign);
        SizeText.checks(w, win);
        res.meshCheck().ifPresent(m -> SizeText.meshCheck(w, m));
        w.println();
        w.println("Why it wins:");
        for (String line : SizeText.why(req, win, res.reasons().orElseThrow())) {
            w.println("  " + line);
        }
        w.println();
        SizeText.tolerances(w, res.tolerances());
        SizeText.misalignment(w, misalignment(req, win));
        w.println();
        w.println("Best design per objective (fine mesh):");
        for (Map.Entry<Objective, Design> e : res.best().entrySet()) {
            Design d = e.getValue();
            w.printf(Locale.ROOT, "  %-32s bias %9.1f V  Cs %10.4g mm  Cc %9.4g mm  field %6.0f V/mm  length %7.4g mm%n",
                    e.getKey().description(), d.bias_V(), d.spherical_m() * 1e3, d.chromatic_m() * 1e3,
                    d.maxSurfaceField_V_per_m() / 1e3, d.length_m() * 1e3);
        }
        w.println();
        w.println("Trade-off front (search mesh; no other design is better in all of Cs, bias and surface field):");
        w.printf(Locale.ROOT, "  %10s %10s %12s %8s %10s  %s%n", "Cs_mm", "bias_V", "field_V_per_mm", "margin", "length_mm", "sizing parameters (mm)");
        for (Design d : res.front()) {
            StringBuilder p = new StringBuilder();
            for (int i = 0; i < d.parameters_m().size(); i++) {
                if (req.parameters().get(i).varied()) {
                    p.append(String.format(Locale.ROOT, "%s %.4g ", req.parameters().get(i).name(), d.parameters_m().get(i) * 1e3));
                }
            }
            w.printf(Locale.ROOT, "  %10.4g %10.1f %12.0f %8.2f %10.4g  %s%n", d.spherical_m() * 1e3, d.bias_V(),
                    d.maxSurfaceField_V_per_m() / 1e3, d.fieldMargin(), d.length_m() * 1e3, p.toString().trim());
        }
        w.println();
        List<String> written = write(req, res, dir);
        w.println("Written (stack files run with 'plan' or 'optics'):");
        written.forEach(x -> w.println("  " + x));
        w.println();
        w.println(SafetyNotice.text());
        w.flush();
        return 0;
    }

    private static String stem(Path p) {
        String n = p.getFileName().toString();
        return n.endsWith(".toml") ? n.substring(0, n.length() - 5) : n;
    }

    private static String target(Requirements r) {
        if (r.focalLength_m().isPresent()) {
            return String.format(Locale.ROOT, "focal length %.4g mm", r.focalLength_m().getAsDouble() * 1e3);
        }
        String img = String.format(Locale.ROOT, "image at z = %.4g mm", r.imageZ_m().getAsDouble() * 1e3);
        return r.objectZ_m().isPresent()
                ? String.format(Locale.ROOT, "object at z = %.4g mm, %s", r.objectZ_m().getAsDouble() * 1e3, img)
                : "parallel beam, " + img;
    }

    /**
     * The chosen design's decentre and tilt budget, as {@code misalign} computes it with its defaults (screen at the
     * image; focus electrode the biased one): one more solve on the final mesh; null when it cannot be computed.
     */
    private static org.axistack.optics.MisalignmentStudy misalignment(Requirements req, Design win) {
        DesignEvaluator ev = new DesignEvaluator(req, (a, b, c, d, e) -> new double[0]);
        Stack st = ev.stack(win.electrodes(), MeshSettings.defaults().withTargetElements(req.search().finalElements()));
        try {
            org.axistack.field.FieldSolution sol = org.axistack.field.BemSolver.solve(st.electrodes(), st.mesh(),
                    org.axistack.field.SolveProgress.NONE);
            return org.axistack.optics.MisalignmentStudy.run(st, sol, req.family().biasedElectrodes().get(0),
                    st.screenZ_m().orElseThrow(), org.axistack.optics.MisalignmentStudy.DEFAULT_ALLOWED_SHIFT_M,
                    Double.NaN, org.axistack.optics.MisalignmentStudy.DEFAULT_ALLOWED_GROWTH_M,
                    org.axistack.field.SolveProgress.NONE);
        } catch (RuntimeException e) {
            return null;
        }
    }

    private List<String> write(Requirements req, SizingResult res, Path dir) throws IOException {
        Files.createDirectories(dir);
        DesignEvaluator ev = new DesignEvaluator(req, (a, b, c, d, e) -> new double[0]);
        MeshSettings mesh = MeshSettings.defaults().withTargetElements(req.search().finalElements());
        Map<Design, String> names = new LinkedHashMap<>();
        names.put(res.winner().get(), "chosen.toml");
        for (Map.Entry<Objective, Design> e : res.best().entrySet()) {
            names.putIfAbsent(e.getValue(), "best-" + e.getKey().keyword() + ".toml");
        }
        List<String> written = new ArrayList<>();
        for (Map.Entry<Design, String> e : names.entrySet()) {
            Design d = e.getKey();
            Stack st = ev.stack(d.electrodes(), mesh);
            List<String> wins = res.best().entrySet().stream().filter(x -> x.getValue().equals(d))
                    .map(x -> x.getKey().keyword()).toList();
            String title = req.title() + " (sized: best for " + String.join(", ", wins) + ")";
            st = st.withTitle(title);
            Path p = AtomicFiles.inside(dir, e.getValue());
            StackWriter.write(st, p);
            written.add(p + "  (best for " + String.join(", ", wins) + ")");
        }
        List<Design> feasible = res.candidates().stream().flatMap(c -> c.designs().stream()).filter(Design::feasible).toList();
        Path png = AtomicFiles.inside(dir, "front.png");
        ChartFiles.writePng(SizingFrontChart.of("Sizing trade-off: " + req.title(), feasible, res.front(),
                res.winner().get()), 1000, 640, png);
        written.add(png + "  (Cs against bias, front coloured by surface-field margin)");
        return written;
    }

    private SizingProgress progress(PrintWriter err) {
        if (quiet) {
            return SizingProgress.NONE;
        }
        int[] last = {-1};
        return (stage, done, budget, best) -> {
            synchronized (last) {
                if (done != last[0]) {
                    last[0] = done;
                    int width = 30;
                    int filled = Math.min(width, (int) Math.round((double) width * done / Math.max(1, budget)));
                    err.printf(Locale.ROOT, "sizing [%s%s] %d/%d geometries, %s%n", "#".repeat(filled),
                            ".".repeat(width - filled), done, budget, stage);
                    err.flush();
                }
            }
            return true;
        };
    }
}
