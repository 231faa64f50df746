package org.axistack.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;

/** {@code gui} without a display: a clear message and exit 2, never a stack trace. */
class GuiCommandTest {

    @Test
    void headlessGuiSaysSoAndExitsTwo() throws Exception {
        String java = Path.of(System.getProperty("java.home"), "bin", "java").toString();
        Process p = new ProcessBuilder(List.of(java, "-Djava.awt.headless=true", "-cp",
                System.getProperty("java.class.path"), Main.class.getName(), "gui"))
                .redirectErrorStream(true).start();
        assertThat(p.waitFor(60, TimeUnit.SECONDS)).isTrue();
        String out = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        assertThat(p.exitValue()).isEqualTo(Main.EXIT_INPUT);
        assertThat(out).contains("gui needs a display").contains("Fix:").doesNotContain("Exception").doesNotContain("\tat ");
    }
}
