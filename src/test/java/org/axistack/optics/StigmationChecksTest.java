package org.axistack.optics;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.List;
import java.util.Map;
import java.util.OptionalDouble;

import org.axistack.field.BemSolver;
import org.axistack.field.BiasedField;
import org.axistack.field.FieldSolution;
import org.axistack.field.SectorField;
import org.axistack.field.SolveProgress;
import org.axistack.model.Beam;
import org.axistack.model.Electrode;
import org.axistack.model.MeshSettings;
import org.axistack.model.Particle;
import org.axistack.model.Sectors;
import org.axistack.trace.SteeredRays;
import org.hipparchus.analysis.integration.IterativeLegendreGaussIntegrator;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * Quadrupole astigmatism of an eight-sector stigmator (tube of radius R between two grounded tubes, 1 keV
 * protons): the first-order x and y focal properties ({@link Stigmation}) against the weak thin quadrupole lens,
 * against exact three-dimensional rays in the harmonic field ({@link SteeredRays}, the tracer of {@code aim}), and
 * their symmetries. One field solve (round and harmonics 1, 2) shared by every check; the round part is re-biased.
 */
class StigmationChecksTest {

    static final double R = 0.005;
    static final double GAP = 0.0005;
    static final double L = 0.010;
    static final Beam BEAM = new Beam(Particle.proton(), 1000);
    /** Common bias of the stigmator when it also focuses (a decelerating einzel lens). */
    static final double COMMON_V = 600;
    static FieldSolution round;
    static SectorField field;

    @BeforeAll
    static void solve() {
        List<Electrode> es = List.of(new Electrode.Tube("in", 0, R, -0.04, -L / 2 - GAP, 0),
                new Electrode.Tube("stig", 0, R, -L / 2, L / 2, 0),
                new Electrode.Tube("out", 0, R, L / 2 + GAP, 0.04, 0));
        round = BemSolver.solve(es, new MeshSettings(360, 6), SolveProgress.NONE);
        field = SectorField.solve(round, Map.of(1, sectors(0, 0, 0)), 2, SolveProgress.NONE);
    }

    /** Eight sectors at common bias c with v0 V of the 0-degree and v45 V of the 45-degree quadrupole pattern. */
    static Sectors sectors(double common, double v0, double v45) {
        Sectors plain = Sectors.fromDifferentials(8, 0, 0, common, 0, 0);
        List<Double> p0 = Stigmation.pattern(plain, 0);
        List<Double> p45 = Stigmation.pattern(plain, 45);
        Double[] b = new Double[8];
        for (int s = 0; s < 8; s++) {
            b[s] = common + v0 * p0.get(s) + v45 * p45.get(s);
        }
        return plain.withBiases_V(List.of(b));
    }

    static ParaxialOptics optics(double common) {
        BiasedField f = round.withBiases(new double[] {0, common, 0});
        return ParaxialOptics.of(new AccelerationPotential(f, BEAM), -0.03, 0.035, ParaxialSettings.defaults());
    }

    /**
     * Weak thin quadrupole in a field-free round lens (every common bias 0): the ray stays at its height through
     * the quadrupole, so the first-order x focal power is 1/f_x = sign(q) g/U* Int Phi_2(z) dz (the electrostatic
     * thin quadrupole lens, 1/f = Int Phi_2 dz / U non-relativistically; P. W. Hawkes and E. Kasper, Principles of
     * Electron Optics, vol. 1, quadrupole lenses, cited from memory and derived in harmonic-field.md), and -1/f_x
     * for y. The integral, by separation of variables at axial wave number k = 0 (the radial equation then has the
     * solution r^m), is a_2 (L + g)/R^2 for a sector tube of length L with linear gaps g between tubes of the same
     * radius; the real gap is an opening, not a ramp (measured difference in the assertion).
     */
    @Test
    void fieldFreeStigmatorIsTheThinQuadrupoleLens() {
        ParaxialOptics o = optics(0);
        Stigmation st = Stigmation.of(field, o, OptionalDouble.empty());
        double[] unit = st.unit(1);
        double[] q = new double[1];
        double integral = new IterativeLegendreGaussIntegrator(8, 1e-12, 1e-14).integrate(100000, z -> {
            field.unitAxial(1, 2, z, 0, q);
            return q[0];
        }, -0.03, 0.035);
        double u = BEAM.energyPerCharge_V();
        AccelerationPotential acc = o.potential();
        double thin = acc.g(u) / acc.uStar(u) * integral;
        System.out.printf("thin: D=%.12g thin=%.12g rel=%.3g; integral %.10g closed %.10g rel %.3g%n", unit[0], thin,
                unit[0] / thin - 1, integral, (L + GAP) / (R * R), integral / ((L + GAP) / (R * R)) - 1);
        assertThat(unit[0]).isCloseTo(thin, within(1e-7 * Math.abs(thin)));
        assertThat(integral).isCloseTo((L + GAP) / (R * R), within(2e-2 * (L + GAP) / (R * R)));
    }

