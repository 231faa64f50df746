package org.axistack.trace;

import org.axistack.field.Field;
import org.axistack.model.Particle;
import org.hipparchus.ode.OrdinaryDifferentialEquation;

/**
 * Relativistic equations of motion of a charged particle in a static electric field (Lorentz force,
 * dp/dt = qE, dx/dt = p / (gamma m); e.g. Jackson, "Classical Electrodynamics", 3rd ed., section
 * 12.1), in Cartesian coordinates so that rays cross the axis without a singularity. Scaled so that
 * all state components are of order one: the independent variable is the light path tau = c t (m),
 * the state is (x, y, z, u_x, u_y, u_z) with u = p / (m c) = gamma beta, and
 * dx/dtau = u / gamma, du/dtau = (q / (m c^2)) E, gamma = sqrt(1 + u.u).
 * One instance per ray (it owns a scratch buffer); not thread-safe.
 */
public final class LorentzEquations implements OrdinaryDifferentialEquation {

    private final Field field;
    private final double qOverRest; // q / (m c^2), 1/V
    private final double[] buf = new double[2];

    public LorentzEquations(Field field, Particle particle) {
        this.field = field;
        this.qOverRest = particle.chargeSign() / particle.restPotential_V();
    }

    @Override
    public int getDimension() {
        return 6;
    }

    @Override
    public double[] computeDerivatives(double tau, double[] s) {
        double x = s[0], y = s[1], z = s[2], ux = s[3], uy = s[4], uz = s[5];
        double gamma = Math.sqrt(1 + ux * ux + uy * uy + uz * uz);
        double r = Math.hypot(x, y);
        field.evaluate(z, r, buf);
        double ez = buf[0], er = buf[1];
        double ex = 0, ey = 0;
        if (r > 0) {
            ex = er * x / r;
            ey = er * y / r;
        }
        return new double[] {ux / gamma, uy / gamma, uz / gamma, qOverRest * ex, qOverRest * ey, qOverRest * ez};
    }

    /** gamma - 1 for momentum u, without cancellation: u.u / (gamma + 1). */
    static double gammaMinusOne(double ux, double uy, double uz) {
        double u2 = ux * ux + uy * uy + uz * uz;
        return u2 / (Math.sqrt(1 + u2) + 1);
    }
}
