package org.axistack.model;

/**
 * A plane where the beam position is watched on the bench (a beam-position monitor, a viewing screen that can
 * be inserted, a wire): the steering analyses report the central ray there.
 *
 * @param name  what the bench calls it ("" if unnamed; {@link Stack#monitorLabel} gives a label)
 * @param z_m   position on the axis, m
 */
public record Monitor(String name, double z_m) {

    public Monitor {
        name = name == null ? "" : name;
        if (!Double.isFinite(z_m)) {
            throw new IllegalArgumentException("monitor plane must be finite: " + z_m);
        }
    }
}
