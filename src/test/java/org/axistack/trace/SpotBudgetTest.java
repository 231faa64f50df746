package org.axistack.trace;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.OptionalDouble;

import org.axistack.model.Particle;
import org.junit.jupiter.api.Test;

class SpotBudgetTest {

    @Test
    void optimumAngleMatchesTheClosedFormsOfTheTwoTermBudgets() {
        // d^2 = (2 eps/alpha)^2 + (Cs alpha^3/2)^2 has its minimum at alpha^8 = 16 eps^2 / (3 Cs^2)
        // (set the derivative to zero; derived here, the classical probe-forming optimum).
        double cs = 0.05, eps = 1e-9;
        SpotBudget sph = new SpotBudget(cs, 0, 0, eps);
        double expected = Math.pow(16 * eps * eps / (3 * cs * cs), 1.0 / 8);
        assertEquals(expected, sph.optimumAngle_rad(1e-5, 1).orElseThrow(), 1e-6 * expected);
        // d^2 = (2 eps/alpha)^2 + (Cc alpha dT/T)^2: alpha = sqrt(2 eps / (Cc dT/T))
        SpotBudget chr = new SpotBudget(0, 0.02, 1e-3, eps);
        double e2 = Math.sqrt(2 * eps / (0.02 * 1e-3));
        assertEquals(e2, chr.optimumAngle_rad(1e-5, 1).orElseThrow(), 1e-6 * e2);
        // lines: the terms as defined
        SpotBudget.Line l = new SpotBudget(cs, 0.02, 1e-3, eps).at(0.01);
        assertEquals(2e-7, l.geometric_m(), 1e-20);
        assertEquals(0.5 * cs * 1e-6, l.spherical_m(), 1e-20);
        assertEquals(0.02 * 0.01 * 1e-3, l.chromatic_m(), 1e-20);
        assertEquals(Math.sqrt(4e-14 + 6.25e-16 + 4e-14), l.total_m(), 1e-20);
        assertThat(new SpotBudget(cs, 0.02, 1e-3, eps).sweep(1e-3, 1e-1, 5)).hasSize(5);
        // no emittance: the smallest angle wins, no interior optimum
        assertThat(new SpotBudget(cs, 0.02, 1e-3, 0).optimumAngle_rad(1e-4, 0.1)).isEmpty();
        assertThatThrownBy(() -> new SpotBudget(cs, 0, -1e-3, 0)).hasMessageContaining("energy spread");
    }

    @Test
    void tracedDiscOfLeastConfusionIsHalfCsAlphaCubed() {
        // Classical result for third-order spherical aberration: the smallest envelope of a bundle
        // filling angles up to alpha has diameter Cs alpha^3 / 2 (e.g. Reimer and Kohl, section 2.3.2).
        // Traced in the three-ring lens; tolerance from the fifth-order term, ~ (C5/Cs) alpha^2.
        RingLens lens = RingLens.withCentre(-1500);
        Tracer tracer = new Tracer(lens.field(), lens.geometry(), TraceSettings.defaults().withRelativeTolerance(1e-12));
        double z0 = -0.045, z1 = 0.095, hMax = 0.4e-3;
        TracedAberrations.Result ab = TracedAberrations.measure(tracer, Particle.electron(), 1000, z0, z1, hMax,
                OptionalDouble.empty());
        int n = 24;
        double[] x = new double[n], s = new double[n];
        for (int k = 0; k < n; k++) {
            double h = hMax * (k + 1) / n;
            Trajectory t = tracer.trace(Particle.electron(), new RayStart(k + 1, h, 0, z0, 0, 0, 1, 1000),
                    TraceTargets.screenOnly(z1));
            x[k] = t.end().x_m();
            s[k] = t.end().slopeX();
        }
        double f = ab.focalPointImageZ_m();
        double[] disc = SpotBudget.leastConfusion(x, s, z1, f - 0.01, f + 0.01);
        double alpha = hMax / ab.focalLengthImage_m();
        double expected = 0.5 * ab.spherical_m() * alpha * alpha * alpha;
        double fifth = Math.abs(ab.fifthOrder_m() / ab.spherical_m()) * alpha * alpha;
        assertEquals(expected, disc[1], (3 * fifth + 1e-3) * expected);
        // the disc lies before the paraxial focus, by about (3/4) Cs alpha^2 (same classical analysis)
        assertEquals(f - 0.75 * ab.spherical_m() * alpha * alpha, disc[0],
                (3 * fifth + 1e-2) * 0.75 * ab.spherical_m() * alpha * alpha);
    }
}
