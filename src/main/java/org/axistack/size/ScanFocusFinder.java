package org.axistack.size;

import java.util.ArrayList;
import java.util.List;

import org.axistack.field.FieldSolution;
import org.axistack.model.Stack;
import org.axistack.optics.ParaxialOptics;
import org.axistack.optics.ReflectionException;
import org.axistack.optics.StartPlaneException;
import org.hipparchus.analysis.solvers.BrentSolver;
import org.hipparchus.exception.MathRuntimeException;

/**
 * Focusing biases by bracketing and refinement: the continuous residual of {@link FocusCondition} is sampled at
 * evenly spaced biases on each side of zero (biases that reflect the beam are skipped), and each sign change is
 * refined with Brent's method (R. P. Brent, Algorithms for Minimization without Derivatives, 1973; Hipparchus
 * implementation). A root narrower than the sample spacing can be missed; the sample count is a setting.
 */
public final class ScanFocusFinder implements FocusFinder {

    private final int samplesPerSign;

    public ScanFocusFinder(int samplesPerSign) {
        if (samplesPerSign < 4) {
            throw new IllegalArgumentException("need at least 4 samples per sign");
        }
        this.samplesPerSign = samplesPerSign;
    }

    @Override
    public double[] focusingBiases(FieldSolution solution, Stack stack, int electrode, FocusCondition target,
            double maxBias_V) {
        List<Double> roots = new ArrayList<>();
        for (int sign : new int[] {-1, 1}) {
            double prevB = Double.NaN, prevR = Double.NaN;
            for (int k = 1; k <= samplesPerSign; k++) {
                double b = sign * maxBias_V * k / samplesPerSign;
                double r = residual(solution, stack, electrode, target, b);
                if (Double.isFinite(r) && Double.isFinite(prevR) && r * prevR <= 0) {
                    double root = refine(solution, stack, electrode, target, prevB, b);
                    if (Double.isFinite(root)) {
                        roots.add(root);
                    }
                }
                prevB = b;
                prevR = r;
            }
        }
        return roots.stream().mapToDouble(Double::doubleValue).sorted().toArray();
    }

    private double refine(FieldSolution sol, Stack stack, int electrode, FocusCondition target, double b0, double b1) {
        BrentSolver brent = new BrentSolver(1e-15, 1e-9 * Math.max(Math.abs(b0), Math.abs(b1)), 1e-13);
        try {
            return brent.solve(80, b -> {
                double r = residual(sol, stack, electrode, target, b);
                if (!Double.isFinite(r)) {
                    throw new ReflectionGap();
                }
                return r;
            }, Math.min(b0, b1), Math.max(b0, b1));
        } catch (MathRuntimeException | ReflectionGap e) {
            return Double.NaN;
        }
    }

    /** The residual at one bias of the chosen electrode, NaN when the beam is reflected or the optics fail. */
    static double residual(FieldSolution sol, Stack stack, int electrode, FocusCondition target, double bias_V) {
        double[] b = stack.biases_V();
        b[electrode] = bias_V;
        try {
            return target.residual(ParaxialOptics.of(sol.withBiases(b), stack.withBiases(b)));
        } catch (ReflectionException | StartPlaneException e) {
            return Double.NaN;
        }
    }

    private static final class ReflectionGap extends RuntimeException {
        private static final long serialVersionUID = 1L;

        ReflectionGap() {
            super(null, null, false, false);
        }
    }
}
