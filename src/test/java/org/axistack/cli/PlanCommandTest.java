package org.axistack.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
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
                "Focusing bias", "focus = ", "Supply-stability budget (focus held within +/- 0.1 mm", "mm/V (",
                "Surface fields", "Report: ", SafetyNotice.TITLE);
        assertThat(r.err()).contains("field solve: done, 100%", "plan: beam envelope");
        for (String f : new String[] {"report.html", "geometry.png", "geometry.svg", "axial.png", "axial.svg",
            "envelope.png", "axial.csv", "cardinal.csv", "surface_fields.csv", "capacitance.csv", "spot_budget.csv",
            "focus_biases.csv", "supply_budget.csv", "sweep.csv", "sweep.png", "stack.toml"}) {
            assertThat(out.resolve(f)).as(f).isNotEmptyFile();
        }
        var png = javax.imageio.ImageIO.read(out.resolve("geometry.png").toFile());
        assertThat(png.getWidth()).isEqualTo(1200);
        assertThat(png.getHeight()).isBetween(420, 900);
        assertThat(Files.readString(out.resolve("geometry.svg"))).startsWith("<?xml").contains("<svg").contains("-120 V");
        String html = Files.readString(out.resolve("report.html"));
        assertThat(html).contains("<h2>Cardinal elements</h2>", "<h2>Electrode surface fields</h2>",
                "<h2>Capacitance matrix (pF)</h2>", "<h2>Method and stated accuracy</h2>", "<h2>Inputs</h2>",
                "[[electrode]]", SafetyNotice.TITLE, "<h2>Focus-bias sweep</h2>", "Not run (plan --no-check)",
                "<h2>Supply-stability budget</h2>");
        assertThat(html).doesNotContain("http://", "https://", "<script");
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
