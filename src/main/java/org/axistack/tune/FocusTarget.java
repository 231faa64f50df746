package org.axistack.tune;

import org.axistack.model.PhysicsMessage;
import java.util.OptionalDouble;

/**
 * Where the beam must be focused: the image plane and the object it images (an object at infinity, i.e. a
 * parallel beam, when objectZ is empty). Stack z coordinates, m.
 *
 * @param imageZ_m  the plane the object must be imaged onto, m
 * @param objectZ_m the axial object point, m; empty for an object at infinity
 */
public record FocusTarget(double imageZ_m, OptionalDouble objectZ_m) {

    public FocusTarget {
        if (!Double.isFinite(imageZ_m)) {
            throw PhysicsMessage.IMAGE_PLANE.exception("z", imageZ_m * 1e3);
        }
        objectZ_m = objectZ_m == null ? OptionalDouble.empty() : objectZ_m;
        if (objectZ_m.isPresent() && !(objectZ_m.getAsDouble() < imageZ_m)) {
            throw PhysicsMessage.OBJECT_AFTER_IMAGE.exception("object", objectZ_m.getAsDouble() * 1e3, "image", imageZ_m * 1e3);
        }
    }

    public static FocusTarget parallelBeam(double imageZ_m) {
        return new FocusTarget(imageZ_m, OptionalDouble.empty());
    }

    public static FocusTarget object(double objectZ_m, double imageZ_m) {
        return new FocusTarget(imageZ_m, OptionalDouble.of(objectZ_m));
    }

    public boolean objectAtInfinity() {
        return objectZ_m.isEmpty();
    }
}
