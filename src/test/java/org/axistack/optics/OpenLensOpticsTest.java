package org.axistack.optics;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;

import org.axistack.field.AxialField;
import org.axistack.field.BemSolver;
import org.axistack.field.BiasedField;
import org.axistack.field.FarField;
import org.axistack.field.FieldSolution;
import org.axistack.field.SolveProgress;
import org.axistack.model.Beam;
import org.axistack.model.Electrode;
import org.axistack.model.MeshSettings;
import org.axistack.model.Particle;
import org.axistack.model.Stack;
import org.hipparchus.analysis.solvers.BrentSolver;
import org.junit.jupiter.api.Test;

/**
 * Issue 23: optics of open lenses (plates in free space, whose axial potential decays like 1/|z|).
 * Checks: convergence of the asymptotic cardinal elements as the traced range doubles, with and without the
 * far-field model; the far-field tail against a closed-form paraxial solution through a pure Coulomb-like
 * potential (derived below); real-plane imaging against exact Lorentz-force tracing in the same field;
 * f1 = f2 for a lens with the same potential on both sides (Helmholtz-Lagrange invariant, f2/f1 =
 * sqrt(U*2/U*1), e.g. Hawkes and Kasper, Principles of Electron Optics, vol. 1, ch. 16).
 */
class OpenLensOpticsTest {

    /** Three thick plates in free space, no enclosure (demo data of our own). */
    static final Stack EINZEL = new Stack("open plate einzel", new Beam(Particle.electron(), 1000), List.of(
            new Electrode.Aperture("p1", 0, -5e-3, 2e-3, 15e-3, 1e-3),
            new Electrode.Aperture("p2", -600, 0, 2e-3, 15e-3, 1e-3),
            new Electrode.Aperture("p3", 0, 5e-3, 2e-3, 15e-3, 1e-3)));
    static final FieldSolution SOLUTION = BemSolver.solve(EINZEL.electrodes(), new MeshSettings(500, 3), SolveProgress.NONE);

    private static CardinalElements cardinal(BiasedField field, Stack stack, ParaxialSettings settings) {
        double[] range = ParaxialOptics.searchRange_m(stack);
        return ParaxialOptics.auto(new AccelerationPotential(field, stack.beam()), range[0], range[1],
                stack.beam().startZ_m(), settings).cardinal();
    }

    @Test
    void asymptoticElementsConvergeAsTheTracedRangeDoubles() {
        BiasedField field = SOLUTION.withBiases(EINZEL.biases_V());
        ParaxialSettings base = ParaxialSettings.defaults();
        CardinalElements one = cardinal(field, EINZEL, base);
        CardinalElements two = cardinal(field, EINZEL, base.withFarFieldReach(2));
        CardinalElements four = cardinal(field, EINZEL, base.withFarFieldReach(4));
        assertThat(one.objectEnd().rule()).isEqualTo(FieldEnd.Rule.FAR_FIELD);
        assertThat(one.imageEnd().rule()).isEqualTo(FieldEnd.Rule.FAR_FIELD);
        double d12 = one.relativeDifference(two);
        double d24 = two.relativeDifference(four);
        // without the model: the field cut where the traced range ends
        ParaxialSettings cut = base.withFarFieldModel(false);
        CardinalElements cut1 = cardinal(field, EINZEL, cut);
        CardinalElements cut2 = cardinal(field, EINZEL, cut.withFarFieldReach(2));
        CardinalElements cut4 = cardinal(field, EINZEL, cut.withFarFieldReach(4));
        System.out.printf("open einzel: f %.9f mm; with model: doubling changes %.2e, %.2e; cut: %.2e, %.2e;"
                + " cut vs model %.2e, %.2e, %.2e; error estimate %.2e%n", one.focalLengthImage_m() * 1e3, d12, d24,
                cut1.relativeDifference(cut2), cut2.relativeDifference(cut4), cut1.relativeDifference(one),
                cut2.relativeDifference(one), cut4.relativeDifference(one), one.errorEstimate());
        assertThat(d12).isLessThan(1e-6);
        assertThat(d24).isLessThan(1e-6);
        // the cut-off result moves by far more when its range doubles, and toward the far-field result (the model
        // makes the difference: it is what the cut leaves out)
        assertThat(cut1.relativeDifference(cut2)).isGreaterThan(1e-4);
        assertThat(cut2.relativeDifference(one)).isLessThan(cut1.relativeDifference(one));
        assertThat(cut4.relativeDifference(one)).isLessThan(cut2.relativeDifference(one));
        assertThat(one.errorEstimate()).isLessThan(1e-6);
    }

