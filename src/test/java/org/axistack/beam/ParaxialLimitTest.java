package org.axistack.beam;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.axistack.field.AxialField;
import org.axistack.model.Particle;
import org.hipparchus.ode.ODEState;
import org.hipparchus.ode.OrdinaryDifferentialEquation;
import org.hipparchus.ode.nonstiff.GraggBulirschStoerIntegrator;
import org.junit.jupiter.api.Test;

/**
 * Zero current and zero emittance: the envelope is the paraxial ray. Checked against the closed-form
 * ray of a uniform field and against an independent integration of Picht's reduced equation.
 */
class ParaxialLimitTest {

    private final EnvelopeSolver solver = new EnvelopeSolver();

    /**
     * S(z) = sqrt(U0*) Integral_0^z dz' / sqrt(U*(z')) for U = U0 + E z, U* = U + U^2/(2 V0): the sine-like
     * ray of a uniform field, from (sqrt(U*) r')' = 0 (first integral of the relativistic paraxial
     * equation when U'' = 0) and Integral dx / sqrt(a x^2 + x) = ln(2 sqrt(a) sqrt(a x^2 + x) + 2 a x + 1)/sqrt(a)
     * (Gradshteyn and Ryzhik 2.261).
     */
    static double sineRay(double u0, double e, double v0, double z) {
        double a = 1 / (2 * v0);
        java.util.function.DoubleUnaryOperator prim = x -> Math.log(2 * Math.sqrt(a) * Math.sqrt(a * x * x + x)
                + 2 * a * x + 1) / Math.sqrt(a);
        double u0s = u0 + a * u0 * u0;
        return Math.sqrt(u0s) * (prim.applyAsDouble(u0 + e * z) - prim.applyAsDouble(u0)) / e;
    }

