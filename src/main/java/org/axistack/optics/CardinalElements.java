package org.axistack.optics;

import java.util.OptionalDouble;

/**
 * Asymptotic cardinal elements of a lens, in the stack's z coordinates (m), for rays travelling toward +z.
 * Focal points: where the asymptote of a ray entering (or leaving) parallel to the axis crosses it.
 * Principal planes: where incoming and outgoing asymptotes of that ray meet. Focal lengths positive for a
 * converging lens: f1 = H1 - F1 (object side), f2 = F2 - H2 (image side); f2/f1 = sqrt(U*2/U*1).
 * Principal planes may be crossed (H2 before H1). Conventions of docs interface.md.
 *
 * @param zStart_m             object-side reference plane (where the field is taken as ended, or where the
 *                             far-field tail of an open side starts), m
 * @param zEnd_m               image-side reference plane, m
 * @param uObject_V            acceleration potential U on the object side (at infinity for an open side), V
 * @param uImage_V             acceleration potential U on the image side (at infinity for an open side), V
 * @param relativistic         whether the relativistic paraxial equation was used
 * @param kind                 converging, diverging or afocal
 * @param focalPointObjectZ_m  F1, m (NaN when afocal)
 * @param focalPointImageZ_m   F2, m (NaN when afocal)
 * @param principalPlaneObjectZ_m H1, m (NaN when afocal)
 * @param principalPlaneImageZ_m  H2, m (NaN when afocal)
 * @param focalLengthObject_m  f1, m (infinite when afocal)
 * @param focalLengthImage_m   f2, m (infinite when afocal)
 * @param realFocusImageZ_m    first axis crossing of the real ray that enters parallel to the axis (traced in
 *                             the full field, through the far-field tail to infinity); empty if it never crosses
 * @param realFocusObjectZ_m   last axis crossing of the real ray that leaves parallel (traced backward)
 * @param planeSensitivity     largest change of F1, F2, H1, H2 (relative to |f|) and of f1, f2 (relative) when
 *                             both reference planes are moved toward the lens (by
 *                             {@link ParaxialSettings#planeCheckFraction()} of their distance to it): a
 *                             conservative estimate of the error from residual field at the planes (0 when
 *                             both ends are open and carried to infinity by the far-field model)
 * @param objectEnd            how the field ends on the object side (far-field tail, tube plane, ...)
 * @param imageEnd             how the field ends on the image side
 * @param errorEstimate        estimated relative error of every element (positions relative to |f|): the larger
 *                             of the plane sensitivity and the integration's own estimate
 * @param farFieldShare        how much the elements change (relative) when the field beyond the traced range of
 *                             the open sides is dropped: what the far field contributes (0 with no open side)
 */
