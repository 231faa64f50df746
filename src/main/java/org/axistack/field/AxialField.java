package org.axistack.field;

/**
 * The potential on the symmetry axis and its z-derivatives, which fix the near-axis field
 * phi(r, z) = sum_n (-1)^n (r/2)^(2n) / (n!)^2 V^(2n)(z). SI units. Immutable and thread-safe.
 */
public interface AxialField {

    /** Highest derivative order every implementation supports. */
    int MAX_ORDER = 16;

    /**
     * Axial potential and derivatives at z.
     *
     * @param order highest derivative wanted, 0..{@link #MAX_ORDER}
     * @param out   receives d^k V/dz^k (V/m^k) in out[k] for k = 0..order
     */
    void axial(double z_m, int order, double[] out);

    /** Axial potential V(z), V. */
    default double axialPotential_V(double z_m) {
        double[] out = new double[1];
        axial(z_m, 0, out);
        return out[0];
    }
}
