package org.axistack.hostile;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.StringReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.TimeUnit;

import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVRecord;
import org.axistack.cli.CliRun;
import org.axistack.io.TextSafety;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import org.junit.jupiter.api.io.TempDir;

/**
 * A received stack with hostile names, end to end through the plan: a formula name reaches every CSV of the report
 * neutralised and the HTML escaped; raw control bytes in the file and escaped control characters in a name are
 * refused with the catalogue message and never echoed raw to the terminal.
 */
class HostileNamesTest {

    private static final String FORMULA = "=HYPERLINK(\"http://example.invalid\",\"x\")<b>&";

    @Test
    @Timeout(value = 120, unit = TimeUnit.SECONDS)
    void aFormulaNameIsNeutralisedInEveryCsvAndEscapedInTheHtml(@TempDir Path dir) throws Exception {
        String text = OutputPathsTest.STACK.replace("name = \"b\"", "name = \"=HYPERLINK(\\\"http://example.invalid\\\",\\\"x\\\")<b>&\"");
        Path stack = Files.writeString(dir.resolve("received.toml"), text);
        Path out = dir.resolve("out");
        CliRun.Run r = CliRun.run("plan", stack.toString(), "--no-check", "-q", "--out", out.toString());
        assertThat(r.code()).as(r.err()).isIn(0, 1);
        int csvs = 0;
        boolean seen = false;
        try (var files = Files.list(out)) {
            for (Path f : (Iterable<Path>) files::iterator) {
                if (!f.toString().endsWith(".csv")) {
                    continue;
                }
                csvs++;
                for (CSVRecord row : CSVFormat.RFC4180.parse(new StringReader(Files.readString(f))).getRecords()) {
                    for (String cell : row) {
                        assertThat(cell).as(f.getFileName() + ": a cell a spreadsheet would run").doesNotStartWith("=")
                                .doesNotStartWith("+").doesNotStartWith("@");
                        seen |= cell.startsWith("'=HYPERLINK");
                    }
                }
            }
        }
        assertThat(csvs).isGreaterThanOrEqualTo(3);
        assertThat(seen).as("the name is in the tables, neutralised").isTrue();
        String html = Files.readString(out.resolve("report.html"));
        assertThat(html).doesNotContain("<b>&").contains("&lt;b&gt;&amp;");
    }

    @Test
    void controlCharactersAreRefusedAndNeverEchoedRaw(@TempDir Path dir) throws Exception {
        // an escaped ESC in a name, and a raw ESC byte in the file (not valid TOML)
        for (String name : new String[] {"a\\u001b]0;owned\\u0007", "a\u001b[2J"}) {
            String text = OutputPathsTest.STACK.replace("name = \"b\"", "name = \"" + name + "\"");
            Path stack = Files.write(dir.resolve("received.toml"), text.getBytes(StandardCharsets.UTF_8));
            CliRun.Run r = CliRun.run("plan", stack.toString(), "--out", dir.resolve("out").toString());
            assertThat(r.code()).as(r.err()).isEqualTo(2);
            assertThat(TextSafety.firstUnsafe(r.err().replace("\n", ""))).as(r.err()).isEqualTo(-1);
            assertThat(r.err()).contains("received.toml").contains("line");
            assertThat(dir.resolve("out")).doesNotExist();
        }
        // a control character in a command-line value is echoed escaped
        CliRun.Run r = CliRun.run("plan", "--set", "x\u001b[2J=5", "--out", dir.resolve("out").toString());
        assertThat(r.code()).isEqualTo(2);
        assertThat(TextSafety.firstUnsafe(r.err().replace("\n", ""))).as(r.err()).isEqualTo(-1);
    }
}
