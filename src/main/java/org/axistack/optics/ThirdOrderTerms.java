package org.axistack.optics;

/**
 * The round lens's relativistic third-order terms at one plane, from the axial potential's derivatives: the
 * paraxial coefficients and the four coefficients of F3 = c1 |w|^2 w + c2 |w|^2 w' + c3 |w'|^2 w + c4 |w'|^2 w'
 * (derivation in optics.md). The one place these are written: the off-axis aberration integrals and the
 * misalignment coma both take them from here.
 *
 * @param g      1 + U / V0 (V0 the rest potential per charge)
 * @param gp     dg/dz, 1/m
 * @param uStar  relativistic acceleration potential U (1 + U / (2 V0)), V
 * @param uStarP dU* / dz, V/m
 * @param aa     -g U'' / 4, V/m^2
 * @param c1     coefficient of |w|^2 w
 * @param c2     coefficient of |w|^2 w'
 * @param c3     coefficient of |w'|^2 w
 * @param c4     coefficient of |w'|^2 w'
 */
record ThirdOrderTerms(double g, double gp, double uStar, double uStarP, double aa, double c1, double c2, double c3,
        double c4) {

    /**
     * @param d           U, U', U'', U''', U'''' at z (V, V/m, ...)
     * @param inverseRest 1 / V0, 1/V
     * @param z_m         the plane, for the reflection a non-positive U means
     * @throws ReflectionException when U <= 0 (the beam turns back)
     */
    static ThirdOrderTerms of(double[] d, double inverseRest, double z_m) {
        double u = d[0];
        if (!(u > 0)) {
            throw new ReflectionException(new Reflection(z_m, Double.NaN));
        }
        double g = 1 + u * inverseRest;
        double gp = d[1] * inverseRest;
        double uStar = u * (1 + 0.5 * u * inverseRest);
        double aa = -g * d[2] / 4;
        double aap = -(g * d[3] + gp * d[2]) / 4;
        double bb = g * d[4] / 64 + d[2] * d[2] * inverseRest / 32;
        double uStarP = g * d[1];
        double c1 = (4 * bb - 2 * aa * aa / uStar) / (2 * uStar);
        double c2 = (-aap + aa * uStarP / uStar) / (2 * uStar);
        double c3 = aa / uStar;
        double c4 = -uStarP / (2 * uStar);
        return new ThirdOrderTerms(g, gp, uStar, uStarP, aa, c1, c2, c3, c4);
    }

    /**
     * Adds the monomial coefficients of F3 for w = a t + b s (t, s two paraxial rays with slopes tp, sp) to out, in
     * the order of {@link OffAxisAberrations#expand}.
     */
    void addMonomials(double t, double tp, double s, double sp, double[] out) {
        OffAxisAberrations.expand(t, s, t, s, c1, out);
        OffAxisAberrations.expand(t, s, tp, sp, c2, out);
        OffAxisAberrations.expand(tp, sp, t, s, c3, out);
        OffAxisAberrations.expand(tp, sp, tp, sp, c4, out);
    }
}
