package org.axistack.optics;

import org.axistack.verify.TwoTubeBesselPotential;
import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.stream.Stream;

import org.axistack.field.AxialField;
import org.axistack.model.Beam;
import org.axistack.model.Particle;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * The aberration integrals against direct tracing of exact rays (physics brief, "Aberrations"): rays at growing
 * aperture in the near-axis series field, traced by {@link ExactMeridionalTracer} (Lorentz force, relativistic),
 * miss at the paraxial focal plane fitted as -Cs alpha^3 + b alpha^5 + c alpha^7; rays with kinetic energy
 * changed by +-dT give Cc from the central difference (miss(+) - miss(-))/2 = Cc alpha dT/T. Required agreement:
 * 1% (issue 5). Scherzer's theorem (O. Scherzer, Z. Phys. 101 (1936) 593): Cs > 0 and Cc > 0.
 */
class AberrationTracingTest {

    static Stream<Arguments> lenses() {
        Particle e = Particle.electron();
        Particle p = Particle.proton();
        return Stream.of(
                Arguments.of("decelerating einzel bump, proton 5 keV", AnalyticAxialField.gaussian(3000, 4e-3), p, 5000.0),
                Arguments.of("accelerating einzel bump, electron 20 keV", AnalyticAxialField.gaussian(40000, 4e-3), e, 20000.0),
                Arguments.of("accelerating immersion, electron 10 keV", AnalyticAxialField.tanhStep(0, 30000, 3e-3), e, 10000.0),
                Arguments.of("decelerating immersion, proton 10 keV", AnalyticAxialField.tanhStep(0, 6000, 3e-3), p, 10000.0),
                Arguments.of("strong accelerating bump, proton 1 keV (real focus inside the field)",
                        AnalyticAxialField.gaussian(-6000, 4e-3), p, 1000.0),
                Arguments.of("zero-gap two-tube lens R 5 mm 1:5, electron 5 keV", new TwoTubeBesselPotential(5e-3, 0, 20000), e, 5000.0),
                Arguments.of("zero-gap two-tube lens R 5 mm 5:1, proton 25 keV", new TwoTubeBesselPotential(5e-3, 0, 20000), p, 25000.0));
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("lenses")
    void integralsAgreeWithTracedRaysWithinOnePercent(String name, AxialField field, Particle particle, double t0) {
        Beam beam = new Beam(particle, t0);
        ParaxialOptics optics = ParaxialOptics.auto(field, beam, -0.08, 0.08);
        CardinalElements ce = optics.cardinal();
        Aberrations ab = optics.aberrations();
        ExactMeridionalTracer tracer = new ExactMeridionalTracer(field, particle);
        double z0 = optics.zStart_m();
        double z1 = optics.zEnd_m();
        double f2 = ce.focalLengthImage_m();
        double fp2 = ce.focalPointImageZ_m();

        // spherical: rays entering parallel at h = alpha f2
        double[] alphas = {2e-3, 4e-3, 6e-3, 8e-3, 10e-3};
        double[] y = new double[alphas.length];
        for (int i = 0; i < alphas.length; i++) {
            double[] r = tracer.trace(z0, alphas[i] * f2, 0, t0, z1);
            double miss = r[0] + r[1] * (fp2 - z1);
            y[i] = miss / Math.pow(alphas[i], 3);
            // energy conservation along the exact ray, 1e-9 relative (issue 5)
            assertThat(r[2]).isCloseTo(r[3], within(1e-9 * Math.abs(r[3])));
        }
        double csTraced = -fitIntercept(alphas, y);
        // issue 5 asks for 1%; measured agreement is ~1e-6, so pin at 1e-4 to catch any drift
        assertThat(ab.sphericalImage_m()).as("Cs integral vs traced, %s", name)
                .isCloseTo(csTraced, within(1e-4 * Math.abs(csTraced)));

        // chromatic: dT = +-kappa T2, T2 the image-side kinetic energy (|q| U2; charge state 1 so eV = V)
        double t2 = optics.potential().u_V(z1) * Math.abs(particle.chargeNumber());
        double alpha = 1e-3;
        double kappa = 1e-4;
        double[] plus = tracer.trace(z0, alpha * f2, 0, t0 + kappa * t2, z1);
        double[] minus = tracer.trace(z0, alpha * f2, 0, t0 - kappa * t2, z1);
        double missPlus = plus[0] + plus[1] * (fp2 - z1);
        double missMinus = minus[0] + minus[1] * (fp2 - z1);
        double ccTraced = (missPlus - missMinus) / 2 / (alpha * kappa);
        // measured agreement 1e-6 .. 1.3e-4 (second-order energy and aperture terms of the central difference)
        assertThat(ab.chromaticImage_m()).as("Cc integral vs traced, %s", name)
                .isCloseTo(ccTraced, within(1e-3 * Math.abs(ccTraced)));

        // small-angle limit: an exact ray entering at h = 1e-5 f2 crosses the axis at the paraxial real focus
        // (issue 5); its third-order miss Cs alpha^3 is ~1e-15 m, so |x| there must vanish to integrator accuracy
        double zReal = ce.realFocusImageZ_m().getAsDouble();
        double h = 1e-5 * f2;
        double[] nearAxis = tracer.trace(z0, h, 0, t0, zReal);
        if (name.contains("inside the field")) {
            // found by root finding inside the field, distinct from the asymptotic F2
            assertThat(zReal).as("real focus inside the traced field").isLessThan(z1);
            assertThat(Math.abs(zReal - ce.focalPointImageZ_m())).isGreaterThan(1e-4 * f2);
        }
        assertThat(Math.abs(nearAxis[0])).as("exact small-angle ray at the real focus").isLessThan(1e-7 * h);

        assertThat(ab.sphericalImage_m()).as("Scherzer Cs > 0").isPositive();
        assertThat(ab.chromaticImage_m()).as("Scherzer Cc > 0").isPositive();
        assertThat(ab.relativistic()).isTrue();
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("lenses")
    void objectSideCoefficientsAgreeWithTracedRays(String name, AxialField field, Particle particle, double t0) {
        Beam beam = new Beam(particle, t0);
        ParaxialOptics optics = ParaxialOptics.auto(field, beam, -0.08, 0.08);
        double z0 = optics.zStart_m();
        double z1 = optics.zEnd_m();
        double zo = z0 - 0.03;
        Imaging im = optics.imaging(zo);
        Aberrations ab = optics.aberrations(zo);
        double m = im.lateralMagnification();
        double zi = im.imageZ_m();
        ExactMeridionalTracer tracer = new ExactMeridionalTracer(field, particle);
        double[] alphas = {2e-3, 4e-3, 6e-3, 8e-3, 10e-3};
        double[] y = new double[alphas.length];
        for (int i = 0; i < alphas.length; i++) {
            double[] r = tracer.trace(z0, alphas[i] * (z0 - zo), alphas[i], t0, z1);
            double miss = r[0] + r[1] * (zi - z1);
            y[i] = miss / (m * Math.pow(alphas[i], 3));
        }
        double csTraced = fitIntercept(alphas, y);
        assertThat(ab.sphericalObject_m().getAsDouble()).as("Cs_o, %s", name)
                .isCloseTo(csTraced, within(0.01 * Math.abs(csTraced)));
        double to = optics.potential().u_V(z0) * Math.abs(particle.chargeNumber());
        double alpha = 1e-3;
        double kappa = 1e-4;
        double[] plus = tracer.trace(z0, alpha * (z0 - zo), alpha, t0 + kappa * to, z1);
        double[] minus = tracer.trace(z0, alpha * (z0 - zo), alpha, t0 - kappa * to, z1);
        double dMiss = ((plus[0] + plus[1] * (zi - z1)) - (minus[0] + minus[1] * (zi - z1))) / 2;
        double ccTraced = -dMiss / (m * alpha * kappa);
        assertThat(ab.chromaticObject_m().getAsDouble()).as("Cc_o, %s", name)
                .isCloseTo(ccTraced, within(0.01 * Math.abs(ccTraced)));
        assertThat(ab.sphericalObject_m().getAsDouble()).isPositive();
        assertThat(ab.chromaticObject_m().getAsDouble()).isPositive();
        assertThat(ab.convention()).contains("object side");
    }

    /** Least-squares intercept of y = a + b x^2 + c x^4. */
    static double fitIntercept(double[] x, double[] y) {
        double[][] a = new double[x.length][3];
        for (int i = 0; i < x.length; i++) {
            double x2 = x[i] * x[i];
            a[i] = new double[] {1, x2, x2 * x2};
        }
        return new org.hipparchus.linear.QRDecomposition(new org.hipparchus.linear.Array2DRowRealMatrix(a))
                .getSolver().solve(new org.hipparchus.linear.ArrayRealVector(y)).getEntry(0);
    }
}
