package org.axistack.optics;

/**
 * Numerical settings of the paraxial optics. Immutable; vary with the {@code withX} methods.
 *
 * @param relativeTolerance  relative local error of the Dormand-Prince 8(5,3) integration (default 1e-12)
 * @param fieldFreeFraction  going outward from the lens, a plane counts as field-free where (|U'| + L|U''|)/U
 *                           first falls below this fraction of its peak (L the scan step) (default 1e-10)
 * @param scanPoints         samples of the axis used to find the lens and the field-free planes (default 600)
 * @param planeCheckFraction the planes are moved inward by this fraction of their distance to the lens
 *                           centre to measure how much the result depends on them (default 0.1)
 */
public record ParaxialSettings(double relativeTolerance, double fieldFreeFraction, int scanPoints,
        double planeCheckFraction, double farFieldReach, boolean farFieldModel) {

    public ParaxialSettings {
        if (!(relativeTolerance > 0 && relativeTolerance < 1e-3)) {
            throw new IllegalArgumentException("relative tolerance must be in (0, 1e-3): " + relativeTolerance);
        }
        if (!(fieldFreeFraction > 0 && fieldFreeFraction < 1)) {
            throw new IllegalArgumentException("field-free fraction must be in (0, 1): " + fieldFreeFraction);
        }
        if (scanPoints < 20) {
            throw new IllegalArgumentException("at least 20 scan points are needed: " + scanPoints);
        }
        if (!(planeCheckFraction > 0 && planeCheckFraction < 0.5)) {
            throw new IllegalArgumentException("plane check fraction must be in (0, 0.5): " + planeCheckFraction);
        }
        if (!(farFieldReach >= 1 && farFieldReach <= 1e6)) {
            throw new IllegalArgumentException("far-field reach must be in [1, 1e6]: " + farFieldReach);
        }
    }

    public static ParaxialSettings defaults() {
        return new ParaxialSettings(1e-12, 1e-10, 600, 0.1, 1, true);
    }

    public ParaxialSettings withRelativeTolerance(double tol) {
        return new ParaxialSettings(tol, fieldFreeFraction, scanPoints, planeCheckFraction, farFieldReach, farFieldModel);
    }

    public ParaxialSettings withFieldFreeFraction(double fraction) {
        return new ParaxialSettings(relativeTolerance, fraction, scanPoints, planeCheckFraction, farFieldReach, farFieldModel);
    }

    public ParaxialSettings withScanPoints(int n) {
        return new ParaxialSettings(relativeTolerance, fieldFreeFraction, n, planeCheckFraction, farFieldReach, farFieldModel);
    }

    /**
     * Open sides traced in z out to reach x the far-field series' start distance (default 1) before the tail
     * takes over: for convergence studies.
     */
    public ParaxialSettings withFarFieldReach(double reach) {
        return new ParaxialSettings(relativeTolerance, fieldFreeFraction, scanPoints, planeCheckFraction, reach,
                farFieldModel);
    }

    /**
     * Without the far-field model, open sides are cut at the end of the traced range (the field taken as ended
     * there): only to show what the model contributes.
     */
    public ParaxialSettings withFarFieldModel(boolean model) {
        return new ParaxialSettings(relativeTolerance, fieldFreeFraction, scanPoints, planeCheckFraction, farFieldReach,
                model);
    }
}
