package org.axistack.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The misalign command on the built-in demo lens: table, budget, CSV with units in the headings, bad input. */
class MisalignCommandTest {

    @Test
    void printsTheTableAndWritesTheBenchCsv(@TempDir Path dir) throws Exception {
        Path csv = dir.resolve("align.csv");
        CliRun.Run r = CliRun.run("misalign", "--quiet", "--csv", csv.toString());
        assertThat(r.code()).as(r.err()).isEqualTo(0);
        assertThat(r.out()).contains("per 0.01 mm decentre", "Tightest: decentre of", "quadrature", "CSV: ");
        List<String> lines = Files.readAllLines(csv);
        assertThat(lines.get(0)).isEqualTo("electrode,motion,unit,screen_z_mm,screen_shift_um_per_unit,"
                + "screen_slope_urad_per_unit,walk_um_per_unit_per_focus_V,tolerance_budget,tolerance_alone,tolerance_unit,"
                + "spot_growth_um_per_unit,growth_tolerance");
        assertThat(lines).hasSize(1 + 2 * 3);
        assertThat(lines.get(1)).contains("decentre", "0.01 mm");
        assertThat(lines.get(2)).contains("tilt", "1 mrad");
    }

    @Test
    void theBenchCsvCarriesEveryMonitorAndSteererAsTheJsonDoes(@TempDir Path dir) throws Exception {
        Path csv = dir.resolve("align.csv");
        String stack = "lens-library/proton-beamline-steerer.toml";
        CliRun.Run r = CliRun.run("misalign", stack, "--quiet", "--json", "--csv", csv.toString());
        assertThat(r.code()).as(r.err()).isEqualTo(0);
        List<String> lines = Files.readAllLines(csv);
        assertThat(lines.get(0)).endsWith(",monitor_viewer_shift_um_per_unit,monitor_last viewer_shift_um_per_unit,"
                + "steerer_steer_x_bias_V_per_unit");
        assertThat(lines).hasSize(1 + 2 * 3);
        // the CSV's monitor column equals the JSON's shift at that monitor (decentre of the first electrode)
        com.fasterxml.jackson.databind.JsonNode j = new com.fasterxml.jackson.databind.ObjectMapper().readTree(r.out());
        double json = j.get("monitors").get(0).get("rows").get(0).get("shift_um_per_0_01_mm_decentre").asDouble();
        String[] cells = lines.get(1).split(",");
        assertThat(Double.parseDouble(cells[cells.length - 3])).isCloseTo(json,
                org.assertj.core.api.Assertions.within(1e-9 * Math.max(1, Math.abs(json))));
    }

    @Test
    void spotGrowthJoinsTheBudget() throws Exception {
        CliRun.Run r = CliRun.run("misalign", "--quiet", "--json", "--aperture-mrad", "10", "--allowed-growth", "0.0001");
        assertThat(r.code()).as(r.err()).isEqualTo(0);
        com.fasterxml.jackson.databind.JsonNode j = new com.fasterxml.jackson.databind.ObjectMapper().readTree(r.out());
        com.fasterxml.jackson.databind.JsonNode g = j.get("spot_growth");
        assertThat(g.get("computed").asBoolean()).isTrue();
        assertThat(g.get("aperture_mrad").asDouble()).isEqualTo(10.0);
        assertThat(g.get("note").asText()).contains("(given)");
        double root = Math.sqrt(4 * 3);
        boolean growthLimits = false;
        for (int k = 0; k < 3; k++) {
            com.fasterxml.jackson.databind.JsonNode row = g.get("rows").get(k);
            double a = row.get("decentre_coma_a_per_rad2").asDouble();
            double b = Math.abs(row.get("decentre_coma_b_per_rad2").asDouble());
            // comet length at 10 mrad per 0.01 mm decentre, um
            double length = 1e-4 * (Math.max(0, a + b) - Math.min(0, a - b)) * 1e-5 * 1e6;
            double growth = row.get("growth_um_per_0_01_mm_decentre").asDouble();
            assertThat(growth).isCloseTo(length, org.assertj.core.api.Assertions.within(1e-9 * length));
            double tol = row.get("decentre_growth_tolerance_mm").asDouble();
            // 0.0001 mm allowed = tolerance x growth per mm x sqrt(4 x electrodes)
            assertThat(tol * growth * 100 * 1e-3 * root).isCloseTo(0.0001,
                    org.assertj.core.api.Assertions.within(1e-9));
            com.fasterxml.jackson.databind.JsonNode budget = j.get("rows").get(2 * k);
            double shiftTol = 0.05 / (Math.abs(budget.get("screen_shift_um_per_unit").asDouble()) * 100 * 1e-3
                    * Math.sqrt(2 * 3));
            assertThat(budget.get("tolerance_budget").asDouble()).isCloseTo(Math.min(shiftTol, tol),
                    org.assertj.core.api.Assertions.within(1e-9 * tol));
            assertThat(row.get("decentre_limited_by").asText()).isEqualTo(tol < shiftTol ? "growth" : "shift");
            growthLimits |= tol < shiftTol;
        }
        // a tight growth allowance makes the coma the limit somewhere
        assertThat(growthLimits).isTrue();
    }

    @Test
    void badAllowanceAndUnknownFocusAreNamed() {
        CliRun.Run g = CliRun.run("misalign", "--quiet", "--allowed-growth", "0");
        assertThat(g.code()).isEqualTo(2);
        assertThat(g.err()).contains("--allowed-growth");
        CliRun.Run a = CliRun.run("misalign", "--quiet", "--aperture-mrad", "-3");
        assertThat(a.code()).isEqualTo(2);
        assertThat(a.err()).contains("--aperture-mrad");
        CliRun.Run r = CliRun.run("misalign", "--quiet", "--allowed-shift", "-1");
        assertThat(r.code()).isEqualTo(2);
        assertThat(r.err()).contains("--allowed-shift");
        CliRun.Run f = CliRun.run("misalign", "--quiet", "--focus", "nosuch");
        assertThat(f.code()).isEqualTo(2);
        assertThat(f.err()).contains("--focus nosuch", "choose one of");
    }
}
