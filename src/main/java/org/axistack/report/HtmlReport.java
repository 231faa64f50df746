package org.axistack.report;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.ZonedDateTime;
import java.time.format.DateTimeFormatter;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;

import org.axistack.io.AtomicFiles;
import org.axistack.io.StackWriter;
import org.axistack.model.Units;
import org.axistack.model.Stack;
import org.axistack.plan.LensPlan;
import org.axistack.trace.RayPoint;
import org.axistack.trace.Trajectory;
import org.axistack.tune.SurfaceFieldCheck;
import org.axistack.verify.CheckResult;
import org.jfree.chart.JFreeChart;

/**
 * The lens plan as one self-contained HTML file (inline CSS, no external links) with PNG/SVG figures and CSV tables
 * beside it in the output folder. Every file is written atomically and only inside that folder.
 */
public final class HtmlReport {

    /** Name of the HTML file in the output folder. */
    public static final String FILE = "report.html";

    private static final String CSS = """
            body{font-family:Helvetica,Arial,sans-serif;margin:24px auto;max-width:1180px;color:#222;background:#fff;
            line-height:1.4}h1{font-size:24px;border-bottom:3px solid #3a7d44;padding-bottom:6px}h2{font-size:18px;
            margin-top:28px;color:#2b5d33}table{border-collapse:collapse;margin:8px 0;font-size:13px}
            th,td{border:1px solid #d5d1c8;padding:3px 8px;text-align:left;vertical-align:top}th{background:#efece4}
            td.caution{background:#f4c04e}td.over{background:#a8321e;color:#fff;font-weight:bold}.caution{border:2px solid #b33a1f;background:#fbefe9;
            padding:8px 16px;margin:12px 0}.caution h2{color:#b33a1f;margin-top:4px}.warn{background:#fff4d6;
            border-left:4px solid #c99a1c;padding:6px 12px}.ok{background:#e8f3e6;border-left:4px solid #3a7d44;
            padding:6px 12px}pre{background:#f6f4ef;padding:8px;font-size:12px;overflow-x:auto}img{max-width:100%;
            border:1px solid #e4e1da}.note{color:#555;font-size:13px}
            """;

    private HtmlReport() {
    }

    /** Writes the report and its figures and tables into {@code dir} (created if missing); returns the HTML path. */
    public static Path write(LensPlan plan, Path dir, Map<String, String> extraTables) throws IOException {
        if (Files.exists(dir) && !Files.isDirectory(dir)) {
            throw new IOException(dir + " exists and is not a folder");
        }
        Files.createDirectories(dir);
        Stack stack = plan.stack();
        List<String> files = new ArrayList<>();
        // figures
        List<List<double[]>> paths = new ArrayList<>();
        for (Trajectory t : plan.rays()) {
            List<double[]> p = new ArrayList<>();
            for (RayPoint q : t.path()) {
                p.add(new double[] {q.z_m(), q.x_m()});
            }
            paths.add(p);
        }
        JFreeChart geo = GeometryChart.withRays(stack, paths, plan.rays().isEmpty() ? "" : "rays: " + shortNote(plan.rayNote()));
        int[] size = GeometryChart.preferredSize(stack);
        figure(geo, size[0], size[1], dir, "geometry", files);
        double[][] axial = PlanTables.axialSamples(plan);
        figure(AxialChart.create("Axial potential and its derivatives at the stack's biases", axial[0],
                new double[][] {axial[1], axial[2], axial[3]}), 1200, 760, dir, "axial", files);
        if (plan.envelope().isPresent()) {
            figure(EnvelopeChart.envelope(stack, plan.envelope().get()), 1200, 520, dir, "envelope", files);
        }
        if (!plan.sweep().isEmpty() && plan.sweepElectrode().isPresent()) {
            String swept = plan.sweepElectrode().get();
            List<Double> focus = plan.tune().filter(t -> t.electrode().equals(swept))
                    .map(t -> t.solutions().stream().map(org.axistack.tune.FocusSolution::bias_V).toList())
                    .orElse(List.of());
            figure(SweepChart.of(stack, swept, plan.sweep(), "Optics against the bias of " + swept, focus), 1200, 760,
                    dir, "sweep", files);
        }
        if (plan.probe().isPresent()) {
            org.axistack.probe.ProbeStudy probe = plan.probe().get();
            if (probe.curves().stream().anyMatch(c -> !c.points().isEmpty())) {
                figure(ProbeChart.of(probe, "Probe current against size: " + stack.title()), 1000, 700, dir, "probe", files);
            }
            AtomicFiles.writeString(AtomicFiles.inside(dir, "probe.csv"), org.axistack.io.ProbeTableCsv.text(probe));
            files.add("probe.csv");
        }
        if (plan.misalignment().isPresent()) {
            AtomicFiles.writeString(AtomicFiles.inside(dir, "misalignment.csv"),
                    org.axistack.io.AlignmentTableCsv.text(plan.misalignment().get().budget()));
            files.add("misalignment.csv");
        }
        // tables
        for (var t : extraTables.entrySet()) {
            AtomicFiles.writeString(AtomicFiles.inside(dir, t.getKey()), t.getValue());
            files.add(t.getKey());
        }
        for (var t : PlanTables.csvTables(plan, axial).entrySet()) {
            AtomicFiles.writeString(AtomicFiles.inside(dir, t.getKey()), t.getValue());
            files.add(t.getKey());
        }
        AtomicFiles.writeString(AtomicFiles.inside(dir, "stack.toml"), StackWriter.toToml(stack));
        files.add("stack.toml");
        Path html = AtomicFiles.inside(dir, FILE);
        AtomicFiles.writeString(html, embedFigures(html(plan, files), dir));
        return html;
    }

