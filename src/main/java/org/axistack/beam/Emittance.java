package org.axistack.beam;

import org.axistack.model.PhysicsMessage;

/**
 * Transverse emittance of a round beam, as the user gives it. SI inside: metre-radians
 * (1 mm mrad = 1e-6 m rad).
 *
 * <p>Conventions (see package documentation):
 * <ul>
 * <li>{@link Measure#EDGE}: the full (edge) emittance, the area / pi of the phase-space ellipse that
 * bounds the beam; for a Kapchinskij-Vladimirskij (KV) beam this is exactly 4 times the rms emittance
 * and the envelope R of the envelope equation is the edge radius (2 x rms radius). The envelope
 * engine works with edge emittance.</li>
 * <li>{@link Measure#RMS}: rms emittance; converted with edge = 4 x rms (Lapostolle's equivalent-beam
 * rule, exact for KV, a convention for other distributions).</li>
 * <li>{@link Frame#GEOMETRIC_AT_START}: the geometric emittance at the start plane, at the beam energy
 * there; {@link Frame#NORMALISED}: beta*gamma times the geometric emittance, conserved under
 * acceleration in linear optics. Geometric emittance scales as 1/(beta*gamma) along the lens.</li>
 * </ul>
 *
 * @param value_m_rad emittance, m rad, &gt;= 0
 * @param measure     edge or rms
 * @param frame       geometric at the start plane, or normalised
 */
public record Emittance(double value_m_rad, Measure measure, Frame frame) {

    /** Which emittance the number is. */
    public enum Measure { EDGE, RMS }

    /** Geometric at the start plane or normalised (beta*gamma x geometric). */
    public enum Frame { GEOMETRIC_AT_START, NORMALISED }

    /** Ratio of edge (full) to rms emittance for a KV beam (Lapostolle 1971; Sacherer 1971). */
    public static final double EDGE_PER_RMS = 4.0;

    public Emittance {
        if (measure == null || frame == null) {
            throw new IllegalArgumentException("emittance needs a measure (edge or rms) and a frame");
        }
        if (!Double.isFinite(value_m_rad) || value_m_rad < 0) {
            throw PhysicsMessage.EMITTANCE_NEGATIVE.exception("emittance", value_m_rad * 1e6);
        }
    }

    /** Edge geometric emittance at the start plane, the common bench quantity. */
    public static Emittance edge(double value_m_rad) {
        return new Emittance(value_m_rad, Measure.EDGE, Frame.GEOMETRIC_AT_START);
    }

    public static Emittance zero() {
        return edge(0);
    }

    /**
     * Normalised edge emittance, m rad.
     *
     * @param betaGammaStart beta*gamma of the beam at the start plane
     */
    public double normalisedEdge_m_rad(double betaGammaStart) {
        double edge = measure == Measure.EDGE ? value_m_rad : EDGE_PER_RMS * value_m_rad;
        return frame == Frame.NORMALISED ? edge : edge * betaGammaStart;
    }
}