    /**
     * The aberration integrals run over the far-field tails too: moving the split between the part integrated in
     * z and the tail integrated in s (traced range doubled) leaves Cs and Cc unchanged (convergence), and both
     * stay positive (Scherzer's theorem, O. Scherzer, Z. Physik 101, 593 (1936)).
     */
    @Test
    void aberrationIntegralsIncludeTheTails() {
        BiasedField field = SOLUTION.withBiases(EINZEL.biases_V());
        double[] range = ParaxialOptics.searchRange_m(EINZEL);
        AccelerationPotential p = new AccelerationPotential(field, EINZEL.beam());
        ParaxialOptics one = ParaxialOptics.auto(p, range[0], range[1], EINZEL.beam().startZ_m(), ParaxialSettings.defaults());
        ParaxialOptics two = ParaxialOptics.auto(p, range[0], range[1], EINZEL.beam().startZ_m(),
                ParaxialSettings.defaults().withFarFieldReach(2));
        Aberrations a = one.aberrations();
        Aberrations b = two.aberrations();
        Aberrations ao = one.aberrations(-0.08);
        Aberrations bo = two.aberrations(-0.08);
        System.out.printf("open einzel: Cs %.9g / %.9g mm, Cc %.9g / %.9g mm; object side Cs %.9g / %.9g mm%n",
                a.sphericalImage_m() * 1e3, b.sphericalImage_m() * 1e3, a.chromaticImage_m() * 1e3,
                b.chromaticImage_m() * 1e3, ao.sphericalObject_m().getAsDouble() * 1e3,
                bo.sphericalObject_m().getAsDouble() * 1e3);
        assertThat(Math.abs(a.sphericalImage_m() / b.sphericalImage_m() - 1)).isLessThan(1e-7);
        assertThat(Math.abs(a.chromaticImage_m() / b.chromaticImage_m() - 1)).isLessThan(1e-7);
        assertThat(Math.abs(ao.sphericalObject_m().getAsDouble() / bo.sphericalObject_m().getAsDouble() - 1)).isLessThan(1e-7);
        assertThat(Math.abs(ao.chromaticObject_m().getAsDouble() / bo.chromaticObject_m().getAsDouble() - 1)).isLessThan(1e-7);
        assertThat(a.sphericalImage_m()).isPositive();
        assertThat(a.chromaticImage_m()).isPositive();
    }

    @Test
    void sameOutsidePotentialGivesEqualFocalLengths() {
        BiasedField field = SOLUTION.withBiases(new double[] {0, 500, 0});
        CardinalElements c = cardinal(field, EINZEL.withBiases(new double[] {0, 500, 0}), ParaxialSettings.defaults());
        assertThat(c.uObject_V()).isEqualTo(c.uImage_V());
        assertThat(Math.abs(c.focalLengthObject_m() - c.focalLengthImage_m()))
                .isLessThan(1e-9 * Math.abs(c.focalLengthImage_m()));
    }

