package org.axistack.optics;

import java.util.List;

import org.axistack.field.AxialField;

/**
 * The axial potentials of a solved stack with one electrode at 1 V and the others at 0 V. By linearity of
 * Laplace's equation (superposition, physics brief "Field") any bias set is their weighted sum, so re-biasing
 * costs no field solve: this is what makes sweeps, tuning and the paraxial benchmark fast. Pass fast unit
 * fields (for example tabulated ones) to get fast re-biased fields. Immutable and thread-safe if the unit
 * fields are.
 */
public final class UnitAxialFields {

    private final List<AxialField> units;

    private UnitAxialFields(List<AxialField> units) {
        this.units = units;
    }

    /** @param unitFields field of electrode i at 1 V, all others at 0 V, in electrode order */
    public static UnitAxialFields of(List<? extends AxialField> unitFields) {
        if (unitFields == null || unitFields.isEmpty()) {
            throw new IllegalArgumentException("at least one unit-bias axial field is needed");
        }
        return new UnitAxialFields(List.copyOf(unitFields));
    }

    public int electrodes() {
        return units.size();
    }

    /** The axial field for the given biases (V, one per electrode, in the same order). */
    public AxialField withBiases(double[] biases_V) {
        if (biases_V.length != units.size()) {
            throw new IllegalArgumentException("expected " + units.size() + " biases, got " + biases_V.length);
        }
        double[] b = biases_V.clone();
        List<AxialField> u = units;
        return (z, order, out) -> {
            java.util.Arrays.fill(out, 0, order + 1, 0.0);
            double[] one = new double[order + 1];
            for (int e = 0; e < b.length; e++) {
                if (b[e] == 0) {
                    continue;
                }
                u.get(e).axial(z, order, one);
                for (int k = 0; k <= order; k++) {
                    out[k] += b[e] * one[k];
                }
            }
        };
    }
}
