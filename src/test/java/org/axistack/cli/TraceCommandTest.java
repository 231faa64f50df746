package org.axistack.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.Reader;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVRecord;
import org.axistack.report.SafetyNotice;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;

/** The trace command end to end on a small, coarsely meshed einzel lens (demo data, our own). */
class TraceCommandTest {

    @TempDir
    static Path dir;
    static Path stack;

    static final String LENS = """
            title = "Test einzel lens, 500 eV electrons, coarse mesh"
            [beam]
            particle = "electron"
            energy_eV = 500.0
            start_z_mm = -20.0
            [[electrode]]
            name = "entry"
            shape = "tube"
            bias_V = 0.0
            radius_mm = 4.0
            z_start_mm = -25.0
            z_end_mm = -3.0
            [[electrode]]
            name = "middle"
            shape = "tube"
            bias_V = -300.0
            radius_mm = 4.0
            z_start_mm = -2.0
            z_end_mm = 2.0
            [[electrode]]
            name = "exit"
            shape = "tube"
            bias_V = 0.0
            radius_mm = 4.0
            z_start_mm = 3.0
            z_end_mm = 25.0
            [screen]
            z_mm = 20.0
            [mesh]
            target_elements = 120
            edge_levels = 4
            """;

    @BeforeAll
    static void writeStack() throws Exception {
        stack = dir.resolve("lens.toml");
        Files.writeString(stack, LENS);
    }

    @Test
    void tableHasEveryRayAtEveryPlaneWithAHeaderAndTheTextShowsRadiiAndCautions() throws Exception {
        Path csv = dir.resolve("rays.csv");
        CliRun.Run r = CliRun.run("trace", stack.toString(), "--planes=-10,0,20", "--count", "12", "--radius", "1",
                "--table", csv.toString());
        assertThat(r.code()).as(r.err()).isZero();
        assertThat(r.out()).contains("rms_radius_mm").contains("12 screen").contains(SafetyNotice.TITLE);
        List<CSVRecord> rows;
        try (Reader in = Files.newBufferedReader(csv)) {
            rows = CSVFormat.RFC4180.builder().setHeader().setSkipHeaderRecord(true).get().parse(in).getRecords();
        }
        assertThat(rows).hasSize(36);
        assertThat(rows.get(0).getParser().getHeaderNames()).startsWith("ray_id", "z_mm", "x_mm", "y_mm", "r_mm",
                "slope_mrad", "kinetic_energy_eV", "time_ns", "status");
        for (CSVRecord row : rows) {
            double x = Double.parseDouble(row.get("x_mm")), y = Double.parseDouble(row.get("y_mm"));
            assertThat(Double.parseDouble(row.get("r_mm"))).isCloseTo(Math.hypot(x, y),
                    org.assertj.core.data.Offset.offset(1e-8));
            assertThat(row.get("status")).isEqualTo("ok");
        }
        // on the grounded exit side the kinetic energy is back near 500 eV (energy conservation)
        assertThat(Double.parseDouble(rows.get(2).get("kinetic_energy_eV"))).isBetween(499.0, 500.5);
        assertThat(Files.list(dir).filter(p -> p.getFileName().toString().endsWith(".part"))).isEmpty();
    }

    @Test
    void jsonCarriesPlanesStatusesAndRayEnds() throws Exception {
        CliRun.Run r = CliRun.run("trace", stack.toString(), "--json", "--rays", "fan", "--count", "5",
                "--half-angle", "10", "--planes=0,20", "-q");
        assertThat(r.code()).as(r.err()).isZero();
        assertThat(r.err()).as("-q silences every stage line").isEmpty();
        JsonNode root = new ObjectMapper().readTree(r.out());
        assertThat(root.get("rays").asInt()).isEqualTo(5);
        assertThat(root.get("planes")).hasSize(2);
        assertThat(root.get("planes").get(1).get("z_mm").asDouble()).isEqualTo(20.0);
        assertThat(root.get("planes").get(1).has("rms_radius_mm")).isTrue();
        assertThat(root.get("status_counts").get("screen").asInt()).isEqualTo(5);
        assertThat(root.get("ray_ends").get(2).get("x_mm").asDouble()).isCloseTo(0.0,
                org.assertj.core.data.Offset.offset(1e-9)); // the axial ray of the fan stays on the axis
        assertThat(root.get("max_energy_error").asDouble()).isLessThan(1e-6);
    }

