package org.axistack.optics;

import org.axistack.field.AxialField;
import org.axistack.model.Particle;
import org.hipparchus.ode.ODEState;
import org.hipparchus.ode.ODEStateAndDerivative;
import org.hipparchus.ode.OrdinaryDifferentialEquation;
import org.hipparchus.ode.nonstiff.DormandPrince853Integrator;

/**
 * Slow, independent reference for the tests: exact relativistic motion of a charged particle in three dimensions
 * (skew rays) under the Lorentz force dp/dt = qE in a round field, with z as the independent variable
 * (dx/dz = px/pz, dy/dz = py/pz, dp/dz = q E gamma m / pz). The field at radius r = sqrt(x^2 + y^2) comes from the
 * near-axis series of {@link ExactMeridionalTracer} (E_x = E_r x/r, E_y = E_r y/r). Nothing here uses the paraxial
 * equation or the aberration expansion: only Newton-Lorentz mechanics and Laplace's equation.
 */
final class ExactSkewTracer {

    private static final double C = org.axistack.model.Codata2018.SPEED_OF_LIGHT_M_PER_S;

    private final ExactMeridionalTracer series;
    private final Particle particle;

    ExactSkewTracer(AxialField field, Particle particle) {
        this.series = new ExactMeridionalTracer(field, particle);
        this.particle = particle;
    }

    /**
     * Traces the ray with position (x0, y0) and slopes (sx0, sy0) = (dx/dz, dy/dz) at z0 and kinetic energy t0_eV where
     * the potential is 0 V, to z1. Returns {x, y, dx/dz, dy/dz} at z1.
     */
    double[] trace(double z0, double x0, double y0, double sx0, double sy0, double t0_eV, double z1) {
        return trace(particle, (x, y, z, e) -> {
            double[] ef = new double[2];
            double r = Math.hypot(x, y);
            double phi = series.evaluate(z, r, ef);
            e[0] = r > 0 ? ef[1] * x / r : 0;
            e[1] = r > 0 ? ef[1] * y / r : 0;
            e[2] = ef[0];
            return phi;
        }, z0, x0, y0, sx0, sy0, t0_eV, z1);
    }

    /** A static field in three dimensions: returns the potential at (x, y, z), V, and puts E_x, E_y, E_z in e. */
    interface Field3 {
        double at(double x, double y, double z, double[] e);
    }

    /**
     * The one reference integrator of the optics tests: exact relativistic motion in any static field (the round
     * series here, round plus dipole in {@link ExactDipoleTracer}); Dormand-Prince 8(5,3) at 1e-13 relative.
     */
    static double[] trace(Particle particle, Field3 field, double z0, double x0, double y0, double sx0, double sy0,
            double t0_eV, double z1) {
        double[] e = new double[3];
        double q = particle.charge_C();
        double mc2 = particle.mass_kg() * C * C;
        double phi0 = field.at(x0, y0, z0, e);
        double kinetic = t0_eV * org.axistack.model.Codata2018.ELEMENTARY_CHARGE_C - q * phi0;
        double gamma = 1 + kinetic / mc2;
        double pNorm = Math.sqrt(gamma * gamma - 1);
        double pz = pNorm / Math.sqrt(1 + sx0 * sx0 + sy0 * sy0);
        double qOverMc2 = q / mc2;
        OrdinaryDifferentialEquation ode = new OrdinaryDifferentialEquation() {
            private final double[] ef = new double[3];

            @Override
            public int getDimension() {
                return 5;
            }

            @Override
            public double[] computeDerivatives(double z, double[] y) {
                field.at(y[0], y[1], z, ef);
                double g = Math.sqrt(1 + y[2] * y[2] + y[3] * y[3] + y[4] * y[4]);
                double k = qOverMc2 * g / y[4];
                return new double[] {y[2] / y[4], y[3] / y[4], k * ef[0], k * ef[1], k * ef[2]};
            }
        };
        double len = Math.abs(z1 - z0);
        DormandPrince853Integrator integ = new DormandPrince853Integrator(len * 1e-14, len / 100,
                new double[] {1e-18, 1e-18, 1e-18, 1e-18, 1e-18}, new double[] {1e-13, 1e-13, 1e-13, 1e-13, 1e-13});
        ODEStateAndDerivative end = integ.integrate(ode,
                new ODEState(z0, new double[] {x0, y0, pz * sx0, pz * sy0, pz}), z1);
        double[] y = end.getPrimaryState();
        return new double[] {y[0], y[1], y[2] / y[4], y[3] / y[4]};
    }
}
