package org.axistack.optics;

import java.util.Locale;

/**
 * Third-order geometric aberrations of a round electrostatic lens for a finite object point off the axis: spherical
 * aberration, coma, astigmatism, field curvature and distortion, with the Petzval coefficient. The five-term form and
 * the names are those of the textbooks (P. W. Hawkes and E. Kasper, Principles of Electron Optics, vol. 1, ch. 24-25;
 * P. Grivet, Electron Optics; the relation to the eikonal below from memory); the integrands are derived here from the
 * exact trajectory equation, as for {@link AberrationIntegrals}, and checked by exact tracing of skew rays.
 *
 * <p>Convention. Transverse positions are complex, w = x + i y. An object point at height a (real, on the x axis) at
 * the object z_o sends a ray with slope vector b = (dx/dz, dy/dz) at z_o, written b = bx + i by. At the asymptotic
 * Gaussian image plane (M the asymptotic lateral magnification) the ray misses the paraxial image point M a by
 * <pre>
 *   dw_i = M [ C b^2 conj(b) + 2K a b conj(b) + K a b^2 + F a^2 b + A a^2 conj(b) + D a^3 ]
 * </pre>
 * C = Cs_o the object-side spherical aberration (m), K the coma (dimensionless), F the field curvature and A the
 * astigmatism (1/m), D the distortion (1/m^2). A meridional ray (b real, = beta) misses by
 * M [C beta^3 + 3K a beta^2 + (F + A) a^2 beta + D a^3] in x; a sagittal ray (b = i beta) by M [K a beta^2 + D a^3] in
 * x and M [C beta^3 + (F - A) a^2 beta] in y. So the tangential image surface has curvature coefficient F + A, the
 * sagittal one F - A; the Petzval coefficient P = F - 2A = (3 (F - A) - (F + A))/2 is unchanged when the aperture
 * stop moves (a change b -&gt; b + kappa a leaves F - 2A fixed: derived in optics.md). D &gt; 0 with the image
 * pushed outward is pincushion distortion, D &lt; 0 barrel.
 *
 * <p>Derivation. The trajectory equation w'' = (1 + |w'|^2)(grad Phi - w' Phi_z)/(2 Phi), Phi = U*(x, y, z) (the
 * meridional form of {@link AberrationIntegrals} with the transverse gradient as a complex number), expanded with
 * Phi = U* + A r^2 + B r^4 (r^2 = |w|^2) to third order, reads w'' + P w' + Q w = F3 with
 * <pre>
 *   F3 = [4B |w|^2 w - A' |w|^2 w' + (|w'|^2 - A |w|^2/U*) (2A w - U*' w')] / (2U*).
 * </pre>
 * Variation of parameters with the axial ray s (s(z_o) = 0, s'(z_o) = 1) and the field ray t (t(z_o) = 1, t'(z_o) = 0),
 * whose Wronskian sqrt(U*)(t s' - s t') = sqrt(U*_o) is conserved, gives at the image (s = 0, t = M)
 * dw_i = -M Integral s sqrt(U*) F3[a t + b s] dz / sqrt(U*_o). Substituting the paraxial ray w = a t + b s makes F3 a
 * cubic form in (a, b, conj(b)); each product |u|^2 v with u = a u_t + b u_s, v = a v_t + b v_s expands into
 * a^3 u_t^2 v_t + a^2 b (u_t^2 v_s + u_t u_s v_t) + a^2 conj(b) u_t u_s v_t + a b^2 u_t u_s v_s
 * + a b conj(b) (u_t u_s v_s + u_s^2 v_t) + b^2 conj(b) u_s^2 v_s, and the six integrals give the six coefficients.
 * The coma appears twice (as 2K from a b conj(b) and as K from a b^2); the two are equal only after the integrals
 * are taken (a consequence of the eikonal, from memory): {@link #comaMismatch()} reports the difference as a check.
 *
 * <p>The integrals run through {@link AberrationQuadrature} (traced range and far-field tails); the rays are the real
 * rays from the real object (as {@link ParaxialOptics#aberrations(double)}), U*_o is taken at the object (at the
 * object-side plane when the object lies in a drift before it).
 *
 * @param objectZ_m          the object plane z_o, m
 * @param imageZ_m           the asymptotic Gaussian image plane, m
 * @param magnification      M, the asymptotic lateral magnification
 * @param spherical_m        C = Cs_o, m
 * @param coma               K
 * @param fieldCurvature_per_m F, 1/m
 * @param astigmatism_per_m  A, 1/m
 * @param distortion_per_m2  D, 1/m^2
 * @param comaMismatch       (2K from the a b conj(b) term)/2 - K from the a b^2 term, relative to |K|
 * @param imageSlopeRatio    the image-side slope per unit object-side slope of the axial ray, s'(z_i)
 * @param relativistic       whether the relativistic trajectory equation was expanded
 * @param quadratureChange   relative change of the integrals at the last refinement
 * @param chromatic_m        Cc_o, the axial chromatic coefficient of the same object (m; as {@link Aberrations})
 * @param lateralChromatic   C_L, the lateral chromatic coefficient (dimensionless): raising the kinetic energy by dT
 *                           moves the image of object height a by -M C_L a dT/T_o (T_o at the object); with the
 *                           aperture term the whole chromatic miss is -M (Cc_o b + C_L a) dT/T_o
 * @param stopSlope          kappa, the slope per unit object height of the chief ray the aperture angle is measured
 *                           about (b = kappa a + beta): 0 for the aperture at the object, -t(z_s)/s(z_s) for a stop
 *                           at z_s ({@link #aboutStop})
 */
