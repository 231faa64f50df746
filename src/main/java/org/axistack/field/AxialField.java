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

    /**
     * The multipole model of the field far from its charges, when the field comes from a finite set of charges
     * (a solved stack); empty for fields given in closed form, whose far field is not known.
     */
    default java.util.Optional<FarField> farField() {
        return java.util.Optional.empty();
    }

    /**
     * Whether the axis at z runs inside a tube-like electrode (one that surrounds the axis at least its own bore
     * radius before and after z), so a weak field there may be taken as the end of the lens. Fields without
     * geometry answer true: the field's decay alone decides for them.
     */
    default boolean insideTube(double z_m) {
        return true;
    }

    /** Whether an electrode closes the axis somewhere in [from, to] (fields without geometry: never). */
    default boolean axisBlocked(double from_m, double to_m) {
        return false;
    }

    /** Axial potential V(z), V. */
    default double axialPotential_V(double z_m) {
        double[] out = new double[1];
        axial(z_m, 0, out);
        return out[0];
    }
}
