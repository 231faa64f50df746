package org.axistack.model;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.List;
import org.junit.jupiter.api.Test;

/** Geometry checks against hand-worked plane geometry (distances between axis-parallel rectangles). */
class GeometryCheckTest {

    private static Electrode tube(String n, double bias, double z0, double z1, double wall) {
        return new Electrode.Tube(n, bias, 0.005, z0, z1, wall);
    }

    @Test
    void separatedTubesAreFineAndTheirGapIsTheAxialDistance() {
        Electrode a = tube("a", 0, -0.02, -0.001, 0.001), b = tube("b", 100, 0.001, 0.02, 0.001);
        assertThat(GeometryCheck.check(List.of(a, b))).isEmpty();
        assertThat(GeometryCheck.gap_m(a, b)).isCloseTo(0.002, within(1e-15));
    }

    @Test
    void touchingIsAnErrorOnlyAtDifferentBiases() {
        Electrode a = tube("a", 0, -0.02, 0.0, 0.001), b = tube("b", 0, 0.0, 0.02, 0.001);
        assertThat(GeometryCheck.check(List.of(a, b))).isEmpty();
        List<GeometryCheck.Problem> p = GeometryCheck.check(List.of(a, b.withBias_V(5)));
        assertThat(p).singleElement().satisfies(q -> assertThat(q.kind()).isEqualTo(GeometryCheck.Kind.TOUCH));
    }

    @Test
    void aGapBelowTheToleranceCountsAsTouching() {
        Electrode a = tube("a", 0, -0.02, 0.0, 0.001), b = tube("b", 1, 0.5e-7, 0.02, 0.001);
        assertThat(GeometryCheck.check(List.of(a, b))).extracting(GeometryCheck.Problem::kind)
                .containsExactly(GeometryCheck.Kind.TOUCH);
        Electrode c = tube("c", 1, 2e-7, 0.02, 0.001);
        assertThat(GeometryCheck.check(List.of(a, c))).isEmpty();
    }

    @Test
    void overlapAndContainmentAreErrorsAtAnyBias() {
        Electrode a = tube("a", 0, -0.02, 0.005, 0.001), b = tube("b", 0, 0.0, 0.02, 0.001);
        assertThat(GeometryCheck.check(List.of(a, b))).extracting(GeometryCheck.Problem::kind)
                .containsExactly(GeometryCheck.Kind.OVERLAP);
        // a thin ring wholly inside a thick plate: no crossing, but contained
        Electrode plate = new Electrode.Aperture("p", 0, 0, 0.001, 0.02, 0.004);
        Electrode ring = new Electrode.Ring("r", 0, 0, 0.01, 0.0005);
        assertThat(GeometryCheck.check(List.of(plate, ring))).extracting(GeometryCheck.Problem::kind)
                .containsExactly(GeometryCheck.Kind.OVERLAP);
        // a sheet crossing a sheet
        Electrode s1 = new Electrode.Aperture("s1", 0, 0.0, 0.001, 0.02, 0);
        Electrode s2 = new Electrode.Tube("s2", 0, 0.01, -0.005, 0.005, 0);
        assertThat(GeometryCheck.check(List.of(s1, s2))).extracting(GeometryCheck.Problem::kind)
                .containsExactly(GeometryCheck.Kind.OVERLAP);
    }

    @Test
    void selfCrossingOutlinesAreFound() {
        Contour bowTie = Contour.polyline(true, new ZR(0, 0.01), new ZR(0.004, 0.014), new ZR(0.004, 0.01),
                new ZR(0, 0.014));
        assertThat(GeometryCheck.check(List.of(new Electrode.Outline("x", 0, bowTie))))
                .extracting(GeometryCheck.Problem::kind).containsExactly(GeometryCheck.Kind.SELF_CROSSING);
        Contour folded = Contour.polyline(false, new ZR(0, 0.01), new ZR(0.004, 0.01), new ZR(0.002, 0.01));
        assertThat(GeometryCheck.check(List.of(new Electrode.Outline("y", 0, folded))))
                .extracting(GeometryCheck.Problem::kind).containsExactly(GeometryCheck.Kind.SELF_CROSSING);
        Contour square = Contour.polyline(true, new ZR(0, 0.01), new ZR(0.004, 0.01), new ZR(0.004, 0.014),
                new ZR(0, 0.014));
        assertThat(GeometryCheck.check(List.of(new Electrode.Outline("z", 0, square)))).isEmpty();
        // every built-in shape passes, including the ring made of two arcs
        assertThat(GeometryCheck.check(List.of(new Electrode.Ring("r", 0, 0, 0.01, 0.0005),
                new Electrode.Disk("d", 0, 0.01, 0.01, 0.001), new Electrode.Disk("e", 0, 0.02, 0.01, 0)))).isEmpty();
    }