public record OffAxisAberrations(double objectZ_m, double imageZ_m, double magnification, double spherical_m,
        double coma, double fieldCurvature_per_m, double astigmatism_per_m, double distortion_per_m2,
        double comaMismatch, double imageSlopeRatio, boolean relativistic, double quadratureChange,
        double chromatic_m, double lateralChromatic, double stopSlope) {

    /**
     * The same aberrations with the aperture angle measured about the chief ray of slope kappa a (stop-shift formulas,
     * derived in optics.md: substitute b = beta + kappa a in the five-term form and the chromatic miss):
     * C' = C, K' = K + kappa C, F' = F + 4 kappa K + 2 kappa^2 C, A' = A + 2 kappa K + kappa^2 C,
     * D' = D + kappa (F + A) + 3 kappa^2 K + kappa^3 C, Cc' = Cc, C_L' = C_L + kappa Cc; kappa adds to the stop
     * slope already applied. The Petzval coefficient F' - 2A' = F - 2A is unchanged.
     */
    public OffAxisAberrations withStopSlope(double kappa) {
        double c = spherical_m;
        double k = coma;
        double f = fieldCurvature_per_m;
        double a = astigmatism_per_m;
        return new OffAxisAberrations(objectZ_m, imageZ_m, magnification, c, k + kappa * c,
                f + 4 * kappa * k + 2 * kappa * kappa * c, a + 2 * kappa * k + kappa * kappa * c,
                distortion_per_m2 + kappa * (f + a) + 3 * kappa * kappa * k + kappa * kappa * kappa * c, comaMismatch,
                imageSlopeRatio, relativistic, quadratureChange, chromatic_m, lateralChromatic + kappa * chromatic_m,
                stopSlope + kappa);
    }

    /**
     * The aberrations for an aperture stop at z_s (these coefficients must be about the object, stop slope 0): the
     * chief ray through the stop's centre leaves the object point at slope kappa a with kappa = -t(z_s)/s(z_s) (t the
     * field ray, s the axial ray from the object).
     *
     * @throws IllegalArgumentException when the stop lies at the object or at an image of it (s(z_s) = 0)
     */
    public OffAxisAberrations aboutStop(ParaxialOptics optics, double stopZ_m) {
        if (stopSlope != 0) {
            throw new IllegalStateException("the coefficients are already about a stop");
        }
        TransferMatrix m = optics.transfer(objectZ_m, stopZ_m);
        double scale = Math.abs(stopZ_m - objectZ_m) + Math.abs(imageZ_m - objectZ_m);
        if (!(Math.abs(m.b()) > 1e-9 * scale)) {
            throw new IllegalArgumentException(String.format(Locale.ROOT, "a stop at z = %.4f mm lies at the object or"
                    + " at an image of it: every ray through it from one object point passes one point", stopZ_m * 1e3));
        }
        return withStopSlope(-m.a() / m.b());
    }

    /** The Petzval coefficient P = F - 2A, 1/m. */
    public double petzval_per_m() {
        return fieldCurvature_per_m - 2 * astigmatism_per_m;
    }

    /**
     * The off-axis aberrations of an axial-symmetric lens for the object at objectZ.
     *
     * @throws IllegalArgumentException if the object is imaged to infinity
     */
    static OffAxisAberrations of(ParaxialOptics optics, double objectZ_m) {
        Imaging im = optics.imaging(objectZ_m);
        if (!Double.isFinite(im.imageZ_m())) {
            throw new IllegalArgumentException(String.format(Locale.ROOT,
                    "the object at z = %.4f mm is imaged to infinity: off-axis aberrations are undefined", objectZ_m * 1e3));
        }
        AccelerationPotential p = optics.potential();
        double inverseRest = 1 / p.restPotential_V();
        double[] d = new double[5];
        double[] mono = new double[6];
        // slots 0-5: the geometric monomials; 6: the chromatic integrand of the field ray (lateral colour), 7: of the
        // axial ray (axial colour, the Cc_o of Aberrations)
        // the six integrals have different dimensions (a is a length, b a slope): scaled by powers of a lens length so
        // that one convergence test, against the largest, treats them alike
        double length = Math.abs(im.imageZ_m() - objectZ_m) + Math.abs(optics.cardinal().focalLengthImage_m());
        double[] powers = {length * length * length, length * length, length * length, length, length, 1, length, 1};
        AberrationQuadrature.Result q = AberrationQuadrature.integrate(optics, objectZ_m, new int[] {0, 0, 0, 0, 0, 0, 1, 1},
                (z, w, acc) -> {
                    TransferMatrix m = optics.transfer(objectZ_m, z);
                    double t = m.a();
                    double tp = m.c();
                    double s = m.b();
                    double sp = m.d();
                    p.derivatives(z, 4, d);
                    ThirdOrderTerms f = ThirdOrderTerms.of(d, inverseRest, z);
                    double g = f.g();
                    double uStar = f.uStar();
                    double weight = w * s * Math.sqrt(uStar);
                    java.util.Arrays.fill(mono, 0);
                    f.addMonomials(t, tp, s, sp, mono);
                    for (int k = 0; k < 6; k++) {
                        acc[k] += weight * mono[k] * powers[k];
                    }
                    // a uniform raise dU perturbs the paraxial equation by -K[w] dU (AberrationIntegrals), linear in w
                    double kc = (g * g / uStar - inverseRest) / uStar;
                    acc[6] += weight * kc * (d[1] * tp / 2 + d[2] * t / 4) * powers[6];
                    acc[7] += weight * kc * (d[1] * sp / 2 + d[2] * s / 4) * powers[7];
                });
        boolean drift = objectZ_m < optics.zStart_m() && optics.objectTail() == null;
        double uo = p.u_V(drift ? optics.zStart_m() : objectZ_m);
        double scale = -1 / Math.sqrt(p.uStar(uo));
        double[] j = q.values().clone();
        for (int k = 0; k < 8; k++) {
            j[k] /= powers[k];
        }
        double dist = scale * j[0];
        double field = scale * j[1];
        double astig = scale * j[2];
        double comaB2 = scale * j[3];
        double comaBB = scale * j[4] / 2;
        double spherical = scale * j[5];
        double mismatch = Math.abs(comaBB - comaB2) / Math.max(Math.abs(comaB2), Double.MIN_NORMAL);
        double slope = im.objectToImage().d();
        double chromaticScale = uo / Math.sqrt(p.uStar(uo));
        return new OffAxisAberrations(objectZ_m, im.imageZ_m(), im.lateralMagnification(), spherical, comaB2, field,
                astig, dist, mismatch, slope, optics.relativistic(), q.change(), chromaticScale * j[7],
                chromaticScale * j[6], 0);
    }

    /**
     * Adds k times the monomial coefficients of |u|^2 v, u = a ut + b us, v = a vt + b vs, to out in the order
     * a^3, a^2 b, a^2 conj(b), a b^2, a b conj(b), b^2 conj(b).
     */
    static void expand(double ut, double us, double vt, double vs, double k, double[] out) {
        out[0] += k * ut * ut * vt;
        out[1] += k * (ut * ut * vs + ut * us * vt);
        out[2] += k * ut * us * vt;
        out[3] += k * ut * us * vs;
        out[4] += k * (ut * us * vs + us * us * vt);
        out[5] += k * us * us * vs;
    }

    /**
     * The image-plane effects at object height h and object-side aperture angle alpha (all lengths at the image, m):
     * {spherical M C alpha^3, tangential coma 3 M K h alpha^2, sagittal coma M K h alpha^2, field curvature M F h^2 alpha,
     * astigmatism M A h^2 alpha (half the distance between the tangential and sagittal line images' blur), distortion
     * M D h^3}. Signed: positive along the image height (the image point's direction for M &gt; 0).
     */
    public double[] imageEffects_m(double height_m, double alpha) {
        double m = magnification;
        double h = height_m;
        return new double[] {m * spherical_m * alpha * alpha * alpha, 3 * m * coma * h * alpha * alpha,
            m * coma * h * alpha * alpha, m * fieldCurvature_per_m * h * h * alpha, m * astigmatism_per_m * h * h * alpha,
            m * distortion_per_m2 * h * h * h};
    }

    /**
     * Where the tangential and sagittal line foci and the Petzval surface lie, measured along the axis from the
     * Gaussian image plane, for object height h, m: {tangential, sagittal, Petzval}. A ray of object slope beta
     * reaches the image at image-side slope beta s'(z_i), so a lateral miss M X h^2 beta is undone at
     * dz = -M X h^2 / s'(z_i) (X = F + A, F - A, F - 2A).
     */
    public double[] focalShifts_m(double height_m) {
        double k = -magnification * height_m * height_m / imageSlopeRatio;
        return new double[] {k * (fieldCurvature_per_m + astigmatism_per_m), k * (fieldCurvature_per_m - astigmatism_per_m),
            k * petzval_per_m()};
    }

    /** The convention in words, for the JSON key off_axis_convention and reports. */
    public String convention() {
        return String.format(Locale.ROOT, "object at z = %.4f mm, object height a (x axis), object-side ray slope b ="
                + " bx + i by: the ray misses the paraxial image point at the Gaussian image z = %.4f mm by"
                + " M [C b^2 conj(b) + 2K a b conj(b) + K a b^2 + F a^2 b + A a^2 conj(b) + D a^3] (x + i y);"
                + " tangential field F + A, sagittal F - A, Petzval P = F - 2A; a kinetic energy raised by dT adds"
                + " -M (Cc b + C_L a) dT/T_o (C_L lateral colour, T_o at the object); %s; third-order aberration integrals"
                + " of the %s trajectory equation", objectZ_m * 1e3, imageZ_m * 1e3, stopSlope == 0
                        ? "b measured about the ray that leaves the object parallel to the axis (aperture at the object)"
                        : String.format(Locale.ROOT, "b measured about the chief ray of slope kappa a, kappa = %.6g /m (through the stop)",
                                stopSlope), relativistic ? "relativistic" : "non-relativistic");
    }
}
