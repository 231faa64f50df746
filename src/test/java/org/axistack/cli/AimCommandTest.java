package org.axistack.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;

import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;

/**
 * The aim command on a small steering stack of our own (a four-sector steerer in an einzel-like tube triple, 1 keV
 * protons entering off the axis and tilted, two monitors): the first-order biases put the central ray on the
 * target (to rounding), the exact trace lands there to 1e-3 of the correction; bad input exits 2 with the option
 * named.
 */
class AimCommandTest {

    static final String STACK = """
            title = "Steering test column"
            [beam]
            particle = "proton"
            energy_eV = 1000.0
            start_z_mm = -35.0
            start_x_mm = 0.03
            start_slope_y_mrad = 0.2

            [[electrode]]
            name = "in"
            shape = "tube"
            bias_V = 0.0
            radius_mm = 5.0
            z_start_mm = -45.0
            z_end_mm = -5.5

            [[electrode]]
            name = "steer"
            shape = "tube"
            bias_V = 250.0
            sectors = 4
            radius_mm = 5.0
            z_start_mm = -5.0
            z_end_mm = 5.0

            [[electrode]]
            name = "out"
            shape = "tube"
            bias_V = 0.0
            radius_mm = 5.0
            z_start_mm = 5.5
            z_end_mm = 45.0

            [screen]
            z_mm = 40.0

            [[monitor]]
            name = "viewer"
            z_mm = 25.0

            [[monitor]]
            z_mm = 32.0

            [mesh]
            target_elements = 360
            edge_levels = 6
            """;

    @TempDir
    static Path dir;
    static Path stack;

    @BeforeAll
    static void write() throws Exception {
        stack = dir.resolve("steer.toml");
        Files.writeString(stack, STACK);
    }

    @Test
    void bringsTheBeamOntoTheAxisAtTheScreenAndChecksItExactly() throws Exception {
        CliRun.Run r = CliRun.run("aim", stack.toString(), "--json");
        assertThat(r.code()).as(r.err()).isEqualTo(0);
        // progress goes to the error stream under --json too (the shared -q convention); standard output is JSON
        assertThat(r.err()).contains("solv");
        JsonNode j = new ObjectMapper().readTree(r.out());
        JsonNode target = j.get("planes").get(0);
        assertThat(target.get("z_mm").asDouble()).isEqualTo(40.0);
        double before = Math.hypot(target.get("before_x_mm").asDouble(), target.get("before_y_mm").asDouble());
        assertThat(before).isGreaterThan(0.01);
        assertThat(Math.abs(target.get("x_mm").asDouble())).isLessThan(1e-12);
        assertThat(Math.abs(target.get("y_mm").asDouble())).isLessThan(1e-12);
        assertThat(Math.hypot(target.get("exact_x_mm").asDouble(), target.get("exact_y_mm").asDouble()))
                .isLessThan(1e-3 * before);
        assertThat(j.get("planes")).hasSize(3);
        assertThat(j.get("planes").get(1).get("plane").asText()).isEqualTo("viewer");
        assertThat(j.get("planes").get(2).get("plane").asText()).isEqualTo("monitor 2");
        JsonNode s = j.get("steerers").get(0);
        assertThat(s.get("electrode").asText()).isEqualTo("steer");
        assertThat(s.get("sector_biases_V")).hasSize(4);
        assertThat(s.get("common_bias_V").asDouble()).isCloseTo(250.0, org.assertj.core.data.Offset.offset(1e-9));
        assertThat(j.get("within_supply_range").asBoolean()).isTrue();
        assertThat(j.get("energy_conservation").asDouble()).isLessThan(1e-8);
        assertThat(target.get("deflection_aberration_mm").asDouble()).isGreaterThanOrEqualTo(0);
    }

    @Test
    void aPointAtAMonitorAndTheSupplyMargin() {
        CliRun.Run r = CliRun.run("aim", stack.toString(), "--at", "viewer:0.05:-0.02", "--no-trace",
                "--supply-limit", "0.5");
        // a 0.5 V supply cannot deliver the volts: printed, then exit 1
        assertThat(r.code()).as(r.err()).isEqualTo(1);
        assertThat(r.out()).contains("Target: at z = 25 mm, x = 0.05 mm, y = -0.02 mm", "OUTSIDE THE SUPPLY RANGE",
                "HIGH VOLTAGE");
        assertThat(r.err()).contains("exceed the supply range");
        CliRun.Run ok = CliRun.run("aim", stack.toString(), "--at", "viewer:0.05:-0.02", "--no-trace");
        assertThat(ok.code()).as(ok.err()).isEqualTo(0);
        assertThat(ok.out()).contains("viewer at z = 25 mm", "after (0.05, -0.02) mm");
    }

    @Test
    void badInputExitsTwoNamingTheOption() {
        String[][] cases = {
            {"--at", "nowhere:0:0"}, {"--at", "30:0"}, {"--at", "30:x:0"}, {"--steerer", "in"},
            {"--steerer", "nosuch"}, {"--slopes", "0:0"}, {"--at", "30:0:0", "--at", "35:0:0"},
            {"--supply-limit", "-3"}, {"--at", "-40:0:0"}, {"--at", "30:9:0"}};
        for (String[] c : cases) {
            String[] args = new String[c.length + 3];
            args[0] = "aim";
            args[1] = stack.toString();
            args[2] = "--no-trace";
            System.arraycopy(c, 0, args, 3, c.length);
            CliRun.Run r = CliRun.run(args);
            assertThat(r.code()).as(String.join(" ", c) + ": " + r.err()).isEqualTo(2);
            assertThat(r.err()).as(String.join(" ", c)).contains(c[0]).doesNotContain("Exception");
        }
        // a plane upstream of the steerer (after the beam's start at -35 mm, before the steerer's start at -5 mm):
        // refused as a usage error before any solve (no solve progress printed)
        CliRun.Run before = CliRun.run("aim", stack.toString(), "--at", "-10:0.01:0");
        assertThat(before.code()).as(before.err()).isEqualTo(2);
        assertThat(before.err()).contains("--at -10:0.01:0", "lies before the steerer steer", "begins at z = -5 mm")
                .doesNotContain("solv").doesNotContain("Exception");
        CliRun.Run round = CliRun.run("aim", "--no-trace");
        assertThat(round.code()).isEqualTo(2);
        assertThat(round.err()).contains("no split electrode");
    }
}
