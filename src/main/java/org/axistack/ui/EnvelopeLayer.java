package org.axistack.ui;

import java.util.Locale;
import java.util.OptionalDouble;

import org.axistack.beam.Emittance;
import org.axistack.beam.EnvelopeCurve;
import org.axistack.beam.EnvelopePoint;
import org.axistack.beam.EnvelopeRequest;
import org.axistack.beam.EnvelopeStart;
import org.axistack.beam.EnvelopeStudy;
import org.axistack.beam.EnvelopeSolver;
import org.axistack.field.AxialField;
import org.axistack.model.Units;
import org.axistack.model.Stack;
import org.axistack.report.LensChart;

/**
 * The beam envelope layer: the round-beam envelope with emittance and space charge of the beam package
 * ({@link EnvelopeStudy}), drawn mirrored. Tens of milliseconds per envelope, so the window computes it
 * after the live redraw has been painted, off the event thread, and abandons it when the biases move again.
 *
 * @param current_A   beam current, A (0 for none)
 * @param emittance_m_rad edge emittance at the start, m rad (geometric)
 * @param radiusFraction  start edge radius as a fraction of the narrowest bore
 */
public record EnvelopeLayer(double current_A, double emittance_m_rad, double radiusFraction) {

    public EnvelopeLayer {
        if (!(current_A >= 0) || !(emittance_m_rad >= 0) || !(radiusFraction > 0 && radiusFraction < 1)) {
            throw new IllegalArgumentException("envelope needs current >= 0 A, emittance >= 0 mm mrad and a start"
                    + " radius between 0 and the bore");
        }
    }

    /** The window's starting values: the plan's current and emittance (one place), a quarter of the bore. */
    public static EnvelopeLayer defaults() {
        org.axistack.plan.PlanAnalysis.Settings plan = org.axistack.plan.PlanAnalysis.Settings.defaults();
        return new EnvelopeLayer(plan.current_A(), plan.emittance_m_rad(), 0.25);
    }

    /** The request for a stack: parallel start at the beam's start plane. */
    public EnvelopeRequest request(Stack stack) {
        return new EnvelopeRequest(current_A, new EnvelopeStart.RadiusSlope(radiusFraction * stack.openBore_m(),
                0, new Emittance(emittance_m_rad, Emittance.Measure.EDGE, Emittance.Frame.GEOMETRIC_AT_START)),
                OptionalDouble.empty(), OptionalDouble.empty());
    }

    /**
     * The envelope with space charge and emittance (the full case of {@link EnvelopeStudy#run}: the same problem
     * and solver, without the study's two comparison curves, which the window does not draw) as mirrored lines,
     * mm. Honours thread interruption (throws {@link java.util.concurrent.CancellationException}).
     */
    public LensChart.Lines lines(Stack stack, AxialField field) {
        EnvelopeRequest req = request(stack);
        EnvelopeCurve c = new EnvelopeSolver().solve(EnvelopeStudy.channel(stack, field),
                EnvelopeStudy.problem(stack, field, req));
        LensChart.LinesBuilder b = new LensChart.LinesBuilder();
        for (double sign : new double[] {1, -1}) {
            for (EnvelopePoint p : c.points()) {
                b.add(Units.mToMm(p.z_m()), sign * Units.mToMm(p.radius_m()));
            }
            b.breakLine();
        }
        return b.build();
    }

    /** A short description for the status line. */
    public String describe() {
        return String.format(Locale.ROOT, "envelope: %s uA, %s mm mrad edge emittance, start radius %s of the bore",
                UiFormat.num(current_A * 1e6), UiFormat.num(emittance_m_rad * 1e6),
                Math.round(radiusFraction * 100) + " %");
    }
}
