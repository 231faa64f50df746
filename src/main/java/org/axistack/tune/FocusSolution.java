package org.axistack.tune;

import org.axistack.optics.CardinalElements;

/**
 * One bias setting that images the object onto the target plane.
 *
 * @param electrode            name of the electrode that was varied
 * @param bias_V               its bias, V
 * @param biases_V             all biases (electrode order), V
 * @param mode                 whether the varied electrode slows the particles down or speeds them up
 * @param imageZ_m             image position achieved at this bias, m (equals the target to the root finder's
 *                             tolerance)
 * @param magnification        lateral magnification for a finite object; NaN for an object at infinity
 * @param cardinal             cardinal elements at this bias
 * @param maxSurfaceField_V_per_m largest electrode surface field, V/m
 * @param surfaceFields_V_per_m   largest surface field on each electrode (electrode order), V/m
 * @param worstElectrode       electrode carrying the largest surface field
 * @param surfaceFieldCheck    verdict against the stack's limits
 * @param axisCrossings        real crossings of the probe ray before the image plane (0: direct image; more:
 *                             the beam crosses over inside the lens first)
 */
public record FocusSolution(String electrode, double bias_V, double[] biases_V, Mode mode, double imageZ_m,
        double magnification, CardinalElements cardinal, double maxSurfaceField_V_per_m,
        double[] surfaceFields_V_per_m, String worstElectrode, SurfaceFieldCheck surfaceFieldCheck,
        int axisCrossings) {

    /** Energy inside the varied electrode relative to the beam energy. */
    public enum Mode {
        /** The electrode's potential slows the particles (einzel "decelerating" or retarding mode). */
        DECELERATING,
        /** The electrode's potential speeds the particles up. */
        ACCELERATING
    }

    public FocusSolution {
        biases_V = biases_V.clone();
        surfaceFields_V_per_m = surfaceFields_V_per_m.clone();
    }

    @Override
    public double[] biases_V() {
        return biases_V.clone();
    }

    @Override
    public double[] surfaceFields_V_per_m() {
        return surfaceFields_V_per_m.clone();
    }
}
