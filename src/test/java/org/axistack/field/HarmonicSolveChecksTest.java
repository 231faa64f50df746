package org.axistack.field;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;

import org.axistack.model.Electrode;
import org.axistack.model.MeshSettings;
import org.hipparchus.analysis.integration.gauss.GaussIntegrator;
import org.hipparchus.analysis.integration.gauss.GaussIntegratorFactory;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/** Harmonic-m boundary-element solves against classical closed forms and a Bessel-integral solution. */
class HarmonicSolveChecksTest {

    static final double R = 0.005;
    static final double V = 100;
    static FieldSolution longTube;
    static HarmonicOperator[] longOps;

    @BeforeAll
    static void solveLongTube() {
        // a thin tube of radius R, 24 R long: at its middle the end effects of harmonic m fall as
        // exp(-j_{m,1} 12) (j_{1,1} = 3.83, the first zero of J_1): below 1e-19
        longTube = BemSolver.solve(List.of(new Electrode.Tube("split", 0, R, -12 * R, 12 * R, 0)),
                new MeshSettings(500, 6), SolveProgress.NONE);
        longOps = new HarmonicOperator[8];
        for (int m = 1; m < longOps.length; m++) {
            longOps[m] = HarmonicOperator.factor(longTube, m, SolveProgress.NONE);
        }
    }

    /**
     * Inside an infinitely long cylinder held at cos(m phi), the potential is (r/R)^m cos(m phi) (separation
     * of variables in the plane: the regular solution of the 2-D Laplace equation, common practice, no
     * source); at the middle of the long tube, per harmonic.
     */
    @Test
    void eachHarmonicGivesRToTheMInsideALongTube() {
        for (int m = 1; m < longOps.length; m++) {
            double[] unit = longOps[m].unitDensity(0);
            for (double x : new double[] {0.1, 0.3, 0.5, 0.7, 0.9}) {
                double u = longOps[m].potential_V(unit, 0, x * R);
                assertThat(Math.abs(u - Math.pow(x, m))).as("m = %d, r/R = %s", m, x).isLessThan(2e-9);
            }
        }
    }

    /**
     * Long split cylinder, halves at +V (x &gt; 0) and -V, zero slits: interior potential
     * (2V/pi) arctan(2 r R cos(phi) / (R^2 - r^2)) and centre field 4V/(pi R) (classical conformal-map result,
     * e.g. W. R. Smythe, Static and Dynamic Electricity, ch. 4, cited from memory). The wall potential's
     * series (4V/pi) sum_{m odd} (-1)^((m-1)/2) cos(m phi)/m is solved to m = 7; the rest of the closed form's
     * own series, (4V/pi) sum_{m &gt;= 9} (-1)^((m-1)/2) (r/R)^m cos(m phi)/m, is added analytically.
     */
    @Test
    void splitCylinderMatchesConformalMap() {
        double[][] dens = new double[longOps.length][];
        for (int m = 1; m < longOps.length; m += 2) {
            dens[m] = longOps[m].unitDensity(0);
        }
        for (double x : new double[] {0.05, 0.1, 0.2, 0.3}) {
            double r = x * R;
            for (double phi = 0; phi < 2 * Math.PI; phi += Math.PI / 7) {
                double u = 0;
                for (int m = 1; m < longOps.length; m += 2) {
                    double am = 4 * V / Math.PI * ((m / 2) % 2 == 0 ? 1 : -1) / m;
                    u += am * Math.cos(m * phi) * longOps[m].potential_V(dens[m], 0, r);
                }
                for (int m = longOps.length + 1; m < 400; m += 2) {
                    u += 4 * V / Math.PI * ((m / 2) % 2 == 0 ? 1 : -1) / m * Math.pow(x, m) * Math.cos(m * phi);
                }
                double exact = 2 * V / Math.PI * Math.atan(2 * r * R * Math.cos(phi) / (R * R - r * r));
                assertThat(Math.abs(u - exact)).as("r/R = %s, phi = %s", x, phi).isLessThan(1e-7 * V);
            }
        }
        // centre field: only m = 1 has a gradient at the axis: E_x = -a_1 du_1/dr(0)
        double h = 1e-4 * R;
        double slope = longOps[1].potential_V(dens[1], 0, h) / h;
        double ex = -4 * V / Math.PI * slope;
        assertThat(Math.abs(Math.abs(ex) - 4 * V / (Math.PI * R)) / (4 * V / (Math.PI * R))).isLessThan(1e-8);
    }

