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
 * <p>Quadrature: composite 8-point Gauss-Legendre over the traced range and, on open sides, over the far-field
 * tails in s = 1/|z - z0| out to infinity (issue 23), panels doubled until the integrals
 * change by less than 1e-10 relative (the change reached is reported).
 */
final class AberrationIntegrals {

    static final double[] GL_X = {
        -0.9602898564975363, -0.7966664774136267, -0.5255324099163290, -0.1834346424956498,
        0.1834346424956498, 0.5255324099163290, 0.7966664774136267, 0.9602898564975363};
    static final double[] GL_W = {
        0.1012285362903763, 0.2223810344533745, 0.3137066557661458, 0.3626837833783620,
        0.3626837833783620, 0.3137066557661458, 0.2223810344533745, 0.1012285362903763};

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

    private static void requireFocusing(CardinalElements c) {
        if (c.kind() == CardinalElements.Kind.AFOCAL) {
            throw new IllegalStateException("the lens is afocal: aberration coefficients at the focal plane are undefined");
        }
    }

    /**
     * {spherical integral, chromatic integral, last relative change} for the ray given by z -> (r, r'), from
     * fromZ on: over the traced range between the reference planes in z and, on open sides, over the far-field
     * tails in s = 1/|z - z0| (dz = ds/s^2; the integrands fall off like 1/|z|^2 there, so the s-form is finite).
     */
    private static double[] integrals(ParaxialOptics optics, java.util.function.DoubleFunction<double[]> ray,
            double fromZ) {
        java.util.List<double[]> parts = new java.util.ArrayList<>(); // {t0, t1, kind, centre, side}
        double a = Math.max(fromZ, optics.zStart_m());
        double b = optics.zEnd_m();
        if (a < b) {
            parts.add(new double[] {a, b, 0, 0, 0});
        }
        FarTail in = optics.objectTail();
        if (in != null && fromZ < optics.zStart_m()) {
            double sFrom = Double.isFinite(fromZ) ? 1 / Math.abs(fromZ - in.centreZ_m()) : 0;
            parts.add(new double[] {sFrom, 1 / Math.abs(optics.zStart_m() - in.centreZ_m()), 1, in.centreZ_m(), -1});
        }
        FarTail out = optics.imageTail();
        if (out != null) {
            double sFrom = fromZ > optics.zEnd_m() ? 1 / Math.abs(fromZ - out.centreZ_m()) : Double.POSITIVE_INFINITY;
            double sTo = Math.min(sFrom, 1 / Math.abs(optics.zEnd_m() - out.centreZ_m()));
            parts.add(new double[] {0, sTo, 1, out.centreZ_m(), +1});
        }
        AccelerationPotential p = optics.potential();
        double inverseRest = 1 / p.restPotential_V();
        double[] d = new double[5];
        double[] prev = null;
        double change = Double.POSITIVE_INFINITY;
        for (int panels = 64; panels <= 8192; panels *= 2) {
            double[] sum = new double[2];
            for (double[] part : parts) {
                double h = (part[1] - part[0]) / panels;
                for (int k = 0; k < panels; k++) {
                    double mid = part[0] + (k + 0.5) * h;
                    for (int j = 0; j < GL_X.length; j++) {
                        double t = mid + 0.5 * h * GL_X[j];
                        double w = 0.5 * h * GL_W[j];
                        double z = t;
                        if (part[2] == 1) {
                            z = part[3] + part[4] / t;
                            w /= t * t;
                        }
                        double[] r = ray.apply(z);
                        p.derivatives(z, 4, d);
                        integrand(d, inverseRest, r[0], r[1], sum, w);
                    }
                }
            }
            if (prev != null) {
                change = Math.max(relChange(sum[0], prev[0]), relChange(sum[1], prev[1]));
                if (change < 1e-10) {
                    return new double[] {sum[0], sum[1], change};
                }
            }
            prev = sum;
        }
        return new double[] {prev[0], prev[1], change};
    }

    private static double relChange(double now, double before) {
        double scale = Math.max(Math.abs(now), Double.MIN_NORMAL);
        return Math.abs(now - before) / scale;
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
