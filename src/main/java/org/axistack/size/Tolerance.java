package org.axistack.size;

/**
 * Sensitivity of the image position to one machining dimension or bias.
 *
 * @param name              dimension name ("gap_in", "bore_radius", ...) or "bias of NAME"
 * @param bias              whether it is a bias (per volt) rather than a length (per 0.01 mm)
 * @param imageShift_m      image shift per 0.01 mm of the dimension, or per volt of the bias, m
 */
public record Tolerance(String name, boolean bias, double imageShift_m) {
}