    /**
     * A split tube (length 2h) between two long grounded tubes of the same radius, gaps g, each harmonic m
     * held at cos(m phi) on the split tube: against the Bessel-integral solution of the Dirichlet problem in an
     * infinite cylinder with the gap potential interpolated linearly, derived here by separation of
     * variables: with V(z) the wall potential and V~(k) its Fourier transform,
     * u(r, z) = (1/pi) Int_0^inf cos(k z) V~(k) I_m(k r)/I_m(k R) dk, and the trapezoid V (1 on |z| &lt; h - g/2,
     * linear to 0 at |z| = h + g/2) has V~(k) = (2 sin(k h)/k) sin(k g/2)/(k g/2) (box convolved with a box).
     * I_m from its power series (Abramowitz and Stegun 9.6.10). The real gap differs from the linear model by a
     * term of order (g/R)^2 (as for m = 0 in {@code FieldSolverChecksTest}); g = 0.004 R keeps it near 1e-6.
     */
    @Test
    void splitTubeBetweenGroundedTubesMatchesBesselIntegral() {
        double h = 1.5 * R;
        double g = 0.004 * R;
        List<Electrode> es = List.of(new Electrode.Tube("up", 0, R, -14 * R, -h - g / 2, 0),
                new Electrode.Tube("split", 0, R, -h + g / 2, h - g / 2, 0),
                new Electrode.Tube("down", 0, R, h + g / 2, 14 * R, 0));
        FieldSolution s = BemSolver.solve(es, new MeshSettings(600, 12), SolveProgress.NONE);
        for (int m : new int[] {1, 2}) {
            HarmonicOperator op = HarmonicOperator.factor(s, m, SolveProgress.NONE);
            assertThat(op.solvedAsMirrorHalves()).isTrue();
            double[] dens = op.unitDensity(1);
            for (double x : new double[] {0.2, 0.5}) {
                BesselIntegral ref = new BesselIntegral(m, x * R, h, g);
                for (double z = -3 * R; z <= 3 * R + 1e-12; z += R / 4) {
                    double u = op.potential_V(dens, z, x * R);
                    assertThat(Math.abs(u - ref.at(z))).as("m = %d, r/R = %s, z/R = %s", m, x, z / R).isLessThan(1e-5);
                }
            }
        }
    }

