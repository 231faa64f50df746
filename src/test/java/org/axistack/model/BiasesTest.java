package org.axistack.model;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * The bias value and the geometry key: "copy the biases, set one" keeps everything else, a split electrode moves
 * in common mode, a stack re-biased through the value equals one re-biased by name, and the geometry key ignores
 * biases but not shapes (bookkeeping checks; no physics involved).
 */
class BiasesTest {

    private static final Stack STACK = new Stack("three tubes", new Beam(Particle.proton(), 1000), List.of(
            new Electrode.Tube("inlet", 0, 5e-3, -0.03, -0.011, 1e-3),
            new Electrode.Tube("focus", 800, 5e-3, -0.01, 0.01, 1e-3),
            new Electrode.Tube("outlet", 0, 5e-3, 0.011, 0.03, 1e-3)));

    @Test
    void withSetsOneBiasAndKeepsTheOthers() {
        Biases b = STACK.biases().with("focus", 650);
        assertThat(b.toArray_V()).containsExactly(0, 650, 0);
        assertThat(STACK.biases().toArray_V()).containsExactly(0, 800, 0);
        assertThat(STACK.withBiases(b)).isEqualTo(STACK.withBias("focus", 650));
        assertThatThrownBy(() -> b.with("nowhere", 1)).hasMessageContaining("nowhere");
    }

    @Test
    void aSplitElectrodeMovesInCommonMode() {
        Stack split = STACK.withSectors("focus", Sectors.fromDifferentials(4, 0, 0, 800, 30, -20));
        Biases b = split.biases();
        assertThat(b.sectors_V().get("focus")).hasSize(4);
        Biases moved = b.with("focus", 700);
        List<Double> before = b.sectors_V().get("focus");
        List<Double> after = moved.sectors_V().get("focus");
        for (int s = 0; s < 4; s++) {
            assertThat(after.get(s) - before.get(s)).isCloseTo(-100, org.assertj.core.api.Assertions.within(1e-9));
        }
        Stack restacked = split.withBiases(moved);
        assertThat(restacked.sectors().get("focus").biases_V()).isEqualTo(after);
        assertThat(restacked.electrode("focus").bias_V()).isCloseTo(700, org.assertj.core.api.Assertions.within(1e-9));
        // sector biases whose mean is not the electrode's bias are refused
        assertThatThrownBy(() -> new Biases(b.names(), List.of(0.0, 800.0, 0.0),
                java.util.Map.of("focus", List.of(0.0, 0.0, 0.0, 0.0)))).hasMessageContaining("mean");
    }

    @Test
    void theGeometryKeyIgnoresBiasesButNotShapes() {
        assertThat(STACK.withBias("focus", -300).geometryKey()).isEqualTo(STACK.geometryKey());
        assertThat(STACK.withBias("focus", -0.0).geometryKey()).isEqualTo(STACK.withBias("focus", 0).geometryKey());
        Stack moved = new Stack("three tubes", STACK.beam(), List.of(STACK.electrodes().get(0),
                new Electrode.Tube("focus", 800, 5e-3, -0.01, 0.012, 1e-3), STACK.electrodes().get(2)));
        assertThat(moved.geometryKey()).isNotEqualTo(STACK.geometryKey());
    }
}