    @Test
    void rayInUniformAcceleratingFieldMatchesClosedForm() {
        // electron, 100 keV at z = 0, accelerated by a uniform 1 MV/m field (relativistic: U/V0 up to 0.6)
        Particle e = Particle.electron();
        double u0 = 100e3;
        double grad = 1e6;
        AxialField f = TestFields.linear(0, grad); // electron: U = U0 + V
        ElectrostaticChannel ch = new ElectrostaticChannel(f, e, u0);
        double r0 = 1e-3;
        double s0 = -0.02;
        EnvelopeCurve c = solver.solve(ch, new EnvelopeProblem(0, 0.2, r0, s0, 0, 0));
        double v0 = e.restPotential_V();
        for (EnvelopePoint p : c.points()) {
            double ref = Math.abs(r0 + s0 * sineRay(u0, grad, v0, p.z_m()));
            assertThat(p.radius_m()).as("z = %s", p.z_m()).isCloseTo(ref, within(1e-9 * r0));
        }
        // one axis crossing where r0 + s0 S(z) = 0, found here by bisection on the closed form
        double lo = 0;
        double hi = 0.2;
        for (int i = 0; i < 200; i++) {
            double mid = 0.5 * (lo + hi);
            if (r0 + s0 * sineRay(u0, grad, v0, mid) > 0) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        assertThat(c.waists()).hasSize(1);
        assertThat(c.waists().get(0).kind()).isEqualTo(Waist.Kind.AXIS_CROSSING);
        assertThat(c.waists().get(0).z_m()).isCloseTo(lo, within(1e-9 * 0.2));
    }

    @Test
    void emittanceEnvelopeUnderAccelerationFollowsNormalisedEmittance() {
        // Linear optics: an upright start ellipse (waist R0, geometric emittance eps0) maps to
        // R(z)^2 = (C R0)^2 + (S eps0 / R0)^2 with C = 1, S the sine-like ray above. This holds only if the
        // geometric emittance shrinks as 1/(beta gamma) (conserved normalised emittance), so it checks
        // the emittance convention; source: Liouville's theorem in linear optics (e.g. Reiser section 3.2).
        Particle e = Particle.electron();
        double u0 = 100e3;
        double grad = 1e6;
        ElectrostaticChannel ch = new ElectrostaticChannel(TestFields.linear(0, grad), e, u0);
        double v0 = e.restPotential_V();
        double r0 = 0.2e-3;
        double eps0 = 5e-6;
        double epsN = eps0 * BeamKinematics.betaGamma(u0, v0);
        EnvelopeCurve c = solver.solve(ch, new EnvelopeProblem(0, 0.2, r0, 0, 0, epsN));
        for (EnvelopePoint p : c.points()) {
            double s = sineRay(u0, grad, v0, p.z_m());
            double ref = Math.hypot(r0, s * eps0 / r0);
            assertThat(p.radius_m()).as("z = %s", p.z_m()).isCloseTo(ref, within(1e-9 * ref));
        }
        double bgEnd = BeamKinematics.betaGamma(u0 + grad * 0.2, v0);
        assertThat(c.last().emittance_m_rad()).isCloseTo(epsN / bgEnd, within(1e-12 * epsN / bgEnd));
    }

    @Test
    void rayThroughBellLensMatchesPichtReducedEquation() {
        // Independent formulation: Picht's reduced ray P = r U*^(1/4) obeys P'' + T P = 0 with (derived from
        // the relativistic paraxial equation by the standard transformation, e.g. Hawkes and Kasper ch. 15)
        // T = (3/16) (gamma U'/U*)^2 - U'^2 / (4 V0 U*), which needs no U''. Integrated here with the
        // Gragg-Bulirsch-Stoer extrapolation method (a different integrator from the one under test).
        Particle e = Particle.electron();
        double u0 = 5000;
        double vc = -3000;
        double w = 0.01;
        AxialField f = TestFields.bell(vc, w);
        ElectrostaticChannel ch = new ElectrostaticChannel(f, e, u0);
        double v0 = e.restPotential_V();
        double zs = -0.06;
        double ze = 0.15;
        double r0 = 1e-3;
        EnvelopeCurve c = solver.solve(ch, new EnvelopeProblem(zs, ze, r0, 0, 0, 0));
        assertThat(c.waists()).as("the lens focuses").isNotEmpty();

        java.util.function.DoubleUnaryOperator uOf = z -> u0 + f.axialPotential_V(z);
        OrdinaryDifferentialEquation picht = new OrdinaryDifferentialEquation() {
            @Override
            public int getDimension() {
                return 2;
            }

            @Override
            public double[] computeDerivatives(double z, double[] y) {
                double[] d = new double[2];
                f.axial(z, 1, d);
                double u = u0 + d[0];
                double du = d[1];
                double us = u * (1 + u / (2 * v0));
                double g = 1 + u / v0;
                double t = 3.0 / 16 * Math.pow(g * du / us, 2) - du * du / (4 * v0 * us);
                return new double[] {y[1], -t * y[0]};
            }
        };
        double us0 = uOf.applyAsDouble(zs) * (1 + uOf.applyAsDouble(zs) / (2 * v0));
        double[] du0 = new double[2];
        f.axial(zs, 1, du0);
        // P' = r' U*^(1/4) + r (1/4) U*^(-3/4) U*' with r' = 0 at the start, U*' = gamma U'
        double gs = 1 + uOf.applyAsDouble(zs) / v0;
        double p0 = r0 * Math.pow(us0, 0.25);
        double dp0 = r0 * 0.25 * Math.pow(us0, -0.75) * gs * du0[1];
        GraggBulirschStoerIntegrator gbs = new GraggBulirschStoerIntegrator(1e-12, 1e-3, 1e-16, 1e-13);
        double z = zs;
        double[] y = {p0, dp0};
        for (double zc : new double[] {-0.01, 0.0, 0.02, 0.05, 0.1, 0.15}) {
            y = gbs.integrate(picht, new ODEState(z, y), zc).getPrimaryState();
            z = zc;
            double u = uOf.applyAsDouble(zc);
            double ref = Math.abs(y[0] / Math.pow(u * (1 + u / (2 * v0)), 0.25));
            assertThat(c.at(zc).radius_m()).as("z = %s", zc).isCloseTo(ref, within(1e-8 * r0));
        }
    }
}
