package org.axistack.optics;

import org.axistack.field.FarField;
import org.hipparchus.ode.ODEState;
import org.hipparchus.ode.OrdinaryDifferentialEquation;
import org.hipparchus.ode.nonstiff.DormandPrince853Integrator;

/**
 * Paraxial rays through the far field of an open lens, from a plane z_b (|z_b - z0| &gt;= the far-field
 * start) out to infinity, in closed form up to one regular ODE. Derivation (the design note
 * {@code src/site/markdown/open-lenses.md} gives it in full):
 * <ol>
 * <li>The paraxial equation r'' + (U*'/2U*) r' + (g U''/4U*) r = 0 becomes R'' + T R = 0 for
 * R = r U*^(1/4) (the usual removal of the first-derivative term), with
 * T = U'^2 [3 g^2/(16 U*^2) - 1/(4 Vr U*)] (the relativistic form of the Picht equation).</li>
 * <li>The ray is written through its tangent: p = R', q = R - zeta R' (the tangent's height at zeta = 0,
 * zeta = z - z0); then p' = -T R and q' = zeta T R.</li>
 * <li>With s = 1/|zeta|, side = sign(zeta) and W = T/s^4 = (V'/s^2)^2 [..], which the multipole series gives
 * as a regular function of s (V' ~ -side m0 s^2):
 * dq/ds = -W (s q + side p), dp/ds = W s (side s q + p). No term grows at s = 0, so this is integrated from
 * infinity (s = 0) to s_b with the Dormand-Prince 8(5,3) integrator.</li>
 * <li>At infinity q, p tend to q_inf, p_inf and r = R U*^(-1/4) tends to the asymptote
 * r = U*inf^(-1/4) [q_inf - p_inf Lambda/(4 U*inf) + p_inf zeta], Lambda = lim zeta (U* - U*inf)
 * = -g_inf sign(charge) side m0: the 1/|zeta| monopole tail shifts the asymptote by a finite amount.</li>
 * </ol>
 * Immutable after construction.
 */
final class FarTail {

    private final AccelerationPotential potential;
    private final FarField far;
    private final int side;
    private final double z0;
    private final double sMax;
    private final StepStore dense;
    private final double uStarInf;
    private final double lambda;

    /**
     * @param boundaryZ_m where the traced field region ends (|boundaryZ - z0| &gt;= the far-field start)
     * @param side        +1 for the image side (z -&gt; +infinity), -1 for the object side
     */
    FarTail(AccelerationPotential potential, FarField far, int side, double boundaryZ_m, double relativeTolerance) {
        this.potential = potential;
        this.far = far;
        this.side = side;
        this.z0 = far.centreZ_m();
        this.sMax = 1 / Math.abs(boundaryZ_m - z0);
        double uInf = potential.u0_V();
        this.uStarInf = potential.uStar(uInf);
        this.lambda = -potential.g(uInf) * potential.chargeSign() * side * far.monopole_V_m();
        double tol = Math.max(relativeTolerance, 1e-14);
        double scale = 1 / sMax;
        double[] absTol = {tol * 1e-3 * scale, tol * 1e-3, tol * 1e-3 * scale, tol * 1e-3};
        double[] relTol = {tol, tol, tol, tol};
        DormandPrince853Integrator integrator = new DormandPrince853Integrator(sMax * 1e-12, sMax / 4, absTol, relTol);
        StepStore store = new StepStore();
        integrator.addStepHandler(store);
        // columns: (q, p) started as (1, 0) and (0, 1) at infinity
        integrator.integrate(new TailEquation(), new ODEState(0, new double[] {1, 0, 0, 1}), sMax);
        this.dense = store.freeze();
    }

    /** The regular tail equation in s for two solutions at once. */
    private final class TailEquation implements OrdinaryDifferentialEquation {
        private final double[] v = new double[2];

        @Override
        public int getDimension() {
            return 4;
        }

        @Override
        public double[] computeDerivatives(double s, double[] y) {
            double w = w(s);
            return new double[] {
                -w * (s * y[0] + side * y[1]), w * s * (side * s * y[0] + y[1]),
                -w * (s * y[2] + side * y[3]), w * s * (side * s * y[2] + y[3])};
        }

        private double w(double s) {
            far.compact(side, s, v);
            double u = potential.u0_V() - potential.chargeSign() * v[0];
            if (!(u > 0)) {
                throw new ReflectionException(new Reflection(z0 + side / s, Double.NaN));
            }
            double uStar = potential.uStar(u);
            double g = potential.g(u);
            double k = 3 * g * g / (16 * uStar * uStar);
            double vr = potential.restPotential_V();
            if (Double.isFinite(vr)) {
                k -= 1 / (4 * vr * uStar);
            }
            return v[1] * v[1] * k;
        }
    }

    double centreZ_m() {
        return z0;
    }

    int side() {
        return side;
    }

    /** Where the tail begins (the traced region's end), m. */
    double boundaryZ_m() {
        return z0 + side / sMax;
    }

    /** Whether z lies in this tail (beyond the boundary on its side, ends included). */
    boolean contains(double z_m) {
        return side * (z_m - boundaryZ_m()) >= 0;
    }

    /** Axial acceleration potential at infinity, V. */
    double uInfinity_V() {
        return potential.u0_V();
    }

    /**
     * The map from the asymptote (A, B) of this side, r = A + B (z - z0), to the real (r, r') at z in the tail:
     * C(z) Phi(s) D.
     */
    double[] fromAsymptote(double z_m) {
        double s = Math.min(1 / Math.abs(z_m - z0), sMax);
        double[] y = dense.state(s);
        // Phi: columns (q, p) of the two solutions
        double f11 = y[0];
        double f21 = y[1];
        double f12 = y[2];
        double f22 = y[3];
        // D: (A, B) -> (q_inf, p_inf): p = B u^(1/4), q = A u^(1/4) + p Lambda/(4 U*)
        double w4 = Math.pow(uStarInf, 0.25);
        double d11 = w4;
        double d12 = w4 * lambda / (4 * uStarInf);
        double d21 = 0;
        double d22 = w4;
        double pd11 = f11 * d11 + f12 * d21;
        double pd12 = f11 * d12 + f12 * d22;
        double pd21 = f21 * d11 + f22 * d21;
        double pd22 = f21 * d12 + f22 * d22;
        // C: (q, p) at zeta -> (r, r'): r = w (q + zeta p), r' = w (p - kappa (q + zeta p))
        double zeta = z_m - z0;
        double[] u = new double[2];
        potential.derivatives(z_m, 1, u);
        double uStar = potential.uStar(u[0]);
        double w = Math.pow(uStar, -0.25);
        double kappa = potential.g(u[0]) * u[1] / (4 * uStar);
        double c11 = w;
        double c12 = w * zeta;
        double c21 = -w * kappa;
        double c22 = w * (1 - kappa * zeta);
        return new double[] {
            c11 * pd11 + c12 * pd21, c11 * pd12 + c12 * pd22,
            c21 * pd11 + c22 * pd21, c21 * pd12 + c22 * pd22};
    }
}
