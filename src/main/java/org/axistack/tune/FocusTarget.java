package org.axistack.tune;

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
            throw new IllegalArgumentException("image plane must be finite: " + imageZ_m);
        }
        objectZ_m = objectZ_m == null ? OptionalDouble.empty() : objectZ_m;
        if (objectZ_m.isPresent() && !(objectZ_m.getAsDouble() < imageZ_m)) {
            throw new IllegalArgumentException("the object must lie before the image plane: object "
                    + objectZ_m.getAsDouble() + " m, image " + imageZ_m + " m");
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
