package org.axistack.report;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;

/** The cautions name what physics-brief.md asks for: common practice, no single source. */
class SafetyNoticeTest {
    @Test
    void namesTheUsualCautionsAndDefersToCodes() {
        String t = SafetyNotice.text().toLowerCase(java.util.Locale.ROOT);
        assertThat(t).contains("interlock").contains("grounded").contains("bleed resistor").contains("one-hand")
                .contains("qualified").contains("local electrical codes").contains("licensed practice")
                .contains("iec 61010-1");
    }

    @Test
    void theReadmeCarriesTheSameCautions() throws Exception {
        String readme = java.nio.file.Files.readString(java.nio.file.Path.of("README.md")).replaceAll("\\s+", " ");
        assertThat(readme).contains(SafetyNotice.TITLE);
        for (String c : SafetyNotice.CAUTIONS) {
            assertThat(readme).contains(c);
        }
    }

    @Test
    void theReadmeGivesTheTwoSetUpCommandsAndCiRunsTheTestOne() throws Exception {
        String readme = java.nio.file.Files.readString(java.nio.file.Path.of("README.md"));
        assertThat(readme).contains("    mvn -q -DskipTests package && java -jar target/axistack.jar plan\n")
                .contains("    mvn -q test\n");
        assertThat(java.nio.file.Files.readString(java.nio.file.Path.of(".ci/run"))).contains("\nmvn -q test\n")
                .contains("set -euo pipefail");
    }
}
