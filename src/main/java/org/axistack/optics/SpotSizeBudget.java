package org.axistack.optics;

import java.util.ArrayList;
import java.util.List;

import org.hipparchus.optim.MaxEval;
import org.hipparchus.optim.nonlinear.scalar.GoalType;
import org.hipparchus.optim.univariate.BrentOptimizer;
import org.hipparchus.optim.univariate.SearchInterval;
import org.hipparchus.optim.univariate.UnivariateObjectiveFunction;

/**
 * Spot-size budget at the image against the image-side aperture half-angle alpha (a pure function).
 * Contributions, as diameters:
 * <ul>
 * <li>geometric image of the source: a fixed part d0 (|M| x source diameter) and, for a brightness-limited beam
 * of fixed current I, k/alpha with k = (2/pi) sqrt(I/B) (B the brightness in A m^-2 sr^-1 at the image:
 * from B = I / ((pi d^2/4)(pi alpha^2)));</li>
 * <li>spherical aberration: disc of least confusion d_s = Cs alpha^3 / 2 (textbook, e.g. L. Reimer, Scanning
 * Electron Microscopy, 2nd ed., ch. 2, from memory);</li>
 * <li>chromatic aberration: d_c = Cc alpha dT/T for a full energy spread dT (rays at +-dT/2 miss by
 * +-Cc alpha dT/(2T)).</li>
 * </ul>
 * They are added in quadrature, d = sqrt(d0^2 + (k/alpha)^2 + d_s^2 + d_c^2): common practice for independent
 * blur contributions (no single source; an approximation that the report states). Diffraction is not included
 * (negligible for ions and for electrons above a few mrad at these energies; not computed). The optimum angle is
 * found by Brent minimisation in log(alpha).
 */
public final class SpotSizeBudget {

    /**
     * @param sphericalAberration_m  image-side Cs, m
     * @param chromaticAberration_m  image-side Cc, m
     * @param energySpread           full relative energy spread dT/T in image space, &gt;= 0
     * @param sourceImage_m          fixed geometric image diameter d0, m, &gt;= 0
     * @param brightnessTerm_m_rad   k in the brightness-limited image k/alpha, m rad, &gt;= 0 (0: not used)
     */
    public record Inputs(double sphericalAberration_m, double chromaticAberration_m, double energySpread,
            double sourceImage_m, double brightnessTerm_m_rad) {
        public Inputs {
            if (!(energySpread >= 0) || !(sourceImage_m >= 0) || !(brightnessTerm_m_rad >= 0)) {
                throw new IllegalArgumentException("energy spread, source image and brightness term must be >= 0");
            }
            if (!Double.isFinite(sphericalAberration_m) || !Double.isFinite(chromaticAberration_m)) {
                throw new IllegalArgumentException("aberration coefficients must be finite");
            }
        }
    }

    /** One line of the budget: contributions and total, diameters in m, at half-angle alpha_rad. */
    public record Row(double alpha_rad, double geometric_m, double spherical_m, double chromatic_m, double total_m) {
    }

    /**
     * The smallest spot in the searched range.
     *
     * @param interior false when the minimum sits at an end of the range (e.g. no brightness term: the spot only
     *                 grows with alpha, so the smallest angle wins and the range end is reported)
     */
    public record Optimum(Row row, boolean interior) {
    }

    private SpotSizeBudget() {
    }

    /** k = (2/pi) sqrt(I/B), m rad, for beam current I (A) and brightness B (A m^-2 sr^-1) at the image. */
    public static double brightnessTerm_m_rad(double current_A, double brightness_A_per_m2_sr) {
        if (!(current_A >= 0) || !(brightness_A_per_m2_sr > 0)) {
            throw new IllegalArgumentException("current must be >= 0 and brightness > 0");
        }
        return 2 / Math.PI * Math.sqrt(current_A / brightness_A_per_m2_sr);
    }

    public static Row at(Inputs in, double alpha_rad) {
        if (!(alpha_rad > 0)) {
            throw new IllegalArgumentException("aperture angle must be > 0: " + alpha_rad);
        }
        double brightness = in.brightnessTerm_m_rad() / alpha_rad;
        double geometric = Math.hypot(in.sourceImage_m(), brightness);
        double spherical = 0.5 * Math.abs(in.sphericalAberration_m()) * alpha_rad * alpha_rad * alpha_rad;
        double chromatic = Math.abs(in.chromaticAberration_m()) * alpha_rad * in.energySpread();
        double total = Math.sqrt(geometric * geometric + spherical * spherical + chromatic * chromatic);
        return new Row(alpha_rad, geometric, spherical, chromatic, total);
    }

    /** Budget at n angles spaced evenly in log(alpha) from alphaMin to alphaMax. */
    public static List<Row> table(Inputs in, double alphaMin_rad, double alphaMax_rad, int n) {
        checkRange(alphaMin_rad, alphaMax_rad);
        if (n < 2) {
            throw new IllegalArgumentException("at least two angles are needed: " + n);
        }
        List<Row> rows = new ArrayList<>(n);
        double ratio = Math.log(alphaMax_rad / alphaMin_rad);
        for (int i = 0; i < n; i++) {
            rows.add(at(in, alphaMin_rad * Math.exp(ratio * i / (n - 1))));
        }
        return List.copyOf(rows);
    }

    /** The angle in [alphaMin, alphaMax] that gives the smallest total spot. */
    public static Optimum optimum(Inputs in, double alphaMin_rad, double alphaMax_rad) {
        checkRange(alphaMin_rad, alphaMax_rad);
        double lo = Math.log(alphaMin_rad);
        double hi = Math.log(alphaMax_rad);
        BrentOptimizer opt = new BrentOptimizer(1e-12, 1e-14);
        double best = opt.optimize(new MaxEval(500),
                new UnivariateObjectiveFunction(x -> at(in, Math.exp(x)).total_m()), GoalType.MINIMIZE,
                new SearchInterval(lo, hi, 0.5 * (lo + hi))).getPoint();
        Row row = at(in, Math.exp(best));
        Row atMin = at(in, alphaMin_rad);
        Row atMax = at(in, alphaMax_rad);
        if (atMin.total_m() <= row.total_m()) {
            return new Optimum(atMin, false);
        }
        if (atMax.total_m() <= row.total_m()) {
            return new Optimum(atMax, false);
        }
        boolean interior = (best - lo) > 1e-6 * (hi - lo) && (hi - best) > 1e-6 * (hi - lo);
        return new Optimum(row, interior);
    }

    private static void checkRange(double a, double b) {
        if (!(a > 0) || !(b > a)) {
            throw new IllegalArgumentException("aperture angle range must satisfy 0 < min < max: " + a + ", " + b);
        }
    }
}
