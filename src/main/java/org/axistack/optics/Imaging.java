package org.axistack.optics;

import java.util.OptionalDouble;

/**
 * Paraxial imaging of an axial object point at a finite position (stack z, m). The image is the asymptotic
 * one (where the outgoing asymptote of the axial ray crosses the axis); the real image is where the axial ray,
 * traced in the full field, first crosses the axis again.
 *
 * @param objectZ_m             object plane, m
 * @param imageZ_m              asymptotic image plane, m (infinite when the image is at infinity)
 * @param lateralMagnification  image height / object height
 * @param angularMagnification  image-side slope / object-side slope of the axial ray
 * @param realImageZ_m          first real crossing of the axial ray after the object, if any
 * @param objectToImage         transfer matrix from the object plane to the (asymptotic) image plane
 * @param realLateralMagnification height of the real ray at the real image over the object height (NaN when the
 *                              axial ray never crosses the axis again)
 */
public record Imaging(double objectZ_m, double imageZ_m, double lateralMagnification, double angularMagnification,
        OptionalDouble realImageZ_m, TransferMatrix objectToImage, double realLateralMagnification) {
}