    /**
     * First-order x and y focal points against exact rays: two rays entering parallel at height h in the x-z and
     * the y-z plane, traced in the full three-dimensional field (round field plus harmonics 1 and 2 by element
     * sums) to a field-free plane, their asymptotes' axis crossings. The difference F_x - F_y is odd in the
     * stigmator bias (turning the eight sectors by 90 degrees reverses the pattern and swaps x and y), so it
     * equals twice the first-order focal shift up to third order in the bias and the small h^2 cross terms.
     * Doubling the bias doubles it (linearity), and the 45-degree pattern acts on rays in the diagonal planes as
     * the 0-degree pattern on x and y (the astigmatism axes turn with the pattern).
     */
    @Test
    void focalPointsAgreeWithExactRays() {
        double v = 0.2;
        ParaxialOptics o = optics(COMMON_V);
        Stigmation st = Stigmation.of(field, o, OptionalDouble.empty());
        System.out.printf("f2 = %.6g mm F2 = %.6g mm%n", st.focalLength_m() * 1e3, st.focalPointZ_m() * 1e3);
        Stigmation.Split fo = st.at(Map.of(1, sectors(COMMON_V, v, 0).biases_V()))[1];
        Stigmation.Split fo2 = st.at(Map.of(1, sectors(COMMON_V, 2 * v, 0).biases_V()))[1];
        Stigmation.Split fo45 = st.at(Map.of(1, sectors(COMMON_V, 0, v).biases_V()))[1];
        assertThat(fo.s()).isCloseTo(0, within(1e-15));
        assertThat(fo2.c()).isCloseTo(2 * fo.c(), within(1e-12 * Math.abs(fo.c())));
        assertThat(fo45.c()).isCloseTo(0, within(1e-12 * Math.abs(fo.c())));
        assertThat(fo45.s()).isCloseTo(fo.c(), within(1e-9 * Math.abs(fo.c())));
        // axes are defined modulo 180 degrees
        double turn = Math.toDegrees(fo45.axis_rad()) - Math.toDegrees(fo.axis_rad());
        assertThat(((turn % 180) + 180) % 180).isCloseTo(45.0, within(1e-9));
        double h = 0.025e-3;
        BiasedField rf = round.withBiases(new double[] {0, COMMON_V, 0});
        double d = Math.sqrt(0.5) * h;
        double[][] starts = {{h, 0}, {0, h}, {h, 0}, {0, h}, {d, d}, {d, -d}};
        Sectors[] set = {sectors(COMMON_V, v, 0), sectors(COMMON_V, v, 0), sectors(COMMON_V, 2 * v, 0),
            sectors(COMMON_V, 2 * v, 0), sectors(COMMON_V, 0, v), sectors(COMMON_V, 0, v)};
        double[] focus = new double[starts.length];
        java.util.stream.IntStream.range(0, starts.length).parallel().forEach(i -> {
            SteeredRays rays = new SteeredRays(rf, field, Map.of(1, set[i].biases_V()), BEAM.particle(),
                    BEAM.energyPerCharge_V(), R, 1e-11);
            double zp = 0.035;
            double[][] t = rays.trace(-0.03, new double[] {starts[i][0], starts[i][1], 0, 0}, new double[] {zp});
            double rr = Math.hypot(t[0][0], t[0][1]);
            double rs = (t[0][0] * starts[i][0] + t[0][1] * starts[i][1]) / h;
            double slope = (t[0][2] * starts[i][0] + t[0][3] * starts[i][1]) / h;
            focus[i] = zp - rs / slope;
            assertThat(t[1][0]).as("energy conservation").isLessThan(1e-8);
            assertThat(Math.abs(rr - Math.abs(rs))).as("ray stays in its plane").isLessThan(1e-6 * h);
        });
        double exact = focus[0] - focus[1];
        double exact2 = focus[2] - focus[3];
        double exact45 = focus[4] - focus[5];
        System.out.printf("first %.9g exact %.9g rel %.3g; 2V first %.9g exact %.9g rel %.3g; 45 exact %.9g rel %.3g%n",
                2 * fo.c(), exact, exact / (2 * fo.c()) - 1, 2 * fo2.c(), exact2, exact2 / (2 * fo2.c()) - 1, exact45,
                exact45 / (2 * fo45.s()) - 1);
        // measured: 8.8e-6 at 0.2 V (h^2 cross terms and the bias's cube; 1.4e-4 with h doubled, 3.4e-3 at 2 V)
        assertThat(exact).isCloseTo(2 * fo.c(), within(5e-5 * Math.abs(2 * fo.c())));
        assertThat(exact45).isCloseTo(2 * fo45.s(), within(5e-5 * Math.abs(2 * fo45.s())));
        // F_x - F_y = alpha V + beta V^3 (odd): the linear part from the two biases against the first order
        // (measured 4.4e-5, falling as h^2: 1.8e-4 with h doubled), and the cubic part small beside it
        double alpha = (8 * exact - exact2) / (6 * v);
        double beta = (exact2 - 2 * exact) / (6 * v * v * v);
        System.out.printf("linear part %.9g m/V first order %.9g m/V rel %.3g; cubic %.3g m/V^3%n", alpha, 2 * fo.c() / v,
                alpha / (2 * fo.c() / v) - 1, beta);
        assertThat(alpha).isCloseTo(2 * fo.c() / v, within(2e-4 * Math.abs(2 * fo.c() / v)));
        assertThat(Math.abs(beta * v * v)).isLessThan(1e-3 * Math.abs(alpha));
    }

