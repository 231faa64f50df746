package org.axistack.model;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;

/** Rounded sections: every corner a tangent quarter circle (plane geometry, no source needed beyond that). */
class RoundedContourTest {

    @Test
    void aRoundedTubeWallHasTangentArcsAndThePerimeterOfARoundedRectangle() {
        double rho = 0.25e-3;
        Electrode.Tube t = new Electrode.Tube("t", 0, 5e-3, -10e-3, 10e-3, 1e-3, rho);
        Contour c = t.contour();
        assertThat(c.closed()).isTrue();
        // rounded rectangle w x h: perimeter 2 (w + h) - 8 rho + 2 pi rho
        assertThat(c.length_m()).isCloseTo(2 * (20e-3 + 1e-3) - 8 * rho + 2 * Math.PI * rho, within(1e-15));
        long arcs = c.segments().stream().filter(s -> s instanceof Segment.Arc).count();
        assertThat(arcs).isEqualTo(4);
        for (int i = 0; i < c.segments().size(); i++) {
            Segment a = c.segments().get(i);
            Segment b = c.segments().get((i + 1) % c.segments().size());
            double[] ta = a.derivative(1);
            double[] tb = b.derivative(0);
            double cross = ta[0] * tb[1] - ta[1] * tb[0];
            assertThat(cross / (Math.hypot(ta[0], ta[1]) * Math.hypot(tb[0], tb[1]))).isCloseTo(0, within(1e-9));
            assertThat(a.end().distanceTo(b.start())).isLessThan(1e-15);
        }
        for (Segment s : c.segments()) {
            if (s instanceof Segment.Arc arc) {
                assertThat(arc.radius_m()).isCloseTo(rho, within(1e-15));
                assertThat(Math.abs(arc.sweep_rad())).isCloseTo(Math.PI / 2, within(1e-12));
            }
        }
    }

    @Test
    void halfTheWallMakesAFullRoundEndWithoutAStraightPiece() {
        Electrode.Aperture a = new Electrode.Aperture("p", 0, 0, 1e-3, 5e-3, 1e-3, 0.5e-3);
        Contour c = a.contour();
        assertThat(c.segments()).hasSize(6); // 4 arcs, 2 straight faces (the ends are half circles)
        assertThat(c.minR_m()).isCloseTo(1e-3, within(1e-12));
        assertThat(c.maxZ_m()).isCloseTo(0.5e-3, within(1e-12));
    }

    @Test
    void tooLargeOrSheetRadiiAreRejected() {
        assertThatThrownBy(() -> new Electrode.Tube("t", 0, 5e-3, 0, 10e-3, 1e-3, 0.6e-3))
                .isInstanceOf(IllegalArgumentException.class);
        assertThatThrownBy(() -> new Electrode.Tube("t", 0, 5e-3, 0, 10e-3, 0, 0.1e-3))
                .isInstanceOf(IllegalArgumentException.class);
        assertThatThrownBy(() -> new Electrode.Aperture("p", 0, 0, 1e-3, 1.5e-3, 2e-3, 0.3e-3))
                .isInstanceOf(IllegalArgumentException.class);
    }
}
