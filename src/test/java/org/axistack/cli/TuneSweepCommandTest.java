package org.axistack.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.axistack.cli.CliRun.run;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVRecord;
import org.axistack.cli.CliRun.Run;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;

/**
 * The tune and sweep commands end to end on the built-in demo lens (demo data): tune's JSON keys of interface.md,
 * exit 1 without a focus in range, bad input exit 2; a sweep row equals a direct {@code optics --json} run at that
 * bias (same stack and mesh, so the same field solve) to round-off.
 */
class TuneSweepCommandTest {

    private static final String DEMO = "lens-library/electron-flood-einzel.toml";

    @Test
    void tuneJsonHasEverySolutionWithTheContractKeys() throws Exception {
        Run r = run("tune", DEMO, "--vary", "focus", "--image-z", "35", "--json");
        assertThat(r.code()).as(r.err()).isZero();
        JsonNode j = new ObjectMapper().readTree(r.out());
        JsonNode sols = j.get("solutions");
        assertThat(sols.size()).isGreaterThanOrEqualTo(2);
        boolean dec = false;
        boolean acc = false;
        for (JsonNode s : sols) {
            assertThat(s.has("bias_V") && s.has("image_z_mm") && s.has("magnification")
                    && s.has("max_surface_field_V_per_mm")).isTrue();
            assertThat(s.get("image_z_mm").asDouble()).isCloseTo(35, org.assertj.core.data.Offset.offset(1e-6));
            dec |= "decelerating".equals(s.get("mode").asText()) && s.get("axis_crossings_before_image").asInt() == 0;
            acc |= "accelerating".equals(s.get("mode").asText());
        }
        assertThat(dec && acc).isTrue();
    }

    @Test
    void noFocusInRangeExitsOne() {
        Run r = run("tune", DEMO, "--vary", "focus", "--image-z", "35", "--from", "-20", "--to", "20");
        assertThat(r.code()).isEqualTo(1);
        assertThat(r.out()).contains("NO SOLUTION").contains("nearest approach");
    }

    @Test
    void unknownElectrodeExitsTwo() {
        Run r = run("tune", DEMO, "--vary", "nosuch", "--image-z", "35");
        assertThat(r.code()).isEqualTo(2);
        assertThat(r.err()).contains("nosuch").contains("focus");
    }

    @Test
    void sweepRowEqualsOpticsRun(@TempDir Path dir) throws Exception {
        Path csv = dir.resolve("sweep.csv");
        Run s = run("sweep", DEMO, "--vary", "focus", "--from=-150", "--to", "150", "--steps", "6", "--csv",
                csv.toString(), "--quiet");
        assertThat(s.code()).as(s.err()).isZero();
        List<CSVRecord> rows = CSVFormat.RFC4180.builder().setHeader().setSkipHeaderRecord(true).get()
                .parse(Files.newBufferedReader(csv)).getRecords();
        assertThat(rows).hasSize(7);
        CSVRecord row = rows.get(1); // -100 V
        assertThat(Double.parseDouble(row.get("bias_V"))).isEqualTo(-100.0);
        Run o = run("optics", DEMO, "--set", "focus=-100", "--json");
        assertThat(o.code()).as(o.err()).isZero();
        JsonNode j = new ObjectMapper().readTree(o.out());
        for (String key : new String[] {"focal_length_image_mm", "focal_point_image_z_mm", "principal_plane_object_z_mm",
            "spherical_aberration_mm", "chromatic_aberration_mm"}) {
            double a = Double.parseDouble(row.get(key));
            double b = j.get(key).asDouble();
            assertThat(Math.abs(a - b)).as(key).isLessThanOrEqualTo(1e-12 * Math.abs(b));
        }
    }
}
