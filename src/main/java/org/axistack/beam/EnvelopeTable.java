package org.axistack.beam;

import org.axistack.field.AxialField;
import org.axistack.field.BiasedField;
import org.axistack.trace.AxialTable;

/**
 * The axial potential the envelope stage integrates through: orders 0..2 Hermite-interpolated (quintic, from V to V''''
 * at the nodes; {@link AxialTable}) on a uniform grid over the envelope's range, so that every integrator stage costs a
 * table look-up whatever the field does there. The nodes are filled from the field's own axial values (the Chebyshev
 * expansion the paraxial optics uses; the exact sum only where the field has no expansion, once per node instead of
 * once per integrator stage: a plate across the axis or a stretch the expansion did not converge on used to make the
 * envelope evaluate the exact element sums tens of thousands of times).
 *
 * <p>Step: a sixteenth of the narrowest open bore (the axial potential varies on the scale of the bore), at most
 * 1/400 of the range, and no more than {@link #MAX_NODES} nodes. The interpolation error is measured at every interval
 * midpoint when the table is built ({@link #relativeFieldError()}); the envelope test holds the result to the direct
 * field's within the solver's own tolerance.
 */
final class EnvelopeTable {

    /** Most nodes of one table (memory 17 doubles per node: 27 MB at the cap). */
    static final int MAX_NODES = 200_000;

    private final AxialTable table;
    private final double relativeFieldError;

    private EnvelopeTable(AxialTable table, double relativeFieldError) {
        this.table = table;
        this.relativeFieldError = relativeFieldError;
    }

    /** A table of the field over [z0, z1] for a stack whose narrowest open bore is bore_m. */
    static EnvelopeTable of(AxialField field, double z0, double z1, double bore_m) {
        double length = z1 - z0;
        double step = Math.min(length / 400, bore_m > 0 ? bore_m / 16 : length / 400);
        step = Math.max(step, length / MAX_NODES);
        // the nodes need orders 0..4 (quintic Hermite of V''); higher orders are never read for order <= 2
        AxialField lowOrders = (z, order, out) -> {
            java.util.Arrays.fill(out, 0, order + 1, 0);
            field.axial(z, Math.min(order, 4), out);
        };
        AxialTable t = new AxialTable(lowOrders, z0, z1, step);
        double[] v = new double[2];
        double scale = 0;
        for (int k = 0; k <= 64; k++) {
            field.axial(z0 + length * k / 64, 1, v);
            scale = Math.max(scale, Math.abs(v[1]));
        }
        return new EnvelopeTable(t, scale > 0 ? t.maxFieldError_V_per_m() / scale : 0);
    }

    /**
     * The field the envelope integrates through: a table of a solved field ({@link BiasedField}, whose values come
     * from the expansion or the exact element sums); any other field (a closed form, already cheap) as it is, and
     * the field itself too if the table came out non-finite (a field without the four derivatives the table needs).
     */
    static AxialField through(AxialField field, double z0, double z1, double bore_m) {
        if (!(field instanceof BiasedField)) {
            return field;
        }
        EnvelopeTable t = of(field, z0, z1, bore_m);
        return Double.isFinite(t.relativeFieldError()) ? t.field() : field;
    }

    /** The tabulated field (outside the range: the field itself). */
    AxialField field() {
        return table;
    }

    /** Largest interpolation error of V' at the interval midpoints, relative to the largest |V'| on the range. */
    double relativeFieldError() {
        return relativeFieldError;
    }
}
