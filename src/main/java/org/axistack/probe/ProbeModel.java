package org.axistack.probe;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

import org.hipparchus.optim.MaxEval;
import org.hipparchus.optim.nonlinear.scalar.GoalType;
import org.hipparchus.optim.univariate.BrentOptimizer;
import org.hipparchus.optim.univariate.SearchInterval;
import org.hipparchus.optim.univariate.UnivariateObjectiveFunction;

/**
 * Probe diameter (FW50: the diameter that holds half the current) against current and image-side aperture
 * half-angle a, after J. E. Barth and P. Kruit, "Addition of different contributions to the charged particle probe
 * size", Optik 101 (1996) 101-109 (constants and exponents below are from memory; the tests check the partial
 * diameters against independent computations):
 * <ul>
 * <li>source image d_I = (2/pi) sqrt(I / (B_r U*)) / a (from I = B_r U* (pi d_I^2/4)(pi a^2)) when the magnification
 * is free, or |M| d_v for a virtual source of FW50 size d_v at the lens's magnification M;</li>
 * <li>diffraction d_A = 0.54 lambda / a (FW50 of the Airy pattern; the exact encircled-energy value is
 * 0.5145 lambda / a, see the tests);</li>
 * <li>spherical aberration d_S = 0.18 Cs a^3 (FW50 at the plane of smallest FW50, uniformly filled aperture);</li>
 * <li>chromatic aberration d_C = 0.34 Cc a dE/E, E = T_i the kinetic energy at the probe; our own computation of
 * the FW50 (tests) gives 0.344 when dE is the FWHM of a Gaussian energy distribution (0.600 with its FW50), so
 * dE here is the FWHM, the figure source makers quote;</li>
 * <li>total d = [ (d_I^1.3 + (d_A^4 + d_S^4)^(1.3/4))^(2/1.3) + d_C^2 ]^(1/2) (root-power-sum, stated by its authors
 * to be within about 10 % of wave-optical FW50 calculations, from memory), and for comparison the quadrature
 * sum sqrt(d_I^2 + d_A^2 + d_S^2 + d_C^2).</li>
 * </ul>
 * The optimum angle at a current minimises the root-power-sum: 64 samples evenly in log(a) over the range, then
 * Brent's method between the neighbours of the best sample. Immutable.
 */
public final class ProbeModel {

    /** FW50 diffraction constant (Barth and Kruit, from memory). */
    public static final double DIFFRACTION_FW50 = 0.54;
    /** FW50 spherical-aberration constant (Barth and Kruit, from memory). */
    public static final double SPHERICAL_FW50 = 0.18;
    /** FW50 chromatic-aberration constant (Barth and Kruit, from memory). */
    public static final double CHROMATIC_FW50 = 0.34;
    /** Root-power-sum exponent of the source term against the geometric aberrations (Barth and Kruit, from memory). */
    public static final double SOURCE_POWER = 1.3;
    /** Root-power-sum exponent of diffraction against spherical aberration (Barth and Kruit, from memory). */
    public static final double DIFFRACTION_SPHERICAL_POWER = 4;

    private static final int SAMPLES = 64;

    private final ProbeLens lens;
    private final ProbeSource source;
    private final double alphaMin;
    private final double alphaMax;
    private final double brightness;
    private final double wavelength;
    private final double relativeSpread;

    /**
     * @param alphaMin_rad smallest image-side aperture half-angle searched, rad &gt; 0
     * @param alphaMax_rad largest, rad &gt; alphaMin (keep it where third-order aberrations hold, tens of mrad)
     */
    public ProbeModel(ProbeLens lens, ProbeSource source, double alphaMin_rad, double alphaMax_rad) {
        if (!(alphaMin_rad > 0) || !(alphaMax_rad > alphaMin_rad) || !Double.isFinite(alphaMax_rad)) {
            throw new IllegalArgumentException("the aperture angle range must satisfy 0 < min < max: " + alphaMin_rad
                    + ", " + alphaMax_rad);
        }
        this.lens = lens;
        this.source = source;
        this.alphaMin = alphaMin_rad;
        this.alphaMax = alphaMax_rad;
        this.brightness = source.reducedBrightness_A_per_m2_sr_V() * lens.imageRelativisticPotential_V();
        this.wavelength = lens.wavelength_m();
        this.relativeSpread = source.energySpread_eV() / lens.imageEnergy_eV();
    }

    public ProbeLens lens() {
        return lens;
    }

    public ProbeSource source() {
        return source;
    }

    public double alphaMin_rad() {
        return alphaMin;
    }

    public double alphaMax_rad() {
        return alphaMax;
    }

    /** Brightness at the probe, B = B_r U*_i, A/(m^2 sr). */
    public double brightness_A_per_m2_sr() {
        return brightness;
    }

    /** Whether the magnification is fixed by a given virtual source size (else free, chosen per current). */
    public boolean fixedMagnification() {
        return source.virtualSourceSize_m().isPresent();
    }

    /** FW50 source image at a fixed magnification, |M| d_v, m (NaN when the magnification is free or unknown). */
    public double fixedSourceImage_m() {
        if (!fixedMagnification() || !Double.isFinite(lens.magnification())) {
            return Double.NaN;
        }
        return Math.abs(lens.magnification()) * source.virtualSourceSize_m().getAsDouble();
    }

