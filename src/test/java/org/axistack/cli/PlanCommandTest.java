package org.axistack.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;

import org.axistack.report.SafetyNotice;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** {@code plan}: console summary, report files, exit codes (the numbers themselves are tested in their packages). */
class PlanCommandTest {

    @TempDir
    Path tmp;

    @Test
    void demoPlanWritesTheReportAndItsTables() throws IOException {
        Path out = tmp.resolve("demo");
        CliRun.Run r = CliRun.run("plan", "--no-check", "--out", out.toString());
        assertThat(r.code()).as(r.err()).isZero();
        assertThat(r.out()).contains("Flood-gun einzel lens", "built-in demo", "IEC 61010-1", "Cardinal elements (lens converging", "Aberrations: Cs =", "Spot-size budget",
                "Focusing bias", "focus = ", "Supply-stability budget (focus held within +/- 0.1 mm", "mm/V  noise/drift +/- ",
                "Surface fields", "Gaps between facing electrodes", "inlet - focus", "gap 1 mm, 120 V across", "Report: ",
                SafetyNotice.TITLE);
        assertThat(r.err()).contains("field solve: done, 100%", "plan: beam envelope");
        for (String f : new String[] {"report.html", "geometry.png", "geometry.svg", "axial.png", "axial.svg",
            "envelope.png", "axial.csv", "cardinal.csv", "surface_fields.csv", "gaps.csv", "capacitance.csv", "spot_budget.csv",
            "focus_biases.csv", "supply_budget.csv", "sweep.csv", "sweep.png", "stack.toml"}) {
            assertThat(out.resolve(f)).as(f).isNotEmptyFile();
        }
        var png = javax.imageio.ImageIO.read(out.resolve("geometry.png").toFile());
        assertThat(png.getWidth()).isEqualTo(1200);
        assertThat(png.getHeight()).isBetween(420, 900);
        assertThat(Files.readString(out.resolve("geometry.svg"))).startsWith("<?xml").contains("<svg").contains("-120 V");
        String html = Files.readString(out.resolve("report.html"));
        assertThat(html).contains("<h2>Cardinal elements</h2>", "<h2>Electrode surface fields</h2>", "<h2>Gaps between facing electrodes</h2>",
                "<h2>Capacitance matrix (pF)</h2>", "<h2>Method and stated accuracy</h2>", "<h2>Inputs</h2>",
                "[[electrode]]", SafetyNotice.TITLE, "<h2>Focus-bias sweep</h2>", "Not run (plan --no-check)",
                "<h2>Supply-stability budget</h2>");
        assertThat(html).doesNotContain("http://", "https://", "<script");
        // one file to mail: the figures are inside it (and still beside it as files)
        assertThat(html).contains("<img src=\"data:image/png;base64,").doesNotContain("<img src=\"geometry.png\"");
        // the supply budget in volts for every electrode, grounded ones too (a grounded electrode once read
        // "any" stability although the image moves with its ground offset): common practice, no source
        List<String> budget = Files.readAllLines(out.resolve("supply_budget.csv"));
        assertThat(budget.get(0)).contains("tolerance_V");
        int tol = List.of(budget.get(0).split(",")).indexOf("tolerance_V");
        int bias = List.of(budget.get(0).split(",")).indexOf("bias_V");
        long grounded = budget.stream().skip(1).map(l -> l.split(",", -1)).filter(c -> c[1].equals("electrode"))
                .filter(c -> Double.parseDouble(c[bias]) == 0).peek(c -> assertThat(c[tol]).isNotBlank()
                        .satisfies(v -> assertThat(Double.parseDouble(v)).isPositive())).count();
        assertThat(grounded).as("grounded electrodes in the demo's budget").isPositive();
        assertThat(html).contains("(grounded)", "noise and drift allowed, absolute").doesNotContain(">any<");
        // focusing biases most useful first: a direct focus in the first row, near-mirror ones flagged
        List<String> focus = Files.readAllLines(out.resolve("focus_biases.csv"));
        int crossings = List.of(focus.get(0).split(",")).indexOf("axis_crossings");
        assertThat(crossings).isNotNegative();
        assertThat(focus.get(1).split(",")[crossings]).isEqualTo("0");
        assertThat(Files.readAllLines(out.resolve("axial.csv")).get(0))
                .isEqualTo("z_mm,potential_V,dV_dz_V_per_mm,d2V_dz2_V_per_mm2");
        try (Stream<Path> files = Files.list(out)) {
            assertThat(files.filter(p -> p.getFileName().toString().contains(".tmp"))).isEmpty();
        }
    }

    @Test
    void reflectedBeamExitsOneButStillWritesTheReport() {
        Path out = tmp.resolve("mirror");
        CliRun.Run r = CliRun.run("plan", "--no-check", "--set", "focus=-400", "--out", out.toString(), "-q");
        assertThat(r.code()).as(r.out() + r.err()).isEqualTo(Main.EXIT_PHYSICS);
        assertThat(r.out()).contains("REFLECTED");
        assertThat(r.err()).contains("reflected");
        assertThat(out.resolve("report.html")).isNotEmptyFile();
    }

    @Test
    void badOptionsExitTwoWithAFix() throws IOException {
        Path file = Files.writeString(tmp.resolve("a-file"), "x");
        assertThat(CliRun.run("plan", "--out", file.toString()).code()).isEqualTo(Main.EXIT_INPUT);
        CliRun.Run r = CliRun.run("plan", "--tune", "nosuch", "--out", tmp.resolve("x").toString());
        assertThat(r.code()).isEqualTo(Main.EXIT_INPUT);
        assertThat(r.err()).contains("--tune nosuch", "inlet, focus, outlet");
    }
}