    /**
     * Beyond the worst case the reader admits (1000 outline points; here 2000, all arcs, bounding boxes overlapping): four
     * nested, non-touching circles of 500 arc points each. The checks must finish and find nothing.
     */
    @Test
    @org.junit.jupiter.api.Timeout(value = 20, unit = java.util.concurrent.TimeUnit.SECONDS)
    void nestedArcOutlinesAtTheSizeLimitAreCheckedInReasonableTime() {
        java.util.List<Electrode> es = new java.util.ArrayList<>();
        for (int k = 0; k < 4; k++) {
            double rad = 0.004 + 0.002 * k;
            java.util.List<Segment> segs = new java.util.ArrayList<>();
            int n = 500;
            for (int i = 0; i < n; i++) {
                double t0 = 2 * Math.PI * i / n, t1 = 2 * Math.PI * (i + 1) / n, tm = (t0 + t1) / 2;
                ZR a = new ZR(rad * Math.cos(t0), 0.02 + rad * Math.sin(t0));
                ZR m = new ZR(rad * Math.cos(tm), 0.02 + rad * Math.sin(tm));
                ZR b = i + 1 == n ? segs.get(0).start() : new ZR(rad * Math.cos(t1), 0.02 + rad * Math.sin(t1));
                segs.add(new Segment.Arc(a, m, b));
            }
            es.add(new Electrode.Outline("c" + k, k, new Contour(segs, true)));
        }
        // nested closed outlines: each inner circle lies inside the solid bounded by the outer ones
        assertThat(GeometryCheck.check(es)).extracting(GeometryCheck.Problem::kind).containsOnly(GeometryCheck.Kind.OVERLAP);
        // the same circles side by side along z: no problem at all
        java.util.List<Electrode> apart = new java.util.ArrayList<>();
        for (int k = 0; k < 4; k++) {
            apart.add(es.get(3).shifted(0.03 * k).withBias_V(k));
        }
        List<Electrode> named = apart.stream().map(e -> (Electrode) new Electrode.Outline("s" + e.bias_V(),
                e.bias_V(), e.contour())).toList();
        assertThat(GeometryCheck.check(named)).isEmpty();
        // circles of radius 10 mm, centres 30 mm apart: the gap is 10 mm (to the chord error of the flattening)
        assertThat(GeometryCheck.gap_m(named.get(0), named.get(1))).isCloseTo(0.010, within(1e-6));
    }

    @Test
    void gapMatchesHandWorkedPlaneGeometry() {
        Electrode lip = new Electrode.Ring("w", 0, 0.003, 0.006, 0.0005);
        Electrode plate = new Electrode.Aperture("p", 1, 0.0, 0.002, 0.012, 0.001);
        Electrode tube = new Electrode.Tube("t", 2, 0.004, 0.005, 0.03, 0.001);
        // hand-worked: ring leftmost point z = 2.5 mm vs plate face z = 0.5 mm -> 2.0 mm;
        // tube starts at z = 5 mm, r 4..5 mm; ring rightmost point (3.5, 6) mm -> distance to corner (5, 5) mm
        assertThat(GeometryCheck.gap_m(lip, plate)).isCloseTo(0.002, within(1e-9));
        assertThat(GeometryCheck.gap_m(plate, tube)).isCloseTo(0.0045, within(1e-12));
        double ringToTube = Math.hypot(0.005 - 0.003, 0.006 - 0.005) - 0.0005;
        assertThat(GeometryCheck.gap_m(lip, tube)).isCloseTo(ringToTube, within(2e-6));
    }
}
