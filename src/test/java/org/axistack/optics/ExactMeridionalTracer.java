package org.axistack.optics;

import org.axistack.field.AxialField;
import org.axistack.model.Particle;
import org.hipparchus.ode.ODEState;
import org.hipparchus.ode.ODEStateAndDerivative;
import org.hipparchus.ode.OrdinaryDifferentialEquation;
import org.hipparchus.ode.nonstiff.DormandPrince853Integrator;

/**
 * Slow, independent reference for the tests: exact relativistic motion of a charged particle in the meridional
 * (x, z) plane under the Lorentz force dp/dt = qE, with z as the independent variable
 * (dx/dz = px/pz, dp/dz = q E gamma m / pz, gamma = sqrt(1 + (p/mc)^2)). The field comes from the near-axis
 * series phi(r, z) = sum_n (-1)^n (r/2)^(2n)/(n!)^2 V^(2n)(z) up to n = 4 (V^(8)), which converges near the
 * axis for the analytic test potentials. Nothing here uses the paraxial equation, U*, or the aberration
 * expansion: only Newton-Lorentz mechanics and Laplace's equation.
 */
final class ExactMeridionalTracer {

    private static final double C = org.axistack.model.Codata2018.SPEED_OF_LIGHT_M_PER_S;
    private static final double[] INV_FACT_SQ = {1, 1, 1.0 / 4, 1.0 / 36, 1.0 / 576};

    private final AxialField field;
    private final Particle particle;

    ExactMeridionalTracer(AxialField field, Particle particle) {
        this.field = field;
        this.particle = particle;
    }

    /** Potential and (E_z, E_x) at (z, x) from the series; returns phi. */
    double evaluate(double z, double x, double[] e) {
        double[] v = new double[9];
        field.axial(z, 8, v);
        double phi = 0;
        double ez = 0;
        double ex = 0;
        double h = x / 2;
        double h2 = h * h;
        double pow = 1; // (x/2)^(2n)
        for (int n = 0; n <= 4; n++) {
            double sgn = (n % 2 == 0) ? 1 : -1;
            phi += sgn * pow * INV_FACT_SQ[n] * v[2 * n];
            if (2 * n + 1 <= 8) {
                ez -= sgn * pow * INV_FACT_SQ[n] * v[2 * n + 1];
            }
            if (n >= 1) {
                // d/dx (x/2)^(2n) = n (x/2)^(2n-1)
                ex -= sgn * n * (pow / h) * INV_FACT_SQ[n] * v[2 * n];
            }
            pow *= h2;
        }
        if (x == 0) {
            ex = v[2] * x / 2; // limit of the n = 1 term: -(-1)(x/2) V'' = x V''/2
        }
        e[0] = ez;
        e[1] = ex;
        return phi;
    }

    /**
     * Traces a ray that has height x0 and slope dx/dz = slope0 at z0 and kinetic energy t0_eV where the
     * potential is 0 V, to z1. Returns {x, dx/dz, kinetic energy + q phi (J), at z1} and the same invariant at z0
     * in [3].
     */
    double[] trace(double z0, double x0, double slope0, double t0_eV, double z1) {
        double[] e = new double[2];
        double q = particle.charge_C();
        double m = particle.mass_kg();
        double mc2 = m * C * C;
        double phi0 = evaluate(z0, x0, e);
        double kinetic = t0_eV * org.axistack.model.Codata2018.ELEMENTARY_CHARGE_C - q * phi0;
        double gamma = 1 + kinetic / mc2;
        double pNorm = Math.sqrt(gamma * gamma - 1); // p / (m c)
        double pz = pNorm / Math.sqrt(1 + slope0 * slope0);
        double px = pz * slope0;
        double qOverMc2 = q / mc2;
        OrdinaryDifferentialEquation ode = new OrdinaryDifferentialEquation() {
            private final double[] ef = new double[2];

            @Override
            public int getDimension() {
                return 3;
            }

            @Override
            public double[] computeDerivatives(double z, double[] y) {
                evaluate(z, y[0], ef);
                double g = Math.sqrt(1 + y[1] * y[1] + y[2] * y[2]);
                double k = qOverMc2 * g / y[2];
                return new double[] {y[1] / y[2], k * ef[1], k * ef[0]};
            }
        };
        double len = Math.abs(z1 - z0);
        DormandPrince853Integrator integ = new DormandPrince853Integrator(len * 1e-14, len / 100,
                new double[] {1e-18, 1e-18, 1e-18}, new double[] {1e-13, 1e-13, 1e-13});
        ODEStateAndDerivative end = integ.integrate(ode, new ODEState(z0, new double[] {x0, px, pz}), z1);
        double[] y = end.getPrimaryState();
        double phi1 = evaluate(z1, y[0], e);
        double g1 = Math.sqrt(1 + y[1] * y[1] + y[2] * y[2]);
        double invariant1 = (g1 - 1) * mc2 + q * phi1;
        double invariant0 = kinetic + q * phi0;
        return new double[] {y[0], y[1] / y[2], invariant1, invariant0};
    }
}
