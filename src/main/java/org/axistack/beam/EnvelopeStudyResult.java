package org.axistack.beam;

import java.util.List;
import java.util.OptionalDouble;

/**
 * An envelope study of a stack: the envelope with the beam's current and emittance, and the same start
 * with zero current (emittance only) and with zero emittance (space charge only), so users see which
 * dominates; bore clearances and warnings for the full envelope.
 *
 * @param request                   what was asked
 * @param zStart_m                  start plane used, m
 * @param zEnd_m                    end plane asked for, m
 * @param betaGammaStart            beta gamma at the start plane
 * @param normalisedEmittance_m_rad normalised edge emittance, m rad
 * @param startPerveance            generalised perveance K at the start plane
 * @param spaceChargeRatio          K R^2 / eps^2 at the start (space-charge over emittance term; &gt; 1 means
 *                                  space-charge dominated); empty when the emittance is zero
 * @param full                      current and emittance
 * @param emittanceOnly             zero current
 * @param spaceChargeOnly           zero emittance
 * @param screenZ_m                 the stack's screen, if any, m
 * @param screenRadius_m            full-envelope radius at the screen, if the envelope reaches it, m
 * @param clearances                per electrode, in stack order
 * @param warnings                  for the full envelope
 */
public record EnvelopeStudyResult(EnvelopeRequest request, double zStart_m, double zEnd_m, double betaGammaStart,
        double normalisedEmittance_m_rad, double startPerveance, OptionalDouble spaceChargeRatio, EnvelopeCurve full,
        EnvelopeCurve emittanceOnly, EnvelopeCurve spaceChargeOnly, OptionalDouble screenZ_m,
        OptionalDouble screenRadius_m, List<BoreClearance> clearances, List<EnvelopeWarning> warnings) {

    public EnvelopeStudyResult {
        clearances = List.copyOf(clearances);
        warnings = List.copyOf(warnings);
    }

    /** True when a warning needs action (hit, reflection, closed axis, failed integration). */
    public boolean blocking() {
        return warnings.stream().anyMatch(w -> w.kind().blocking());
    }

    /** One-line verdict on which effect dominates at the start plane. */
    public String dominance() {
        if (request.current_A() == 0) {
            return "no current: emittance only";
        }
        if (spaceChargeRatio.isEmpty()) {
            return "zero emittance: space charge only";
        }
        double x = spaceChargeRatio.getAsDouble();
        return x > 1 ? BeamMessages.fmt("space-charge dominated (K R^2/eps^2 = %.3g at the start)", x)
                : BeamMessages.fmt("emittance dominated (K R^2/eps^2 = %.3g at the start)", x);
    }
}
