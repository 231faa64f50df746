package org.axistack.optics;

/**
 * Paraxial transfer matrix from plane z1 to plane z2: (r, r') at z2 = [[a, b], [c, d]] (r, r') at z1, with
 * r in m and r' = dr/dz. Its determinant is sqrt(U*(z1)/U*(z2)) (Helmholtz-Lagrange invariant).
 */
public record TransferMatrix(double z1_m, double z2_m, double a, double b, double c, double d) {

    public double determinant() {
        return a * d - b * c;
    }

    /** Height at z2 of the ray (r1, slope1) at z1, m. */
    public double height(double r1_m, double slope1) {
        return a * r1_m + b * slope1;
    }

    /** Slope at z2 of the ray (r1, slope1) at z1. */
    public double slope(double r1_m, double slope1) {
        return c * r1_m + d * slope1;
    }

    /** This matrix followed by {@code next} (which must start where this one ends). */
    public TransferMatrix then(TransferMatrix next) {
        return new TransferMatrix(z1_m, next.z2_m,
                next.a * a + next.b * c, next.a * b + next.b * d,
                next.c * a + next.d * c, next.c * b + next.d * d);
    }

    /** The same matrix labelled with other planes. */
    public TransferMatrix withPlanes(double newZ1_m, double newZ2_m) {
        return new TransferMatrix(newZ1_m, newZ2_m, a, b, c, d);
    }

    /** A field-free drift of length z2 - z1. */
    public static TransferMatrix drift(double z1_m, double z2_m) {
        return new TransferMatrix(z1_m, z2_m, 1, z2_m - z1_m, 0, 1);
    }
}
