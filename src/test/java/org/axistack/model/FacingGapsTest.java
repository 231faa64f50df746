package org.axistack.model;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.List;

import org.junit.jupiter.api.Test;

/** Gaps between facing electrodes against plane and circle geometry worked by hand (analytic geometry). */
class FacingGapsTest {

    @Test
    void twoCoaxialTubesFaceAcrossTheirEndGap() {
        // end faces at z = -1 and +1 mm, walls r = 5..6 mm: the gap is 2 mm, across the end faces
        List<FacingGaps.Gap> g = FacingGaps.of(List.of(new Electrode.Tube("a", 0, 5e-3, -30e-3, -1e-3, 1e-3),
                new Electrode.Tube("b", 100, 5e-3, 1e-3, 30e-3, 1e-3)));
        assertThat(g).hasSize(1);
        assertThat(g.get(0).gap_m()).isCloseTo(2e-3, within(1e-12));
        assertThat(g.get(0).from().z_m()).isCloseTo(-1e-3, within(1e-12));
        assertThat(g.get(0).to().z_m()).isCloseTo(1e-3, within(1e-12));
    }

    @Test
    void roundedTubeEndsFaceAcrossTheFlatPartOfTheirEnds() {
        // edge radius 0.25 mm on a 1 mm wall leaves the end faces flat between r = 5.25 and 5.75 mm: still 2 mm
        List<FacingGaps.Gap> g = FacingGaps.of(List.of(new Electrode.Tube("a", 0, 5e-3, -30e-3, -1e-3, 1e-3, 0.25e-3),
                new Electrode.Tube("b", 100, 5e-3, 1e-3, 30e-3, 1e-3, 0.25e-3)));
        assertThat(g.get(0).gap_m()).isCloseTo(2e-3, within(1e-12));
        assertThat(g.get(0).from().r_m()).isBetween(5.25e-3 - 1e-12, 5.75e-3 + 1e-12);
    }

    @Test
    void twoRingsFaceAcrossTheDistanceOfTheirCentresLessTheWires() {
        // rings (tori) of radius 10 and 14 mm at z = 0 and 3 mm, wire radius 0.5 mm: centres (0, 10) and (3, 14) are
        // 5 mm apart, so the wires face across 5 - 2 x 0.5 = 4 mm (good to the chord sagitta of the flattened circle)
        List<FacingGaps.Gap> g = FacingGaps.of(List.of(new Electrode.Ring("a", 0, 0, 10e-3, 0.5e-3),
                new Electrode.Ring("b", 50, 3e-3, 14e-3, 0.5e-3)));
        assertThat(g.get(0).gap_m()).isCloseTo(4e-3, within(0.5e-3 * 1.3e-3));
    }

    @Test
    void aPlateBetweenTwoOthersShieldsThemFromEachOther() {
        // three plates with 2 mm holes, outer radius 16 mm, 6 mm apart: the outer two only see each other through the
        // middle plate's hole or past its rim, both of which the middle plate touches, so they do not face
        List<FacingGaps.Gap> g = FacingGaps.of(List.of(new Electrode.Aperture("in", 0, -6e-3, 2e-3, 16e-3, 1e-3),
                new Electrode.Aperture("mid", 1000, 0, 2e-3, 16e-3, 1e-3),
                new Electrode.Aperture("out", 0, 6e-3, 2e-3, 16e-3, 1e-3)));
        assertThat(g).extracting(x -> x.first() + "-" + x.second()).containsExactly("0-1", "1-2");
        assertThat(g.get(0).gap_m()).isCloseTo(5e-3, within(1e-12));
    }

    @Test
    void aSmallerMiddlePlateLeavesTheOuterPlatesFacingPastItsRim() {
        // middle plate outer radius 10 mm, outer plates 16 mm: the outer plates face each other past the middle plate's
        // rim; the shortest unblocked line is 11 mm long (the faces are 11 mm apart), clear of the rim (r > 10 mm)
        List<FacingGaps.Gap> g = FacingGaps.of(List.of(new Electrode.Aperture("in", 0, -6e-3, 2e-3, 16e-3, 1e-3),
                new Electrode.Aperture("mid", 1000, 0, 2e-3, 10e-3, 1e-3),
                new Electrode.Aperture("out", 500, 6e-3, 2e-3, 16e-3, 1e-3)));
        FacingGaps.Gap outer = g.stream().filter(x -> x.first() == 0 && x.second() == 2).findFirst().orElseThrow();
        assertThat(outer.gap_m()).isCloseTo(11e-3, within(1e-12));
        assertThat(outer.from().r_m()).isGreaterThan(10e-3);
    }

    @Test
    void gapRuleGivesTheVoltageAtOneMillimetreAndGrowsWithTheExponent() {
        // the rule's arithmetic: V(g) = V1 (g / 1 mm)^alpha (common practice, no source)
        GapRule r = GapRule.defaults();
        assertThat(r.comfort_V(1e-3)).isCloseTo(5000, within(1e-9));
        assertThat(r.aggressive_V(4e-3)).isCloseTo(20000, within(1e-9));
        assertThat(new GapRule(5000, 10000, 1).comfort_V(10e-3)).isCloseTo(50000, within(1e-9));
    }
}
