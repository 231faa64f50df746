package org.axistack.tune;

import org.axistack.model.PhysicsMessage;
import org.axistack.model.Beam;

/**
 * A closed interval of bias voltages searched for a solution, V.
 *
 * <p>Default rule ({@link #supplyDefault}): a real bench supply for a lens electrode is chosen to reach a few
 * times the beam's energy per charge in either polarity (an einzel lens needs about 0.5 to 1 times it on the
 * decelerating side and 2 to 5 times it on the accelerating side), and rarely exceeds 30 kV: so the default is
 * +/- {@value #ENERGY_MULTIPLE} x (beam energy per charge), capped at +/- {@value #CAP_V} V, plus at least
 * +/- {@value #FLOOR_V} V. Common practice, no source; the range is a user setting.
 *
 * @param from_V lower end, V
 * @param to_V   upper end, V (greater than from)
 */
public record BiasRange(double from_V, double to_V) {

    /** Multiple of the beam energy per charge covered by the default range. */
    public static final double ENERGY_MULTIPLE = 6;
    /** Largest magnitude of the default range, V. */
    public static final double CAP_V = 30000;
    /** Smallest half-width of the default range, V. */
    public static final double FLOOR_V = 10;

    public BiasRange {
        if (!Double.isFinite(from_V) || !Double.isFinite(to_V) || !(from_V < to_V)) {
            throw PhysicsMessage.BIAS_RANGE.exception("from", from_V, "to", to_V);
        }
    }

    /** The range a real supply would allow for this beam (see the class comment). */
    public static BiasRange supplyDefault(Beam beam) {
        double half = Math.min(CAP_V, Math.max(FLOOR_V, ENERGY_MULTIPLE * Math.abs(beam.energyPerCharge_V())));
        return new BiasRange(-half, half);
    }

    public double width_V() {
        return to_V - from_V;
    }

    public boolean contains(double bias_V) {
        return bias_V >= from_V && bias_V <= to_V;
    }
}
