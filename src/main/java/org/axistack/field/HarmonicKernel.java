package org.axistack.field;

/**
 * Ring kernel of azimuthal harmonic m: the potential of a ring of radius a at z' whose line density
 * varies as cos(m phi'), per unit strength, divided by cos(m phi) at the target,
 *
 * <pre>
 *   H_m(z, r; z', a) = (1 / 2 pi) Int_0^2pi cos(m u) / |x - x'| du = Q_{m-1/2}(chi) / (pi sqrt(r a)),
 *   chi = (r^2 + a^2 + (z - z')^2) / (2 r a),
 * </pre>
 *
 * from the Fourier series of the inverse distance in toroidal functions (Heine's formula; e.g. W. R.
 * Smythe, Static and Dynamic Electricity, ch. 5, cited from memory; the steps are in
 * src/site/markdown/harmonic-field.md and the tests check the result numerically). For m = 0
 * it is the ring potential of {@link RingKernel#potential}, normalised the same way, so a harmonic-m
 * collocation matrix is the m = 0 matrix with this kernel in place of that one.
 *
 * <p>Two routes, chosen per call by the toroidal distance eta = arccosh(chi):
 * <ul>
 * <li>near the ring (2 m eta &lt; {@link #FORWARD_LIMIT}): Q_{-1/2} = k K(k^2) and
 *   Q_{1/2} = (2/k) [(K - E) - (k^2/2) K] with k^2 = 2 / (chi + 1) (complete elliptic integrals by the
 *   arithmetic-geometric mean, the complement 1 - k^2 = rho_-^2 / rho_+^2 passed without cancellation), then the
 *   three-term recurrence (j + 1/2) Q_{j+1/2} = 2 j chi Q_{j-1/2} - (j - 1/2) Q_{j-3/2} upward. The recurrence
 *   is unstable (the growing solution P_{j-1/2} ~ e^{j eta} contaminates Q ~ e^{-j eta}): the relative error
 *   grows like eps e^{2 m eta}, which the limit holds below about 1e3 eps;</li>
 * <li>far from it: the hypergeometric series in t^2 = e^{-2 eta},
 *   Q_{m-1/2}(cosh eta) = sqrt(pi) Gamma(m + 1/2) / m! e^{-(m + 1/2) eta} 2F1(1/2, m + 1/2; m + 1; e^{-2 eta})
 *   (Whipple/Erdelyi form of the toroidal function; Abramowitz and Stegun 8.1.3 with the quadratic
 *   transformation, cited from memory and checked by the tests), with e^{-eta} = 2 r a / (S + rho_- rho_+),
 *   S = r^2 + a^2 + d^2, free of cancellation. Its terms fall like t^{2n} and there t^2 &lt; e^{-FORWARD_LIMIT / m}.</li>
 * </ul>
 * Measured against 60-digit trapezoid sums and graded Gauss-Legendre quadrature of the azimuthal integral
 * ({@code HarmonicKernelTest}): relative error below 1e-13 for m = 0..16, chi from 1 + 1e-12 to 1e6.
 *
 * <p>The log singularity at the ring, Q_{m-1/2}(chi) = -(1/2) ln((chi - 1)/2) - gamma - psi(m + 1/2) + o(1), has the
 * same logarithm for every m, so the graded panel rule that integrates the m = 0 kernel over a panel
 * through the collocation node ({@link PanelQuadrature}) integrates every harmonic kernel as well.
 */
public final class HarmonicKernel {

    /** Upper bound of 2 m eta for the upward recurrence (e^{6.9} = 1e3: error growth at most 1e3 eps). */
    static final double FORWARD_LIMIT = 6.9;
    /** Largest harmonic order supported (the series needs about 40 m terms at the switch). */
    public static final int MAX_ORDER = 64;

    private HarmonicKernel() {
    }

    /**
     * H_m at (z, r) of a ring of radius aRing at zRing, 1/m: (1/2pi) Int cos(m u)/|x - x'| du. Zero on the
     * axis (r = 0) or for a ring on the axis when m &gt; 0, and zero exactly on the ring itself (see
     * {@link RingKernel#ON_RING}).
     */
    public static double potential(int m, double z, double r, double zRing, double aRing) {
        if (m == 0) {
            return RingKernel.potential(z, r, zRing, aRing);
        }
        if (m < 0 || m > MAX_ORDER) {
            throw new IllegalArgumentException("harmonic order " + m + " outside 0.." + MAX_ORDER);
        }
        if (!(r > 0) || !(aRing > 0)) {
            return 0;
        }
        double d = z - zRing;
        double rp2 = (r + aRing) * (r + aRing) + d * d;
        double rm2 = (r - aRing) * (r - aRing) + d * d;
        if (rm2 == 0) {
            return 0; // on the ring itself: see RingKernel.ON_RING
        }
        double s = r * r + aRing * aRing + d * d;
        double rp = Math.sqrt(rp2);
        double rm = Math.sqrt(rm2);
        double ra = r * aRing;
        double denom = s + rm * rp;
        double t = 2 * ra / denom; // e^{-eta}
        double eta = -Math.log(t);
        if (2 * m * eta < FORWARD_LIMIT) {
            return upward(m, rp2, rm2, rp, s, ra);
        }
        return series(m, t, denom);
    }

    /** Upward recurrence from the elliptic forms of H_0 and H_1. */
    static double upward(int m, double rp2, double rm2, double rp, double s, double ra) {
        double k2 = 4 * ra / rp2;
        double[] ke = new double[3];
        EllipticIntegrals.kAndE(k2, rm2 / rp2, ke);
        double kk = ke[0];
        double kme = ke[2];
        double h0 = (2 / Math.PI) * kk / rp;
        double h1 = rp * (kme - 0.5 * k2 * kk) / (Math.PI * ra);
        if (m == 1) {
            return h1;
        }
        double chi = s / (2 * ra);
        double prev = h0;
        double cur = h1;
        for (int j = 1; j < m; j++) {
            double next = (2 * j * chi * cur - (j - 0.5) * prev) / (j + 0.5);
            prev = cur;
            cur = next;
        }
        return cur;
    }

    /** Hypergeometric series in t^2 = e^{-2 eta}; denom = S + rho_- rho_+. */
    static double series(int m, double t, double denom) {
        double c = 1; // binom(2m, m) / 4^m
        double tm = 1;
        for (int j = 1; j <= m; j++) {
            c *= (2 * j - 1) / (2.0 * j);
            tm *= t;
        }
        double z = t * t;
        double term = 1;
        double sum = 1;
        for (int n = 0; n < 100000; n++) {
            term *= (n + 0.5) * (m + n + 0.5) / ((m + n + 1.0) * (n + 1.0)) * z;
            sum += term;
            if (term <= 1e-17 * sum) {
                break;
            }
        }
        return c * tm * Math.sqrt(2 / denom) * sum;
    }
}
