package org.axistack.ui;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.axistack.report.LensChart;
import org.junit.jupiter.api.Test;

/** Marching squares against potentials whose equipotentials are known in closed form. */
class IsolinesTest {

    /** A grid over z in [-1, 1] m, r in [0, 1] m with the given values. */
    private static double[][] values(int nz, int nr, java.util.function.DoubleBinaryOperator f) {
        double[][] v = new double[nz][nr];
        for (int i = 0; i < nz; i++) {
            for (int j = 0; j < nr; j++) {
                v[i][j] = f.applyAsDouble(-1 + 2.0 * i / (nz - 1), (double) j / (nr - 1));
            }
        }
        return v;
    }

    @Test
    void linearPotentialGivesStraightLinesAtTheExactPlace() {
        // phi = 100 z (uniform field): the level c lies on the plane z = c / 100 exactly, since linear
        // interpolation along cell edges is exact for a linear function
        int nz = 21, nr = 7;
        double[][] v = values(nz, nr, (z, r) -> 100 * z);
        PotentialGridStub g = new PotentialGridStub(nz, nr);
        LensChart.Lines l = Isolines.trace(g.grid, v, new double[] {25});
        assertThat(l.size()).isGreaterThan(0);
        for (int k = 0; k < l.size(); k++) {
            if (!Double.isNaN(l.z_mm()[k])) {
                assertThat(l.z_mm()[k]).isCloseTo(250.0, within(1e-9)); // 0.25 m in mm
            }
        }
    }

    @Test
    void circlesOfARadialPotentialAreFollowedToTheGridResolution() {
        // phi = z^2 + r^2: level 0.25 is the circle of radius 0.5 m; linear interpolation of a quadratic
        // over a cell of size h misplaces the crossing by at most h^2 / (8 * 0.5) ~ 2.5e-4 m for h = 0.02 m
        int nz = 101, nr = 51;
        double[][] v = values(nz, nr, (z, r) -> z * z + r * r);
        PotentialGridStub g = new PotentialGridStub(nz, nr);
        LensChart.Lines l = Isolines.trace(g.grid, v, new double[] {0.25});
        int points = 0;
        for (int k = 0; k < l.size(); k++) {
            if (!Double.isNaN(l.z_mm()[k])) {
                double rho = Math.hypot(l.z_mm()[k], l.r_mm()[k]) / 1000;
                assertThat(rho).isCloseTo(0.5, within(3e-4));
                points++;
            }
        }
        assertThat(points).isGreaterThan(100);
    }

    @Test
    void segmentsAreJoinedIntoOneLinePerContour() {
        // phi = z^2 + r^2, level 0.25: the upper half of one circle, so one poly-line above the axis and its
        // mirror image below, each point shared by two neighbouring cell segments (a closed form, no source needed)
        int nz = 41, nr = 21;
        double[][] v = values(nz, nr, (z, r) -> z * z + r * r + 1e-9 * z); // tilt off the exact node values
        LensChart.Lines l = Isolines.trace(new PotentialGridStub(nz, nr).grid, v, new double[] {0.25});
        int pieces = 0;
        for (int k = 0; k < l.size(); k++) {
            if (Double.isNaN(l.z_mm()[k])) {
                pieces++;
            }
        }
        assertThat(pieces).isEqualTo(2);
        // the piece runs from one side of the axis to the other
        double zFirst = l.z_mm()[0], zLast = l.z_mm()[l.size() / 2 - 2]; // the upper piece, then NaN
        assertThat(Math.abs(zFirst) / 1000).isCloseTo(0.5, within(1e-3));
        assertThat(zFirst * zLast).isNegative();
        // a closed contour away from the axis closes on itself: phi = (z - 0.5)^2 + (r - 0.5)^2, radius 0.2
        double[][] w = values(nz, nr, (z, r) -> (z - 0.01) * (z - 0.01) + (r - 0.5) * (r - 0.5));
        LensChart.Lines ring = Isolines.trace(new PotentialGridStub(nz, nr).grid, w, new double[] {0.04});
        int end = 0;
        while (!Double.isNaN(ring.z_mm()[end])) {
            end++;
        }
        assertThat(ring.z_mm()[0]).isEqualTo(ring.z_mm()[end - 1]);
        assertThat(ring.r_mm()[0]).isEqualTo(ring.r_mm()[end - 1]);
        assertThat(end).isGreaterThan(20);
    }

    @Test
    void levelsAreRoundAndInsideTheRange() {
        assertThat(Isolines.levels(-120, 0, 10)).containsExactly(-110, -100, -90, -80, -70, -60, -50, -40, -30, -20,
                -10);
        assertThat(Isolines.roundStep(0.13)).isEqualTo(0.2);
        assertThat(Isolines.roundStep(7)).isEqualTo(10);
        assertThat(Isolines.levels(5, 5, 10)).isEmpty();
    }

    @Test
    void saddleCellGivesTwoSegments() {
        double[] out = new double[8];
        // corners a (0,0)=1, b (1,0)=0, c (1,1)=1, d (0,1)=0 at level 0.5: two segments
        assertThat(Isolines.cell(1, 0, 1, 0, 0.5, 0, 1, 0, 1, out)).isEqualTo(2);
        assertThat(Isolines.cell(1, 1, 1, 1, 0.5, 0, 1, 0, 1, out)).isZero();
    }

    /** A grid of nz x nr nodes over z in [-1, 1] m and r in [0, 1] m built through the public factory. */
    private static final class PotentialGridStub {
        final PotentialGrid grid;

        PotentialGridStub(int nz, int nr) {
            grid = PotentialGrid.geometry(-1, 1, 1, nz, nr);
        }
    }
}
