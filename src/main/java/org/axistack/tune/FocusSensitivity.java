package org.axistack.tune;

import java.util.List;

import org.axistack.field.BiasedField;
import org.axistack.field.FieldSolution;
import org.axistack.model.Stack;
import org.axistack.optics.AccelerationPotential;
import org.axistack.optics.ParaxialOptics;
import org.axistack.optics.ReflectionException;
import org.hipparchus.ode.ODEState;
import org.hipparchus.ode.ODEStateAndDerivative;
import org.hipparchus.ode.OrdinaryDifferentialEquation;
import org.hipparchus.ode.nonstiff.DormandPrince853Integrator;

/**
 * How far the image moves per volt of each electrode bias and per unit relative change of the beam energy, and
 * the supply stability that keeps the focus within a given depth.
 *
 * <p>Method: linearisation of the paraxial ray equation r'' + P r' + Q r = 0 (P = g U'/(2U*), Q = g U''/(4U*);
 * relativistic form, P. W. Hawkes and E. Kasper, Principles of Electron Optics, vol. 1, ch. 15) with respect to
 * each parameter p: the first-variation (forward sensitivity) equations w'' + P w' + Q w = -(dP/dp) r' -
 * (dQ/dp) r, w = dr/dp, with zero start values (the ray enters from field-free space independently of p),
 * integrated together with the ray by the Dormand-Prince 8(5,3) method (Hipparchus). dU/dV_i is minus the charge
 * sign times the unit-bias axial potential of electrode i (superposition), dU/dU0 = 1. The image moves by
 * dZ = -w(Z)/r'(Z) (the ray height at the image plane is zero). Exact to first order; the test compares it with
 * central finite differences of full optics runs.
 *
 * <p>Supply budget: a supply of relative stability e moves the image by e |V dZ/dV|; the allowed e for a focus
 * held within +/- depth is depth / |V dZ/dV| per supply alone, and depth / sqrt(sum (V_i dZ/dV_i)^2) when all
 * supplies have the same relative stability and drift independently (errors added in quadrature). The same for
 * the beam energy with T dZ/dT. In absolute terms every electrode (a grounded one too) may carry depth / |dZ/dV_i|
 * volts of noise or drift on its own ({@link #tolerance_V()}).
 *
 * @param electrodes          electrode names (stack order)
 * @param biases_V            the biases linearised about, V
 * @param imageShift_m_per_V  dZ/dV_i, m/V
 * @param imageShiftPerRelativeEnergy_m  T dZ/dT: image shift per unit relative change of the beam kinetic energy, m
 * @param depth_m             the focus must stay within +/- this, m
 * @param stabilityPerSupply  allowed relative stability of each supply alone (infinite at 0 V), dimensionless
 * @param stabilityAllSupplies allowed common relative stability of all supplies drifting independently
 * @param stabilityEnergy     allowed relative stability of the beam energy
 */
