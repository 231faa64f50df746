package org.axistack.tune;

import org.axistack.model.PhysicsMessage;
import org.axistack.optics.ParaxialOptics;

/** The second condition solved together with the image position when two electrodes are varied. */
public sealed interface SecondCondition permits SecondCondition.Magnification, SecondCondition.FocalLength {

    /** Residual of this condition at an evaluated bias set, dimensionless, continuous in the biases. */
    double residual(ParaxialOptics optics, FocusTarget target);

    /** The achieved value (magnification, or focal length in m) at an evaluated bias set. */
    double achieved(ParaxialOptics optics, FocusTarget target);

    /** Target value (magnification, or focal length in m). */
    double value();

    /**
     * Lateral magnification of a finite object at the image plane (negative: inverted real image). Residual
     * (M - target)/max(|target|, 0.1).
     */
    record Magnification(double value) implements SecondCondition {
        public Magnification {
            if (!Double.isFinite(value) || value == 0) {
                throw PhysicsMessage.MAGNIFICATION_VALUE.exception("value", value);
            }
        }

        @Override
        public double residual(ParaxialOptics optics, FocusTarget target) {
            return (achieved(optics, target) - value) / Math.max(Math.abs(value), 0.1);
        }

        @Override
        public double achieved(ParaxialOptics optics, FocusTarget target) {
            return optics.transfer(target.objectZ_m().getAsDouble(), target.imageZ_m()).a();
        }
    }

    /**
     * Image-side focal length f2, m (positive when converging). Residual target/f2 - 1 = -target c - 1 (c the
     * lens matrix element, -1/f2), which has no pole where the lens passes through afocal.
     */
    record FocalLength(double value) implements SecondCondition {
        public FocalLength {
            if (!Double.isFinite(value) || value == 0) {
                throw PhysicsMessage.FOCAL_LENGTH_VALUE.exception("value", value * 1e3);
            }
        }

        @Override
        public double residual(ParaxialOptics optics, FocusTarget target) {
            double c = optics.transfer(optics.zStart_m(), optics.zEnd_m()).c();
            return -value * c - 1;
        }

        @Override
        public double achieved(ParaxialOptics optics, FocusTarget target) {
            return -1 / optics.transfer(optics.zStart_m(), optics.zEnd_m()).c();
        }
    }
}
