package org.axistack.ui;

import org.axistack.field.BiasedField;
import org.axistack.model.Stack;
import org.axistack.report.LensChart;

/**
 * Everything the window shows for one set of biases.
 *
 * @param stack      the stack with these biases
 * @param field      the re-biased field
 * @param layers     what the lens chart draws
 * @param properties the property rows
 * @param rays       the live rays
 * @param compute_ms time spent computing this view, ms (wall clock)
 * @param cpu_ms     processor time of the computing thread, ms (less disturbed by other load)
 */
public record LensView(Stack stack, BiasedField field, LensChart.Layers layers, PropertySheet properties,
        LiveRays.Result rays, double compute_ms, double cpu_ms) {

    /** The same view with an envelope layer. */
    public LensView withEnvelope(LensChart.Lines envelope) {
        return new LensView(stack, field, layers.withEnvelope(envelope), properties, rays, compute_ms, cpu_ms);
    }
}
