package org.axistack.ui;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.nio.file.Path;
import java.util.prefs.Preferences;
import org.axistack.model.SurfaceFieldLimits;
import org.junit.jupiter.api.Test;

/** Bias scale, number reading, recent files and warning levels: the small view models. */
class SmallModelsTest {

    @Test
    void biasScaleCoversTheBiasesAndTheBeamEnergy() {
        BiasScale s = BiasScale.forStack(120, 200);
        assertThat(s.limit_V()).isEqualTo(200);
        assertThat(s.bias_V(s.position(-120))).isEqualTo(-120);
        assertThat(s.position(1e6)).isEqualTo(s.steps());
        assertThat(BiasScale.forStack(2640, 3000).limit_V()).isEqualTo(5000);
    }

    @Test
    void typedBiasesAreReadOrExplained() {
        assertThat(BiasScale.parse("focus", " -140.5 V")).isEqualTo(-140.5);
        assertThat(BiasScale.parse("focus", "12,5")).isEqualTo(12.5);
        assertThatThrownBy(() -> BiasScale.parse("focus", "abc")).hasMessageContaining("focus")
                .hasMessageContaining("type a number");
        assertThatThrownBy(() -> BiasScale.parse("focus", "2e8")).hasMessageContaining("out of range");
    }

    @Test
    void recentFilesKeepTheNewestFirstWithoutDuplicates() throws Exception {
        Preferences node = new MemoryPreferences().node("org/axistack/desktop"); // never the user's own preferences
        try {
            RecentFiles r = new RecentFiles(node);
            assertThat(r.cautionsSeen()).isFalse();
            for (int i = 0; i < RecentFiles.MAX + 3; i++) {
                r.add(Path.of("lens" + i + ".toml"));
            }
            r.add(Path.of("lens5.toml"));
            assertThat(r.list()).hasSize(RecentFiles.MAX);
            assertThat(r.list().get(0).getFileName().toString()).isEqualTo("lens5.toml");
            assertThat(r.list().stream().filter(p -> p.getFileName().toString().equals("lens5.toml"))).hasSize(1);
            r.markCautionsSeen();
            assertThat(new RecentFiles(node).cautionsSeen()).isTrue();
        } finally {
            node.removeNode();
        }
    }

    @Test
    void surfaceFieldLevelsFollowTheLimits() {
        SurfaceFieldLimits lim = new SurfaceFieldLimits(5e6, 10e6);
        assertThat(PropertySheet.level(4.9e6, lim)).isEqualTo(PropertySheet.Level.PLAIN);
        assertThat(PropertySheet.level(5.1e6, lim)).isEqualTo(PropertySheet.Level.CAUTION);
        assertThat(PropertySheet.level(10.1e6, lim)).isEqualTo(PropertySheet.Level.OVER);
    }

    @Test
    void numbersAreShownPlainly() {
        assertThat(UiFormat.num(32.2249)).isEqualTo("32.22");
        assertThat(UiFormat.num(-0.0)).isEqualTo("0");
        assertThat(UiFormat.num(17770)).isEqualTo("17770");
        assertThat(UiFormat.num(Double.POSITIVE_INFINITY)).isEqualTo("infinite");
        assertThat(UiFormat.volts(-120)).isEqualTo("-120");
    }
}
