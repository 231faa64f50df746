package org.axistack.optics;

import java.util.Locale;

/**
 * How the lens field ends on one side of the lens, and where: the rule every optical result on that side rests on.
 *
 * @param rule how the end is treated
 * @param z_m  the reference plane: where the field is taken as ended, or where the far-field tail starts, m
 */
public record FieldEnd(Rule rule, double z_m) {

    /** The ways a side can end. */
    public enum Rule {
        /** Open side: the field of the solved charges is carried to infinity by its multipole series. */
        FAR_FIELD("open: traced to infinity through the far-field (multipole) model"),
        /**
         * The axis runs inside a drift tube whose field dies away (a tube standing for a beam pipe): the field is
         * taken as ended where it is weakest inside the tube; rays drift beyond.
         */
        TUBE_PLANE("inside a drift tube: field taken as ended where it is weakest (the tube stands for a beam pipe)"),
        /** Open side of a field without a far-field model: cut where the field is weakest in the scanned range. */
        NO_MODEL("cut where the field is weakest (no far-field model for this field)"),
        /**
         * The beam start, where an electrode closes the axis behind it: the field before the start is not traced
         * (the object-side elements then hold for rays that are parallel at the start).
         */
        BEAM_START("the beam start (an electrode closes the axis behind it; the field before it is not traced)"),
        /** A reference plane given by the caller: the field is taken as ended there. */
        GIVEN_PLANE("field taken as ended at the given plane");

        private final String description;

        Rule(String description) {
            this.description = description;
        }

        public String description() {
            return description;
        }

        /** Lower-case key for JSON and CSV. */
        public String key() {
            return name().toLowerCase(Locale.ROOT);
        }
    }

    static FieldEnd given(double z_m) {
        return new FieldEnd(Rule.GIVEN_PLANE, z_m);
    }
}
