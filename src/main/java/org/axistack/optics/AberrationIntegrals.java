package org.axistack.optics;

import java.util.OptionalDouble;

/**
 * Spherical and chromatic aberration coefficients of a round electrostatic lens from the aberration
 * integrals in their perturbation form (P. W. Hawkes and E. Kasper, Principles of Electron Optics, vol. 1,
 * ch. 24; the trajectory method of O. Scherzer, Z. Phys. 101 (1936) 593).
 *
 * <p>Derivation (checked against direct tracing of exact rays in the tests). The meridional trajectory in a
 * static field obeys r'' = (1 + r'^2)(Phi_r - r' Phi_z)/(2 Phi) with Phi = U*(r, z) (Maupertuis' principle
 * with momentum proportional to sqrt(U*)). With the near-axis expansion U(r, z) = U - r^2 U''/4 + r^4 U''''/64
 * one gets Phi = U* + A r^2 + B r^4, A = -g U''/4, B = g U''''/64 + U''^2/(32 Vr), and to third order
 * r'' + P r' + Q r = F3 with the paraxial P = g U'/(2U*), Q = g U''/(4U*) and
 * F3 = [4B r^3 - A' r^2 r' + (r'^2 - A r^2/U*)(2A r - g U' r')] / (2U*).
 * Variation of parameters with the conserved Wronskian sqrt(U*)(u v' - v u') gives the deviation at the
 * Gaussian image; for an object at infinity Cs = -f2^4 / sqrt(U*2) Integral u sqrt(U*) F3[u] dz, u the ray
 * entering parallel at unit height. A uniform raise dU of U perturbs P and Q by
 * (1/Vr - g^2/U*)(U' r'/(2U*) + U'' r/(4U*)) dU, giving Cc = U2 f2^2 / sqrt(U*2) Integral u sqrt(U*) K[u] dz
 * with K = (g^2/U* - 1/Vr)(U' u'/(2U*) + U'' u/(4U*)). For a finite object the axial ray s (s(z_o) = 0,
 * s'(z_o) = 1) replaces u: Cs_o = -Integral s sqrt(U*) F3[s] dz / sqrt(U*_o),
 * Cc_o = U_o Integral s sqrt(U*) K[s] dz / sqrt(U*_o). Vr = m c^2/|q| is infinite non-relativistically.
 *
 * <p>Quadrature: {@link AberrationQuadrature} (the traced range and, on open sides, the far-field tails in
 * s = 1/|z - z0| out to infinity; the change at the last refinement is reported).
 */
final class AberrationIntegrals {

    private AberrationIntegrals() {
    }

    static Aberrations atInfinity(ParaxialOptics optics) {
        CardinalElements c = optics.cardinal();
        requireFocusing(c);
        // the ray that enters parallel at unit height (along its asymptote from infinity on an open object side)
        double[] integrals = integrals(optics, z -> {
            TransferMatrix t = optics.fromObjectAsymptote(z);
            return new double[] {t.a(), t.c()};
        }, Double.NEGATIVE_INFINITY);
        AccelerationPotential p = optics.potential();
        double u2 = c.uImage_V();
        double s2 = Math.sqrt(p.uStar(u2));
        double f2 = c.focalLengthImage_m();
        double cs = -Math.pow(f2, 4) * integrals[0] / s2;
        double cc = u2 * f2 * f2 * integrals[1] / s2;
        return new Aberrations(cs, cc, OptionalDouble.empty(), OptionalDouble.empty(), OptionalDouble.empty(),
                optics.relativistic(), integrals[2]);
    }

    static Aberrations forObject(ParaxialOptics optics, double objectZ_m) {
        Aberrations inf = atInfinity(optics);
        Imaging im = optics.imaging(objectZ_m);
        if (!Double.isFinite(im.imageZ_m())) {
            throw new IllegalArgumentException(String.format(java.util.Locale.ROOT,
                    "the object at z = %.4f mm is imaged to infinity: object-side aberrations are undefined",
                    objectZ_m * 1e3));
        }
        double[] integrals = integrals(optics, z -> optics.ray(objectZ_m, 0, 1, z), objectZ_m);
        AccelerationPotential p = optics.potential();
        boolean drift = objectZ_m < optics.zStart_m() && optics.objectTail() == null;
        double uo = p.u_V(drift ? optics.zStart_m() : objectZ_m);
        double so = Math.sqrt(p.uStar(uo));
        double cs = -integrals[0] / so;
        double cc = uo * integrals[1] / so;
        return new Aberrations(inf.sphericalImage_m(), inf.chromaticImage_m(), OptionalDouble.of(objectZ_m),
                OptionalDouble.of(cs), OptionalDouble.of(cc), optics.relativistic(),
                Math.max(inf.quadratureChange(), integrals[2]));
    }

