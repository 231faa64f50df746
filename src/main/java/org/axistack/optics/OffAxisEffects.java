package org.axistack.optics;

import java.util.OptionalDouble;

/**
 * The off-axis aberrations of an imaging use of a lens: the coefficients for the object plane and, where the user
 * gave them, the object height and the object-side aperture angle at which their effects are evaluated
 * ({@link OffAxisAberrations#imageEffects_m}, {@link OffAxisAberrations#focalShifts_m}).
 *
 * @param coefficients   the five third-order coefficients (and the Petzval one) for the object plane
 * @param objectHeight_m object height, m &gt; 0 (empty: coefficients only)
 * @param aperture_rad   object-side aperture half-angle, rad &gt; 0 (empty: no blur figures; needs a height)
 */
public record OffAxisEffects(OffAxisAberrations coefficients, OptionalDouble objectHeight_m, OptionalDouble aperture_rad) {

    public OffAxisEffects {
        if (coefficients == null) {
            throw new IllegalArgumentException("the off-axis coefficients are required");
        }
        objectHeight_m = objectHeight_m == null ? OptionalDouble.empty() : objectHeight_m;
        aperture_rad = aperture_rad == null ? OptionalDouble.empty() : aperture_rad;
        requireValid(objectHeight_m, aperture_rad);
    }

    /**
     * Checks an object height and aperture angle as a use takes them: each positive and finite when given, the angle
     * only with a height.
     *
     * @throws IllegalArgumentException when not
     */
    public static void requireValid(OptionalDouble objectHeight_m, OptionalDouble aperture_rad) {
        if (objectHeight_m.isPresent() && !(objectHeight_m.getAsDouble() > 0 && Double.isFinite(objectHeight_m.getAsDouble()))) {
            throw new IllegalArgumentException("the object height must be a positive length: " + objectHeight_m.getAsDouble());
        }
        if (aperture_rad.isPresent() && !(aperture_rad.getAsDouble() > 0 && Double.isFinite(aperture_rad.getAsDouble()))) {
            throw new IllegalArgumentException("the aperture angle must be positive: " + aperture_rad.getAsDouble());
        }
        if (aperture_rad.isPresent() && objectHeight_m.isEmpty()) {
            throw new IllegalArgumentException("an aperture angle needs an object height (the off-axis blur depends on both)");
        }
    }

    /**
     * The image-plane effects at the height and aperture, m (see {@link OffAxisAberrations#imageEffects_m}), or empty
     * when either is missing.
     */
    public java.util.Optional<double[]> imageEffects_m() {
        if (objectHeight_m.isEmpty() || aperture_rad.isEmpty()) {
            return java.util.Optional.empty();
        }
        return java.util.Optional.of(coefficients.imageEffects_m(objectHeight_m.getAsDouble(), aperture_rad.getAsDouble()));
    }
}