    @Test
    void aberrationsAreFittedToTracesAndPrintedBesideTheIntegrals() throws Exception {
        CliRun.Run t = CliRun.run("trace", stack.toString(), "--count", "4", "--radius", "0.5", "--aberrations",
                "--emittance", "0.001", "--energy-width", "0.5");
        assertThat(t.code()).as(t.err()).isZero();
        assertThat(t.out()).contains("spherical aberration Cs (mm)").contains("Spot budget").contains("optimum: alpha =")
                .contains(SafetyNotice.TITLE);
        CliRun.Run r = CliRun.run("trace", stack.toString(), "--count", "4", "--radius", "0.5", "--aberrations",
                "--json");
        assertThat(r.code()).as(r.err()).isZero();
        JsonNode ab = new ObjectMapper().readTree(r.out()).get("aberrations");
        double cs = ab.get("spherical_aberration_mm").asDouble(), csT = ab.get("traced_spherical_aberration_mm").asDouble();
        double cc = ab.get("chromatic_aberration_mm").asDouble(), ccT = ab.get("traced_chromatic_aberration_mm").asDouble();
        // integral versus fitted within 1 % (issue 5); Scherzer: both positive
        assertThat(csT).isPositive().isCloseTo(cs, org.assertj.core.data.Percentage.withPercentage(1));
        assertThat(ccT).isPositive().isCloseTo(cc, org.assertj.core.data.Percentage.withPercentage(1));
    }

    @Test
    void lostRaysExitOneUnlessAllowed() throws Exception {
        CliRun.Run r = CliRun.run("trace", stack.toString(), "--rays", "ring", "--radius", "3.9", "--slope", "50",
                "--count", "4");
        assertThat(r.code()).isEqualTo(1);
        assertThat(r.err()).contains("4 of 4 rays did not reach the screen: 4 hit electrodes").contains("--allow-losses");
        assertThat(r.out()).contains("hit 'entry' at z = -18.00").contains("4 hit");
        Path csv = dir.resolve("lost.csv");
        CliRun.Run ok = CliRun.run("trace", stack.toString(), "--rays", "ring", "--radius", "3.9", "--slope", "50",
                "--count", "4", "--allow-losses", "--planes=0,10", "--table", csv.toString());
        assertThat(ok.code()).isZero();
        List<CSVRecord> rows;
        try (Reader in = Files.newBufferedReader(csv)) {
            rows = CSVFormat.RFC4180.builder().setHeader().setSkipHeaderRecord(true).get().parse(in).getRecords();
        }
        assertThat(rows).hasSize(8).allSatisfy(row -> {
            assertThat(row.get("status")).isEqualTo("hit:entry");
            assertThat(row.get("x_mm")).isEmpty();
        });
    }

    @Test
    void aMirrorSaysTheRaysTurnedBack() {
        CliRun.Run r = CliRun.run("trace", stack.toString(), "--set", "middle=-1000", "--count", "3", "--radius", "0.5");
        assertThat(r.code()).isEqualTo(1);
        assertThat(r.err()).contains("3 turned back").contains("weaken that bias");
        assertThat(r.out()).contains("ray 1 turned back at z = ");
    }

    @Test
    void badInputExitsTwoWithAClearMessageAndNoTable() {
        Path csv = dir.resolve("never.csv");
        String[][] cases = {
            {"--screen", "500", "lies outside the traced region"},
            {"--rays", "ring", "--radius", "4", "starts inside electrode 'entry'"},
            {"--count", "0", "at least one ray"},
            {"--energy-sigma", "-1", "energy spread must be zero or positive"},
            {"--radius", "-1", "disk radius must be zero or positive"},
            {"--planes=30", "lies beyond the screen"},
        };
        for (String[] c : cases) {
            String[] args = new String[c.length + 3];
            args[0] = "trace";
            args[1] = stack.toString();
            System.arraycopy(c, 0, args, 2, c.length - 1);
            args[c.length + 1] = "--table";
            args[c.length + 2] = csv.toString();
            CliRun.Run r = CliRun.run(args);
            assertThat(r.code()).as(String.join(" ", c)).isEqualTo(2);
            assertThat(r.err()).as(String.join(" ", c)).contains(c[c.length - 1]).doesNotContain("Exception");
            assertThat(csv).doesNotExist();
        }
    }
}
