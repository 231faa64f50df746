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
                + "screen_slope_urad_per_unit,walk_um_per_unit_per_focus_V,tolerance_budget,tolerance_alone,tolerance_unit");
        assertThat(lines).hasSize(1 + 2 * 3);
        assertThat(lines.get(1)).contains("decentre", "0.01 mm");
        assertThat(lines.get(2)).contains("tilt", "1 mrad");
    }

    @Test
    void badAllowanceAndUnknownFocusAreNamed() {
        CliRun.Run r = CliRun.run("misalign", "--quiet", "--allowed-shift", "-1");
        assertThat(r.code()).isEqualTo(2);
        assertThat(r.err()).contains("--allowed-shift");
        CliRun.Run f = CliRun.run("misalign", "--quiet", "--focus", "nosuch");
        assertThat(f.code()).isEqualTo(2);
        assertThat(f.err()).contains("--focus nosuch", "choose one of");
    }
}
