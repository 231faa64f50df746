package org.axistack.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.axistack.cli.CliRun.run;

import java.nio.file.Files;
import java.nio.file.Path;

import org.axistack.cli.CliRun.Run;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The size command end to end on tiny budgets: files written and runnable, exit 1 naming the binding limit, exit 2 on bad input. */
class SizeCommandTest {

    static final String REQ = """
            title = "small plates"
            [beam]
            particle = "proton"
            energy_eV = 2000.0
            [target]
            object_z_mm = -60.0
            image_z_mm = 90.0
            [limits]
            min_bore_radius_mm = 2.0
            max_length_mm = 50.0
            max_bias_V = 8000.0
            max_surface_field_V_per_mm = FIELD
            [family]
            kind = "einzel-plates"
            bore_radius_mm = [2.0, 5.0]
            gap_mm = [2.0, 6.0]
            thickness_mm = 1.0
            outer_radius_mm = 14.0
            [search]
            evaluations = 6
            mesh_elements = 120
            final_mesh_elements = 160
            """;

    @Test
    void writesRunnableStackFilesAndAChart(@TempDir Path dir) throws Exception {
        Path req = dir.resolve("req.toml");
        Files.writeString(req, REQ.replace("FIELD", "5000.0"));
        Path outDir = dir.resolve("designs");
        Run r = run("size", req.toString(), "--out", outDir.toString(), "--threads", "2");
        assertThat(r.code()).as(r.err()).isZero();
        assertThat(r.out()).contains("Chosen design", "Why it wins", "<- matters most", "HIGH VOLTAGE", "Trade-off front",
                "Decentre and tilt budget of the chosen design", "tightest: decentre of");
        assertThat(r.err()).contains("sizing [");
        assertThat(outDir.resolve("front.png")).isNotEmptyFile();
        Run optics = run("optics", outDir.resolve("chosen.toml").toString(), "--json");
        assertThat(optics.code()).as(optics.err()).isZero();
        assertThat(optics.out()).containsPattern("\"real_image_z_mm\" : 89\\.9999|\"real_image_z_mm\" : 90\\.0000");
    }

    @Test
    void anImpossibleRequirementExitsOneNamingTheBindingLimit(@TempDir Path dir) throws Exception {
        Path req = dir.resolve("req.toml");
        Files.writeString(req, REQ.replace("FIELD", "20.0"));
        Run r = run("size", req.toString(), "--out", dir.resolve("o").toString(), "--quiet", "--evaluations", "4");
        assertThat(r.code()).isEqualTo(Main.EXIT_PHYSICS);
        assertThat(r.out()).contains("NO DESIGN", "surface field (max_surface_field_V_per_mm)");
        assertThat(r.err()).contains("binding limit", "surface field");
        assertThat(dir.resolve("o")).doesNotExist();
    }

    @Test
    void badInputExitsTwoWithFileLineAndField(@TempDir Path dir) throws Exception {
        Path req = dir.resolve("req.toml");
        Files.writeString(req, REQ.replace("FIELD", "5000.0").replace("\"einzel-plates\"", "\"einzel-plate\""));
        Run r = run("size", req.toString(), "--quiet");
        assertThat(r.code()).isEqualTo(Main.EXIT_INPUT);
        assertThat(r.err()).contains("req.toml, line 14, field kind", "did you mean 'einzel-plates'");
    }
}
