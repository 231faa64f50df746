package org.axistack.beam;

/**
 * How much of one electrode's bore the envelope fills.
 *
 * @param electrode    electrode name
 * @param bore_m       smallest radius of the electrode's outline, m (0: it closes the axis)
 * @param zFrom_m      electrode extent start, m
 * @param zTo_m        electrode extent end, m
 * @param radius_m     envelope radius where the fill is largest, m
 * @param zWorst_m     where the fill is largest, m
 * @param fill         largest ratio envelope radius / local wall radius (0 if not reached or the axis is closed)
 * @param status       verdict
 */
public record BoreClearance(String electrode, double bore_m, double zFrom_m, double zTo_m, double radius_m,
        double zWorst_m, double fill, Status status) {

    /** The verdict on one electrode: clear, near, hit or closed. */
    public enum Status {
        /** Fill below the near-electrode threshold. */
        CLEAR,
        /** Fill at or above the threshold but below 1. */
        NEAR,
        /** The envelope reaches the wall: the beam is clipped. */
        HIT,
        /** The electrode closes the axis (no bore): the beam stops on it. */
        CLOSES_AXIS,
        /** The envelope does not reach this electrode's extent. */
        NOT_REACHED
    }
}
