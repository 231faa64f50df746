package org.axistack.trace;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.List;

import org.axistack.model.Particle;
import org.junit.jupiter.api.Test;

/**
 * The speed layers (axial table, near-axis series, hybrid field, field map) against the exact ring
 * field they approximate, and their stated error bounds against the truth.
 */
class FieldLayersTest {

    private final RingLens lens = RingLens.withCentre(-1500);
    private final RingChargeField exact = lens.field();

    @Test
    void axialTableReportsAndMeetsItsInterpolationError() {
        // quintic Hermite, step 0.1 mm on a 5 mm lens: error ~ h^6 V^(6) / 46080 ~ 1e-12 of V
        AxialTable t = new AxialTable(exact, -0.03, 0.03, 0.1e-3);
        double[] a = new double[9], b = new double[9];
        double worst = 0;
        for (int i = 0; i < 997; i++) {
            double z = -0.0299 + i * 0.06e-3;
            t.axial(z, 8, a);
            exact.axial(z, 8, b);
            worst = Math.max(worst, Math.abs(a[0] - b[0]));
            assertEquals(b[1], a[1], 1e-9 * 1500 / 5e-3);
        }
        assertThat(worst).isLessThan(1e-9 * 1500);
        assertThat(t.maxPotentialError_V()).isLessThan(1e-9 * 1500).isGreaterThan(0);
    }

    @Test
    void nearAxisSeriesErrorStaysBelowItsFirstOmittedTermTimesAFewNearTheAxis() {
        NearAxisField s = new NearAxisField(exact);
        double[] v = new double[9];
        for (double r : new double[] {0.2e-3, 0.5e-3, 1e-3}) {
            for (double z : new double[] {-0.01, -0.004, 0, 0.003, 0.012}) {
                exact.axial(z, 8, v);
                double est = NearAxisField.truncationEstimate_V(v, r);
                double err = Math.abs(s.potential_V(z, r) - exact.potential_V(z, r));
                assertThat(err).as("r %s z %s", r, z).isLessThan(3 * est + 1e-12);
            }
        }
    }

    @Test
    void hybridFieldTracesLikeTheExactFieldWithinItsTolerance() {
        HybridField h = HybridField.forGeometry(exact, exact, lens.geometry(), 1e-9);
        Tracer th = new Tracer(h, lens.geometry(), TraceSettings.defaults());
        Tracer te = new Tracer(exact, lens.geometry(), TraceSettings.defaults());
        RayStart ray = RayStart.withSlopes(1, 1e-3, 0.3e-3, -0.04, 0, 0, 1000);
        Trajectory a = th.trace(Particle.electron(), ray, TraceTargets.screenOnly(0.06));
        Trajectory b = te.trace(Particle.electron(), ray, TraceTargets.screenOnly(0.06));
        // series potential tolerance 1e-9 V on a 1 kV beam: relative effect on the slope ~ 1e-9 / 1e3 x lens gain
        assertEquals(b.end().slopeX(), a.end().slopeX(), 1e-8 * Math.abs(b.end().slopeX()));
        assertThat(h.seriesFraction()).isGreaterThan(0.1); // the rest fell back to the exact field
        assertThat(a.maxEnergyError()).isLessThan(1e-9);
    }

    @Test
    void fieldMapIsConservativeAndWithinItsMeasuredError() {
        AxialTable t = new AxialTable(exact, -0.045, 0.065, 0.1e-3);
        FieldMap map = new FieldMap(exact, new NearAxisField(t), lens.geometry(), -0.042, 0.062, 4e-3, 0.125e-3,
                TraceProgress.none());
        assertThat(map.mappedCells()).isGreaterThan(map.cells() / 2);
        // the measured error (sampled) against independent samples at other points
        double worst = 0;
        for (int i = 0; i < 200; i++) {
            double z = -0.02 + i * 0.2e-3 + 0.031e-3, r = 0.3e-3 + (i % 7) * 0.4e-3;
            worst = Math.max(worst, Math.abs(map.potential_V(z, r) - exact.potential_V(z, r)));
        }
        assertThat(worst).isLessThan(3 * map.maxPotentialError_V() + 1e-12);
        // the mapped field is minus the gradient of the mapped potential, so energy is conserved up to
        // the integrator's error; the map's second derivatives jump at cell edges, which the step-size
        // control only partly sees, so conservation is ~1e-8 here (measured), not the 1e-11 of a smooth field
        Tracer tm = new Tracer(map, lens.geometry(), TraceSettings.defaults());
        Trajectory tr = tm.trace(Particle.electron(), RayStart.withSlopes(1, 1.5e-3, 0, -0.04, 0, 0, 1000),
                TraceTargets.screenOnly(0.06));
        assertThat(tr.maxEnergyError()).isLessThan(1e-7);
        Trajectory te = new Tracer(exact, lens.geometry(), TraceSettings.defaults()).trace(Particle.electron(),
                RayStart.withSlopes(1, 1.5e-3, 0, -0.04, 0, 0, 1000), TraceTargets.screenOnly(0.06));
        assertEquals(te.end().slopeX(), tr.end().slopeX(), 1e-5 * Math.abs(te.end().slopeX()));
        assertThat(List.of(map.maxPotentialError_V())).allSatisfy(e -> assertThat(e).isLessThan(1e-6 * 1500));
    }
}
