package org.axistack.field;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.List;

import org.axistack.model.Codata2018;
import org.axistack.model.Contour;
import org.axistack.model.Electrode;
import org.axistack.model.MeshSettings;
import org.axistack.model.Segment;
import org.axistack.model.ZR;
import org.axistack.verify.TwoTubeBesselPotential;
import org.junit.jupiter.api.Test;

/** The boundary-element solver against classical closed forms. */
class FieldSolverChecksTest {

    private static final double EPS0 = Codata2018.EPSILON0_F_PER_M;

    private static FieldSolution solve(List<Electrode> es, int unknowns, int levels) {
        return BemSolver.solve(es, new MeshSettings(unknowns, levels), SolveProgress.NONE);
    }

    /**
     * Isolated thin conducting disk of radius a: capacitance 8 eps0 a and axial potential (2V/pi) arctan(a/z)
     * (classical; e.g. J. D. Jackson, Classical Electrodynamics, 3rd ed., sec. 3.13 and problem 3.3).
     */
    @Test
    void thinDiskCapacitanceAndAxialPotential() {
        double a = 0.012;
        double v = 250.0;
        FieldSolution s = solve(List.of(new Electrode.Disk("plate", v, 0.003, a, 0)), 160, 8);
        double c = s.capacitanceMatrix_F()[0][0];
        assertThat(Math.abs(c - 8 * EPS0 * a) / (8 * EPS0 * a)).isLessThan(1e-6);
        BiasedField f = s.biased();
        for (double x = 0.1; x <= 10.0001; x *= 1.2) {
            double exact = 2 * v / Math.PI * Math.atan(1 / x);
            assertThat(Math.abs(f.axialPotential_V(0.003 + x * a) - exact)).isLessThan(1e-6 * v);
            assertThat(Math.abs(f.axialPotential_V(0.003 - x * a) - exact)).isLessThan(1e-6 * v);
        }
        // total surface density 4 eps0 V / (pi sqrt(a^2 - r^2)) (same sources), at nodes away from the edge
        for (int j = 0; j < s.unknowns(); j++) {
            double r = s.mesh().nodeR(j);
            if (r < 0.9 * a) {
                double exact = 4 * v / (Math.PI * Math.sqrt(a * a - r * r));
                assertThat(f.nodeDensity_V_per_m(j)).isCloseTo(exact, org.assertj.core.data.Offset.offset(1e-6 * exact));
            }
        }
    }

    /** Conducting sphere as the outline of a half circle: capacitance 4 pi eps0 R (classical). */
    @Test
    void sphereCapacitance() {
        double radius = 0.02;
        Contour half = new Contour(List.of(new Segment.Arc(new ZR(-radius, 0), new ZR(0, radius), new ZR(radius, 0))), false);
        FieldSolution s = solve(List.of(new Electrode.Outline("ball", 1.0, half)), 96, 4);
        double ref = 4 * Math.PI * EPS0 * radius;
        assertThat(Math.abs(s.capacitanceMatrix_F()[0][0] - ref) / ref).isLessThan(1e-6);
        // and the potential outside is V R / d (point-charge law)
        assertThat(s.biased().potential_V(0.01, 0.05)).isCloseTo(radius / Math.hypot(0.01, 0.05),
                org.assertj.core.data.Offset.offset(1e-9));
    }

    private static List<Electrode> twoTubes(double radius, double length, double gap, double v1, double v2) {
        return List.of(new Electrode.Tube("upstream", v1, radius, -length, -gap / 2, 0),
                new Electrode.Tube("downstream", v2, radius, gap / 2, length, 0));
    }

    /**
     * Two long coaxial tubes with a small gap against the Bessel-integral solution (classical; reference
     * computed independently in {@link TwoTubeBesselPotential}). The real gap differs from the linear-gap model
     * by about 1.1e-5 (g/0.1 mm)^2 of V2-V1 for R = 5 mm (measured, scales as g^2); at g = 0.02 mm that is
     * below 1e-6, so the 1e-5 tolerance tests the solver.
     */
    @Test
    void twoTubeSmallGapMatchesBesselIntegral() {
        double radius = 0.005, gap = 0.00002;
        TwoTubeBesselPotential ref = new TwoTubeBesselPotential(radius, -300, 700, gap);
        BiasedField f = solve(twoTubes(radius, 0.06, gap, -300, 700), 900, 12).biased();
        for (double z = -2 * radius; z <= 2 * radius + 1e-12; z += radius / 8) {
            assertThat(Math.abs(f.axialPotential_V(z) - ref.derivative(z, 0))).isLessThan(1e-5 * 1000);
        }
    }

    /**
     * Convergence: the axial error against the zero-gap Bessel integral, after Richardson extrapolation of two
     * small gaps to g = 0 (the real-gap model error falls as g^2), falls as the mesh is refined. Printed for
     * src/site/ and checked to fall steadily and reach 3e-11 of V2-V1 (measured 6.2e-12 at 1200 unknowns).
     */
    @Test
    void convergenceAgainstZeroGapBesselIntegral() {
        double radius = 0.005, g1 = 0.00004, g2 = 0.00002;
        TwoTubeBesselPotential ref = new TwoTubeBesselPotential(radius, 0, 1);
        double previous = Double.POSITIVE_INFINITY;
        System.out.println("unknowns, max axial error / (V2-V1) over |z| <= 2R (zero-gap extrapolated)");
        for (int n : new int[] {300, 600, 1200}) {
            BiasedField f1 = solve(twoTubes(radius, 0.06, g1, 0, 1), n, 12).biased();
            FieldSolution s2 = solve(twoTubes(radius, 0.06, g2, 0, 1), n, 12);
            BiasedField f2 = s2.biased();
            double err = 0;
            for (double z = -2 * radius; z <= 2 * radius + 1e-12; z += radius / 10) {
                double v = (g1 * g1 * f2.axialPotential_V(z) - g2 * g2 * f1.axialPotential_V(z)) / (g1 * g1 - g2 * g2);
                err = Math.max(err, Math.abs(v - ref.derivative(z, 0)));
            }
            System.out.printf(java.util.Locale.ROOT, "%d, %.3e%n", s2.unknowns(), err);
            assertThat(err).isLessThan(previous);
            previous = err;
        }
        assertThat(previous).isLessThan(3e-11);
    }

