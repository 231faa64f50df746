package org.axistack.model;

/** A point of the meridian half-plane: axial position z and radius r, metres. */
public record ZR(double z_m, double r_m) {
    public ZR {
        if (!Double.isFinite(z_m) || !Double.isFinite(r_m)) {
            throw new IllegalArgumentException("non-finite point (" + z_m + ", " + r_m + ")");
        }
    }

    public double distanceTo(ZR o) {
        return Math.hypot(z_m - o.z_m, r_m - o.r_m);
    }

    public ZR plus(double dz_m, double dr_m) {
        return new ZR(z_m + dz_m, r_m + dr_m);
    }

    public ZR scaled(double k) {
        return new ZR(z_m * k, r_m * k);
    }

    public ZR shifted(double dz_m) {
        return new ZR(z_m + dz_m, r_m);
    }

    public ZR mirrored() {
        return new ZR(-z_m, r_m);
    }
}