public record FocusSensitivity(List<String> electrodes, double[] biases_V, double[] imageShift_m_per_V,
        double imageShiftPerRelativeEnergy_m, double depth_m, double[] stabilityPerSupply,
        double stabilityAllSupplies, double stabilityEnergy) {

    /** Default depth of focus budget, m: +/- 0.1 mm, our choice (a typical mounting tolerance of a sample or
     *  screen on the bench); settable. */
    public static final double DEFAULT_DEPTH_M = 1e-4;

    public FocusSensitivity {
        electrodes = List.copyOf(electrodes);
        biases_V = biases_V.clone();
        imageShift_m_per_V = imageShift_m_per_V.clone();
        stabilityPerSupply = stabilityPerSupply.clone();
    }

    @Override
    public double[] biases_V() {
        return biases_V.clone();
    }

    @Override
    public double[] imageShift_m_per_V() {
        return imageShift_m_per_V.clone();
    }

    @Override
    public double[] stabilityPerSupply() {
        return stabilityPerSupply.clone();
    }

    /**
     * Absolute budget of every electrode, grounded ones included: the volts of noise or drift on that electrode
     * alone (supply ripple, a ground offset, a wandering 0 V return) that keep the focus within +/- the depth,
     * depth / |dZ/dV_i|; infinite when the electrode does not move the image. Unlike the relative view
     * ({@link #stabilityPerSupply()}, ppm of the bias) it exists for an electrode at 0 V too.
     */
    public double[] tolerance_V() {
        double[] t = new double[imageShift_m_per_V.length];
        for (int i = 0; i < t.length; i++) {
            double s = Math.abs(imageShift_m_per_V[i]);
            t[i] = s == 0 ? Double.POSITIVE_INFINITY : depth_m / s;
        }
        return t;
    }

    /**
     * Linearised sensitivity at the given biases (normally a tune solution) for the target's object and image
     * plane.
     *
     * @throws ReflectionException if the beam turns back at these biases
     */
    public static FocusSensitivity of(FieldSolution solution, Stack stack, double[] biases_V, FocusTarget target,
            double depth_m) {
        if (!(depth_m > 0) || !Double.isFinite(depth_m)) {
            throw new IllegalArgumentException("depth must be positive: " + depth_m);
        }
        int ne = biases_V.length;
        BiasedField field = solution.withBiases(biases_V);
        ParaxialOptics optics = ParaxialOptics.of(field, stack);
        AccelerationPotential pot = optics.potential();
        BiasedField[] units = new BiasedField[ne];
        for (int i = 0; i < ne; i++) {
            double[] e = new double[ne];
            e[i] = 1;
            units[i] = solution.withBiases(e);
        }
        double z1 = optics.zStart_m();
        double z2 = optics.zEnd_m();
        double r0 = 1;
        double s0 = 0;
        if (!target.objectAtInfinity()) {
            double zo = target.objectZ_m().getAsDouble();
            double scale = target.imageZ_m() - zo;
            if (zo > z1) {
                z1 = zo;
                r0 = 0;
                s0 = 1 / scale;
            } else {
                r0 = (z1 - zo) / scale;
                s0 = 1 / scale;
            }
        }
        double zEnd = Math.min(z2, Math.max(target.imageZ_m(), z1 + 1e-9));
        Variational eq = new Variational(pot, units, stack.beam().particle().chargeSign());
        double[] y0 = new double[2 + 2 * (ne + 1)];
        y0[0] = r0;
        y0[1] = s0;
        double length = zEnd - z1;
        double[] absTol = new double[y0.length];
        double[] relTol = new double[y0.length];
        java.util.Arrays.fill(relTol, 1e-11);
        java.util.Arrays.fill(absTol, 1e-14);
        DormandPrince853Integrator integrator = new DormandPrince853Integrator(length * 1e-12, length / 50, absTol, relTol);
        ODEStateAndDerivative end = integrator.integrate(eq, new ODEState(z1, y0), zEnd);
        double[] y = end.getPrimaryState();
        double drift = target.imageZ_m() - zEnd;
        double slope = y[1];
        double[] shift = new double[ne];
        for (int i = 0; i < ne; i++) {
            double w = y[2 + 2 * i] + y[3 + 2 * i] * drift;
            shift[i] = -w / slope;
        }
        double wEnergy = y[2 + 2 * ne] + y[3 + 2 * ne] * drift;
        double perRelEnergy = -wEnergy / slope * pot.u0_V();
        double[] perSupply = new double[ne];
        double sum = 0;
        for (int i = 0; i < ne; i++) {
            double s = Math.abs(biases_V[i] * shift[i]);
            perSupply[i] = s == 0 ? Double.POSITIVE_INFINITY : depth_m / s;
            sum += s * s;
        }
        double all = sum == 0 ? Double.POSITIVE_INFINITY : depth_m / Math.sqrt(sum);
        double energy = perRelEnergy == 0 ? Double.POSITIVE_INFINITY : depth_m / Math.abs(perRelEnergy);
        return new FocusSensitivity(stack.names(), biases_V, shift, perRelEnergy, depth_m, perSupply, all, energy);
    }

    /** Ray plus one first-variation pair per electrode bias and one for the energy. */
    private static final class Variational implements OrdinaryDifferentialEquation {
        private final AccelerationPotential pot;
        private final BiasedField[] units;
        private final double sign;
        private final double invRest;
        private final double[] u = new double[3];
        private final double[] phi = new double[3];

        Variational(AccelerationPotential pot, BiasedField[] units, double sign) {
            this.pot = pot;
            this.units = units;
            this.sign = sign;
            this.invRest = 1 / pot.restPotential_V();
        }

        @Override
        public int getDimension() {
            return 2 + 2 * (units.length + 1);
        }

        @Override
        public double[] computeDerivatives(double z, double[] y) {
            pot.derivatives(z, 2, u);
            if (!(u[0] > 0)) {
                throw new ReflectionException(new org.axistack.optics.Reflection(z, Double.NaN));
            }
            double g = pot.g(u[0]);
            double us = pot.uStar(u[0]);
            double p = g * u[1] / (2 * us);
            double q = g * u[2] / (4 * us);
            double[] dy = new double[y.length];
            double r = y[0];
            double s = y[1];
            dy[0] = s;
            dy[1] = -p * s - q * r;
            int n = units.length;
            for (int k = 0; k <= n; k++) {
                double up;
                double up1;
                double up2;
                if (k < n) {
                    units[k].axial(z, 2, phi);
                    up = -sign * phi[0];
                    up1 = -sign * phi[1];
                    up2 = -sign * phi[2];
                } else {
                    up = 1;
                    up1 = 0;
                    up2 = 0;
                }
                double dg = invRest * up;
                double dus = g * up;
                double dp = (dg * u[1] + g * up1) / (2 * us) - p * dus / us;
                double dq = (dg * u[2] + g * up2) / (4 * us) - q * dus / us;
                double w = y[2 + 2 * k];
                double ws = y[3 + 2 * k];
                dy[2 + 2 * k] = ws;
                dy[3 + 2 * k] = -p * ws - q * w - dp * s - dq * r;
            }
            return dy;
        }
    }
}
