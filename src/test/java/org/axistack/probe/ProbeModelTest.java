package org.axistack.probe;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.Arrays;
import java.util.List;
import java.util.OptionalDouble;

import org.axistack.model.Particle;
import org.hipparchus.analysis.solvers.BrentSolver;
import org.hipparchus.distribution.continuous.NormalDistribution;
import org.hipparchus.optim.MaxEval;
import org.hipparchus.optim.nonlinear.scalar.GoalType;
import org.hipparchus.optim.univariate.BrentOptimizer;
import org.hipparchus.optim.univariate.SearchInterval;
import org.hipparchus.optim.univariate.UnivariateObjectiveFunction;
import org.hipparchus.special.BesselJ;
import org.junit.jupiter.api.Test;

/** The probe model's partial diameters against closed forms and independent computations, and its optimum. */
class ProbeModelTest {

    private static final ProbeLens ELECTRON_LENS = new ProbeLens(2e-3, 3e-3, Particle.electron(), 1000, -0.1);

    /**
     * de Broglie wavelengths of electrons: 3.70 pm at 100 kV and 2.51 pm at 200 kV (relativistic; tabulated in TEM
     * textbooks, e.g. D. B. Williams and C. B. Carter, Transmission Electron Microscopy, table 1.1, from memory) and
     * the non-relativistic 1.2264 nm / sqrt(V/volt) at 10 V (same source, from memory).
     */
    @Test
    void wavelengthMatchesTextbookValues() {
        assertThat(new ProbeLens(0, 0, Particle.electron(), 100e3, Double.NaN).wavelength_m()).isCloseTo(3.70e-12, within(0.01e-12));
        assertThat(new ProbeLens(0, 0, Particle.electron(), 200e3, Double.NaN).wavelength_m()).isCloseTo(2.51e-12, within(0.01e-12));
        assertThat(new ProbeLens(0, 0, Particle.electron(), 10, Double.NaN).wavelength_m()).isCloseTo(1.2264e-9 / Math.sqrt(10), within(1e-12));
    }

    /**
     * Diffraction: the FW50 of the Airy pattern from its encircled energy 1 - J0(v)^2 - J1(v)^2 (Lord Rayleigh;
     * M. Born and E. Wolf, Principles of Optics, sec. 8.5.2), v = 2 pi a r / lambda, with Hipparchus' Bessel functions:
     * FW50 = v50 lambda / (pi a) = 0.5348 lambda / a; the model's 0.54 (Barth and Kruit, from memory) within 1 %.
     */
    @Test
    void diffractionConstantIsTheAiryFw50() {
        double v50 = new BrentSolver(1e-14).solve(100, v -> {
            double j0 = BesselJ.value(0, v);
            double j1 = BesselJ.value(1, v);
            return 1 - j0 * j0 - j1 * j1 - 0.5;
        }, 0.5, 3);
        double exact = v50 / Math.PI;
        assertThat(exact).isCloseTo(0.5348, within(1e-4));
        assertThat(ProbeModel.DIFFRACTION_FW50).isCloseTo(exact, within(0.01 * exact));
        ProbeModel m = new ProbeModel(ELECTRON_LENS, new ProbeSource(1e8, 0, OptionalDouble.empty()), 1e-4, 0.1);
        assertThat(m.at(1e-12, 5e-3).diffraction_m()).isCloseTo(0.54 * ELECTRON_LENS.wavelength_m() / 5e-3, within(1e-20));
    }

