package org.axistack.tune;

/**
 * Optical properties at one bias of a sweep (SI; NaN where undefined: afocal lens, no finite object, or the beam
 * turned back).
 *
 * @param bias_V                 the swept electrode's bias, V
 * @param status                 "ok", "reflected" (the beam turns back: a mirror) or "no planes" (no field-free
 *                               start plane)
 * @param focalLengthObject_m    f1, m
 * @param focalLengthImage_m     f2, m
 * @param focalPointObjectZ_m    F1, m
 * @param focalPointImageZ_m     F2, m
 * @param principalPlaneObjectZ_m H1, m
 * @param principalPlaneImageZ_m  H2, m
 * @param imageZ_m               asymptotic image of the finite object, m
 * @param magnification          its lateral magnification
 * @param sphericalAberration_m  Cs (image side; object side conventions as the optics command), m
 * @param chromaticAberration_m  Cc, m
 * @param realImageZ_m           real image of the finite object (first axis crossing of its axial ray traced in the
 *                               full field), m
 * @param errorEstimate          estimated relative error of the cardinal elements (of f)
 */
public record SweepPoint(double bias_V, String status, double focalLengthObject_m, double focalLengthImage_m,
        double focalPointObjectZ_m, double focalPointImageZ_m, double principalPlaneObjectZ_m,
        double principalPlaneImageZ_m, double imageZ_m, double magnification, double sphericalAberration_m,
        double chromaticAberration_m, double realImageZ_m, double errorEstimate) {

    public boolean ok() {
        return "ok".equals(status);
    }

    static SweepPoint failed(double bias_V, String status) {
        double n = Double.NaN;
        return new SweepPoint(bias_V, status, n, n, n, n, n, n, n, n, n, n, n, n);
    }
}
