package org.axistack.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.axistack.cli.CliRun.run;

import java.nio.file.Files;
import java.nio.file.Path;

import org.axistack.cli.CliRun.Run;
import org.axistack.report.SafetyNotice;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;

/** The probe command on the demo: JSON keys, files, the dominant terms, and bad input (common practice, no source). */
class ProbeCommandTest {

    @Test
    void demoGivesCurvesForTheGivenAndTheFocusingBiasesAndWritesTheFiles(@TempDir Path tmp) throws Exception {
        Path out = tmp.resolve("probe-out");
        Run r = run("probe", "--brightness", "1e5", "--energy-spread", "0.5", "--points", "20", "--json", "--out", out.toString());
        assertThat(r.code()).as(r.err()).isZero();
        JsonNode j = new ObjectMapper().readTree(r.out());
        assertThat(j.get("measure").asText()).contains("FW50");
        JsonNode curves = j.get("curves");
        assertThat(curves.size()).isGreaterThanOrEqualTo(2); // as given, plus at least one focusing bias
        assertThat(curves.get(0).get("working_point").asText()).isEqualTo("biases as given");
        assertThat(curves.get(1).get("working_point").asText()).startsWith("focus on the screen");
        JsonNode pts = curves.get(0).get("points");
        assertThat(pts.size()).isEqualTo(20);
        double previous = 0;
        for (JsonNode p : pts) {
            assertThat(p.get("probe_fw50_nm").asDouble()).isGreaterThan(previous);
            previous = p.get("probe_fw50_nm").asDouble();
            assertThat(p.get("dominant").asText()).isIn("source", "diffraction", "spherical", "chromatic");
        }
        assertThat(curves.get(0).get("spherical_aberration_image_mm").asDouble()).isPositive();
        // the demo's source is at infinity: the off-axis statement says why it is not evaluated
        assertThat(curves.get(0).get("off_axis").asText()).contains("source is at infinity");
        assertThat(Files.readString(out.resolve("probe.csv"))).startsWith("working_point,current_A,alpha_mrad,probe_fw50_nm");
        assertThat(Files.size(out.resolve("probe.png"))).isGreaterThan(1000);
        assertThat(Files.readString(out.resolve("probe.svg"))).contains("<svg");
    }

    @Test
    void textNamesTheMeasureTheDominantTermAndTheCautions() {
        Run r = run("probe", "--brightness", "1e5", "--points", "10");
        assertThat(r.code()).as(r.err()).isZero();
        assertThat(r.out()).contains("FW50").contains("dominant:").contains("Barth and Kruit").contains(SafetyNotice.TITLE);
    }

    @Test
    void badInputIsAUsageErrorWithTheOptionNamed() {
        Run r = run("probe", "--brightness", "-3");
        assertThat(r.code()).isEqualTo(2);
        assertThat(r.err()).contains("--brightness").doesNotContain("\tat ");
        Run c = run("probe", "--brightness", "1e5", "--current-from", "1e-6", "--current-to", "1e-9");
        assertThat(c.code()).isEqualTo(2);
        assertThat(c.err()).contains("--current-from");
        Run t = run("probe", "--brightness", "1e5", "--tune", "nosuch");
        assertThat(t.code()).isEqualTo(2);
        assertThat(t.err()).contains("nosuch");
        assertThat(run("probe").code()).isEqualTo(2); // --brightness is required
    }
}