    /**
     * Source term: the current through a disc of diameter d (FW50 area) and a cone of half-angle a, counted with the
     * exact solid angle 2 pi (1 - cos a), is B (pi d^2/4) 2 pi (1 - cos a) (definition of brightness); the model's
     * small-angle d_I returns the current to within a^2/4 (the small-angle error).
     */
    @Test
    void sourceTermReturnsTheCurrentThroughItsAreaAndSolidAngle() {
        ProbeModel m = new ProbeModel(ELECTRON_LENS, new ProbeSource(1e7, 0.5, OptionalDouble.empty()), 1e-4, 0.1);
        for (double alpha : new double[] {1e-3, 1e-2, 5e-2}) {
            double current = 1e-9;
            double d = m.at(current, alpha).source_m();
            double back = m.brightness_A_per_m2_sr() * Math.PI * d * d / 4 * 2 * Math.PI * (1 - Math.cos(alpha));
            assertThat(back).isCloseTo(current, within(current * alpha * alpha / 4 * 1.01));
        }
        // brightness scales with the relativistic potential U* (reduced brightness conserved)
        assertThat(m.brightness_A_per_m2_sr()).isCloseTo(1e7 * ELECTRON_LENS.imageRelativisticPotential_V(), within(1e-3));
    }

    /**
     * Spherical aberration: an independent geometric computation of the FW50 of a uniformly filled aperture (ray at
     * slope a lands at radius |Cs a^3 - z a| at defocus z; the encircled half is the median over rays, minimised over
     * z): 0.1768 Cs a^3; the model's 0.18 (Barth and Kruit, from memory) within 2 %.
     */
    @Test
    void sphericalConstantIsTheBestFocusFw50OfAFilledAperture() {
        int n = 200_000;
        double[] a = new double[n];
        for (int i = 0; i < n; i++) {
            a[i] = Math.sqrt((i + 0.5) / n); // uniform over the aperture disc, alpha = 1, Cs = 1
        }
        double[] r = new double[n];
        UnivariateObjectiveFunction median = new UnivariateObjectiveFunction(z -> {
            for (int i = 0; i < n; i++) {
                r[i] = Math.abs(a[i] * a[i] * a[i] - z * a[i]);
            }
            Arrays.sort(r);
            return r[n / 2];
        });
        double best = new BrentOptimizer(1e-10, 1e-12).optimize(new MaxEval(200), median, GoalType.MINIMIZE,
                new SearchInterval(0, 1.5)).getValue();
        double constant = 2 * best;
        assertThat(constant).isCloseTo(0.1768, within(5e-4));
        assertThat(ProbeModel.SPHERICAL_FW50).isCloseTo(constant, within(0.02 * constant));
    }

    /**
     * Chromatic aberration: FW50 of a uniformly filled aperture with a Gaussian energy distribution (ray lands at
     * radius |Cc a dE/E|; median over the aperture and the energies, Gaussian quantiles from Hipparchus): 0.344 Cc a
     * dE/E with dE the FWHM of the distribution (0.600 with its FW50); the model's 0.34 within 2 %.
     */
    @Test
    void chromaticConstantIsTheFw50ForAGaussianSpreadOfGivenFwhm() {
        int n = 1500;
        NormalDistribution gauss = new NormalDistribution(0, 1);
        double[] r = new double[n * n];
        for (int i = 0; i < n; i++) {
            double a = Math.sqrt((i + 0.5) / n);
            for (int j = 0; j < n; j++) {
                r[i * n + j] = Math.abs(a * gauss.inverseCumulativeProbability((j + 0.5) / n));
            }
        }
        Arrays.sort(r);
        double fw50 = 2 * r[r.length / 2];
        double fwhm = 2 * Math.sqrt(2 * Math.log(2));
        double constant = fw50 / fwhm;
        assertThat(constant).isCloseTo(0.344, within(2e-3));
        assertThat(ProbeModel.CHROMATIC_FW50).isCloseTo(constant, within(0.02 * constant));
    }

