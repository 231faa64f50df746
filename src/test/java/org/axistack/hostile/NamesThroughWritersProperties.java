package org.axistack.hostile;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.StringReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import javax.xml.parsers.DocumentBuilderFactory;

import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVRecord;
import org.axistack.io.CsvTable;
import org.axistack.io.StackInputException;
import org.axistack.io.StackMessage;
import org.axistack.io.StackReader;
import org.axistack.io.StackWriter;
import org.axistack.io.TextSafety;
import org.axistack.model.Stack;
import org.axistack.report.ChartFiles;
import org.axistack.report.GeometryChart;

/**
 * Electrode names drawn from every character class (letters of several scripts, digits, spaces, CSV and HTML
 * specials, formula starters = + - @, tab, CR, LF, escape, bell, NUL, DEL, C1 controls, bidirectional overrides,
 * combining marks, characters outside the BMP) through every writer: the stack reader (names with a control
 * character are refused with the catalogue message, never shown raw), the TOML round trip, the one CSV cell writer
 * (read back by Commons CSV: the same text, with a leading apostrophe where a spreadsheet would run a formula)
 * and the SVG figure (well-formed XML, the name in it). The HTML report and the terminal are covered for a hostile
 * name by {@code HostileNamesTest}.
 */
class NamesThroughWritersProperties {

    private static final String CLASSES = "aZé中ж09 _.,;:\"'<>&/\\|%=+-@\t\r\n\u001b\u0007\u0000\u007f\u0085\u009b"
            + "\u202e\u2066\u0301\u2028";

    /** A plain decimal number: a spreadsheet reads it as a number, never as a formula. */
    private static final String NUMBER = "-?(\\d+\\.?\\d*|\\.\\d+)([eE][-+]?\\d+)?";

    /** A text cell as a spreadsheet must receive it: formula starters behind an apostrophe, numbers as they are. */
    private static String shown(String text) {
        return "=+-@\t\r".indexOf(text.charAt(0)) >= 0 && !text.matches(NUMBER) ? "'" + text : text;
    }

    @Provide
    Arbitrary<String> names() {
        Arbitrary<String> pieces = Arbitraries.oneOf(
                Arbitraries.of(CLASSES.chars().mapToObj(c -> String.valueOf((char) c)).toList()),
                Arbitraries.of("\ud83d\ude00", "=SUM(A1)", "+1", "-2+3", "@cmd", "-130.08", "<script>", "]]>"));
        return pieces.list().ofMinSize(1).ofMaxSize(8).map(l -> String.join("", l));
    }

    private static String stackText(String name) {
        return HostileStackFilesTest.BASE.replace("name = \"a\"", "name = " + tomlQuote(name));
    }

    /** A TOML basic string (every control character as an escape, as a careful editor would write it). */
    private static String tomlQuote(String s) {
        StringBuilder b = new StringBuilder("\"");
        s.chars().forEach(c -> {
            if (c == '"' || c == '\\') {
                b.append('\\').append((char) c);
            } else if (c < 0x20 || c == 0x7f) {
                b.append(String.format("\\u%04X", c));
            } else {
                b.append((char) c);
            }
        });
        return b.append('"').toString();
    }

    @Property(seed = "20261201")
    void everyNameIsRefusedOrWrittenSafely(@ForAll("names") String name) throws Exception {
        String text = stackText(name);
        if (TextSafety.firstUnsafe(name) >= 0) {
            assertThatThrownBy(() -> StackReader.parse(text, "received.toml"))
                    .isInstanceOfSatisfying(StackInputException.class, e -> {
                        assertThat(e.id()).isEqualTo(StackMessage.CONTROL_CHARACTER);
                        assertThat(e.getMessage()).contains("received.toml").contains("line 5").contains("name");
                        assertThat(TextSafety.firstUnsafe(e.getMessage())).as("message shown raw").isEqualTo(-1);
                    });
            return;
        }
        if (name.isBlank()) {
            assertThatThrownBy(() -> StackReader.parse(text, "received.toml")).isInstanceOf(StackInputException.class);
            return;
        }
        Stack s = StackReader.parse(text, "received.toml");
        assertThat(s.electrodes().get(0).name()).isEqualTo(name);
        // TOML round trip
        Stack back = StackReader.parse(StackWriter.toToml(s), "written.toml");
        assertThat(back).isEqualTo(s);
        // CSV: header and cell, read back by Commons CSV (a general-purpose reference reader)
        String csv = CsvTable.text(List.of("electrode", name + "_pF"), List.of(List.of(name, -130.08), List.of("b", 1.5)));
        List<CSVRecord> rows = CSVFormat.RFC4180.parse(new StringReader(csv)).getRecords();
        assertThat(rows).hasSize(3);
        for (CSVRecord r : rows) {
            for (String cell : r) {
                assertThat(cell).as("a cell a spreadsheet would run").doesNotStartWith("=").doesNotStartWith("+")
                        .doesNotStartWith("@").doesNotStartWith("\t").doesNotStartWith("\r");
                if (cell.startsWith("-")) {
                    assertThat(cell).as("only numbers may start with a minus").matches(NUMBER);
                }
            }
        }
        assertThat(rows.get(1).get(0)).isEqualTo(shown(name));
        assertThat(rows.get(1).get(1)).isEqualTo("-130.08");
        assertThat(rows.get(0).get(1)).isEqualTo(shown(name + "_pF"));
        // SVG of the geometry figure: well-formed XML holding the name
        Path svg = Files.createTempFile("names", ".svg");
        try {
            ChartFiles.writeSvg(GeometryChart.create(s), 600, 300, svg);
            DocumentBuilderFactory f = DocumentBuilderFactory.newInstance();
            f.setFeature("http://apache.org/xml/features/nonvalidating/load-external-dtd", false);
            var doc = f.newDocumentBuilder().parse(svg.toFile());
            assertThat(doc.getDocumentElement().getTextContent()).contains(name.strip().isEmpty() ? "" : name.strip());
            assertThat(Files.readString(svg, StandardCharsets.UTF_8)).doesNotContain("NaN");
        } finally {
            Files.deleteIfExists(svg);
        }
    }
}