public record CardinalElements(double zStart_m, double zEnd_m, double uObject_V, double uImage_V,
        boolean relativistic, Kind kind,
        double focalPointObjectZ_m, double focalPointImageZ_m,
        double principalPlaneObjectZ_m, double principalPlaneImageZ_m,
        double focalLengthObject_m, double focalLengthImage_m,
        OptionalDouble realFocusImageZ_m, OptionalDouble realFocusObjectZ_m, double planeSensitivity,
        FieldEnd objectEnd, FieldEnd imageEnd, double errorEstimate, double farFieldShare) {

    /** Whether the lens converges, diverges, or leaves parallel rays parallel. */
    public enum Kind { CONVERGING, DIVERGING, AFOCAL }

    /** Below this |c| * (zEnd - zStart) the lens is treated as afocal (focal length > 1e12 x its length). */
    static final double AFOCAL_LIMIT = 1e-12;

    /**
     * Cardinal elements from the transfer matrix between two field-free planes (the asymptotic formulas:
     * F2 = z2 - a/c, H2 = z2 + (1 - a)/c, f2 = -1/c; F1 = z1 + d/c, f1 = -det/c, H1 = F1 + f1).
     */
    static CardinalElements fromMatrix(TransferMatrix m, double u1_V, double u2_V, boolean relativistic,
            OptionalDouble realImage, OptionalDouble realObject, double planeSensitivity) {
        double length = m.z2_m() - m.z1_m();
        if (Math.abs(m.c()) * length < AFOCAL_LIMIT) {
            return new CardinalElements(m.z1_m(), m.z2_m(), u1_V, u2_V, relativistic, Kind.AFOCAL,
                    Double.NaN, Double.NaN, Double.NaN, Double.NaN,
                    Double.POSITIVE_INFINITY, Double.POSITIVE_INFINITY, realImage, realObject, planeSensitivity,
                    FieldEnd.given(m.z1_m()), FieldEnd.given(m.z2_m()), planeSensitivity, 0);
        }
        double f2 = -1 / m.c();
        double f1 = -m.determinant() / m.c();
        double fp2 = m.z2_m() - m.a() / m.c();
        double h2 = fp2 - f2;
        double fp1 = m.z1_m() + m.d() / m.c();
        double h1 = fp1 + f1;
        return new CardinalElements(m.z1_m(), m.z2_m(), u1_V, u2_V, relativistic,
                f2 > 0 ? Kind.CONVERGING : Kind.DIVERGING, fp1, fp2, h1, h2, f1, f2, realImage, realObject,
                planeSensitivity, FieldEnd.given(m.z1_m()), FieldEnd.given(m.z2_m()), planeSensitivity, 0);
    }

    /** The same elements with the field's ends and the error estimate filled in. */
    CardinalElements withEnds(FieldEnd object, FieldEnd image, double error, double farShare) {
        return new CardinalElements(zStart_m, zEnd_m, uObject_V, uImage_V, relativistic, kind, focalPointObjectZ_m,
                focalPointImageZ_m, principalPlaneObjectZ_m, principalPlaneImageZ_m, focalLengthObject_m,
                focalLengthImage_m, realFocusImageZ_m, realFocusObjectZ_m, planeSensitivity, object, image, error, farShare);
    }

    /** Whether both ends are carried to infinity by the far-field model (true asymptotic elements). */
    public boolean openBothSides() {
        return objectEnd.rule() == FieldEnd.Rule.FAR_FIELD && imageEnd.rule() == FieldEnd.Rule.FAR_FIELD;
    }

    public boolean converging() {
        return kind == Kind.CONVERGING;
    }

    /**
     * Whether the lens brings a parallel beam to a real focus: it converges, or the real ray that enters
     * parallel crosses the axis (a lens whose asymptotic elements say diverging can still focus in its field).
     * The one test behind every "the lens does not focus" outcome.
     */
    public boolean focuses() {
        return kind == Kind.CONVERGING || realFocusImageZ_m.isPresent();
    }

    /**
     * The plain statement of a lens that does not focus, e.g. "the lens does not focus (diverging): a parallel
     * beam leaves diverging" (the caller adds the remedy that fits its interface).
     */
    public String notFocusingStatement() {
        return "the lens does not focus (" + kind.name().toLowerCase(java.util.Locale.ROOT) + "): a parallel beam leaves "
                + (kind == Kind.AFOCAL ? "parallel" : "diverging");
    }

    /**
     * Asymptotic image position of an axial object at z_o, m, from Newton's relation, which in these z
     * coordinates (both focal lengths positive when converging) reads (z_o - F1)(z_i - F2) = -f1 f2.
     */
    public double imageZ_m(double objectZ_m) {
        return focalPointImageZ_m - focalLengthObject_m * focalLengthImage_m / (objectZ_m - focalPointObjectZ_m);
    }

    /** Lateral magnification for an object at z_o: f1/(z_o - F1) (negative for a real inverted image). */
    public double magnification(double objectZ_m) {
        return focalLengthObject_m / (objectZ_m - focalPointObjectZ_m);
    }

    /** Largest relative deviation between two results (positions scaled by |f2|), for convergence checks. */
    double relativeDifference(CardinalElements o) {
        if (kind == Kind.AFOCAL || o.kind == Kind.AFOCAL) {
            return kind == o.kind ? 0 : Double.POSITIVE_INFINITY;
        }
        double s1 = Math.abs(focalLengthObject_m);
        double s2 = Math.abs(focalLengthImage_m);
        double d = Math.abs(focalLengthObject_m - o.focalLengthObject_m) / s1;
        d = Math.max(d, Math.abs(focalLengthImage_m - o.focalLengthImage_m) / s2);
        d = Math.max(d, Math.abs(focalPointObjectZ_m - o.focalPointObjectZ_m) / s1);
        d = Math.max(d, Math.abs(principalPlaneObjectZ_m - o.principalPlaneObjectZ_m) / s1);
        d = Math.max(d, Math.abs(focalPointImageZ_m - o.focalPointImageZ_m) / s2);
        d = Math.max(d, Math.abs(principalPlaneImageZ_m - o.principalPlaneImageZ_m) / s2);
        return d;
    }
}
