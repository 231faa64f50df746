package org.axistack.optics;

import java.util.Locale;

import org.hipparchus.linear.Array2DRowRealMatrix;
import org.hipparchus.linear.ArrayRealVector;
import org.hipparchus.linear.LUDecomposition;
import org.hipparchus.linear.RealMatrix;

/**
 * Object-side spherical and chromatic aberration coefficients of a round electrostatic lens as polynomials in
 * the reciprocal lateral magnification m = 1/M, so one set of coefficients serves every object position in the
 * field-free object space (the form of the lens data books, e.g. E. Harting and F. H. Read, Electrostatic
 * Lenses, Elsevier 1976, from memory; derivation in P. W. Hawkes and E. Kasper, Principles of Electron Optics,
 * vol. 1, ch. 24-25, from memory):
 * <pre>
 *   Cs_o(M) = Cs0 + Cs1/M + Cs2/M^2 + Cs3/M^3 + Cs4/M^4,   Cc_o(M) = Cc0 + Cc1/M + Cc2/M^2.
 * </pre>
 *
 * <p>Convention (that of {@link Aberrations}, object side). M is the signed asymptotic lateral magnification
 * f1/(z_o - F1) (negative for a real inverted image). An axial ray leaving the object at slope a_o meets the
 * Gaussian image plane at M Cs_o a_o^3; raising the kinetic energy by dT moves it by -M Cc_o a_o dT/T_o (T_o the
 * kinetic energy at the object). Referred to the image (image-side slope a_i, T_i the image-side kinetic energy):
 * the miss is Cs_i a_i^3 and -Cc_i a_i dT/T_i with Cs_i = M^4 (U*_i/U*_o)^(3/2) Cs_o and
 * Cc_i = M^2 (U*_i/U*_o)^(1/2) (U_i/U_o) Cc_o (Lagrange-Helmholtz: M a_i sqrt(U*_i) = a_o sqrt(U*_o)); so
 * Cs4 (U*_i/U*_o)^(3/2) and Cc2 (U*_i/U*_o)^(1/2) (U_i/U_o) are the image-side coefficients for the object at
 * infinity.
 *
 * <p>Derivation. The object-side coefficients are Cs_o = -I_s[s]/sqrt(U*_o) and Cc_o = U_o I_c[s]/sqrt(U*_o) with
 * I the aberration integrals over the axial ray s of {@link AberrationIntegrals}, integrated over the whole axis
 * by {@link AberrationQuadrature} (far-field tails of an open lens included). The object is asymptotic: s is the
 * ray whose object-side asymptote leaves z_o at slope 1, so it has asymptote height z_1 - z_o at the object-side
 * plane z_1; with z_o = F1 + f1 m, s = a + m b with a = (z_1 - F1) u1 + u2 and b = -f1 u1 (u1, u2 the rays whose
 * object-side asymptotes have (height at z_1, slope) = (1, 0) and (0, 1); on a side that ends in a drift, the rays
 * given at z_1). The spherical integrand is a homogeneous quartic form in (s, s') and the chromatic one a quadratic
 * form, so I_s is a quartic and I_c a quadratic polynomial in m. The coefficients come from the integrals of the
 * same integrand at m = -2, -1, 0, 1, 2 (one quadrature pass for all five rays) and the exact interpolating
 * polynomial through them.
 *
 * <p>Valid for objects at or before the object-side plane of a lens that ends in a drift there (the real object is
 * then the asymptotic one); on an open lens for the object seen along its asymptote (the lens data books'
 * asymptotic coefficients), which differs from a real object placed inside the decaying field by the part of the
 * field the ray does not cross. Real objects inside the field: {@link ParaxialOptics#aberrations(double)}.
 *
 * @param zObjectPlane_m    the object-side reference plane z_1; the polynomials hold for objects at z_o &lt;= z_1
 * @param quadratureChange  relative change of the integrals at the last quadrature refinement
 */
