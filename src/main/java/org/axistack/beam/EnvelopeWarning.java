package org.axistack.beam;

/**
 * Something the user must look at.
 *
 * @param kind      what
 * @param z_m       where, m
 * @param electrode electrode concerned, or "" for none
 * @param message   full sentence with values, units and the fix
 */
public record EnvelopeWarning(Kind kind, double z_m, String electrode, String message) {

    /** The kind of warning. */
    public enum Kind {
        START_OUTSIDE_BORE, HITS_ELECTRODE, NEAR_ELECTRODE, CLOSES_AXIS, REFLECTED, INTEGRATION_FAILED;

        /** True when the outcome needs action (the command exits with 1). */
        public boolean blocking() {
            return this != NEAR_ELECTRODE;
        }
    }

    public EnvelopeWarning {
        electrode = electrode == null ? "" : electrode;
    }
}