    /**
     * Closed form for the tail. Non-relativistic paraxial equation r'' + U' r'/(2U) + U'' r/(4U) = 0 in the pure
     * Coulomb-like tail U = Uinf (1 + a/z) (a monopole about z = 0). Substitution R = r U^(1/4) gives
     * R'' + (3/16)(U'/U)^2 R = 0 with U'/U = -a/(z (z + a)); with P = z (z + a), xi = ln(z/(z + a)) and
     * R = sqrt(P) f(xi), the first-derivative terms cancel and P^(3/2) (R'' + T R) = a^2 (f_xixi - f/16), so
     * f = A e^(xi/4) + B e^(-xi/4), hence R = A z^(3/4)(z+a)^(1/4) + B z^(1/4)(z+a)^(3/4) and r = R U^(-1/4)
     * is a combination of r1 = z and r2 = sqrt(z (z + a)). (Check r1: U'/(2U) = -a/(2 z (z+a)) and
     * U''/(4U) z = a/(2 z (z+a)).) The asymptotes: r1 -> z, r2 -> z + a/2. A ray given at z_b is
     * r = alpha z + beta r2 with alpha, beta from its height and slope there; its asymptote has slope alpha + beta
     * and height beta a/2 at z = 0.
     */
    @Test
    void tailMatchesTheClosedFormThroughACoulombLikePotential() {
        double uInf = 1000;
        for (double a : new double[] {2e-3, -3e-3, 10e-3}) {
            // electron: U = u0 + V, so V = uInf a / z
            FarField far = FarField.ofMoments(0, 1e-3, uInf * a);
            AxialField field = new AxialField() {
                @Override
                public void axial(double z, int order, double[] out) {
                    far.axial(z, order, out);
                }

                @Override
                public java.util.Optional<FarField> farField() {
                    return java.util.Optional.of(far);
                }
            };
            AccelerationPotential p = new AccelerationPotential(field, new Beam(Particle.electron(), uInf)).nonRelativistic();
            double zb = 0.05;
            FarTail tail = new FarTail(p, far, +1, zb, 1e-13);
            double[] m = tail.fromAsymptote(zb); // asymptote (A, B) -> (r, r') at zb
            double det = m[0] * m[3] - m[1] * m[2];
            for (double[] ray : new double[][] {{1e-3, 0}, {0, 1e-2}, {2e-3, -3e-2}}) {
                double r = ray[0];
                double s = ray[1];
                // numerical: (A, B) = m^-1 (r, s)
                double aNum = (m[3] * r - m[1] * s) / det;
                double bNum = (-m[2] * r + m[0] * s) / det;
                // closed form
                double r2 = Math.sqrt(zb * (zb + a));
                double r2p = (2 * zb + a) / (2 * r2);
                double beta = (r - zb * s) / (r2 - zb * r2p);
                double alpha = s - beta * r2p;
                double aRef = beta * a / 2;
                double bRef = alpha + beta;
                double scale = Math.abs(r) + zb * Math.abs(s);
                assertThat(Math.abs(aNum - aRef)).as("height, a = %s", a).isLessThan(1e-11 * scale);
                assertThat(Math.abs(bNum - bRef)).as("slope, a = %s", a).isLessThan(1e-11 * scale / zb);
            }
        }
    }

    /**
     * Real-plane imaging: the paraxial real image of an object in the far field (before the traced range) against
     * exact relativistic Lorentz-force tracing ({@link ExactMeridionalTracer}) of a ray 1e-6 rad off the axis in
     * the same boundary-element field: the crossings agree to 1e-6 of the object-image distance.
     */
    @Test
    void realImageMatchesExactTracing() {
        BiasedField field = SOLUTION.withBiases(EINZEL.biases_V());
        ParaxialOptics optics = ParaxialOptics.of(field, EINZEL);
        double zo = -0.08;
        Imaging im = optics.imaging(zo);
        assertThat(im.realImageZ_m()).isPresent();
        double zi = im.realImageZ_m().getAsDouble();
        ExactMeridionalTracer exact = new ExactMeridionalTracer(field, Particle.electron());
        double alpha = 1e-6;
        double span = zi - zo;
        double zExact = new BrentSolver(1e-15, 1e-12 * span).solve(100,
                z -> exact.trace(zo, 0, alpha, 1000, z)[0], zi - 0.02 * span, zi + 0.02 * span);
        System.out.printf("open einzel: object %.1f mm, real image %.9f mm (asymptotic %.9f mm), exact %.9f mm%n",
                zo * 1e3, zi * 1e3, im.imageZ_m() * 1e3, zExact * 1e3);
        assertThat(Math.abs(zExact - zi)).isLessThan(1e-6 * span);
        // the real magnification: ray height ratio at the real image, checked by an off-axis exact ray
        double h = 1e-7;
        double[] off = exact.trace(zo, h, 0, 1000, zi);
        assertThat(Math.abs(off[0] / h - im.realLateralMagnification())).isLessThan(1e-5 * Math.abs(im.realLateralMagnification()));
    }
}