public record AberrationPolynomials(double[] spherical_m, double[] chromatic_m, double uObject_V,
        double uStarObject_V, double uImage_V, double uStarImage_V, double zObjectPlane_m, boolean relativistic,
        double quadratureChange) {

    private static final double[] NODES = {-2, -1, 0, 1, 2};

    public AberrationPolynomials {
        if (spherical_m.length != 5 || chromatic_m.length != 3) {
            throw new IllegalArgumentException("need 5 spherical and 3 chromatic coefficients");
        }
        spherical_m = spherical_m.clone();
        chromatic_m = chromatic_m.clone();
    }

    /** Cs0..Cs4, m (a copy). */
    @Override
    public double[] spherical_m() {
        return spherical_m.clone();
    }

    /** Cc0..Cc2, m (a copy). */
    @Override
    public double[] chromatic_m() {
        return chromatic_m.clone();
    }

    /** The polynomials of a lens; the lens must not be afocal. */
    public static AberrationPolynomials of(ParaxialOptics optics) {
        CardinalElements c = optics.cardinal();
        if (c.kind() == CardinalElements.Kind.AFOCAL) {
            throw new IllegalStateException("the lens is afocal: the magnification is not defined by an object position");
        }
        double z1 = optics.zStart_m();
        double lead = z1 - c.focalPointObjectZ_m();
        double f1 = c.focalLengthObject_m();
        AccelerationPotential p = optics.potential();
        double inverseRest = 1 / p.restPotential_V();
        double[] d = new double[5];
        double[] part = new double[2];
        int[] groups = new int[2 * NODES.length];
        for (int n = 0; n < NODES.length; n++) {
            groups[2 * n + 1] = 1;
        }
        // u1, u2: the rays whose object-side asymptotes have (height at z1, slope) = (1, 0) and (0, 1); on an ended
        // object side these are the rays given at z1 (the asymptote is the ray there)
        AberrationQuadrature.Result q = AberrationQuadrature.integrate(optics, Double.NEGATIVE_INFINITY, groups,
                (z, w, acc) -> {
                    TransferMatrix u = optics.fromObjectAsymptote(z);
                    p.derivatives(z, 4, d);
                    double ar = lead * u.a() + u.b();
                    double ap = lead * u.c() + u.d();
                    for (int n = 0; n < NODES.length; n++) {
                        double m = NODES[n];
                        part[0] = 0;
                        part[1] = 0;
                        AberrationIntegrals.integrand(d, inverseRest, ar - m * f1 * u.a(), ap - m * f1 * u.c(), part, w);
                        acc[2 * n] += part[0];
                        acc[2 * n + 1] += part[1];
                    }
                });
        double[] sums = q.values();
        double uo = c.uObject_V();
        double so = Math.sqrt(p.uStar(uo));
        double[] is = new double[NODES.length];
        double[] ic = new double[3];
        for (int n = 0; n < NODES.length; n++) {
            is[n] = -sums[2 * n] / so;
        }
        for (int n = 0; n < 3; n++) {
            ic[n] = uo * sums[2 * (n + 1) + 1] / so;
        }
        double ui = c.uImage_V();
        double change = q.change();
        return new AberrationPolynomials(interpolate(NODES, is), interpolate(new double[] {-1, 0, 1}, ic), uo,
                p.uStar(uo), ui, p.uStar(ui), z1, optics.relativistic(), change);
    }

    /** Coefficients c_0..c_(n-1) of the polynomial through (x_k, y_k) (Vandermonde system, LU). */
    private static double[] interpolate(double[] x, double[] y) {
        int n = x.length;
        RealMatrix v = new Array2DRowRealMatrix(n, n);
        for (int i = 0; i < n; i++) {
            for (int k = 0; k < n; k++) {
                v.setEntry(i, k, Math.pow(x[i], k));
            }
        }
        return new LUDecomposition(v).getSolver().solve(new ArrayRealVector(y)).toArray();
    }

    private static double horner(double[] c, double m) {
        double s = 0;
        for (int k = c.length - 1; k >= 0; k--) {
            s = s * m + c[k];
        }
        return s;
    }

    private static void requireMagnification(double m) {
        if (!Double.isFinite(m) || m == 0) {
            throw new IllegalArgumentException("magnification must be finite and non-zero: " + m);
        }
    }

    /** Object-side Cs_o at lateral magnification M, m. */
    public double sphericalObject_m(double magnification) {
        requireMagnification(magnification);
        return horner(spherical_m, 1 / magnification);
    }

    /** Object-side Cc_o at lateral magnification M, m. */
    public double chromaticObject_m(double magnification) {
        requireMagnification(magnification);
        return horner(chromatic_m, 1 / magnification);
    }

    /** Image-side Cs_i = M^4 (U*_i/U*_o)^(3/2) Cs_o at lateral magnification M (M = 0: object at infinity), m. */
    public double sphericalImage_m(double magnification) {
        double ratio = Math.pow(uStarImage_V / uStarObject_V, 1.5);
        double m = magnification;
        double s = 0;
        for (int k = 0; k <= 4; k++) { // M^4 sum Cs_k M^-k = sum Cs_k M^(4-k)
            s += spherical_m[k] * Math.pow(m, 4 - k);
        }
        return ratio * s;
    }

    /** Image-side Cc_i = M^2 (U*_i/U*_o)^(1/2) (U_i/U_o) Cc_o at lateral magnification M (0: object at infinity), m. */
    public double chromaticImage_m(double magnification) {
        double ratio = Math.sqrt(uStarImage_V / uStarObject_V) * uImage_V / uObject_V;
        double m = magnification;
        return ratio * (chromatic_m[0] * m * m + chromatic_m[1] * m + chromatic_m[2]);
    }

    /** The convention in words, for the JSON key aberration_poly_convention and reports. */
    public String convention() {
        return String.format(Locale.ROOT, "object side, polynomials in 1/M (M the signed lateral magnification, negative"
                + " for a real inverted image): Cs_o = sum Cs_k M^-k (k = 0..4), Cc_o = sum Cc_k M^-k (k = 0..2); an axial"
                + " ray leaving the object at slope a_o meets the Gaussian image at M Cs_o a_o^3 - M Cc_o a_o dT/T_o;"
                + " image side Cs_i = M^4 (U*_i/U*_o)^1.5 Cs_o, Cc_i = M^2 (U*_i/U*_o)^0.5 (U_i/U_o) Cc_o; asymptotic"
                + " (the object seen along its straight object-side asymptote, the whole field including far-field tails"
                + " crossed), the real object for objects at or before z = %.4f mm when the field ends there", zObjectPlane_m * 1e3);
    }
}
