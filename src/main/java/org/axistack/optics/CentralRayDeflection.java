package org.axistack.optics;

import java.util.List;
import java.util.function.DoubleUnaryOperator;

import org.hipparchus.ode.ODEState;
import org.hipparchus.ode.ODEStateAndDerivative;
import org.hipparchus.ode.OrdinaryDifferentialEquation;
import org.hipparchus.ode.nonstiff.DormandPrince853Integrator;

/**
 * First-order deflection of the central ray (launched on the axis, parallel to it) by dipole fields. Near the
 * axis a split electrode adds to the potential r cos(phi) Phi_c(z) + r sin(phi) Phi_s(z) (the dipole functions),
 * so on the axis the transverse derivative of the acceleration potential is dU/dx = -sign(q) Phi_c, and the
 * paraxial ray equation with a transverse force (momentum p^2 = 2 m |q| U*, p v = 2 |q| U* / g; the relativistic
 * form of the ray equation, e.g. P. W. Hawkes and E. Kasper, Principles of Electron Optics, vol. 1, ch. 15,
 * cited from memory and derived in src/site/markdown/harmonic-field.md) reads
 *
 * <pre>
 *   x'' + (g U' / (2 U*)) x' + (g U''/(4 U*)) x = -sign(q) g Phi_c(z) / (2 U*),   g = 1 + U/Vr,
 * </pre>
 *
 * and the same for y with Phi_s. It is linear in the dipole functions, so each source k (one split
 * electrode's unit dipole function d_k) is integrated once, x = sum_k a_k xi_k, y = sum_k b_k xi_k, and a
 * change of sector biases only recombines (no integration). Integrated with Hipparchus' Dormand-Prince 8(5,3)
 * (relative tolerance 1e-11) from a start plane to each requested plane. Immutable.
 */
public final class CentralRayDeflection {

    private final double zStart;
    private final double[] planes;
    /** offset[p][k], slope[p][k]: xi_k and xi_k' at plane p, m and rad per unit coefficient. */
    private final double[][] offset;
    private final double[][] slope;

    private CentralRayDeflection(double zStart, double[] planes, double[][] offset, double[][] slope) {
        this.zStart = zStart;
        this.planes = planes;
        this.offset = offset;
        this.slope = slope;
    }

    /**
     * Integrates the unit responses.
     *
     * @param u       acceleration potential of the round field
     * @param zStart  start plane (the ray is on the axis and parallel to it there), m
     * @param planes  planes after zStart where the response is wanted, ascending, m
     * @param dipoles unit dipole functions d_k(z), V/m per unit coefficient
     */
    public static CentralRayDeflection of(AccelerationPotential u, double zStart, double[] planes,
            List<DoubleUnaryOperator> dipoles) {
        int k = dipoles.size();
        double sign = u.chargeSign();
        double[] buf = new double[3];
        OrdinaryDifferentialEquation ode = new OrdinaryDifferentialEquation() {
            @Override
            public int getDimension() {
                return 2 * k;
            }

            @Override
            public double[] computeDerivatives(double z, double[] y) {
                u.derivatives(z, 2, buf);
                double uu = buf[0];
                if (!(uu > 0)) {
                    throw new ReflectionException(new Reflection(z, zStart));
                }
                double g = u.g(uu);
                double us = u.uStar(uu);
                double c1 = g * buf[1] / (2 * us);
                double c0 = g * buf[2] / (4 * us);
                double f = -sign * g / (2 * us);
                double[] d = new double[2 * k];
                for (int i = 0; i < k; i++) {
                    d[2 * i] = y[2 * i + 1];
                    d[2 * i + 1] = -c1 * y[2 * i + 1] - c0 * y[2 * i] + f * dipoles.get(i).applyAsDouble(z);
                }
                return d;
            }
        };
        double[] pl = planes.clone();
        double[][] off = new double[pl.length][k];
        double[][] sl = new double[pl.length][k];
        double span = pl.length == 0 ? 1 : Math.max(pl[pl.length - 1] - zStart, 1e-9);
        DormandPrince853Integrator integ = new DormandPrince853Integrator(1e-12 * span, span / 40, 1e-15, 1e-11);
        ODEState state = new ODEState(zStart, new double[2 * k]);
        for (int p = 0; p < pl.length; p++) {
            if (pl[p] > state.getTime()) {
                ODEStateAndDerivative end = integ.integrate(ode, state, pl[p]);
                state = new ODEState(end.getTime(), end.getPrimaryState());
            }
            double[] y = state.getPrimaryState();
            for (int i = 0; i < k; i++) {
                off[p][i] = y[2 * i];
                sl[p][i] = y[2 * i + 1];
            }
        }
        return new CentralRayDeflection(zStart, pl, off, sl);
    }

    public double zStart_m() {
        return zStart;
    }

    public double[] planes_m() {
        return planes.clone();
    }

    /** Offset at plane p per unit coefficient of source k, m. */
    public double unitOffset_m(int plane, int source) {
        return offset[plane][source];
    }

    /** Slope at plane p per unit coefficient of source k, rad. */
    public double unitSlope_rad(int plane, int source) {
        return slope[plane][source];
    }

    /** Offset at plane p for coefficients c_k (x: the cos coefficients a_1, y: the sin coefficients b_1), m. */
    public double offset_m(int plane, double[] coefficients) {
        double s = 0;
        for (int i = 0; i < coefficients.length; i++) {
            s += coefficients[i] * offset[plane][i];
        }
        return s;
    }

    /** Slope at plane p for coefficients c_k, rad. */
    public double slope_rad(int plane, double[] coefficients) {
        double s = 0;
        for (int i = 0; i < coefficients.length; i++) {
            s += coefficients[i] * slope[plane][i];
        }
        return s;
    }
}
