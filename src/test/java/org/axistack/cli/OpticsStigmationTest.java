package org.axistack.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.nio.file.Files;
import java.nio.file.Path;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;

/**
 * The optics command's stigmator output (issue 16): x and y focal properties at the stored sector biases, the
 * astigmatic difference per volt of each quadrupole pattern, and the biases that cancel a given astigmatism. The
 * physics is checked in optics.StigmationChecksTest (thin quadrupole lens, exact 3-D rays); here the output is
 * checked against itself by linearity (common practice, no source): the stored biases carry 0.3 V of the
 * 0-degree pattern, so their astigmatic difference is 0.3 times the per-volt figure.
 */
class OpticsStigmationTest {

    static String stack(int sectors, String biases) {
        return """
                title = "Stigmator test column"
                [beam]
                particle = "proton"
                energy_eV = 1000.0
                object_z_mm = -60.0

                [[electrode]]
                name = "in"
                shape = "tube"
                bias_V = 0.0
                radius_mm = 5.0
                z_start_mm = -60.0
                z_end_mm = -5.5

                [[electrode]]
                name = "stig"
                shape = "tube"
                sectors = %d
                sector_biases_V = [%s]
                radius_mm = 5.0
                z_start_mm = -5.0
                z_end_mm = 5.0

                [[electrode]]
                name = "out"
                shape = "tube"
                bias_V = 0.0
                radius_mm = 5.0
                z_start_mm = 5.5
                z_end_mm = 60.0

                [mesh]
                target_elements = 300
                edge_levels = 6
                """.formatted(sectors, biases);
    }

    @Test
    void eightSectorsCancelAnyAstigmatism(@TempDir Path dir) throws Exception {
        Path f = dir.resolve("stig8.toml");
        Files.writeString(f, stack(8, "600.3, 600.0, 599.7, 600.0, 600.3, 600.0, 599.7, 600.0"));
        CliRun.Run r = CliRun.run("optics", f.toString(), "--json", "-q", "--accuracy", "1e-3", "--astigmatism",
                "0.2:30");
        assertThat(r.code()).as(r.err()).isEqualTo(0);
        JsonNode s = new ObjectMapper().readTree(r.out()).get("stigmation");
        assertThat(s.get("astigmatism_of").asText()).isEqualTo("image of the object");
        // a positive 0-degree pattern converges protons in x: x focuses first
        assertThat(s.get("focal_length_x_mm").asDouble()).isLessThan(s.get("focal_length_y_mm").asDouble());
        assertThat(s.get("image_x_z_mm").asDouble()).isLessThan(s.get("image_y_z_mm").asDouble());
        assertThat(s.get("astigmatism_axis_deg").asDouble()).isCloseTo(90, within(1e-9));
        JsonNode stig = s.get("stigmators").get(0);
        assertThat(stig.get("stored_quad_0_V").asDouble()).isCloseTo(0.3, within(1e-12));
        JsonNode p0 = stig.get("patterns").get(0);
        JsonNode p45 = stig.get("patterns").get(1);
        double perVolt = p0.get("astigmatic_difference_mm_per_V").asDouble();
        assertThat(s.get("astigmatic_difference_mm").asDouble()).isCloseTo(0.3 * perVolt, within(1e-9 * perVolt));
        assertThat(s.get("image_y_z_mm").asDouble() - s.get("image_x_z_mm").asDouble())
                .isCloseTo(0.3 * perVolt, within(1e-9 * perVolt));
        // the 45-degree pattern of eight sectors is the 0-degree one turned: same size, axis turned by 45 degrees
        assertThat(p45.get("present").asBoolean()).isTrue();
        assertThat(p45.get("astigmatic_difference_mm_per_V").asDouble()).isCloseTo(perVolt, within(1e-9 * perVolt));
        assertThat(p45.get("axis_deg").asDouble()).isCloseTo(-45, within(1e-9));
        JsonNode c = s.get("cancel");
        assertThat(c.get("residual_difference_mm").asDouble()).isLessThan(1e-12);
        assertThat(c.get("settings").get(0).get("sector_biases_V")).hasSize(8);
        CliRun.Run text = CliRun.run("optics", f.toString(), "-q", "--accuracy", "1e-3");
        assertThat(text.out()).contains("stigmators (first order", "astigmatic difference", "45 deg: astigmatic");
    }

    @Test
    void fourSectorsActAlongOnePairOfPlanes(@TempDir Path dir) throws Exception {
        Path f = dir.resolve("stig4.toml");
        Files.writeString(f, stack(4, "600.0, 600.0, 600.0, 600.0"));
        CliRun.Run r = CliRun.run("optics", f.toString(), "--json", "-q", "--accuracy", "1e-3", "--astigmatism",
                "0.2:30");
        assertThat(r.code()).as(r.err()).isEqualTo(0);
        JsonNode s = new ObjectMapper().readTree(r.out()).get("stigmation");
        // equal sector biases: no astigmatism (to the rounding of the Fourier sums)
        assertThat(s.get("astigmatic_difference_mm").asDouble()).isLessThan(1e-9);
        assertThat(s.get("astigmatism_axis_deg").isNull()).isTrue();
        JsonNode stig = s.get("stigmators").get(0);
        assertThat(stig.get("patterns").get(1).get("present").asBoolean()).isFalse();
        // 0.2 mm along 30 degrees = 0.1 mm along 0 degrees (cos 60) + 0.1732 mm along 45: the 0-degree part goes
        JsonNode c = s.get("cancel");
        assertThat(c.get("residual_difference_mm").asDouble()).isCloseTo(0.2 * Math.sin(Math.toRadians(60)),
                within(1e-9));
        assertThat(c.get("settings").get(0).get("add_quad_45_V").asDouble()).isEqualTo(0.0);
    }

    @Test
    void badAstigmatismIsAUsageError(@TempDir Path dir) throws Exception {
        Path f = dir.resolve("stig4.toml");
        Files.writeString(f, stack(4, "600.0, 600.0, 600.0, 600.0"));
        for (String bad : new String[] {"0.2", "x:30", "0.2:30:1", "0.2:1000", "NaN:0"}) {
            CliRun.Run r = CliRun.run("optics", f.toString(), "--astigmatism", bad);
            assertThat(r.code()).as(bad).isEqualTo(2);
            assertThat(r.err()).contains("--astigmatism " + bad, "DZ:DEG").doesNotContain("field solve")
                    .doesNotContain("Exception");
        }
        CliRun.Run round = CliRun.run("optics", "--astigmatism", "0.2:30");
        assertThat(round.code()).isEqualTo(2);
        assertThat(round.err()).contains("needs a stigmator");
    }
}
