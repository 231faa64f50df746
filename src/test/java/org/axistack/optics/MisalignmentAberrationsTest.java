package org.axistack.optics;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;
import java.util.OptionalDouble;
import java.util.stream.Stream;

import org.axistack.field.AxialField;
import org.axistack.field.BemSolver;
import org.axistack.field.FieldSolution;
import org.axistack.field.HarmonicOperator;
import org.axistack.field.MisalignmentResponse;
import org.axistack.field.SolveProgress;
import org.axistack.model.Beam;
import org.axistack.model.Electrode;
import org.axistack.model.MeshSettings;
import org.axistack.model.Particle;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * Axial coma of a misalignment (issue 17) against (1) exact three-dimensional tracing of a cone of rays through a
 * round field plus a dipole field of closed form ({@link ExactDipoleTracer}: Lorentz force, relativistic, the
 * dipole's potential from Laplace's series; nothing of the perturbation expansion), and (2) exact invariants of a
 * boundary-element lens: decentring every electrode by d is the round lens seen from an object at height -d, so the
 * summed coma must be the round lens's off-axis coma ({@link OffAxisAberrations}, itself checked against exact skew
 * rays), A = -2 K M and B = -K M; turning every electrode about z = c adds the spherical aberration of the turned
 * cone, A = -M (2 C + 2 K (z_o - c)), B = -M (C + K (z_o - c)); a parallel beam through the decentred lens is the
 * round lens's spherical aberration about the height -d, A = -2 S, B = -S (derivations in misalignment.md).
 */
class MisalignmentAberrationsTest {

    static Stream<Arguments> cases() {
        return Stream.of(
                // decelerating einzel bump, 5 keV protons from an object 30 mm before the start plane; dipole of its own
                // shape and place (any axial function is a valid m = 1 field)
                Arguments.of("decelerating bump, proton 5 keV, object", AnalyticAxialField.gaussian(3000, 4e-3),
                        new AnalyticAxialField(z -> z.subtract(0.002).divide(0.003).square().negate().exp().multiply(2000)),
                        Particle.proton(), 5000.0, 0.03),
                // accelerating bump, 20 keV electrons (relativistic), parallel beam; an odd (tilt-like) dipole
                Arguments.of("accelerating bump, electron 20 keV, parallel", AnalyticAxialField.gaussian(40000, 4e-3),
                        new AnalyticAxialField(z -> z.divide(0.005).square().negate().exp().multiply(z).multiply(4e6)),
                        Particle.electron(), 20000.0, Double.NaN));
    }

