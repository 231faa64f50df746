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
     * Going outward from the strongest point of the lens on each side: the first sample where the field weight
     * has fallen below fraction x its peak (one sample further out, clipped to the scanned range); if it never
     * does, the sample where it is smallest (the most nearly field-free place, e.g. the middle of a short drift
     * tube whose open mouth leaks field). Stopping there keeps the planes inside drift tubes instead of running
     * on to the tube mouths. Returns {zStart, zEnd}.
     */
    double[] fieldFreePlanes(double fraction) {
        if (!(weight[peak] > 0)) {
            return new double[] {z[0], z[z.length - 1]}; // no field at all: the whole range is field-free
        }
        double limit = weight[peak] * fraction;
        int right = z.length - 1;
        int bestRight = peak;
        for (int i = peak; i < z.length; i++) {
            if (weight[i] < limit) {
                right = Math.min(z.length - 1, i + 1);
                bestRight = -1;
                break;
            }
            if (weight[i] < weight[bestRight]) {
                bestRight = i;
            }
        }
        if (bestRight >= 0) {
            right = bestRight;
        }
        int left = 0;
        int bestLeft = peak;
        for (int i = peak; i >= 0; i--) {
            if (weight[i] < limit) {
                left = Math.max(0, i - 1);
                bestLeft = -1;
                break;
            }
            if (weight[i] < weight[bestLeft]) {
                bestLeft = i;
            }
        }
        if (bestLeft >= 0) {
            left = bestLeft;
        }
        if (right <= left) {
            return new double[] {z[0], z[z.length - 1]};
        }
        return new double[] {z[left], z[right]};
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
