package org.axistack.size;

import java.util.OptionalDouble;

import org.axistack.optics.ParaxialOptics;
import org.axistack.optics.TransferMatrix;

/**
 * A focusing condition as a function that is continuous in the bias and zero where it is met (no poles, unlike
 * the image position, which jumps through infinity): for a finite object the 1-2 element of the object-to-image
 * transfer matrix (the axial ray meets the axis at the image plane), for a parallel beam the 1-1 element from
 * the entrance plane to the image plane, for a focal length 1 - f/f2 through the 2-1 element c = -1/f2.
 * All values dimensionless.
 *
 * @param objectZ_m     object point, m (empty: parallel beam)
 * @param imageZ_m      image plane, m (empty when a focal length is asked for)
 * @param focalLength_m image-side focal length asked for, m (empty when an image plane is given)
 */
public record FocusCondition(OptionalDouble objectZ_m, OptionalDouble imageZ_m, OptionalDouble focalLength_m) {

    public static FocusCondition of(Requirements r) {
        return new FocusCondition(r.objectZ_m(), r.imageZ_m(), r.focalLength_m());
    }

    /** The residual for a lens; zero when the condition is met. */
    public double residual(ParaxialOptics optics) {
        if (focalLength_m.isPresent()) {
            TransferMatrix t = optics.asymptoticTransfer();
            return 1 + t.c() * focalLength_m.getAsDouble();
        }
        double zi = imageZ_m.getAsDouble();
        if (objectZ_m.isPresent()) {
            double zo = objectZ_m.getAsDouble();
            return optics.transfer(zo, zi).b() / (zi - zo);
        }
        return optics.fromObjectAsymptote(zi).a();
    }
}
