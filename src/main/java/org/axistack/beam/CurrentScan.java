package org.axistack.beam;

import org.axistack.model.PhysicsMessage;
import java.util.ArrayList;
import java.util.List;
import java.util.OptionalDouble;
import java.util.concurrent.CancellationException;
import java.util.function.DoubleConsumer;

/**
 * Waist position and size against beam current, up to the current where the waist leaves the range
 * (space charge pushes the focus downstream and widens it until the envelope no longer turns). The waist
 * is the smallest interior local minimum of the envelope. The vanishing current is bracketed on the scan
 * grid and refined by bisection (it assumes one transition inside the bracket; a non-monotone case
 * shows in the scan table).
 */
public final class CurrentScan {

    /** Relative tolerance of the vanishing current. */
    public static final double BISECTION_TOLERANCE = 1e-4;

    private final EnvelopeSolver solver;

    public CurrentScan(EnvelopeSolver solver) {
        this.solver = solver;
    }

    public ScanPoint at(EnvelopeChannel ch, EnvelopeProblem base, double current_A) {
        EnvelopeCurve c = solver.solve(ch, base.withCurrent_A(current_A));
        return new ScanPoint(current_A, c.smallestWaist(), c.termination(), c.last().radius_m());
    }

    private static boolean hasWaist(ScanPoint p) {
        return p.waist().isPresent();
    }

    /**
     * A current at which the waist has left the range: doubles from a small start until it does.
     *
     * @return the first such current found, or empty if the waist persists up to limit_A
     */
    public OptionalDouble findVanishingBound(EnvelopeChannel ch, EnvelopeProblem base, double limit_A) {
        double i = 1e-9;
        while (i <= limit_A) {
            checkCancel();
            if (!hasWaist(at(ch, base, i))) {
                return OptionalDouble.of(i);
            }
            i *= 2;
        }
        return OptionalDouble.empty();
    }

    /**
     * Scans steps+1 equal current steps from 0 to maxCurrent_A and refines the vanishing current.
     *
     * @param progress receives the fraction done (0..1); may be null
     */
    public ScanResult scan(EnvelopeChannel ch, EnvelopeProblem base, double maxCurrent_A, int steps,
            DoubleConsumer progress) {
        if (!(maxCurrent_A > 0) || !Double.isFinite(maxCurrent_A)) {
            throw PhysicsMessage.CURRENT_SCAN_TOP.exception("current", maxCurrent_A);
        }
        if (steps < 1 || steps > 10_000) {
            throw PhysicsMessage.CURRENT_SCAN_STEPS.exception("steps", steps);
        }
        int bisections = (int) Math.ceil(Math.log(steps / BISECTION_TOLERANCE) / Math.log(2));
        double total = steps + 1 + bisections;
        List<ScanPoint> pts = new ArrayList<>();
        for (int k = 0; k <= steps; k++) {
            checkCancel();
            pts.add(at(ch, base, maxCurrent_A * k / steps));
            report(progress, pts.size() / total);
        }
        OptionalDouble vanish = OptionalDouble.empty();
        for (int k = 1; k < pts.size(); k++) {
            if (hasWaist(pts.get(k - 1)) && !hasWaist(pts.get(k))) {
                double lo = pts.get(k - 1).current_A();
                double hi = pts.get(k).current_A();
                int done = 0;
                while (hi - lo > BISECTION_TOLERANCE * hi) {
                    checkCancel();
                    double mid = 0.5 * (lo + hi);
                    if (hasWaist(at(ch, base, mid))) {
                        lo = mid;
                    } else {
                        hi = mid;
                    }
                    report(progress, (steps + 1 + ++done) / total);
                }
                vanish = OptionalDouble.of(0.5 * (lo + hi));
                break;
            }
        }
        report(progress, 1);
        return new ScanResult(pts, maxCurrent_A, vanish);
    }

    private static void report(DoubleConsumer progress, double f) {
        if (progress != null) {
            progress.accept(Math.min(1, f));
        }
    }

    private static void checkCancel() {
        if (Thread.currentThread().isInterrupted()) {
            throw new CancellationException("current scan cancelled");
        }
    }
}