    /**
     * Closed-form optima (derivative of the total set to zero): with source and spherical terms only the root-power-sum
     * is smallest where d_I = 3^(1/1.3) d_S, quadrature where d_I = 3 d_S (the classical brightness-limited probe,
     * d proportional to Cs^(1/4) (I/B)^(3/8): L. Reimer, Scanning Electron Microscopy, ch. 2, from memory); with
     * diffraction and chromatic terms only, both totals are smallest where d_A = d_C, at d = sqrt(2 d_A d_C).
     */
    @Test
    void optimumAngleMatchesClosedFormLimits() {
        ProbeLens sphericalOnly = new ProbeLens(5e-3, 0, Particle.proton(), 5000, -0.2);
        ProbeModel m = new ProbeModel(sphericalOnly, new ProbeSource(100, 0, OptionalDouble.empty()), 1e-4, 0.2);
        for (double current : new double[] {1e-12, 1e-10, 1e-8}) {
            ProbePoint p = m.optimum(current).orElseThrow();
            assertThat(p.interior()).isTrue();
            assertThat(p.diffraction_m() / p.fw50_m()).as("protons: diffraction negligible").isLessThan(1e-3);
            assertThat(p.source_m()).isCloseTo(Math.pow(3, 1 / 1.3) * p.spherical_m(), within(1e-5 * p.source_m()));
            // quadrature optimum: a^8 = k^2 / (3 (0.18 Cs)^2), k = (2/pi) sqrt(I/B)
            double k = 2 / Math.PI * Math.sqrt(current / m.brightness_A_per_m2_sr());
            double aq = Math.pow(k * k / (3 * Math.pow(0.18 * 5e-3, 2)), 0.125);
            double dq = Math.hypot(k / aq, 0.18 * 5e-3 * aq * aq * aq);
            assertThat(p.quadrature_m()).isGreaterThanOrEqualTo(dq * (1 - 1e-12));
        }
        ProbeLens slow = new ProbeLens(0, 4e-3, Particle.electron(), 500, Double.NaN);
        ProbeModel lowVoltage = new ProbeModel(slow, new ProbeSource(1e9, 0.6, OptionalDouble.empty()), 1e-4, 0.2);
        ProbePoint p = lowVoltage.optimum(1e-15).orElseThrow();
        assertThat(p.diffraction_m()).isCloseTo(p.chromatic_m(), within(1e-3 * p.chromatic_m()));
        double closed = Math.sqrt(2 * 0.54 * slow.wavelength_m() * 0.34 * 4e-3 * 0.6 / 500);
        assertThat(p.fw50_m()).isCloseTo(closed, within(2e-3 * closed)); // the tiny source term adds < 0.2 %
        assertThat(p.dominant()).isIn(ProbeTerm.DIFFRACTION, ProbeTerm.CHROMATIC);
    }

    /** Fixed magnification: d_I = |M| d_v and the angle that carries the current; unreachable currents left out. */
    @Test
    void fixedMagnificationSetsTheAngleFromTheCurrent() {
        ProbeModel m = new ProbeModel(ELECTRON_LENS, new ProbeSource(1e6, 0.5, OptionalDouble.of(20e-6)), 1e-4, 0.05);
        ProbePoint p = m.optimum(1e-9).orElseThrow();
        assertThat(p.source_m()).isCloseTo(2e-6, within(1e-18));
        double current = m.brightness_A_per_m2_sr() * Math.PI * 1e-12 * Math.PI * p.alpha_rad() * p.alpha_rad();
        assertThat(current).isCloseTo(1e-9, within(1e-21));
        List<ProbePoint> curve = m.curve(1e-12, 1e-3, 50);
        assertThat(curve.size()).isBetween(2, 49);
        assertThatThrownBy(() -> m.optimum(0)).isInstanceOf(IllegalArgumentException.class);
    }

    /** The probe only grows with the current at the optimum, and the total never falls below the largest term. */
    @Test
    void curveIsMonotoneAndBoundedByTheLargestTerm() {
        ProbeModel m = new ProbeModel(ELECTRON_LENS, new ProbeSource(1e7, 0.5, OptionalDouble.empty()), 1e-4, 0.1);
        List<ProbePoint> curve = m.curve(1e-13, 1e-7, 50);
        assertThat(curve).hasSize(50);
        for (int i = 1; i < curve.size(); i++) {
            assertThat(curve.get(i).fw50_m()).isGreaterThan(curve.get(i - 1).fw50_m());
        }
        for (ProbePoint p : curve) {
            assertThat(p.fw50_m()).isGreaterThanOrEqualTo(p.partial_m(p.dominant()) * (1 - 1e-12));
        }
    }
}
