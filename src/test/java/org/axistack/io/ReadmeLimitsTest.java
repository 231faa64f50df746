package org.axistack.io;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.axistack.model.Electrode;
import org.junit.jupiter.api.Test;

/**
 * The README's limits and shape table are the ones the reader applies: each figure the README gives is read from
 * the README and compared with {@link Limits}, and its shape table lists exactly {@link Electrode#SHAPES}. When a
 * limit changes, this test names the README sentence to change (one place holds each limit; the README quotes it).
 */
class ReadmeLimitsTest {

    private static String readme() throws Exception {
        return Files.readString(Path.of("README.md")).replaceAll("\\s+", " ");
    }

    private static double figure(String text, String regex) {
        Matcher m = Pattern.compile(regex).matcher(text);
        assertThat(m.find()).as("README sentence matching /" + regex + "/").isTrue();
        return Double.parseDouble(m.group(1).replace(" ", ""));
    }

    @Test
    void theReadmeQuotesTheReadersLimits() throws Exception {
        String t = readme();
        assertThat(figure(t, "stack files up to (\\d+) MiB") * (1 << 20)).isEqualTo(Limits.MAX_FILE_BYTES);
        assertThat(figure(t, "MiB, (\\d+) electrodes")).isEqualTo(Limits.MAX_ELECTRODES);
        assertThat(figure(t, "electrodes and (\\d+) outline points")).isEqualTo(Limits.MAX_TOTAL_POINTS);
        assertThat(figure(t, "(\\d+) points per outline")).isEqualTo(Limits.MAX_OUTLINE_POINTS);
        assertThat(figure(t, "\\|lengths\\| up to (\\d+ ?\\d*) mm")).isEqualTo(Limits.MAX_LENGTH_MM);
        assertThat(figure(t, "sizes at least ([\\d.]+) mm")).isEqualTo(Limits.MIN_SIZE_MM);
        assertThat(figure(t, "\\|bias\\| up to (\\d+) MV") * 1e6).isEqualTo(Limits.MAX_BIAS_V);
        assertThat(figure(t, "energy up to (\\d+) GeV") * 1e9).isEqualTo(Limits.MAX_ENERGY_EV);
    }

    @Test
    void theReadmesShapeTableListsEveryShape() throws Exception {
        String raw = Files.readString(Path.of("README.md"));
        int start = raw.indexOf("| shape | keys |");
        assertThat(start).as("README shape table").isNotNegative();
        Matcher m = Pattern.compile("\\n\\| `(\\w+)` \\|").matcher(raw.substring(start, raw.indexOf("\n\n", start)));
        List<String> shapes = new java.util.ArrayList<>();
        while (m.find()) {
            shapes.add(m.group(1));
        }
        assertThat(shapes).containsExactlyElementsOf(Electrode.SHAPES);
    }
}