    /**
     * Laplace consistency: the near-axis series from the exact axial derivatives equals the direct ring sum
     * at r = 0.3 R inside a three-tube lens (both are solutions of Laplace's equation with the same sources).
     */
    @Test
    void nearAxisSeriesMatchesDirectSum() {
        double radius = 0.004;
        List<Electrode> es = List.of(new Electrode.Tube("in", 0, radius, -0.04, -0.005, 0),
                new Electrode.Tube("mid", -900, radius, -0.004, 0.004, 0),
                new Electrode.Tube("out", 0, radius, 0.005, 0.04, 0));
        BiasedField f = solve(es, 600, 10).biased();
        double r = 0.3 * radius;
        double[] d = new double[17];
        double[] series = new double[2];
        double[] direct = new double[2];
        for (double z = -0.008; z <= 0.008; z += 0.001) {
            f.axial(z, 16, d);
            double ps = NearAxisSeries.evaluate(d, 8, r, series);
            double pd = f.evaluate(z, r, direct);
            assertThat(Math.abs(ps - pd)).isLessThan(1e-8 * 900);
            assertThat(Math.abs(series[0] - direct[0])).isLessThan(1e-8 * 900 / radius * 10);
            assertThat(Math.abs(series[1] - direct[1])).isLessThan(1e-8 * 900 / radius * 10);
        }
    }

    /** Superposition: the field of a bias set equals the weighted sum of unit fields to round-off. */
    @Test
    void superpositionOfUnitSolutions() {
        List<Electrode> es = List.of(new Electrode.Aperture("a1", 0, -0.005, 0.002, 0.015, 0.001),
                new Electrode.Aperture("a2", 0, 0, 0.002, 0.015, 0.001), new Electrode.Aperture("a3", 0, 0.005, 0.002, 0.015, 0.001));
        FieldSolution s = solve(es, 500, 8);
        double[] b = {120, -2500, 35};
        BiasedField all = s.withBiases(b);
        double[] fo = new double[2];
        double[] fu = new double[2];
        for (double[] p : new double[][] {{0.001, 0.0005}, {-0.007, 0.0012}, {0.0025, 0.003}}) {
            double phi = all.evaluate(p[0], p[1], fo);
            double sum = 0, ez = 0, er = 0;
            for (int e = 0; e < 3; e++) {
                double[] unit = new double[3];
                unit[e] = 1;
                sum += b[e] * s.withBiases(unit).evaluate(p[0], p[1], fu);
                ez += b[e] * fu[0];
                er += b[e] * fu[1];
            }
            assertThat(phi).isCloseTo(sum, org.assertj.core.data.Offset.offset(1e-12 * 2500));
            assertThat(fo[0]).isCloseTo(ez, org.assertj.core.data.Offset.offset(1e-9 * 2500 / 0.001));
            assertThat(fo[1]).isCloseTo(er, org.assertj.core.data.Offset.offset(1e-9 * 2500 / 0.001));
        }
    }

    /**
     * On every electrode surface, between the collocation nodes, the potential equals the bias (what the
     * solver promises); the capacitance matrix is symmetric (Green's reciprocity theorem), its diagonal positive
     * and off-diagonal negative (textbook properties of the Maxwell capacitance coefficients).
     */
    @Test
    void surfacePotentialAndReciprocity() {
        List<Electrode> es = List.of(new Electrode.Tube("t", 100, 0.003, -0.02, -0.002, 0.0005),
                new Electrode.Aperture("a", -400, 0.0, 0.0015, 0.01, 0.0008),
                new Electrode.Ring("w", 250, 0.006, 0.005, 0.0004));
        FieldSolution s = solve(es, 900, 10);
        BiasedField f = s.biased();
        for (int e = 0; e < es.size(); e++) {
            Contour c = es.get(e).contour();
            for (Segment seg : c.segments()) {
                for (double t = 0.0537; t < 1; t += 0.1) {
                    ZR p = seg.at(t);
                    assertThat(f.potential_V(p.z_m(), p.r_m())).isCloseTo(es.get(e).bias_V(),
                            org.assertj.core.data.Offset.offset(1e-6 * 400));
                }
            }
        }
        double[][] c = s.capacitanceMatrix_F();
        for (int i = 0; i < 3; i++) {
            assertThat(c[i][i]).isPositive();
            for (int j = 0; j < 3; j++) {
                if (i != j) {
                    assertThat(c[i][j]).isNegative();
                    assertThat(Math.abs(c[i][j] - c[j][i])).isLessThan(1e-6 * c[i][i]);
                }
            }
        }
        assertThat(s.residual()).isLessThan(1e-10);
    }

    @Test
    void refusesMeshesLargerThanTheHeap() {
        assertThat(BemSolver.maxUnknownsForHeap()).isGreaterThan(1000);
        assertThatThrownBy(() -> new MeshSettings(MeshSettings.MAX_ELEMENTS + 1, 8)).isInstanceOf(IllegalArgumentException.class);
    }
}
