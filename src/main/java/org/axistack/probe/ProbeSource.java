package org.axistack.probe;

import org.axistack.model.PhysicsMessage;
import java.util.OptionalDouble;

/**
 * The particle source as the probe model sees it.
 *
 * @param reducedBrightness_A_per_m2_sr_V B_r = B / U*, with B = dI / (dA dOmega) and the area counted inside the
 *                                        FW50 diameter of the source image (so I = B_r U* (pi d50^2/4)(pi a^2)
 *                                        for a probe of current I, FW50 source image d50 and aperture half-angle a)
 * @param energySpread_eV                 FWHM of the kinetic-energy distribution (taken as Gaussian), eV, &gt;= 0
 * @param virtualSourceSize_m             FW50 diameter of the virtual source, m, when known: the probe then has
 *                                        the lens's fixed magnification and the aperture angle follows from the
 *                                        current; when absent, the magnification is taken as free (a column with
 *                                        a zoom condenser) and the aperture angle is optimised at each current
 */
public record ProbeSource(double reducedBrightness_A_per_m2_sr_V, double energySpread_eV, OptionalDouble virtualSourceSize_m) {

    public ProbeSource {
        if (!(reducedBrightness_A_per_m2_sr_V > 0) || !Double.isFinite(reducedBrightness_A_per_m2_sr_V)) {
            throw PhysicsMessage.PROBE_BRIGHTNESS.exception("value", reducedBrightness_A_per_m2_sr_V);
        }
        if (!(energySpread_eV >= 0) || !Double.isFinite(energySpread_eV)) {
            throw PhysicsMessage.PROBE_ENERGY_SPREAD.exception("value", energySpread_eV);
        }
        if (virtualSourceSize_m.isPresent() && !(virtualSourceSize_m.getAsDouble() > 0
                && Double.isFinite(virtualSourceSize_m.getAsDouble()))) {
            throw PhysicsMessage.PROBE_SOURCE_SIZE.exception("value", virtualSourceSize_m.getAsDouble() * 1e9);
        }
    }
}
