package org.axistack.field;

/**
 * The potential and field near the axis from the axial potential's derivatives (solution of Laplace's
 * equation in cylindrical coordinates regular on the axis; e.g. P. W. Hawkes and E. Kasper, Principles of
 * Electron Optics, vol. 1, eq. 7.5): phi(r, z) = sum_k (-1)^k (r/2)^(2k) / (k!)^2 V^(2k)(z). The series
 * converges inside the distance from the axis point to the nearest charge; with n terms its truncation
 * error is of the order of the first omitted term.
 */
public final class NearAxisSeries {

    private NearAxisSeries() {
    }

    /**
     * @param d        axial derivatives d[k] = V^(k)(z), k = 0..2 terms - 1
     * @param terms    number of series terms (1 = paraxial potential only)
     * @param r_m      distance from the axis
     * @param fieldOut receives E_z in [0], E_r in [1] (V/m)
     * @return the potential, V
     */
    public static double evaluate(double[] d, int terms, double r_m, double[] fieldOut) {
        double phi = 0;
        double ez = 0;
        double er = 0;
        double h = r_m / 2;
        double coef = 1; // (-1)^k (r/2)^(2k) / (k!)^2
        double coefR = 0; // (-1)^k k (r/2)^(2k-1) / (k!)^2
        for (int k = 0; k < terms; k++) {
            if (k > 0) {
                double prev = coef;
                coef = -prev * h * h / ((double) k * k);
                // d/dr of (r/2)^(2k) is k (r/2)^(2k-1): coefR = -prev h / k, finite at r = 0
                coefR = -prev * h / k;
            }
            phi += coef * d[2 * k];
            ez -= coef * d[2 * k + 1];
            if (k > 0) {
                er -= coefR * d[2 * k];
            }
        }
        fieldOut[0] = ez;
        fieldOut[1] = er;
        return phi;
    }
}
