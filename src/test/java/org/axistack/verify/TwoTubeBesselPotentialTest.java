package org.axistack.verify;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;

/** The reference potential of the zero-gap two-tube lens checked against itself and known facts. */
class TwoTubeBesselPotentialTest {

    private static final double R = 5e-3;

    /** Integral and eigenfunction series are two exact forms of one solution: they must agree where both converge. */
    @Test
    void integralAndSeriesAgree() {
        TwoTubeBesselPotential f = new TwoTubeBesselPotential(R, -300, 1700);
        double[] a = new double[9];
        double[] b = new double[9];
        for (double z : new double[] {-1.5 * R, -0.6 * R, 0.4 * R, 0.6 * R, R, 1.5 * R}) {
            f.integral(z, 8, a);
            f.series(z, 8, b);
            for (int n = 0; n <= 8; n++) {
                double scale = 2000 * Math.pow(3.0 / R, n); // (V2 - V1) / R^n times a margin for the growth with n
                assertThat(a[n]).as("order %d at z=%s", n, z).isCloseTo(b[n], within(1e-11 * scale));
            }
        }
    }

    /**
     * With a gap the series carries the factor sinh(j g/2R)/(j g/2R) and holds beyond the gap: the integral (with
     * its sinc factor) and the series must still agree there; and the gap potential at the gap's middle is the mean.
     */
    @Test
    void integralAndSeriesAgreeWithAGap() {
        double g = 1e-3;
        TwoTubeBesselPotential f = new TwoTubeBesselPotential(R, 100, -900, g);
        double[] a = new double[7];
        double[] b = new double[7];
        for (double z : new double[] {-1.2 * R, -0.8 * R, 0.6 * R, 0.9 * R, 1.3 * R}) {
            f.integral(z, 6, a);
            f.series(z, 6, b);
            for (int n = 0; n <= 6; n++) {
                double scale = 1000 * Math.pow(3.0 / R, n);
                assertThat(a[n]).as("order %d at z=%s", n, z).isCloseTo(b[n], within(1e-11 * scale));
            }
        }
        assertThat(f.axialPotential_V(0)).isCloseTo(-400, within(1e-12));
        // a wider gap weakens the lens: the potential at z = R/2 moves toward the mean
        double zeroGap = new TwoTubeBesselPotential(R, 100, -900).axialPotential_V(0.5 * R);
        assertThat(Math.abs(f.axialPotential_V(0.5 * R) + 400)).isLessThan(Math.abs(zeroGap + 400));
    }

    /**
     * Known values: V(0) = (V1+V2)/2 (antisymmetry), V -> V2 deep inside the second tube, and the published fit
     * 1/2 + 1/2 tanh(1.318 z/R) to within about 4e-3 of V2 - V1 (physics brief: a fit, not a tight reference).
     */
    @Test
    void matchesKnownValuesAndTheTanhFit() {
        TwoTubeBesselPotential f = new TwoTubeBesselPotential(R, 0, 1);
        assertThat(f.axialPotential_V(0)).isCloseTo(0.5, within(1e-15));
        assertThat(f.axialPotential_V(8 * R)).isCloseTo(1, within(1e-8));
        assertThat(f.axialPotential_V(-8 * R)).isCloseTo(0, within(1e-8));
        for (double z = -3 * R; z <= 3 * R; z += 0.1 * R) {
            double fit = 0.5 + 0.5 * Math.tanh(1.318 * z / R);
            assertThat(f.axialPotential_V(z)).isCloseTo(fit, within(5e-3));
        }
    }
}
