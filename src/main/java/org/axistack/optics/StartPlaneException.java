package org.axistack.optics;

/** The beam's start plane cannot be used: it lies outside the searched range or at/after the lens exit plane. */
public final class StartPlaneException extends IllegalArgumentException {

    private static final long serialVersionUID = 1L;

    private final double startZ_m;
    private final double usableFromZ_m;
    private final double usableToZ_m;

    public StartPlaneException(double startZ_m, double usableFromZ_m, double usableToZ_m) {
        super(String.format(java.util.Locale.ROOT, "beam start z = %.4f mm lies outside the usable range %.4f .. %.4f mm",
                startZ_m * 1e3, usableFromZ_m * 1e3, usableToZ_m * 1e3));
        this.startZ_m = startZ_m;
        this.usableFromZ_m = usableFromZ_m;
        this.usableToZ_m = usableToZ_m;
    }

    public double startZ_m() {
        return startZ_m;
    }

    /** Lower end of the usable range, m. */
    public double usableFromZ_m() {
        return usableFromZ_m;
    }

    /** Upper end of the usable range (the image-side reference plane), m. */
    public double usableToZ_m() {
        return usableToZ_m;
    }
}
