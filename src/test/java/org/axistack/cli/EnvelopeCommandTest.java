package org.axistack.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import javax.imageio.ImageIO;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The envelope command end to end on a small two-tube stack (coarse mesh to keep the test quick). */
class EnvelopeCommandTest {

    static final String STACK = """
            title = "envelope command test"
            [beam]
            particle = "proton"
            energy_eV = 2000.0
            start_z_mm = -30.0
            [[electrode]]
            name = "first"
            shape = "tube"
            bias_V = 0.0
            radius_mm = 5.0
            z_start_mm = -40.0
            z_end_mm = -1.0
            wall_mm = 0.0
            [[electrode]]
            name = "second"
            shape = "tube"
            bias_V = -6000.0
            radius_mm = 5.0
            z_start_mm = 1.0
            z_end_mm = 40.0
            wall_mm = 0.0
            [mesh]
            target_elements = 300
            """;

    static int run(StringWriter out, StringWriter err, String... args) {
        return Main.run(args, new PrintWriter(out), new PrintWriter(err));
    }

    @Test
    void jsonTextFilesAndExitCodes(@TempDir Path dir) throws Exception {
        Path stack = dir.resolve("two-tube.toml");
        Files.writeString(stack, STACK);
        Path png = dir.resolve("env.png");
        Path csv = dir.resolve("env.csv");
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = run(out, err, "envelope", stack.toString(), "--current", "1e-5", "--emittance", "2", "--radius-mm",
                "1", "--to-mm", "100", "--json", "--png", png.toString(), "--csv", csv.toString());
        assertThat(code).as(err.toString()).isZero();
        JsonNode j = new ObjectMapper().readTree(out.toString());
        assertThat(j.get("current_A").asDouble()).isEqualTo(1e-5);
        assertThat(j.get("emittance_edge_start_mm_mrad").asDouble()).isEqualTo(2.0);
        assertThat(j.get("cases").get("full").get("termination").asText()).isEqualTo("end_plane");
        assertThat(j.get("cases").has("zero_current")).isTrue();
        assertThat(j.get("cases").has("zero_emittance")).isTrue();
        assertThat(j.get("bores")).hasSize(2);
        assertThat(j.get("envelope").size()).isGreaterThan(100);
        assertThat(out.toString()).doesNotContain("NaN").doesNotContain("Infinity");
        assertThat(ImageIO.read(png.toFile()).getWidth()).isEqualTo(1100);
        assertThat(Files.readAllLines(csv).get(0)).startsWith("z_mm,radius_mm,slope_mrad");

        // bad input: negative current is a usage error (exit 2) with the fix, no stack trace
        StringWriter e2 = new StringWriter();
        assertThat(run(new StringWriter(), e2, "envelope", stack.toString(), "--current", "-1", "--emittance", "2"))
                .isEqualTo(2);
        assertThat(e2.toString()).contains("magnitude of the current").doesNotContain("Exception");

        // a start radius larger than the bore: physics outcome (exit 1) with the warning
        StringWriter o3 = new StringWriter();
        StringWriter e3 = new StringWriter();
        assertThat(run(o3, e3, "envelope", stack.toString(), "--current", "0", "--emittance", "1", "--radius-mm", "6",
                "--to-mm", "100")).isEqualTo(1);
        assertThat(o3.toString()).contains("larger than the bore of electrode 'first'");
    }
}