    /**
     * The cancelling bias: an eight-sector stigmator cancels an astigmatism along any axis exactly (first order);
     * the biases found reproduce minus the given split; a given astigmatism made by the stigmator itself is
     * cancelled by minus its own pattern biases.
     */
    @Test
    void cancellingBiasUndoesAGivenAstigmatism() {
        ParaxialOptics o = optics(COMMON_V);
        Stigmation st = Stigmation.of(field, o, OptionalDouble.of(-0.06));
        assertThat(st.hasImage()).isTrue();
        Stigmation.Split made = st.astigmatism(Map.of(1, sectors(COMMON_V, 1.5, -0.7).biases_V()));
        Stigmation.Cancel c = st.cancel(2 * made.magnitude(), made.axis_rad());
        assertThat(c.settings().get(1)[0]).isCloseTo(-1.5, within(1e-9));
        assertThat(c.settings().get(1)[1]).isCloseTo(0.7, within(1e-9));
        assertThat(c.residual().magnitude()).isLessThan(1e-12 * made.magnitude());
        Stigmation.Cancel any = st.cancel(1e-3, Math.toRadians(30));
        double[] v = any.settings().get(1);
        Stigmation.Split after = st.astigmatism(Map.of(1, sectors(COMMON_V, v[0], v[1]).biases_V()));
        assertThat(2 * after.magnitude()).isCloseTo(1e-3, within(1e-12));
        assertThat(Math.toDegrees(after.axis_rad())).isCloseTo(30 - 90, within(1e-9));
    }
}
