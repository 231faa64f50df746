package org.axistack.beam;

import java.util.Optional;

/**
 * One current of a current scan.
 *
 * @param current_A   beam current, A
 * @param waist       the smallest interior waist at this current, if there is one
 * @param termination how the envelope ended
 * @param endRadius_m envelope radius at the last plane reached, m
 */
public record ScanPoint(double current_A, Optional<Waist> waist, Termination termination, double endRadius_m) {
    public ScanPoint {
        waist = waist == null ? Optional.empty() : waist;
    }
}
