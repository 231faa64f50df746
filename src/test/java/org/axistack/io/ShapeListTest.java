package org.axistack.io;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.Arrays;
import java.util.Locale;
import java.util.Map;
import org.axistack.model.Electrode;
import org.junit.jupiter.api.Test;

/**
 * The shapes live in one list ({@link Electrode#SHAPES}): the sealed interface permits one record per entry,
 * each record writes its entry, the reader knows the keys of exactly those shapes, and the message for an
 * unknown shape names them (common practice, no source).
 */
class ShapeListTest {

    @Test
    void recordsReaderAndMessageAgreeWithTheOneList() throws Exception {
        assertThat(Arrays.stream(Electrode.class.getPermittedSubclasses())
                .map(c -> c.getSimpleName().toLowerCase(Locale.ROOT)).toList())
                .as("one record per shape, in the list's order").isEqualTo(Electrode.SHAPES);
        assertThat(ElectrodeReader.SHAPE_KEYS.keySet()).containsExactlyElementsOf(Electrode.SHAPES);
        assertThat(StackMessage.UNKNOWN_SHAPE.format(Map.of("shape", "tub", "suggestion", "",
                "shapes", String.join(", ", Electrode.SHAPES))))
                .endsWith("Fix: use one of: tube, aperture, disk, ring, outline.");
        // every shape read from a stack file reports its own keyword
        String text = """
                [beam]
                particle = "electron"
                energy_eV = 100
                [[electrode]]
                name = "t"
                shape = "tube"
                bias_V = 0
                radius_mm = 5.0
                z_start_mm = -45.0
                z_end_mm = -4.0
                [[electrode]]
                name = "ap"
                shape = "aperture"
                bias_V = 0
                z_mm = 20.0
                hole_radius_mm = 1.0
                outer_radius_mm = 12.0
                [[electrode]]
                name = "d"
                shape = "disk"
                bias_V = 0
                z_mm = 40.0
                radius_mm = 8.0
                [[electrode]]
                name = "r"
                shape = "ring"
                bias_V = 0
                z_mm = 30.0
                radius_mm = 9.0
                wire_radius_mm = 0.25
                [[electrode]]
                name = "o"
                shape = "outline"
                bias_V = 0
                closed = false
                points_mm = [[0.0, 15.0], [4.0, 15.0]]
                """;
        for (Electrode e : StackReader.parse(text, "all-shapes.toml").electrodes()) {
            assertThat(e.shape()).isEqualTo(e.getClass().getSimpleName().toLowerCase(Locale.ROOT));
        }
    }
}
