package org.axistack.trace;

import java.util.List;

import org.axistack.model.Electrode;

/**
 * Test fixture: a lens made of three charged rings (demo data, our own): a central ring of radius
 * 5 mm whose own centre potential is -400 V (for electrons of 1 keV: a decelerating einzel-type
 * lens) flanked by two rings at +-8 mm carrying half the opposite charge, so the total charge is zero
 * and the axial potential falls off fast. The rings are also electrodes (thin wire loops) for the
 * hit tests.
 */
record RingLens(RingChargeField field, ElectrodeGeometry geometry, double sign) {

    static RingLens standard() {
        return build(1, -400);
    }

    /** The same geometry with the central ring's own centre potential set to v0 (V). */
    static RingLens withCentre(double v0_V) {
        return build(1, v0_V);
    }

    RingLens withSign(double s) {
        return build(s, -400);
    }

    private static RingLens build(double s, double v0) {
        double a = 5e-3;
        double q = s * RingChargeField.chargeForCentrePotential(a, v0);
        RingChargeField f = new RingChargeField(new double[] {-8e-3, 0, 8e-3}, new double[] {a, a, a},
                new double[] {-q / 2, q, -q / 2});
        List<Electrode> wires = List.of(new Electrode.Ring("left", 0, -8e-3, a, 0.3e-3),
                new Electrode.Ring("centre", 0, 0, a, 0.3e-3), new Electrode.Ring("right", 0, 8e-3, a, 0.3e-3));
        return new RingLens(f, new ElectrodeGeometry(wires, -0.05, 0.1, 0.02), s);
    }
}
