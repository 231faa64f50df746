package org.axistack.optics;

/**
 * An electrode crosses the axis in the beam's path (a disk, or an outline closed across the axis): a beam
 * along the axis hits it, so the lens has no paraxial optics there. A physics outcome for the user, not bad
 * input. The axial potential has a kink at such a conductor, which no ray equation may integrate through.
 */
public final class BlockedAxisException extends IllegalStateException {

    private static final long serialVersionUID = 1L;

    private final String electrode;
    private final double zFrom_m;
    private final double zTo_m;

    public BlockedAxisException(String electrode, double zFrom_m, double zTo_m) {
        super(String.format(java.util.Locale.ROOT, "electrode '%s' crosses the axis at z = %.4f .. %.4f mm, in the beam's"
                + " path: a beam along the axis hits it; open it (an aperture instead of a disk) or start the beam after"
                + " it with [beam] start_z_mm", electrode, zFrom_m * 1e3, zTo_m * 1e3));
        this.electrode = electrode;
        this.zFrom_m = zFrom_m;
        this.zTo_m = zTo_m;
    }

    public String electrode() {
        return electrode;
    }

    public double zFrom_m() {
        return zFrom_m;
    }

    public double zTo_m() {
        return zTo_m;
    }
}