    private static MisalignmentAberrations.DipoleSources one(AxialField dipole) {
        return new MisalignmentAberrations.DipoleSources() {
            @Override
            public int count() {
                return 1;
            }

            @Override
            public void at(double z_m, double[][] out) {
                dipole.axial(z_m, 2, out[0]);
            }
        };
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("cases")
    void comaAgreesWithExactlyTracedCone(String name, AxialField round, AxialField dipole, Particle particle, double t0,
            double back) {
        ParaxialOptics optics = ParaxialOptics.auto(round, new Beam(particle, t0), -0.08, 0.08);
        boolean parallel = Double.isNaN(back);
        double zo = optics.zStart_m() - (parallel ? 0 : back);
        OptionalDouble object = parallel ? OptionalDouble.empty() : OptionalDouble.of(zo);
        MisalignmentAberrations ma = MisalignmentAberrations.of(optics, object, one(dipole), 1e-11);
        ExactDipoleTracer tracer = new ExactDipoleTracer(round, dipole, particle);
        double z0 = optics.zStart_m();
        double z1 = optics.zEnd_m();
        double zi = ma.imageZ_m();
        // the aperture variable b: object-side slope (rays from the axial object) or entrance height (parallel beam)
        java.util.function.BiFunction<double[], Double, double[]> land = (b, eps) -> {
            double x0 = parallel ? b[0] : b[0] * (z0 - zo);
            double y0 = parallel ? b[1] : b[1] * (z0 - zo);
            double sx = parallel ? 0 : b[0];
            double sy = parallel ? 0 : b[1];
            double[] e = tracer.trace(z0, x0, y0, sx, sy, t0, z1, eps);
            return new double[] {e[0] + e[2] * (zi - z1), e[1] + e[3] * (zi - z1)};
        };
        double eps = 1;
        double[] c0p = land.apply(new double[] {0, 0}, eps);
        double[] c0m = land.apply(new double[] {0, 0}, -eps);
        // first order in eps (odd part) less the central ray, per image-side alpha^2
        double bMax = parallel ? 2e-4 : 4e-3;
        double[] fr = {0.25, 0.5, 0.75, 1};
        double[] sumX = new double[fr.length];
        double[] difX = new double[fr.length];
        double[] diagY = new double[fr.length];
        for (int i = 0; i < fr.length; i++) {
            double b = bMax * fr[i];
            double alpha2 = b * b * ma.imageSlopeRatio() * ma.imageSlopeRatio();
            double[][] pats = {{b, 0}, {0, b}, {b / Math.sqrt(2), b / Math.sqrt(2)}};
            double[][] d = new double[3][];
            for (int p = 0; p < 3; p++) {
                double[] plus = land.apply(pats[p], eps);
                double[] minus = land.apply(pats[p], -eps);
                d[p] = new double[] {((plus[0] - minus[0]) - (c0p[0] - c0m[0])) / (2 * eps * alpha2),
                    ((plus[1] - minus[1]) - (c0p[1] - c0m[1])) / (2 * eps * alpha2)};
            }
            sumX[i] = d[0][0];   // A + B
            difX[i] = d[1][0];   // A - B
            diagY[i] = d[2][1];  // B (alpha^2 = i |alpha|^2)
        }
        double ab = AberrationTracingTest.fitIntercept(fr, sumX);
        double amb = AberrationTracingTest.fitIntercept(fr, difX);
        double bDiag = AberrationTracingTest.fitIntercept(fr, diagY);
        double aTraced = (ab + amb) / 2;
        double bTraced = (ab - amb) / 2;
        double a = ma.comaRound()[0];
        double bb = ma.comaCircle()[0];
        double scale = Math.max(Math.abs(a), Math.abs(bb));
        System.out.printf(java.util.Locale.ROOT, "%s: A %.8g / %.8g, B %.8g / %.8g / %.8g m (integral / traced)%n", name, a,
                aTraced, bb, bTraced, bDiag);
        assertThat(Math.abs(aTraced - a)).as("A, %s", name).isLessThan(1e-3 * scale);
        assertThat(Math.abs(bTraced - bb)).as("B, %s", name).isLessThan(1e-3 * scale);
        assertThat(Math.abs(bDiag - bb)).as("B diagonal, %s", name).isLessThan(1e-3 * scale);
        // a first-order term in the aperture would survive the division by alpha^2 as 1/alpha: the fit's slope of
        // a 1/fr term would show in the spread; the coefficients settle instead (no axial astigmatism at first order)
        assertThat(Math.abs(sumX[0] - sumX[3])).as("no first-order term, %s", name).isLessThan(0.01 * scale);
    }

    // ---- boundary-element lens: invariants of the whole lens moved ----

    static FieldSolution solution;
    static MisalignmentResponse response;
    static ParaxialOptics optics;

    @BeforeAll
    static void solve() {
        // a three-aperture einzel lens for 2 keV positive ions (demo numbers of our own), strong enough for coma
        List<Electrode> es = List.of(new Electrode.Aperture("a", 0, -0.004, 0.002, 0.008, 0.0005),
                new Electrode.Aperture("b", 1200, 0, 0.002, 0.008, 0.0005),
                new Electrode.Aperture("c", 0, 0.004, 0.002, 0.008, 0.0005));
        solution = BemSolver.solve(es, new MeshSettings(500, 6), SolveProgress.NONE);
        response = MisalignmentResponse.solve(solution.biased(), HarmonicOperator.factor(solution, 1, SolveProgress.NONE));
        AccelerationPotential p = new AccelerationPotential(solution.biased(), 2000, 1, Double.POSITIVE_INFINITY);
        optics = ParaxialOptics.of(p, -0.03, 0.03, ParaxialSettings.defaults());
    }

    @Test
    void decentringOrTurningTheWholeLensGivesTheRoundLensOffAxisComa() {
        double zo = -0.05;
        MisalignmentAberrations ma = MisalignmentAberrations.of(response, optics, OptionalDouble.of(zo));
        OffAxisAberrations oa = OffAxisAberrations.of(optics, zo);
        double m = oa.magnification();
        double s2 = ma.imageSlopeRatio() * ma.imageSlopeRatio();
        double c = 0.001;
        double aDec = 0;
        double bDec = 0;
        double aTilt = 0;
        double bTilt = 0;
        for (int k = 0; k < 3; k++) {
            aDec += ma.comaRound()[2 * k] * s2;
            bDec += ma.comaCircle()[2 * k] * s2;
            double arm = response.centreZ_m(k) - c;
            aTilt += (ma.comaRound()[2 * k + 1] + arm * ma.comaRound()[2 * k]) * s2;
            bTilt += (ma.comaCircle()[2 * k + 1] + arm * ma.comaCircle()[2 * k]) * s2;
        }
        double k = oa.coma();
        double cs = oa.spherical_m();
        System.out.printf(java.util.Locale.ROOT, "whole lens: decentre A %.8g / %.8g, B %.8g / %.8g; tilt A %.8g / %.8g,"
                + " B %.8g / %.8g; spherical %.8g / %.8g%n", aDec, -2 * k * m, bDec, -k * m, aTilt,
                -m * (2 * cs + 2 * k * (zo - c)), bTilt, -m * (cs + k * (zo - c)), ma.spherical_m() * s2 * ma.imageSlopeRatio(),
                m * cs);
        // measured 2e-6 (the responses' sum is the translated field to about 1e-9; the rest is the two routes'
        // integration of the same field and the dipole's derivatives from the mesh)
        assertThat(Math.abs(aDec + 2 * k * m)).isLessThan(1e-5 * Math.abs(2 * k * m));
        assertThat(Math.abs(bDec + k * m)).isLessThan(1e-5 * Math.abs(k * m));
        double tiltA = -m * (2 * cs + 2 * k * (zo - c));
        double tiltB = -m * (cs + k * (zo - c));
        // the tilt's two parts nearly cancel here (about 200 against 2.7): judged against the parts
        double parts = Math.abs(2 * m * cs) + Math.abs(2 * m * k * (zo - c));
        assertThat(Math.abs(aTilt - tiltA)).isLessThan(1e-5 * parts);
        assertThat(Math.abs(bTilt - tiltB)).isLessThan(1e-5 * parts / 2);
        assertThat(Math.abs(ma.spherical_m() * s2 * ma.imageSlopeRatio() - m * cs)).isLessThan(1e-7 * Math.abs(m * cs));
    }

    @Test
    void parallelBeamThroughTheDecentredLensIsSphericalAberrationAboutTheOffset() {
        MisalignmentAberrations ma = MisalignmentAberrations.of(response, optics, OptionalDouble.empty());
        double a = 0;
        double b = 0;
        for (int k = 0; k < 3; k++) {
            a += ma.comaRound()[2 * k];
            b += ma.comaCircle()[2 * k];
        }
        // per unit entrance height the image-side slope is s' = -1/f: S_height = C_i s'^3, so A_height = -2 C_i s'^3
        // and A_image = A_height / s'^2 = -2 C_i s' (and B likewise)
        double sp = ma.imageSlopeRatio();
        double ci = ma.spherical_m();
        assertThat(Math.abs(a + 2 * ci * sp)).isLessThan(1e-6 * Math.abs(2 * ci * sp));
        assertThat(Math.abs(b + ci * sp)).isLessThan(1e-6 * Math.abs(ci * sp));
        assertThat(Math.abs(sp + 1 / optics.cardinal().focalLengthImage_m()) * optics.cardinal().focalLengthImage_m())
                .isLessThan(1e-6);
    }

    @Test
    void tabulatedDipolesGiveTheDirectSums() {
        MisalignmentAberrations direct = MisalignmentAberrations.of(optics, OptionalDouble.of(-0.05),
                MisalignmentAberrations.sources(response), MisalignmentAberrations.TOLERANCE);
        MisalignmentAberrations table = MisalignmentAberrations.of(response, optics, OptionalDouble.of(-0.05));
        double scale = 0;
        for (int s = 0; s < 6; s++) {
            scale = Math.max(scale, Math.abs(direct.comaRound()[s]));
        }
        // measured 1.8e-6 (0.15 mm intervals against 2 mm bores: the interpolated second derivative)
        for (int s = 0; s < 6; s++) {
            assertThat(Math.abs(direct.comaRound()[s] - table.comaRound()[s])).isLessThan(1e-5 * scale);
            assertThat(Math.abs(direct.comaCircle()[s] - table.comaCircle()[s])).isLessThan(1e-5 * scale);
        }
    }

    @Test
    void integrationHasSettled() {
        MisalignmentAberrations loose = MisalignmentAberrations.of(optics, OptionalDouble.of(-0.05),
                MisalignmentAberrations.sources(response), 1e-8);
        MisalignmentAberrations tight = MisalignmentAberrations.of(optics, OptionalDouble.of(-0.05),
                MisalignmentAberrations.sources(response), 1e-12);
        double scale = 0;
        for (int s = 0; s < 6; s++) {
            scale = Math.max(scale, Math.abs(tight.comaRound()[s]));
        }
        for (int s = 0; s < 6; s++) {
            assertThat(Math.abs(loose.comaRound()[s] - tight.comaRound()[s])).isLessThan(1e-6 * scale);
            assertThat(Math.abs(loose.comaCircle()[s] - tight.comaCircle()[s])).isLessThan(1e-6 * scale);
        }
    }
}
