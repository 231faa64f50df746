package org.axistack.beam;

import org.axistack.field.AxialField;

/** Analytic axial potentials for the tests (not electrode solutions: any smooth V(z) is the axial potential of some harmonic field). */
final class TestFields {
    private TestFields() {
    }

    /** V = 0 everywhere: a field-free drift. */
    static AxialField drift() {
        return (z, order, out) -> {
            for (int k = 0; k <= order; k++) {
                out[k] = 0;
            }
        };
    }

    /** V = v0 + e1 * z: a uniform axial field -e1 (V/m). */
    static AxialField linear(double v0, double e1) {
        return (z, order, out) -> {
            out[0] = v0 + e1 * z;
            for (int k = 1; k <= order; k++) {
                out[k] = k == 1 ? e1 : 0;
            }
        };
    }

    /** V = vc exp(-z^2/w^2): a bell-shaped (einzel-like) axial potential; derivatives via Hermite polynomials. */
    static AxialField bell(double vc, double w) {
        return (z, order, out) -> {
            double x = z / w;
            double g = vc * Math.exp(-x * x);
            // d^n/dx^n exp(-x^2) = (-1)^n H_n(x) exp(-x^2), H_{n+1} = 2x H_n - 2n H_{n-1}
            double hPrev = 1;
            double h = 2 * x;
            for (int k = 0; k <= order; k++) {
                double hk = k == 0 ? 1 : (k == 1 ? 2 * x : 0);
                if (k >= 2) {
                    double next = 2 * x * h - 2 * (k - 1) * hPrev;
                    hPrev = h;
                    h = next;
                    hk = h;
                }
                out[k] = ((k % 2 == 0) ? 1 : -1) * hk * g / Math.pow(w, k);
            }
        };
    }

    /** V = v1 (1 + tanh(z/w))/2: an immersion step from 0 to v1. */
    static AxialField step(double v1, double w) {
        return (z, order, out) -> {
            double t = Math.tanh(z / w);
            double s2 = 1 - t * t;
            double[] d = {0.5 * v1 * (1 + t), 0.5 * v1 * s2 / w, 0.5 * v1 * (-2 * t * s2) / (w * w),
                0.5 * v1 * (-2 * s2 * s2 + 4 * t * t * s2) / (w * w * w)};
            for (int k = 0; k <= order; k++) {
                out[k] = k < d.length ? d[k] : Double.NaN;
            }
        };
    }
}
