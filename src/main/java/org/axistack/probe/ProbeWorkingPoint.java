package org.axistack.probe;

import java.util.List;
import java.util.OptionalDouble;

import org.axistack.model.PhysicsMessage;
import org.axistack.model.Particle;
import org.axistack.optics.AberrationPolynomials;
import org.axistack.optics.CardinalElements;
import org.axistack.optics.ParaxialOptics;

/**
 * One lens setting whose probe is planned: its biases, where the probe forms and the lens data of the probe model.
 *
 * @param label     what the setting is ("biases as given", "focus on the screen, focus = -120.3 V")
 * @param biases_V  all electrode biases, V (stack order)
 * @param probeZ_m  where the probe forms: the asymptotic image of the object (F2 for an object at infinity), m
 * @param lens      the lens data for {@link ProbeModel}
 */
public record ProbeWorkingPoint(String label, List<Double> biases_V, double probeZ_m, ProbeLens lens) {

    public ProbeWorkingPoint {
        biases_V = List.copyOf(biases_V);
    }

    /**
     * The lens data of a paraxial optics for an object at objectZ (empty: at infinity): image-side Cs_i and Cc_i from
     * {@link AberrationPolynomials} at the object's magnification (the object must lie at or before the object-side
     * reference plane), U on the image side (at infinity on an open side), the magnification.
     *
     * @throws org.axistack.model.PhysicsException when the lens is not converging, or the object lies inside the field
     */
    public static ProbeWorkingPoint of(String label, double[] biases_V, ParaxialOptics optics, OptionalDouble objectZ_m,
            Particle particle) {
        CardinalElements c = optics.cardinal();
        if (c.kind() != CardinalElements.Kind.CONVERGING) {
            throw PhysicsMessage.PROBE_NOT_CONVERGING.exception("kind", c.kind().name().toLowerCase(java.util.Locale.ROOT));
        }
        AberrationPolynomials poly = AberrationPolynomials.of(optics);
        double m = 0;
        double probeZ = c.focalPointImageZ_m();
        if (objectZ_m.isPresent()) {
            double zo = objectZ_m.getAsDouble();
            if (zo > optics.zStart_m()) {
                throw PhysicsMessage.PROBE_OBJECT_IN_FIELD.exception("z", zo * 1e3, "plane", optics.zStart_m() * 1e3);
            }
            m = c.magnification(zo);
            probeZ = c.imageZ_m(zo);
            if (!(m < 0) || !Double.isFinite(probeZ)) {
                throw PhysicsMessage.PROBE_NO_REAL_IMAGE.exception("z", zo * 1e3, "m", m);
            }
        }
        double uImage = c.uImage_V(); // at infinity on an open image side
        ProbeLens lens = new ProbeLens(poly.sphericalImage_m(m), poly.chromaticImage_m(m), particle, uImage,
                objectZ_m.isPresent() ? m : Double.NaN);
        Double[] boxed = new Double[biases_V.length];
        for (int i = 0; i < boxed.length; i++) {
            boxed[i] = biases_V[i];
        }
        return new ProbeWorkingPoint(label, List.of(boxed), probeZ, lens);
    }
}