    /** Root-power-sum of Barth and Kruit, m. */
    public static double rootPowerSum(double source_m, double diffraction_m, double spherical_m, double chromatic_m) {
        double ds4 = Math.pow(diffraction_m, 4) + Math.pow(spherical_m, 4);
        double inner = Math.pow(source_m, SOURCE_POWER) + Math.pow(ds4, SOURCE_POWER / DIFFRACTION_SPHERICAL_POWER);
        double geometric = Math.pow(inner, 2 / SOURCE_POWER);
        return Math.sqrt(geometric + chromatic_m * chromatic_m);
    }

    /** FW50 source image for current I at angle a when the magnification is free: (2/pi) sqrt(I/B)/a, m. */
    public double sourceImage_m(double current_A, double alpha_rad) {
        return 2 / Math.PI * Math.sqrt(current_A / brightness) / alpha_rad;
    }

    /** The probe at current I and angle a (free magnification: d_I from the brightness). */
    public ProbePoint at(double current_A, double alpha_rad) {
        return point(current_A, alpha_rad, sourceImage_m(current_A, alpha_rad), false);
    }

    private ProbePoint point(double current_A, double alpha_rad, double sourceImage_m, boolean interior) {
        double dA = DIFFRACTION_FW50 * wavelength / alpha_rad;
        double dS = SPHERICAL_FW50 * lens.sphericalImage_m() * alpha_rad * alpha_rad * alpha_rad;
        double dC = CHROMATIC_FW50 * lens.chromaticImage_m() * alpha_rad * relativeSpread;
        double rps = rootPowerSum(sourceImage_m, dA, dS, dC);
        double quad = Math.sqrt(sourceImage_m * sourceImage_m + dA * dA + dS * dS + dC * dC);
        ProbeTerm dominant = ProbeTerm.SOURCE;
        double largest = sourceImage_m;
        double[] others = {dA, dS, dC};
        ProbeTerm[] terms = {ProbeTerm.DIFFRACTION, ProbeTerm.SPHERICAL, ProbeTerm.CHROMATIC};
        for (int i = 0; i < others.length; i++) {
            if (others[i] > largest) {
                largest = others[i];
                dominant = terms[i];
            }
        }
        return new ProbePoint(current_A, alpha_rad, sourceImage_m, dA, dS, dC, rps, quad, dominant, interior);
    }

    /**
     * The probe at current I: with a free magnification, the angle in the range that minimises the root-power-sum
     * FW50; with a fixed magnification, the angle the current needs, a = (2/pi) sqrt(I/B) / (|M| d_v) (empty when
     * it lies outside the range).
     */
    public Optional<ProbePoint> optimum(double current_A) {
        if (!(current_A > 0) || !Double.isFinite(current_A)) {
            throw new IllegalArgumentException("the probe current must be > 0: " + current_A);
        }
        if (fixedMagnification()) {
            double dI = fixedSourceImage_m();
            if (!Double.isFinite(dI)) {
                throw new IllegalStateException("a virtual source size needs a finite magnification (an object before the lens)");
            }
            double alpha = 2 / Math.PI * Math.sqrt(current_A / brightness) / dI;
            if (alpha < alphaMin || alpha > alphaMax) {
                return Optional.empty();
            }
            return Optional.of(point(current_A, alpha, dI, false));
        }
        double lo = Math.log(alphaMin);
        double hi = Math.log(alphaMax);
        int best = 0;
        double bestValue = Double.POSITIVE_INFINITY;
        for (int i = 0; i < SAMPLES; i++) {
            double v = at(current_A, Math.exp(lo + (hi - lo) * i / (SAMPLES - 1))).fw50_m();
            if (v < bestValue) {
                bestValue = v;
                best = i;
            }
        }
        if (best == 0 || best == SAMPLES - 1) {
            double alpha = best == 0 ? alphaMin : alphaMax;
            return Optional.of(at(current_A, alpha));
        }
        double a = lo + (hi - lo) * (best - 1) / (SAMPLES - 1);
        double b = lo + (hi - lo) * (best + 1) / (SAMPLES - 1);
        double x = new BrentOptimizer(1e-12, 1e-14).optimize(new MaxEval(200),
                new UnivariateObjectiveFunction(t -> at(current_A, Math.exp(t)).fw50_m()), GoalType.MINIMIZE,
                new SearchInterval(a, b, lo + (hi - lo) * best / (SAMPLES - 1))).getPoint();
        ProbePoint p = at(current_A, Math.exp(x));
        return Optional.of(point(current_A, p.alpha_rad(), p.source_m(), true));
    }

    /** The probe at n currents spaced evenly in log(I) from iMin to iMax (currents a fixed magnification cannot reach are left out). */
    public List<ProbePoint> curve(double currentMin_A, double currentMax_A, int n) {
        if (!(currentMin_A > 0) || !(currentMax_A > currentMin_A) || !Double.isFinite(currentMax_A) || n < 2) {
            throw new IllegalArgumentException("the current range must satisfy 0 < min < max with at least 2 points");
        }
        List<ProbePoint> out = new ArrayList<>(n);
        double ratio = Math.log(currentMax_A / currentMin_A);
        for (int i = 0; i < n; i++) {
            optimum(currentMin_A * Math.exp(ratio * i / (n - 1))).ifPresent(out::add);
        }
        return List.copyOf(out);
    }

    /** Wavelength at the probe, m. */
    public double wavelength_m() {
        return wavelength;
    }

    /** Relative FW50 energy spread dE/T_i at the probe. */
    public double relativeEnergySpread() {
        return relativeSpread;
    }
}