    private static String shortNote(String s) {
        int i = s.indexOf(';');
        return i > 0 ? s.substring(0, i) : s;
    }

    private static final java.util.regex.Pattern FIGURE = java.util.regex.Pattern.compile("<img src=\"([a-z_]+\\.png)\"");

    /**
     * The report as one file that can be mailed: every figure it shows is embedded as a PNG data URI (the same
     * bytes as the PNG file written beside it, which stays for slides and the SVG for print).
     */
    static String embedFigures(String html, Path dir) throws IOException {
        java.util.regex.Matcher m = FIGURE.matcher(html);
        StringBuilder out = new StringBuilder(html.length());
        while (m.find()) {
            byte[] png = Files.readAllBytes(dir.resolve(m.group(1)));
            m.appendReplacement(out, java.util.regex.Matcher.quoteReplacement("<img src=\"data:image/png;base64,"
                    + java.util.Base64.getEncoder().encodeToString(png) + "\" title=\"" + m.group(1) + "\""));
        }
        m.appendTail(out);
        return out.toString();
    }

    private static void figure(JFreeChart chart, int w, int h, Path dir, String name, List<String> files) throws IOException {
        ChartFiles.writePng(chart, w, h, AtomicFiles.inside(dir, name + ".png"));
        ChartFiles.writeSvg(chart, w, h, AtomicFiles.inside(dir, name + ".svg"));
        files.add(name + ".png");
        files.add(name + ".svg");
    }

    static String html(LensPlan plan, List<String> files) {
        Stack s = plan.stack();
        String title = s.title().isBlank() ? "Untitled stack" : s.title();
        StringBuilder b = new StringBuilder(32_000);
        b.append("<!DOCTYPE html>\n<html lang=\"en\"><head><meta charset=\"utf-8\">\n<title>Lens plan: ")
                .append(Html.esc(title)).append("</title>\n<style>").append(CSS).append("</style></head><body>\n");
        b.append("<h1>Lens plan: ").append(Html.esc(title)).append("</h1>\n");
        b.append("<p class=\"note\">Stack ").append(Html.esc(plan.source())).append("; ")
                .append(Html.esc(s.beam().particle().label())).append(", ").append(num(s.beam().energy_eV()))
                .append(" eV where the potential is 0 V. Computed by axistack on ")
                .append(ZonedDateTime.now().format(DateTimeFormatter.ofPattern("yyyy-MM-dd HH:mm z", Locale.ROOT)))
                .append(String.format(Locale.ROOT, " in %.1f s.</p>%n", plan.seconds()));
        caution(b);
        warnings(b, plan);
        b.append("<h2>Geometry and rays</h2>\n<img src=\"geometry.png\" alt=\"meridian section with rays\">\n<p class=\"note\">")
                .append(Html.esc(plan.rayNote())).append("</p>\n");
        PlanSections.optics(b, plan);
        OffAxisSection.html(b, plan);
        PlanSections.spot(b, plan);
        ProbeSection.html(b, plan);
        PlanSections.tuning(b, plan);
        BudgetSection.html(b, plan);
        SteeringSection.html(b, plan);
        MisalignmentSection.html(b, plan);
        if (!plan.sweep().isEmpty() && plan.sweepElectrode().isPresent()) {
            long ok = plan.sweep().stream().filter(p -> p.ok()).count();
            b.append("<h2>Focus-bias sweep</h2>\n<img src=\"sweep.png\" alt=\"optics against the bias\">\n")
                    .append("<p class=\"note\">Paraxial optics at ").append(plan.sweep().size())
                    .append(" biases of electrode ").append(Html.esc(plan.sweepElectrode().get()))
                    .append(" (other biases as given; one field solution, re-biased), ").append(ok)
                    .append(" with usable optics; the rest reflect the beam or leave no field-free reference planes. "
                            + "Table: sweep.csv.</p>\n");
        }
        PlanSections.surfaceFields(b, plan);
        PlanSections.gaps(b, plan);
        PlanSections.capacitance(b, plan);
        b.append("<h2>Axial potential</h2>\n<img src=\"axial.png\" alt=\"V, V' and V'' on the axis\">\n");
        b.append("<h2>Beam envelope</h2>\n");
        if (plan.envelope().isPresent()) {
            b.append("<img src=\"envelope.png\" alt=\"beam envelope\">\n");
        }
        b.append("<p class=\"note\">").append(Html.esc(plan.envelopeNote())).append(". Paraxial round-beam envelope "
                + "equation with space charge (uniform density) and emittance, integrated by an adaptive Dormand-Prince "
                + "method.</p>\n");
        verification(b, plan.checks());
        PlanSections.method(b, plan);
        b.append("<h2>Inputs</h2>\n<p class=\"note\">The stack as planned (with the biases given by --set or set in the window), also in stack.toml:</p>\n<pre>")
                .append(Html.esc(StackWriter.toToml(s))).append("</pre>\n");
        b.append("<h2>Files</h2>\n<p class=\"note\">");
        for (String f : files) {
            b.append("<a href=\"").append(Html.esc(f)).append("\">").append(Html.esc(f)).append("</a> ");
        }
        b.append("</p>\n");
        caution(b);
        b.append("</body></html>\n");
        return b.toString();
    }

