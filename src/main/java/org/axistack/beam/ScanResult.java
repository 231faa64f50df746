package org.axistack.beam;

import java.util.List;
import java.util.OptionalDouble;

/**
 * Waist against beam current.
 *
 * @param points             scan points in current order (equal steps from 0 to maxCurrent_A)
 * @param maxCurrent_A       top of the scan, A
 * @param vanishingCurrent_A the current at which the waist disappears from the range (bisection to the
 *                           relative tolerance of the scan), if it does below maxCurrent_A
 */
public record ScanResult(List<ScanPoint> points, double maxCurrent_A, OptionalDouble vanishingCurrent_A) {
    public ScanResult {
        points = List.copyOf(points);
        vanishingCurrent_A = vanishingCurrent_A == null ? OptionalDouble.empty() : vanishingCurrent_A;
    }
}
