package org.axistack.beam;

/**
 * Numerical settings of the envelope engine.
 *
 * @param relativeTolerance  relative tolerance of the Dormand-Prince 8(5,3) integrator
 * @param absoluteTolerance  absolute tolerance relative to the envelope scale (start radius, and start
 *                           radius per unit range for the slope)
 * @param samples            number of equal z intervals in the output table (the table also holds every waist)
 * @param floorFraction      radius, as a fraction of the start radius, below which a space-charge or
 *                           emittance crossover is passed analytically (see {@link EnvelopeSolver})
 * @param reflectionFraction the beam is reported reflected where U falls below this fraction of U at the start
 * @param nearFill           fraction of the local bore above which the envelope is "near an electrode"
 */
public record EnvelopeSettings(double relativeTolerance, double absoluteTolerance, int samples, double floorFraction,
        double reflectionFraction, double nearFill) {

    public EnvelopeSettings {
        if (!(relativeTolerance > 0 && relativeTolerance < 1e-3) || !(absoluteTolerance > 0 && absoluteTolerance < 1e-3)) {
            throw new IllegalArgumentException("envelope tolerances must lie in (0, 1e-3)");
        }
        if (samples < 2 || samples > 1_000_000) {
            throw new IllegalArgumentException("envelope samples must be between 2 and 1000000");
        }
        if (!(floorFraction > 0 && floorFraction < 1e-2) || !(reflectionFraction > 0 && reflectionFraction < 0.5)) {
            throw new IllegalArgumentException("floor fraction must lie in (0, 1e-2), reflection fraction in (0, 0.5)");
        }
        if (!(nearFill > 0 && nearFill <= 1)) {
            throw new IllegalArgumentException("near-electrode fill fraction must lie in (0, 1]");
        }
    }

    /**
     * Defaults: tolerances 1e-12 (the closed-form checks pass at 1e-9 with these), 400 intervals, floor
     * 1e-6 of the start radius, reflection below 1e-6 of the start potential, warning above 70 % of the
     * bore (common practice, no source: beams filling more than about two thirds of a bore see strong
     * aberrations and halo losses).
     */
    public static EnvelopeSettings defaults() {
        return new EnvelopeSettings(1e-12, 1e-12, 400, 1e-6, 1e-6, 0.7);
    }

    public EnvelopeSettings withNearFill(double f) {
        return new EnvelopeSettings(relativeTolerance, absoluteTolerance, samples, floorFraction, reflectionFraction, f);
    }
}
