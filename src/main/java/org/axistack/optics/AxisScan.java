package org.axistack.optics;

import org.hipparchus.analysis.solvers.BrentSolver;
import org.hipparchus.optim.MaxEval;
import org.hipparchus.optim.nonlinear.scalar.GoalType;
import org.hipparchus.optim.univariate.BrentOptimizer;
import org.hipparchus.optim.univariate.SearchInterval;
import org.hipparchus.optim.univariate.UnivariateObjectiveFunction;

/**
 * A uniform sampling of U, U', U'' along the axis: finds where the lens is strongest, where the field has
 * decayed (field-free reference planes), and whether U reaches zero (reflection). Local minima of U between
 * samples are refined with Brent's method (R. P. Brent, Algorithms for Minimization without Derivatives,
 * 1973) so a narrow potential barrier is not stepped over.
 */
final class AxisScan {

    private final AccelerationPotential potential;
    private final double[] z;
    private final double[] u;
    private final double[] weight;
    private final int peak;

    private AxisScan(AccelerationPotential potential, double[] z, double[] u, double[] weight, int peak) {
        this.potential = potential;
        this.z = z;
        this.u = u;
        this.weight = weight;
        this.peak = peak;
    }

    static AxisScan sample(AccelerationPotential potential, double zMin, double zMax, int n) {
        double[] z = new double[n];
        double[] u = new double[n];
        double[] w = new double[n];
        double[] d = new double[3];
        double step = (zMax - zMin) / (n - 1);
        int peak = 0;
        for (int i = 0; i < n; i++) {
            z[i] = i == n - 1 ? zMax : zMin + i * step;
            potential.derivatives(z[i], 2, d);
            u[i] = d[0];
            w[i] = u[i] > 0 ? (Math.abs(d[1]) + step * Math.abs(d[2])) / u[i] : Double.POSITIVE_INFINITY;
            if (w[i] > w[peak]) {
                peak = i;
            }
        }
        return new AxisScan(potential, z, u, w, peak);
    }

    double peakZ() {
        return z[peak];
    }

    /**
     * Where the field ends on each side ({@link ParaxialOptics#auto} describes the rule). Going outward from the
     * strongest point of the lens: the first sample where the weight has fallen below fraction x its peak ends
     * the field there (one sample further out); failing that, the weakest sample ends it if it lies inside the
     * range, at most tubeDepth x the peak, with the weight rising again beyond it (a drift tube before its
     * mouth); otherwise the side is open. Returns {objectEnd, imageEnd}.
     */
    FieldEnd[] ends(double fraction, double tubeDepth, boolean farModel) {
        int last = z.length - 1;
        if (!(weight[peak] > 0)) {
            // no field at all: the whole range is field-free
            return new FieldEnd[] {new FieldEnd(FieldEnd.Rule.TUBE_PLANE, z[0]), new FieldEnd(FieldEnd.Rule.TUBE_PLANE, z[last])};
        }
        FieldEnd left = side(-1, fraction, tubeDepth, farModel);
        FieldEnd right = side(+1, fraction, tubeDepth, farModel);
        if (!(right.z_m() > left.z_m())) {
            return new FieldEnd[] {new FieldEnd(left.rule(), z[0]), new FieldEnd(right.rule(), z[last])};
        }
        return new FieldEnd[] {left, right};
    }

    private FieldEnd side(int dir, double fraction, double tubeDepth, boolean farModel) {
        int last = z.length - 1;
        int end = dir > 0 ? last : 0;
        double limit = weight[peak] * fraction;
        int best = peak;
        for (int i = peak; dir > 0 ? i <= last : i >= 0; i += dir) {
            if (weight[i] < limit) {
                return new FieldEnd(FieldEnd.Rule.TUBE_PLANE, z[Math.min(last, Math.max(0, i + dir))]);
            }
            if (weight[i] < weight[best]) {
                best = i;
            }
        }
        if (best != end && weight[best] <= tubeDepth * weight[peak]) {
            double beyond = 0;
            for (int i = best; dir > 0 ? i <= last : i >= 0; i += dir) {
                beyond = Math.max(beyond, weight[i]);
            }
            if (beyond > 10 * weight[best] && potential.field().insideTube(z[best])) {
                return new FieldEnd(FieldEnd.Rule.TUBE_PLANE, z[best]);
            }
        }
        if (farModel) {
            return new FieldEnd(FieldEnd.Rule.FAR_FIELD, z[end]);
        }
        return new FieldEnd(FieldEnd.Rule.NO_MODEL, z[best]);
    }

    /**
     * Throws {@link ReflectionException} if U reaches zero on the axis after fromZ (the direction of travel
     * is +z). Sampled minima are refined by Brent minimisation on the neighbouring interval.
     */
    void checkNoReflection(double fromZ) {
        BrentSolver solver = new BrentSolver(1e-15, 1e-15 * Math.max(1e-3, Math.abs(z[z.length - 1] - z[0])));
        java.util.function.DoubleUnaryOperator uf = potential::u_V;
        if (!(potential.u_V(fromZ) > 0)) {
            throw new ReflectionException(new Reflection(fromZ, fromZ));
        }
        double prevZ = fromZ;
        for (int i = 0; i < z.length; i++) {
            if (z[i] <= fromZ) {
                continue;
            }
            if (!(u[i] > 0)) {
                double root = solver.solve(300, uf::applyAsDouble, prevZ, z[i]);
                throw new ReflectionException(new Reflection(root, fromZ));
            }
            boolean localMin = i > 0 && i < z.length - 1 && u[i] <= u[i - 1] && u[i] <= u[i + 1];
            if (localMin) {
                double lo = Math.max(fromZ, z[i - 1]);
                double hi = z[i + 1];
                BrentOptimizer opt = new BrentOptimizer(1e-12, 1e-15 * Math.max(1e-3, hi - lo));
                double zMin = opt.optimize(new MaxEval(200), new UnivariateObjectiveFunction(uf::applyAsDouble),
                        GoalType.MINIMIZE, new SearchInterval(lo, hi, z[i])).getPoint();
                if (!(potential.u_V(zMin) > 0)) {
                    double a = Math.max(lo, prevZ);
                    double root = potential.u_V(a) > 0 ? solver.solve(300, uf::applyAsDouble, a, zMin) : a;
                    throw new ReflectionException(new Reflection(root, fromZ));
                }
            }
            prevZ = z[i];
        }
    }
}
