package org.axistack.io;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.axistack.model.Contour;
import org.axistack.model.Electrode;
import org.axistack.model.ZR;
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
        // every record reports its own keyword (one of each shape, as the reader makes them)
        Contour line = Contour.polyline(false, new ZR(0, 0.015), new ZR(0.004, 0.015));
        List<Electrode> each = List.of(new Electrode.Tube("t", 0, 0.005, -0.045, -0.004, 0),
                new Electrode.Aperture("ap", 0, 0.020, 0.001, 0.012, 0), new Electrode.Disk("d", 0, 0.040, 0.008, 0.001),
                new Electrode.Ring("r", 0, 0.030, 0.009, 0.00025), new Electrode.Outline("o", 0, line));
        for (Electrode e : each) {
            assertThat(e.shape()).isEqualTo(e.getClass().getSimpleName().toLowerCase(Locale.ROOT));
        }
    }
}
