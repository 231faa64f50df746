package org.axistack.model;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * The shared outline polygons: the even-odd rule on a square and on a solid of revolution closed along the axis
 * (common practice, no source: points chosen well inside and outside), and the vertex list of a flattened contour.
 */
class OutlinesTest {

    @Test
    void evenOddRuleOnAClosedSquare() {
        Contour sq = Contour.polyline(true, new ZR(0, 1), new ZR(2, 1), new ZR(2, 3), new ZR(0, 3));
        double[][] ring = Outlines.solidRing(sq, Outlines.vertices(sq, arc -> 4));
        assertThat(ring[0]).isEqualTo(ring[ring.length - 1]);
        assertThat(Outlines.contains(ring, 1, 2)).isTrue();
        assertThat(Outlines.contains(ring, 3, 2)).isFalse();
        assertThat(Outlines.contains(ring, 1, 0.5)).isFalse();
        assertThat(Outlines.contains(ring, -1, 2)).isFalse();
    }

    @Test
    void anOpenOutlineFromAxisToAxisIsClosedAlongTheAxis() {
        // a disk-like solid: up from the axis at z = 0, across at r = 2, down to the axis at z = 1
        Contour open = Contour.polyline(false, new ZR(0, 0), new ZR(0, 2), new ZR(1, 2), new ZR(1, 0));
        List<ZR> v = Outlines.vertices(open, arc -> 4);
        assertThat(v).hasSize(4);
        double[][] ring = Outlines.solidRing(open, v);
        assertThat(ring.length).isEqualTo(5);
        assertThat(Outlines.contains(ring, 0.5, 1)).isTrue();
        assertThat(Outlines.contains(ring, 1.5, 1)).isFalse();
    }
}
