package org.axistack.field;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;

/**
 * The quintic Hermite table behind SectorField.unitFunction: on the axial potential of a charged ring,
 * (1 + z^2)^(-1/2) (a closed form; its derivatives by hand), the error between nodes stays within the measured
 * midpoint error (a little above it at worst, since the midpoints only sample the error curve), the step is
 * halved until the tolerance is met, a polynomial of degree 5 is reproduced to rounding (the interpolant is exact
 * for quintics: Burden and Faires, Numerical Analysis, section 3.4), and outside the grid the function itself is
 * returned.
 */
class HermiteTableTest {

    static void ring(double z, double[] out) {
        double q = 1 + z * z;
        out[0] = Math.pow(q, -0.5);
        out[1] = -z * Math.pow(q, -1.5);
        out[2] = (2 * z * z - 1) * Math.pow(q, -2.5);
    }

    @Test
    void errorBetweenNodesIsTheMeasuredOne() {
        HermiteTable t = HermiteTable.of(HermiteTableTest::ring, -10, 10, 2, 1e-10, 8);
        assertThat(t.relativeError()).isLessThanOrEqualTo(1e-10);
        assertThat(t.intervals()).isGreaterThan(10);
        double worst = 0;
        double[] out = new double[3];
        for (int i = 0; i <= 10000; i++) {
            double z = -10 + 20 * i / 10000.0 + 1e-7;
            ring(z, out);
            worst = Math.max(worst, Math.abs(t.value(z) - out[0]));
        }
        assertThat(worst).isLessThan(2 * t.relativeError() + 1e-15);
        // outside: the function itself
        ring(12, out);
        assertThat(t.value(12)).isEqualTo(out[0]);
        // a loose tolerance stops early with a coarser grid
        assertThat(HermiteTable.of(HermiteTableTest::ring, -10, 10, 2, 1e-3, 8).intervals()).isLessThan(t.intervals());
    }

    @Test
    void quinticsAreExact() {
        HermiteTable t = HermiteTable.of((z, out) -> {
            out[0] = 3 - 2 * z + z * z * z * z * z - 0.5 * z * z;
            out[1] = -2 + 5 * z * z * z * z - z;
            out[2] = 20 * z * z * z - 1;
        }, -1, 2, 0.5, 1e-12, 0);
        for (double z = -1; z <= 2; z += 0.0137) {
            double exact = 3 - 2 * z + z * z * z * z * z - 0.5 * z * z;
            assertThat(t.value(z)).isCloseTo(exact, org.assertj.core.data.Offset.offset(1e-12));
        }
    }
}