    /**
     * Object-side {Cs_o, Cc_o, quadrature change} for the asymptotic object of lateral magnification M: the axial
     * ray whose object-side asymptote leaves z_o = F1 + f1/M at slope 1, integrated over the whole axis (through the
     * object-side tail of an open lens, from infinity). On a lens whose object side ends in a drift this is the
     * real object at z_o before the object-side plane; on an open lens it is the asymptotic coefficient of the lens
     * data books (the object seen along its asymptote), which {@link AberrationPolynomials} gives for every M.
     */
    static double[] forAsymptoticObject(ParaxialOptics optics, double magnification) {
        CardinalElements c = optics.cardinal();
        requireFocusing(c);
        double zo = c.focalPointObjectZ_m() + c.focalLengthObject_m() / magnification;
        double h = optics.zStart_m() - zo;
        double[] integrals = integrals(optics, z -> {
            TransferMatrix t = optics.fromObjectAsymptote(z);
            return new double[] {t.height(h, 1), t.slope(h, 1)};
        }, Double.NEGATIVE_INFINITY);
        AccelerationPotential p = optics.potential();
        double uo = c.uObject_V();
        double so = Math.sqrt(p.uStar(uo));
        return new double[] {-integrals[0] / so, uo * integrals[1] / so, integrals[2]};
    }

    private static void requireFocusing(CardinalElements c) {
        if (c.kind() == CardinalElements.Kind.AFOCAL) {
            throw new IllegalStateException("the lens is afocal: aberration coefficients at the focal plane are undefined");
        }
    }

    /**
     * {spherical integral, chromatic integral, last relative change} for the ray given by z -> (r, r'), from
     * fromZ on, through {@link AberrationQuadrature} (traced range in z, far-field tails of open sides in s).
     */
    private static double[] integrals(ParaxialOptics optics, java.util.function.DoubleFunction<double[]> ray,
            double fromZ) {
        AccelerationPotential p = optics.potential();
        double inverseRest = 1 / p.restPotential_V();
        double[] d = new double[5];
        AberrationQuadrature.Result q = AberrationQuadrature.integrate(optics, fromZ, new int[] {0, 1}, (z, w, acc) -> {
            double[] r = ray.apply(z);
            p.derivatives(z, 4, d);
            integrand(d, inverseRest, r[0], r[1], acc, w);
        });
        return new double[] {q.values()[0], q.values()[1], q.change()};
    }

    /** Adds w * r sqrt(U*) F3 to sum[0] and w * r sqrt(U*) K to sum[1]. */
    static void integrand(double[] d, double inverseRest, double r, double rp, double[] sum, double w) {
        double u = d[0];
        if (!(u > 0)) {
            throw new ReflectionException(new Reflection(Double.NaN, Double.NaN));
        }
        double g = 1 + u * inverseRest;
        double gp = d[1] * inverseRest;
        double uStar = u * (1 + 0.5 * u * inverseRest);
        double aa = -g * d[2] / 4;
        double aap = -(g * d[3] + gp * d[2]) / 4;
        double bb = g * d[4] / 64 + d[2] * d[2] * inverseRest / 32;
        double uStarP = g * d[1];
        double f3 = (4 * bb * r * r * r - aap * r * r * rp
                + (rp * rp - aa * r * r / uStar) * (2 * aa * r - uStarP * rp)) / (2 * uStar);
        double k = (g * g / uStar - inverseRest) * (d[1] * rp / (2 * uStar) + d[2] * r / (4 * uStar));
        double root = Math.sqrt(uStar);
        sum[0] += w * r * root * f3;
        sum[1] += w * r * root * k;
    }

}
