package org.axistack.beam;

import org.axistack.model.PhysicsMessage;

/**
 * The envelope at the start plane: either a radius, a slope and an emittance, or a source (its radius
 * and the half-angle of divergence of its emission), taken as a waist at the start plane.
 */
public sealed interface EnvelopeStart permits EnvelopeStart.RadiusSlope, EnvelopeStart.Source {

    /** Edge radius at the start plane, m. */
    double radius_m();

    /** Envelope slope R' at the start plane, rad. */
    double slope_rad();

    /** The beam's emittance. */
    Emittance emittance();

    /**
     * Radius, slope and emittance given directly.
     *
     * @param radius_m  edge radius, m, &gt;= 0
     * @param slope_rad R', rad (negative: converging)
     * @param emittance the emittance
     */
    record RadiusSlope(double radius_m, double slope_rad, Emittance emittance) implements EnvelopeStart {
        public RadiusSlope {
            if (!Double.isFinite(radius_m) || radius_m < 0) {
                throw PhysicsMessage.START_RADIUS.exception("radius", radius_m * 1e3);
            }
            if (!Double.isFinite(slope_rad)) {
                throw PhysicsMessage.START_SLOPE.exception("slope", slope_rad * 1e3);
            }
            if (emittance == null) {
                throw new IllegalArgumentException("an envelope start needs an emittance (zero is allowed)");
            }
        }
    }

    /**
     * A source at the start plane: every point of a disk of radius radius_m emits into a cone of half-angle
     * divergence_rad. Modelled as an upright phase-space ellipse (a waist) with semi-axes radius and
     * divergence, i.e. edge emittance radius x divergence at the start energy: an estimate (a uniform
     * disk-times-cone distribution is not a KV ellipse; the ellipse encloses it).
     *
     * @param radius_m       source radius, m, &gt; 0
     * @param divergence_rad emission half-angle, rad, &gt;= 0
     */
    record Source(double radius_m, double divergence_rad) implements EnvelopeStart {
        public Source {
            if (!Double.isFinite(radius_m) || !(radius_m > 0)) {
                throw PhysicsMessage.START_RADIUS.exception("radius", radius_m * 1e3);
            }
            if (!Double.isFinite(divergence_rad) || divergence_rad < 0) {
                throw PhysicsMessage.SOURCE_DIVERGENCE.exception("divergence", divergence_rad * 1e3);
            }
        }

        @Override
        public double slope_rad() {
            return 0;
        }

        @Override
        public Emittance emittance() {
            return Emittance.edge(radius_m * divergence_rad);
        }
    }
}