    private static void caution(StringBuilder b) {
        b.append("<div class=\"caution\"><h2>").append(Html.esc(SafetyNotice.TITLE)).append("</h2><ul>\n");
        for (String c : SafetyNotice.CAUTIONS) {
            b.append("<li>").append(Html.esc(c)).append("</li>\n");
        }
        b.append("</ul></div>\n");
    }

    private static void warnings(StringBuilder b, LensPlan plan) {
        if (plan.warnings().isEmpty()) {
            b.append("<p class=\"ok\">No warnings: the beam is not reflected, the lens has a real focus, the envelope "
                    + "clears the bores and every surface field is within the comfort limit.</p>\n");
            return;
        }
        b.append("<div class=\"warn\"><b>Look at these first:</b><ul>\n");
        for (String w : plan.warnings()) {
            b.append("<li>").append(Html.esc(w)).append("</li>\n");
        }
        b.append("</ul></div>\n");
    }

    /** The verification table (same content as the check command). */
    static void verification(StringBuilder b, List<CheckResult> checks) {
        b.append("<h2>Verification against closed forms</h2>\n");
        if (checks.isEmpty()) {
            b.append("<p class=\"note\">Not run (plan --no-check); run the check command.</p>\n");
            return;
        }
        List<List<String>> rows = new ArrayList<>();
        for (CheckResult r : checks) {
            rows.add(List.of(r.name(), r.quantity(), r.unit(), Html.g(r.computed()), Html.g(r.reference()),
                    (r.passed() ? "" : "!!") + Html.sci(r.error()), Html.sci(r.tolerance()), r.errorMeasure(),
                    r.passed() ? "pass" : "!!FAIL", r.source(), r.method()));
        }
        b.append(Html.table(List.of("case", "compared", "unit", "computed", "reference", "error", "tolerance",
                "error measure", "result", "reference source", "project method"), rows));
        long passed = checks.stream().filter(CheckResult::passed).count();
        b.append("<p class=\"").append(passed == checks.size() ? "ok" : "warn").append("\">").append(passed)
                .append(" of ").append(checks.size()).append(" cases within tolerance (the same cases as the check command, "
                        + "run on this machine with this build).</p>\n");
    }

    static String num(double x) {
        if (org.axistack.model.Numbers.whole(x, 1e12)) {
            return String.valueOf((long) x);
        }
        return org.axistack.model.Numbers.general(x, org.axistack.model.Numbers.REPORT_DIGITS);
    }

    static String mm(double z_m) {
        return Html.g(Units.mToMm(z_m));
    }

    static String field(double v_per_m, SurfaceFieldCheck c) {
        return mark(c) + Html.g(Units.vPerMToVPerMm(v_per_m));
    }

    /** The table mark of a surface-field verdict: "!!" above the aggressive limit, "!" above comfort only. */
    static String mark(SurfaceFieldCheck c) {
        return c == SurfaceFieldCheck.ABOVE_AGGRESSIVE ? "!!" : c.warning() ? "!" : "";
    }
}
