package org.axistack.optics;

import java.util.OptionalDouble;

/**
 * Paraxial imaging of an axial object point at a finite position (stack z, m). The image is the asymptotic
 * one (where the outgoing asymptote of the axial ray crosses the axis); where the real ray crosses the axis
 * inside the field region that crossing is given too.
 *
 * @param objectZ_m             object plane, m
 * @param imageZ_m              asymptotic image plane, m (infinite when the image is at infinity)
 * @param lateralMagnification  image height / object height
 * @param angularMagnification  image-side slope / object-side slope of the axial ray
 * @param realImageZ_m          first real crossing of the axial ray after the object, if any
 * @param objectToImage         transfer matrix from the object plane to the image plane
 */
public record Imaging(double objectZ_m, double imageZ_m, double lateralMagnification, double angularMagnification,
        OptionalDouble realImageZ_m, TransferMatrix objectToImage) {
}
