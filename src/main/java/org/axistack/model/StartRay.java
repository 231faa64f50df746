package org.axistack.model;

/**
 * Where the beam's central ray enters, relative to the mechanical axis, at the beam start (or the object-side
 * reference plane when the stack gives no start): transverse offsets and slopes. The steering analyses carry it
 * through the lens to first order; the round analyses ignore it.
 *
 * @param x_m        offset along x, m
 * @param y_m        offset along y, m
 * @param slopeX_rad slope dx/dz, rad
 * @param slopeY_rad slope dy/dz, rad
 */
public record StartRay(double x_m, double y_m, double slopeX_rad, double slopeY_rad) {

    /** On the axis and parallel to it. */
    public static final StartRay ON_AXIS = new StartRay(0, 0, 0, 0);

    public StartRay {
        if (!Double.isFinite(x_m) || !Double.isFinite(y_m) || !Double.isFinite(slopeX_rad)
                || !Double.isFinite(slopeY_rad)) {
            throw new IllegalArgumentException("start offsets and slopes must be finite");
        }
    }

    /** Whether the ray starts on the axis and parallel to it. */
    public boolean onAxis() {
        return x_m == 0 && y_m == 0 && slopeX_rad == 0 && slopeY_rad == 0;
    }

    /** Distance from the axis, m. */
    public double radius_m() {
        return Math.hypot(x_m, y_m);
    }
}