    /**
     * The arbitrary right-hand-side API on a stack without a mirror (whole-matrix factorisation): harmonic 0
     * reproduces the round solve's densities (same equation, common practice, no source), a solve of an
     * electrode's indicator gives its unit density, and solves are linear.
     */
    @Test
    void arbitraryRightHandSidesOnAnUnsymmetricStack() {
        List<Electrode> es = List.of(new Electrode.Tube("a", 0, R, -6 * R, -0.2 * R, 0),
                new Electrode.Aperture("b", 0, 0.5 * R, 0.4 * R, 2 * R, 0));
        FieldSolution s = BemSolver.solve(es, new MeshSettings(300, 6), SolveProgress.NONE);
        assertThat(s.solvedAsMirrorHalves()).isFalse();
        HarmonicOperator zero = HarmonicOperator.factor(s, 0, SolveProgress.NONE);
        BiasedField round = s.withBiases(new double[] {1, 0});
        double[] d0 = zero.unitDensity(0);
        for (int j = 0; j < s.unknowns(); j++) {
            assertThat(d0[j]).isCloseTo(round.nodeDensity_V_per_m(j),
                    org.assertj.core.data.Offset.offset(1e-9 * Math.abs(round.nodeDensity_V_per_m(j)) + 1e-9));
        }
        HarmonicOperator one = HarmonicOperator.factor(s, 1, SolveProgress.NONE);
        assertThat(one.solvedAsMirrorHalves()).isFalse();
        int n = s.unknowns();
        double[] rhsA = new double[n];
        double[] rhsMix = new double[n];
        for (int i = 0; i < n; i++) {
            rhsA[i] = s.mesh().electrodeOf(i) == 0 ? 1 : 0;
            rhsMix[i] = s.mesh().electrodeOf(i) == 0 ? 3 : -2 * s.mesh().nodeR(i) / R;
        }
        double[][] x = one.solve(new double[][] {rhsA, rhsMix});
        double[] ua = one.unitDensity(0);
        double scale = 0;
        for (double v : ua) {
            scale = Math.max(scale, Math.abs(v));
        }
        for (int i = 0; i < n; i++) {
            assertThat(x[0][i]).isCloseTo(ua[i], org.assertj.core.data.Offset.offset(1e-9 * scale));
        }
        // linearity: the potential of the mixed solution meets its boundary values between the nodes too
        double[] rhsB = new double[n];
        for (int i = 0; i < n; i++) {
            rhsB[i] = rhsMix[i] - 3 * rhsA[i];
        }
        double[] xb = one.solve(rhsB);
        for (int i = 0; i < n; i++) {
            assertThat(x[1][i]).isCloseTo(3 * ua[i] + xb[i], org.assertj.core.data.Offset.offset(1e-8 * scale));
        }
        // boundary condition at a point of the tube between nodes (mid-panel): amplitude 3
        double zMid = -3.1 * R;
        assertThat(one.potential_V(x[1], zMid, R)).isCloseTo(3, org.assertj.core.data.Offset.offset(1e-5));
    }

    /**
     * (1/pi) Int_0^inf cos(k z) V~(k) I_m(k r)/I_m(k R) dk by a composite 20-point Gauss-Legendre rule, the
     * z-independent factor tabulated once.
     */
    static final class BesselIntegral {
        final double[] k;
        final double[] weight;

        BesselIntegral(int m, double r, double h, double g) {
            GaussIntegrator gl = new GaussIntegratorFactory().legendre(20, 0, 1);
            double kMax = 45 / (R - r); // the ratio falls as exp(-k (R - r))
            int pieces = 600;
            double dk = kMax / pieces;
            k = new double[pieces * 20];
            weight = new double[pieces * 20];
            for (int p = 0; p < pieces; p++) {
                for (int q = 0; q < 20; q++) {
                    double kk = (p + gl.getPoint(q)) * dk;
                    double vk = 2 * Math.sin(kk * h) / kk * sinc(kk * g / 2);
                    k[p * 20 + q] = kk;
                    weight[p * 20 + q] = dk * gl.getWeight(q) * vk * besselIRatio(m, kk * r, kk * R) / Math.PI;
                }
            }
        }

        double at(double z) {
            double sum = 0;
            for (int i = 0; i < k.length; i++) {
                sum += weight[i] * Math.cos(k[i] * z);
            }
            return sum;
        }
    }

    private static double sinc(double x) {
        return Math.abs(x) < 1e-8 ? 1 : Math.sin(x) / x;
    }

    /** I_m(a)/I_m(b) from the power series sum_j (x/2)^(2j+m)/(j! (j+m)!), both scaled by (b/2)^m / m!. */
    static double besselIRatio(int m, double a, double b) {
        return Math.pow(a / b, m) * scaledSeries(m, a) / scaledSeries(m, b);
    }

    private static double scaledSeries(int m, double x) {
        double q = x * x / 4;
        double term = 1;
        double sum = 1;
        for (int j = 1; j < 2000; j++) {
            term *= q / (j * (double) (j + m));
            sum += term;
            if (term < 1e-17 * sum) {
                break;
            }
        }
        return sum;
    }
}
