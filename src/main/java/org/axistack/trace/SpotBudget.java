package org.axistack.trace;

import java.util.ArrayList;
import java.util.List;
import java.util.OptionalDouble;

import org.hipparchus.optim.MaxEval;
import org.hipparchus.optim.nonlinear.scalar.GoalType;
import org.hipparchus.optim.univariate.BrentOptimizer;
import org.hipparchus.optim.univariate.SearchInterval;
import org.hipparchus.optim.univariate.UnivariateObjectiveFunction;
import org.hipparchus.optim.univariate.UnivariatePointValuePair;

/**
 * Spot-size budget at the image against the aperture angle alpha (image side), the usual
 * probe-forming estimate (e.g. Reimer and Kohl, "Transmission Electron Microscopy", 5th ed., section
 * 2.3; Hawkes and Kasper, "Principles of Electron Optics", vol. 2, ch. 41):
 * geometric image of the source d_g = 2 eps / alpha (eps the image-side edge emittance, half-width
 * times half-angle of the beam, m rad), spherical disc of least confusion d_s = Cs alpha^3 / 2,
 * chromatic disc d_c = Cc alpha dT/T (dT the full energy spread), combined in quadrature
 * d = sqrt(d_g^2 + d_s^2 + d_c^2). The quadrature sum is an approximation (common practice; the
 * discs are not Gaussian), good to some tens of per cent; the optimum angle it gives is the useful
 * part. The optimum is found by Brent's method (Hipparchus BrentOptimizer) on log alpha.
 *
 * @param spherical_m          Cs, image side, m
 * @param chromatic_m          Cc, image side, m
 * @param relativeEnergySpread dT/T, full width (&gt;= 0)
 * @param emittance_m_rad      image-side edge emittance, m rad (&gt;= 0)
 */
public record SpotBudget(double spherical_m, double chromatic_m, double relativeEnergySpread,
        double emittance_m_rad) {

    public SpotBudget {
        if (!(spherical_m >= 0) || !(chromatic_m >= 0) || !Double.isFinite(spherical_m + chromatic_m)) {
            throw new IllegalArgumentException("spot budget needs finite Cs >= 0 and Cc >= 0 (Scherzer)");
        }
        if (!(relativeEnergySpread >= 0) || !Double.isFinite(relativeEnergySpread)) {
            throw new IllegalArgumentException("relative energy spread must be zero or positive: " + relativeEnergySpread);
        }
        if (!(emittance_m_rad >= 0) || !Double.isFinite(emittance_m_rad)) {
            throw new IllegalArgumentException("emittance must be zero or positive: " + emittance_m_rad);
        }
    }

    /**
     * One line of the budget, diameters in m.
     *
     * @param alpha_rad aperture half-angle, rad
     * @param geometric_m d_g
     * @param spherical_m d_s
     * @param chromatic_m d_c
     * @param total_m     quadrature sum
     */
    public record Line(double alpha_rad, double geometric_m, double spherical_m, double chromatic_m, double total_m) {
    }

    /** The budget at one angle. */
    public Line at(double alpha_rad) {
        if (!(alpha_rad > 0) || !Double.isFinite(alpha_rad)) {
            throw new IllegalArgumentException("aperture angle must be positive: " + alpha_rad);
        }
        double g = 2 * emittance_m_rad / alpha_rad;
        double s = 0.5 * spherical_m * alpha_rad * alpha_rad * alpha_rad;
        double c = chromatic_m * alpha_rad * relativeEnergySpread;
        return new Line(alpha_rad, g, s, c, Math.sqrt(g * g + s * s + c * c));
    }

    /** The budget at n angles spaced geometrically from alphaMin to alphaMax. */
    public List<Line> sweep(double alphaMin_rad, double alphaMax_rad, int n) {
        if (!(alphaMin_rad > 0) || !(alphaMax_rad > alphaMin_rad) || n < 2) {
            throw new IllegalArgumentException("angle sweep needs 0 < alpha_min < alpha_max and at least 2 points");
        }
        List<Line> out = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            out.add(at(alphaMin_rad * Math.pow(alphaMax_rad / alphaMin_rad, (double) i / (n - 1))));
        }
        return out;
    }

    /**
     * The angle in [alphaMin, alphaMax] with the smallest total spot, if the total has an interior
     * minimum there (with no emittance the smallest angle always wins and there is none).
     */
    public OptionalDouble optimumAngle_rad(double alphaMin_rad, double alphaMax_rad) {
        if (!(alphaMin_rad > 0) || !(alphaMax_rad > alphaMin_rad)) {
            throw new IllegalArgumentException("angle range needs 0 < alpha_min < alpha_max");
        }
        if (emittance_m_rad == 0) {
            return OptionalDouble.empty();
        }
        BrentOptimizer opt = new BrentOptimizer(1e-12, 1e-14);
        UnivariatePointValuePair p = opt.optimize(new MaxEval(1000), GoalType.MINIMIZE,
                new UnivariateObjectiveFunction(x -> Math.log(at(Math.exp(x)).total_m())),
                new SearchInterval(Math.log(alphaMin_rad), Math.log(alphaMax_rad)));
        double a = Math.exp(p.getPoint());
        double edge = 1e-6 * Math.log(alphaMax_rad / alphaMin_rad);
        if (p.getPoint() - Math.log(alphaMin_rad) < edge || Math.log(alphaMax_rad) - p.getPoint() < edge) {
            return OptionalDouble.empty();
        }
        return OptionalDouble.of(a);
    }

    /**
     * The smallest envelope diameter of a ray bundle near its focus, from the asymptotes of traced rays
     * (x at zRef and slope dx/dz, meridional rays of both signs or one sign mirrored): the geometric
     * disc of least confusion, searched by Brent's method between zFrom and zTo.
     *
     * @return {z of the disc, diameter}, m
     */
    public static double[] leastConfusion(double[] x_m, double[] slope, double zRef_m, double zFrom_m,
            double zTo_m) {
        if (x_m.length == 0 || x_m.length != slope.length) {
            throw new IllegalArgumentException("need at least one ray, with one slope per position");
        }
        BrentOptimizer opt = new BrentOptimizer(1e-12, 1e-15);
        UnivariatePointValuePair p = opt.optimize(new MaxEval(2000), GoalType.MINIMIZE,
                new UnivariateObjectiveFunction(z -> envelope(x_m, slope, zRef_m, z)),
                new SearchInterval(zFrom_m, zTo_m));
        return new double[] {p.getPoint(), 2 * p.getValue()};
    }

    private static double envelope(double[] x, double[] s, double zRef, double z) {
        double m = 0;
        for (int i = 0; i < x.length; i++) {
            m = Math.max(m, Math.abs(x[i] + s[i] * (z - zRef)));
        }
        return m;
    }
}
