package org.axistack.optics;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.List;

import org.junit.jupiter.api.Test;

/** The spot-size budget against closed-form optima (elementary calculus on the stated model). */
class SpotSizeBudgetTest {

    /**
     * Brightness-limited image k/alpha with spherical blur Cs alpha^3/2: d^2 = k^2/alpha^2 + Cs^2 alpha^6/4 is
     * smallest at alpha^8 = 4 k^2/(3 Cs^2), where d = k/alpha * sqrt(4/3) (derivative set to zero).
     */
    @Test
    void sphericalAndBrightnessOptimumMatchesClosedForm() {
        double cs = 0.35;
        double k = SpotSizeBudget.brightnessTerm_m_rad(1e-9, 1e8);
        SpotSizeBudget.Inputs in = new SpotSizeBudget.Inputs(cs, 0.02, 0, 0, k);
        SpotSizeBudget.Optimum opt = SpotSizeBudget.optimum(in, 1e-5, 0.2);
        double alpha = Math.pow(4 * k * k / (3 * cs * cs), 0.125);
        assertThat(opt.interior()).isTrue();
        assertThat(opt.row().alpha_rad()).isCloseTo(alpha, within(1e-6 * alpha));
        assertThat(opt.row().total_m()).isCloseTo(k / alpha * Math.sqrt(4.0 / 3), within(1e-9 * k / alpha));
    }

    /** Chromatic-dominated: d^2 = k^2/alpha^2 + (Cc alpha dT/T)^2 is smallest at alpha^2 = k/(Cc dT/T), d = sqrt(2 k Cc dT/T). */
    @Test
    void chromaticAndBrightnessOptimumMatchesClosedForm() {
        double cc = 0.05;
        double spread = 2e-3;
        double k = 3e-12;
        SpotSizeBudget.Inputs in = new SpotSizeBudget.Inputs(0, cc, spread, 0, k);
        SpotSizeBudget.Optimum opt = SpotSizeBudget.optimum(in, 1e-6, 0.3);
        assertThat(opt.row().alpha_rad()).isCloseTo(Math.sqrt(k / (cc * spread)), within(1e-6 * Math.sqrt(k / (cc * spread))));
        assertThat(opt.row().total_m()).isCloseTo(Math.sqrt(2 * k * cc * spread), within(1e-9 * Math.sqrt(2 * k * cc * spread)));
    }

    /** Without a brightness term every blur grows with alpha: the smallest angle wins and is flagged as a range end. */
    @Test
    void fixedSourceImageHasNoInteriorOptimumAndRowsAddInQuadrature() {
        SpotSizeBudget.Inputs in = new SpotSizeBudget.Inputs(0.2, 0.04, 1e-3, 5e-6, 0);
        SpotSizeBudget.Optimum opt = SpotSizeBudget.optimum(in, 1e-4, 0.05);
        assertThat(opt.interior()).isFalse();
        assertThat(opt.row().alpha_rad()).isEqualTo(1e-4);
        List<SpotSizeBudget.Row> rows = SpotSizeBudget.table(in, 1e-4, 0.05, 9);
        assertThat(rows).hasSize(9);
        SpotSizeBudget.Row r = rows.get(8);
        assertThat(r.alpha_rad()).isCloseTo(0.05, within(1e-15));
        assertThat(r.spherical_m()).isCloseTo(0.5 * 0.2 * Math.pow(0.05, 3), within(1e-18));
        assertThat(r.chromatic_m()).isCloseTo(0.04 * 0.05 * 1e-3, within(1e-18));
        assertThat(r.total_m()).isCloseTo(Math.sqrt(25e-12 + Math.pow(r.spherical_m(), 2) + Math.pow(r.chromatic_m(), 2)),
                within(1e-18));
        assertThatThrownBy(() -> SpotSizeBudget.optimum(in, 0.1, 0.01)).isInstanceOf(IllegalArgumentException.class);
        assertThatThrownBy(() -> new SpotSizeBudget.Inputs(1, 1, -1e-3, 0, 0)).isInstanceOf(IllegalArgumentException.class);
    }
}
