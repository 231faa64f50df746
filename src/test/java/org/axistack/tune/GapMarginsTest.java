package org.axistack.tune;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.List;

import org.axistack.model.Beam;
import org.axistack.model.Electrode;
import org.axistack.model.GapRule;
import org.axistack.model.Particle;
import org.axistack.model.Stack;
import org.junit.jupiter.api.Test;

/** The gap assessment of a plan: gap, voltage and verdict against the gap rule (rule: common practice, no source). */
class GapMarginsTest {

    private static Stack tubes(double gap_mm, double high_V) {
        double h = gap_mm * 0.5e-3;
        return new Stack("gap", new Beam(Particle.electron(), 1000, java.util.OptionalDouble.empty(),
                java.util.OptionalDouble.empty()), List.of(new Electrode.Tube("low", 0, 5e-3, -60e-3, -h, 1e-3, 0.25e-3),
                        new Electrode.Tube("high", high_V, 5e-3, h, 60e-3, 1e-3, 0.25e-3)));
    }

    @Test
    void aWideGapIsAboveComfortAtAVoltageANarrowOneHolds() {
        // 20 kV across 4 mm: comfort 5000 x 4^0.5 = 10 kV, aggressive 20 kV -> above comfort, not above aggressive
        GapMargins.Row r = GapMargins.of(tubes(4, 20000)).get(0);
        assertThat(r.gap().gap_m()).isCloseTo(4e-3, within(1e-12));
        assertThat(r.voltage_V()).isEqualTo(20000);
        assertThat(r.comfort_V()).isCloseTo(10000, within(1e-6));
        assertThat(r.averageField_V_per_m()).isCloseTo(5e6, within(1e-3));
        assertThat(r.check()).isEqualTo(SurfaceFieldCheck.ABOVE_COMFORT);
        assertThat(GapMargins.warning(r)).contains("gap low - high", "20000 V across 4 mm", "above the comfort voltage",
                "10000 V for this gap");
        // the same average field (5 kV/mm) across 0.5 mm is within the rule: 2500 V against 5000 x 0.5^0.5 = 3536 V
        assertThat(GapMargins.of(tubes(0.5, 2500)).get(0).check()).isEqualTo(SurfaceFieldCheck.WITHIN);
        // 50 kV across 16 mm: aggressive 10000 x 4 = 40 kV
        assertThat(GapMargins.of(tubes(16, -50000)).get(0).check()).isEqualTo(SurfaceFieldCheck.ABOVE_AGGRESSIVE);
    }

    @Test
    void theRuleIsTheStacksAndPairsAtOneBiasAreLeftOut() {
        Stack s = tubes(4, 20000);
        Stack lenient = s.withLimits(s.limits().withGapRule(new GapRule(5000, 10000, 1)));
        assertThat(GapMargins.of(lenient).get(0).check()).isEqualTo(SurfaceFieldCheck.WITHIN);
        assertThat(GapMargins.of(tubes(4, 0))).isEmpty();
        assertThat(GapMargins.gaps(tubes(4, 0))).hasSize(1);
    }
}
