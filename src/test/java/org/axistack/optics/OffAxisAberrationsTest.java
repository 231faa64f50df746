package org.axistack.optics;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.stream.Stream;

import org.axistack.field.AxialField;
import org.axistack.model.Beam;
import org.axistack.model.Particle;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * Off-axis third-order aberrations (issue 18) against exact tracing of skew rays ({@link ExactSkewTracer}, Lorentz
 * force, relativistic) in the same field. For a ray pattern (object height a0, object-side slope b0 = bx + i by)
 * scaled by eps, the miss at the Gaussian image, w_exact - M a0 eps, divided by M eps^3 and fitted as
 * T3 + T5 eps^2 + T7 eps^4, gives the third-order part T3 (convergence in the aperture: the fit's intercept); the
 * patterns separate the terms of the convention in {@link OffAxisAberrations}: b = 0 gives D, a = 0 gives C, a
 * meridional pair (a, +-beta) gives 3K (even part) and F + A (odd part), a sagittal ray (a, i beta) gives K (x) and
 * F - A (y). Required: 1 % (issue 18), each against the larger of its own size and the term scale it belongs to.
 */
class OffAxisAberrationsTest {

    static Stream<Arguments> lenses() {
        return Stream.of(
                Arguments.of("decelerating einzel bump, proton 5 keV", AnalyticAxialField.gaussian(3000, 4e-3),
                        Particle.proton(), 5000.0, 0.03),
                Arguments.of("accelerating immersion, electron 10 keV", AnalyticAxialField.tanhStep(0, 30000, 3e-3),
                        Particle.electron(), 10000.0, 0.05),
                Arguments.of("accelerating einzel bump, electron 20 keV, magnified image", AnalyticAxialField.gaussian(40000, 4e-3),
                        Particle.electron(), 20000.0, 0.01));
    }

    /** Third-order part of the miss divided by M for the pattern (a0, bx, by): {x, y}. */
    private static double[] thirdOrder(Traced t, double m, double a0, double bx, double by) {
        double[] eps = {0.25, 0.5, 0.75, 1};
        double[] yx = new double[eps.length];
        double[] yy = new double[eps.length];
        for (int i = 0; i < eps.length; i++) {
            double e = eps[i];
            double[] miss = t.miss(a0 * e, bx * e, by * e);
            yx[i] = miss[0] / (m * e * e * e);
            yy[i] = miss[1] / (m * e * e * e);
        }
        return new double[] {AberrationTracingTest.fitIntercept(eps, yx), AberrationTracingTest.fitIntercept(eps, yy)};
    }

    /** Exact skew rays from the object to the asymptotic Gaussian image. */
    interface Traced {
        /** Miss (x, y) at the Gaussian image of the ray from object height a with slopes (bx, by), relative to M a. */
        double[] miss(double a, double bx, double by);
    }

    static Traced traced(ParaxialOptics optics, ExactSkewTracer tracer, double t0, double zo, OffAxisAberrations oa) {
        double z0 = Math.max(zo, optics.zStart_m());
        double z1 = optics.zEnd_m();
        double zi = oa.imageZ_m();
        double m = oa.magnification();
        return (a, bx, by) -> {
            // field-free drift from the object to the object-side plane (the optics takes the field as ended there)
            double d = z0 - zo;
            double[] end = tracer.trace(z0, a + bx * d, by * d, bx, by, t0, z1);
            return new double[] {end[0] + end[2] * (zi - z1) - m * a, end[1] + end[3] * (zi - z1)};
        };
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("lenses")
    void coefficientsAgreeWithExactSkewRays(String name, AxialField field, Particle particle, double t0, double back) {
        ParaxialOptics optics = ParaxialOptics.auto(field, new Beam(particle, t0), -0.08, 0.08);
        double zo = optics.zStart_m() - back;
        OffAxisAberrations oa = OffAxisAberrations.of(optics, zo);
        check(name, optics, zo, oa, traced(optics, new ExactSkewTracer(field, particle), t0, zo, oa));
    }

    static void check(String name, ParaxialOptics optics, double zo, OffAxisAberrations oa, Traced t) {
        double c = oa.spherical_m();
        double k = oa.coma();
        double fa = oa.fieldCurvature_per_m() + oa.astigmatism_per_m();
        double fs = oa.fieldCurvature_per_m() - oa.astigmatism_per_m();
        double dd = oa.distortion_per_m2();
        // scales: heights up to aMax, slopes up to bMax (rays well inside the near-axis series); the mixed patterns
        // are chosen so the term they measure is the largest in them (from the coefficients' sizes)
        double aMax = 1e-3;
        double bMax = 5e-3;
        double dTraced = thirdOrder(t, oa.magnification(), aMax, 0, 0)[0] / Math.pow(aMax, 3);
        double cTraced = thirdOrder(t, oa.magnification(), 0, bMax, 0)[0] / Math.pow(bMax, 3);
        // coma: 3K a b^2 against D a^3 and C b^3: a = b sqrt(|C|/|D|)-ish, within the limits
        double bK = bMax;
        double aK = Math.min(aMax, bK * Math.sqrt(Math.abs(c / (3 * k))) / 3);
        double[] plus = thirdOrder(t, oa.magnification(), aK, bK, 0);
        double[] minus = thirdOrder(t, oa.magnification(), aK, -bK, 0);
        double kTangential = ((plus[0] + minus[0]) / 2 - dTraced * aK * aK * aK) / (3 * aK * bK * bK);
        double[] sag = thirdOrder(t, oa.magnification(), aK, 0, bK);
        double kSagittal = (sag[0] - dTraced * aK * aK * aK) / (aK * bK * bK);
        // field: (F +- A) a^2 b against C b^3
        double aF = aMax;
        double bF = Math.min(bMax, aF * Math.sqrt(Math.max(Math.abs(fa), Math.abs(fs)) / Math.abs(c)) / 3);
        double[] fPlus = thirdOrder(t, oa.magnification(), aF, bF, 0);
        double[] fMinus = thirdOrder(t, oa.magnification(), aF, -bF, 0);
        double faTraced = ((fPlus[0] - fMinus[0]) / 2 - cTraced * bF * bF * bF) / (aF * aF * bF);
        double[] fSag = thirdOrder(t, oa.magnification(), aF, 0, bF);
        double fsTraced = (fSag[1] - cTraced * bF * bF * bF) / (aF * aF * bF);
        // Petzval: F - 2A is a small difference of large numbers when the aperture is measured at the object; it does
        // not change when the stop moves (optics.md), so it is measured with the aperture about the chief ray through
        // the lens centre z_c, b = kappa a + beta, kappa = -t(z_c)/s(z_c), where F' and A' are small
        TransferMatrix toCentre = optics.transfer(zo, optics.lensCentreZ_m());
        double kappa = -toCentre.a() / toCentre.b();
        double fStop = oa.fieldCurvature_per_m() + 4 * kappa * k + 2 * kappa * kappa * c;
        double aStop = oa.astigmatism_per_m() + 2 * kappa * k + kappa * kappa * c;
        double bP = Math.min(bMax, aF * Math.sqrt(Math.max(Math.abs(fStop + aStop), Math.abs(fStop - aStop)) / Math.abs(c)) / 3);
        double[] pPlus = thirdOrder(t, oa.magnification(), aF, kappa * aF + bP, 0);
        double[] pMinus = thirdOrder(t, oa.magnification(), aF, kappa * aF - bP, 0);
        double faStop = ((pPlus[0] - pMinus[0]) / 2 - cTraced * bP * bP * bP) / (aF * aF * bP);
        double[] pSag = thirdOrder(t, oa.magnification(), aF, kappa * aF, bP);
        double fsStop = (pSag[1] - cTraced * bP * bP * bP) / (aF * aF * bP);
        double pTraced = (3 * fsStop - faStop) / 2;
        System.out.printf(java.util.Locale.ROOT, "%s: about the centre F'+A' %.6g / %.6g, F'-A' %.6g / %.6g; P %.6g / %.6g 1/m%n",
                name, fStop + aStop, faStop, fStop - aStop, fsStop, oa.petzval_per_m(), pTraced);
        assertThat(Math.abs(pTraced - oa.petzval_per_m())).as("Petzval, %s", name).isLessThan(0.01 * Math.abs(oa.petzval_per_m()));
        System.out.printf(java.util.Locale.ROOT, "%s: M %.4f; C %.6g / %.6g m, K %.6g / %.6g (t) / %.6g (s), F+A %.6g / %.6g,"
                + " F-A %.6g / %.6g 1/m, D %.6g / %.6g 1/m^2, P %.6g 1/m, coma mismatch %.1e (integral / traced)%n",
                name, oa.magnification(), c, cTraced, k, kTangential, kSagittal, fa, faTraced, fs, fsTraced, dd, dTraced,
                oa.petzval_per_m(), oa.comaMismatch());
        double fieldScale = Math.max(Math.abs(fa), Math.abs(fs));
        assertThat(Math.abs(cTraced - c)).as("C, %s", name).isLessThan(0.01 * Math.abs(c));
        assertThat(Math.abs(kTangential - k)).as("K tangential, %s", name).isLessThan(0.01 * Math.abs(k));
        assertThat(Math.abs(kSagittal - k)).as("K sagittal, %s", name).isLessThan(0.01 * Math.abs(k));
        assertThat(Math.abs(faTraced - fa)).as("F + A, %s", name).isLessThan(0.01 * fieldScale);
        assertThat(Math.abs(fsTraced - fs)).as("F - A, %s", name).isLessThan(0.01 * fieldScale);
        assertThat(Math.abs(dTraced - dd)).as("D, %s", name).isLessThan(0.01 * Math.abs(dd));
        // the two coma terms agree once integrated (eikonal), and C is the object-side Cs of the meridional route
        assertThat(oa.comaMismatch()).isLessThan(1e-6);
        double cs = optics.aberrations(zo).sphericalObject_m().getAsDouble();
        assertThat(Math.abs(c - cs)).isLessThan(1e-9 * Math.abs(cs));
        assertThat(oa.quadratureChange()).isLessThan(1e-9);
    }

    /**
     * Lateral chromatic aberration and the stop shift (issue 18) against exact skew rays in the same three lenses.
     * Lateral colour: rays from object height a about the chief ray of slope kappa a, traced with the kinetic energy
     * raised and lowered by eps T_o; half the difference of their misses at the Gaussian image (the geometric terms
     * cancel) divided by -M a eps, extrapolated to eps -> 0 from eps and 2 eps (Richardson), is C_L + kappa Cc
     * ({@link OffAxisAberrations#withStopSlope}). Stop shift: with the stop at the object-side reference plane, the
     * coma K' (even part of a meridional pair about the chief ray), F' + A' (odd part), F' - A' (sagittal, y) and
     * D' (the chief ray itself) fitted from traced rays as in {@link #check}. Required 1 % of the term (of the larger
     * field term for F' +- A'); Cc of this route against the meridional Cc_o: 1e-9.
     */
    @ParameterizedTest(name = "{0}")
    @MethodSource("lenses")
    void lateralColourAndStopShiftAgreeWithExactSkewRays(String name, AxialField field, Particle particle, double t0,
            double back) {
        ParaxialOptics optics = ParaxialOptics.auto(field, new Beam(particle, t0), -0.08, 0.08);
        double zo = optics.zStart_m() - back;
        OffAxisAberrations oa = OffAxisAberrations.of(optics, zo);
        double cc = optics.aberrations(zo).chromaticObject_m().getAsDouble();
        assertThat(Math.abs(oa.chromatic_m() - cc)).as("Cc, %s", name).isLessThan(1e-9 * Math.abs(cc));
        ExactSkewTracer tracer = new ExactSkewTracer(field, particle);
        double z0 = Math.max(zo, optics.zStart_m());
        double z1 = optics.zEnd_m();
        double zi = oa.imageZ_m();
        double m = oa.magnification();
        double uo = optics.potential().u_V(z0);
        double tObject = uo * Math.abs(particle.chargeNumber()); // eV at the object (drift before z0)
        OffAxisAberrations stop = oa.aboutStop(optics, optics.zStart_m());
        for (OffAxisAberrations about : new OffAxisAberrations[] {oa, stop}) {
            double kappa = about.stopSlope();
            double a = 1e-4;
            double[] lateral = new double[2];
            for (int r = 0; r < 2; r++) {
                double eps = 1e-4 * (r + 1);
                double[] miss = new double[2];
                for (int sgn = 0; sgn < 2; sgn++) {
                    double t = t0 + (sgn == 0 ? 1 : -1) * eps * tObject;
                    double d = z0 - zo;
                    double[] end = tracer.trace(z0, a + kappa * a * d, 0, kappa * a, 0, t, z1);
                    miss[sgn] = end[0] + end[2] * (zi - z1) - m * a;
                }
                lateral[r] = (miss[0] - miss[1]) / 2 / (-m * a * eps);
            }
            double cl = (4 * lateral[0] - lateral[1]) / 3; // the odd difference leaves eps^2 errors
            System.out.printf(java.util.Locale.ROOT, "%s, stop slope %.6g: C_L %.8g / traced %.8g%n", name, kappa,
                    about.lateralChromatic(), cl);
            assertThat(Math.abs(cl - about.lateralChromatic())).as("C_L, %s, kappa %s", name, kappa)
                    .isLessThan(0.01 * Math.max(Math.abs(about.lateralChromatic()), Math.abs(kappa * cc) + 1e-30));
        }
        // the geometric terms about the stop: rays b = kappa a + beta
        Traced t = traced(optics, tracer, t0, zo, oa);
        double kappa = stop.stopSlope();
        double aMax = 1e-3;
        double bMax = 5e-3;
        double c = oa.spherical_m();
        double dStop = thirdOrder(t, m, aMax, kappa * aMax, 0)[0] / Math.pow(aMax, 3);
        double cTraced = thirdOrder(t, m, 0, bMax, 0)[0] / Math.pow(bMax, 3);
        double bK = bMax;
        double aK = Math.min(aMax, bK * Math.sqrt(Math.abs(c / (3 * stop.coma()))) / 3);
        double[] plus = thirdOrder(t, m, aK, kappa * aK + bK, 0);
        double[] minus = thirdOrder(t, m, aK, kappa * aK - bK, 0);
        double kTraced = ((plus[0] + minus[0]) / 2 - dStop * aK * aK * aK) / (3 * aK * bK * bK);
        double fa = stop.fieldCurvature_per_m() + stop.astigmatism_per_m();
        double fs = stop.fieldCurvature_per_m() - stop.astigmatism_per_m();
        double aF = aMax;
        double bF = Math.min(bMax, aF * Math.sqrt(Math.max(Math.abs(fa), Math.abs(fs)) / Math.abs(c)) / 3);
        double[] fPlus = thirdOrder(t, m, aF, kappa * aF + bF, 0);
        double[] fMinus = thirdOrder(t, m, aF, kappa * aF - bF, 0);
        double faTraced = ((fPlus[0] - fMinus[0]) / 2 - cTraced * bF * bF * bF) / (aF * aF * bF);
        double[] fSag = thirdOrder(t, m, aF, kappa * aF, bF);
        double fsTraced = (fSag[1] - cTraced * bF * bF * bF) / (aF * aF * bF);
        System.out.printf(java.util.Locale.ROOT, "%s, stop at the object-side plane (kappa %.6g): K' %.6g / %.6g, F'+A' %.6g"
                + " / %.6g, F'-A' %.6g / %.6g 1/m, D' %.6g / %.6g 1/m^2%n", name, kappa, stop.coma(), kTraced, fa,
                faTraced, fs, fsTraced, stop.distortion_per_m2(), dStop);
        double fieldScale = Math.max(Math.abs(fa), Math.abs(fs));
        assertThat(Math.abs(kTraced - stop.coma())).as("K', %s", name).isLessThan(0.01 * Math.abs(stop.coma()));
        assertThat(Math.abs(faTraced - fa)).as("F' + A', %s", name).isLessThan(0.01 * fieldScale);
        assertThat(Math.abs(fsTraced - fs)).as("F' - A', %s", name).isLessThan(0.01 * fieldScale);
        assertThat(Math.abs(dStop - stop.distortion_per_m2())).as("D', %s", name)
                .isLessThan(0.01 * Math.abs(stop.distortion_per_m2()));
        assertThat(stop.petzval_per_m()).isCloseTo(oa.petzval_per_m(), org.assertj.core.api.Assertions.within(
                1e-9 * Math.abs(oa.fieldCurvature_per_m())));
    }

    /**
     * The open three-plate einzel of {@link OpenLensAberrationTest} (boundary-element field, far-field tails on both
     * sides): a real object at z = -80 mm inside the decaying field, exact skew rays traced from it to z = +0.5 m and
     * carried to their outgoing asymptotes by the paraxial tail map (the third-order action beyond 0.5 m is below
     * 1e-6 of Cs there, measured in {@link OpenLensAberrationTest}).
     */
    @Test
    void openLensCoefficientsAgreeWithExactSkewRays() {
        ParaxialOptics optics = OpenLensAberrationTest.optics(ParaxialSettings.defaults());
        AxialField field = OpenLensAberrationTest.SOLUTION.withBiases(OpenLensAberrationTest.PLATES.biases_V());
        Particle particle = OpenLensAberrationTest.PLATES.beam().particle();
        double t0 = OpenLensAberrationTest.PLATES.beam().energy_eV();
        double zo = -0.08;
        OffAxisAberrations oa = OffAxisAberrations.of(optics, zo);
        ExactSkewTracer tracer = new ExactSkewTracer(field, particle);
        double zb = 0.5;
        double[] map = optics.imageTail().fromAsymptote(zb);
        double det = map[0] * map[3] - map[1] * map[2];
        double centre = optics.imageTail().centreZ_m();
        double zi = oa.imageZ_m();
        double m = oa.magnification();
        Traced t = (a, bx, by) -> {
            double[] end = tracer.trace(zo, a, 0, bx, by, t0, zb);
            double[] miss = new double[2];
            for (int q = 0; q < 2; q++) {
                double r = end[q];
                double rp = end[q + 2];
                double height = (map[3] * r - map[1] * rp) / det;
                double slope = (-map[2] * r + map[0] * rp) / det;
                miss[q] = height + slope * (zi - centre);
            }
            miss[0] -= m * a;
            return miss;
        };
        check("open three-plate einzel, object at -80 mm", optics, zo, oa, t);
    }

    /**
     * Symmetry principle, derived in optics.md: a lens whose field is mirror-symmetric about z_c (so invariant under the
     * point reflection (x, y, z) -> (-x, -y, 2 z_c - z), and rays reversible) imaging at M = -1 maps every ray to a
     * ray, so with the aperture measured at z_c (stop coordinate sigma) the third-order miss is odd in sigma: coma and
     * distortion vanish. With b = sigma/s(z_c) + kappa a, kappa = -t(z_c)/s(z_c), the coefficients about that stop are
     * K' = K + kappa C and D' = D + kappa (F + A) + 3 kappa^2 K + kappa^3 C; both must vanish (relative to the
     * size of their terms). Not a tracing check: the integrals alone, at 1e-10 (measured below 1e-14).
     */
    @Test
    void symmetricLensAtUnitMagnificationHasNoComaOrDistortionAboutItsCentre() {
        AxialField field = AnalyticAxialField.gaussian(3000, 4e-3);
        ParaxialOptics optics = ParaxialOptics.auto(field, new Beam(Particle.proton(), 5000.0), -0.08, 0.08);
        CardinalElements ce = optics.cardinal();
        double zo = ce.focalPointObjectZ_m() - ce.focalLengthObject_m();
        OffAxisAberrations oa = OffAxisAberrations.of(optics, zo);
        assertThat(oa.magnification()).isCloseTo(-1, org.assertj.core.api.Assertions.within(1e-9));
        TransferMatrix toCentre = optics.transfer(zo, 0);
        double kappa = -toCentre.a() / toCentre.b();
        double c = oa.spherical_m();
        double k = oa.coma();
        double fa = oa.fieldCurvature_per_m() + oa.astigmatism_per_m();
        double d = oa.distortion_per_m2();
        double kStop = k + kappa * c;
        double dStop = d + kappa * fa + 3 * kappa * kappa * k + kappa * kappa * kappa * c;
        System.out.printf(java.util.Locale.ROOT, "symmetric bump at M = -1: kappa %.6g; K %.6g -> %.3g; D %.6g -> %.3g%n",
                kappa, k, kStop, d, dStop);
        assertThat(Math.abs(kStop)).isLessThan(1e-10 * Math.max(Math.abs(k), Math.abs(kappa * c)));
        double dScale = Math.max(Math.max(Math.abs(d), Math.abs(kappa * fa)),
                Math.max(Math.abs(3 * kappa * kappa * k), Math.abs(kappa * kappa * kappa * c)));
        assertThat(Math.abs(dStop)).isLessThan(1e-10 * dScale);
    }

    /**
     * Thin-lens limit (derived in optics.md): a lens much shorter than its focal length deflects a ray by an amount
     * that depends on the ray's position at the lens alone, so with the aperture measured at the lens
     * (b = kappa a + sigma/s(z_c)) only the spherical term is left: K' = F' = A' = D' = 0, i.e. K = -kappa C,
     * F = 2 kappa^2 C, A = kappa^2 C, D = -kappa^3 C and P = 0 in units of C and kappa. As an einzel bump of fixed
     * width weakens, the deviations (each against its scale |kappa^n C|) must fall, toward zero.
     */
    @Test
    void weakLensApproachesTheThinLensForm() {
        double previous = Double.POSITIVE_INFINITY;
        for (double peak : new double[] {1000, 300, 100}) {
            ParaxialOptics optics = ParaxialOptics.auto(AnalyticAxialField.gaussian(peak, 4e-3), new Beam(Particle.proton(), 5000.0),
                    -0.08, 0.08);
            CardinalElements ce = optics.cardinal();
            double zo = ce.focalPointObjectZ_m() - 0.5 * ce.focalLengthObject_m(); // M = -2
            OffAxisAberrations oa = OffAxisAberrations.of(optics, zo);
            TransferMatrix toCentre = optics.transfer(zo, 0);
            double kappa = -toCentre.a() / toCentre.b();
            double c = oa.spherical_m();
            double dev = Math.max(Math.max(Math.abs(oa.coma() / (-kappa * c) - 1),
                    Math.abs(oa.fieldCurvature_per_m() / (2 * kappa * kappa * c) - 1)),
                    Math.max(Math.abs(oa.astigmatism_per_m() / (kappa * kappa * c) - 1),
                            Math.abs(oa.distortion_per_m2() / (-kappa * kappa * kappa * c) - 1)));
            dev = Math.max(dev, Math.abs(oa.petzval_per_m() / (kappa * kappa * c)));
            System.out.printf(java.util.Locale.ROOT, "thin-lens form, peak %.0f V, f %.4g m: deviation %.2e%n", peak,
                    ce.focalLengthImage_m(), dev);
            assertThat(dev).as("peak %s V", peak).isLessThan(previous);
            previous = dev;
        }
        // measured 4.6e-5, 2.9e-7, 3.4e-9 for f = 0.34, 4.4, 42 m: the deviation falls as (width/f)^2
        assertThat(previous).isLessThan(1e-6);
    }
}
