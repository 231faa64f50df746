package org.axistack.tune;

import org.axistack.field.BiasedField;
import org.axistack.field.FieldSolution;
import org.axistack.model.Stack;
import org.axistack.optics.AccelerationPotential;
import org.axistack.optics.ParaxialOptics;
import org.axistack.optics.ParaxialSettings;
import org.axistack.optics.ReflectionException;
import org.axistack.optics.StartPlaneException;
import org.axistack.optics.TransferMatrix;

/**
 * The focusing condition as a continuous function of the biases, for root finding: the paraxial ray that
 * starts at the object (the ray entering parallel at unit height for an object at infinity; the axial ray at
 * unit slope, scaled by the object-image distance, for a finite object) has height {@link Point#miss} at the
 * image plane, traced in the full field between the real planes (the beam start or the object, and the image
 * plane; an open lens's far field included). It is zero exactly when the real ray crosses the axis there, and
 * unlike the image position it has no pole where the lens passes
 * through afocal. Optics by {@link ParaxialOptics#of(org.axistack.field.AxialField, Stack)}, the same
 * reference planes the {@code optics} command uses; biases re-applied by superposition
 * ({@link FieldSolution#withBiases}), never a new field solve. Thread-safe.
 */
final class FocusProbe {

    private final FieldSolution solution;
    private final Stack stack;
    private final FocusTarget target;
    private final ParaxialSettings settings;
    private final double[] searchRange;

    /** A probe with the optics command's default settings (the results agree with {@code optics} runs). */
    FocusProbe(FieldSolution solution, Stack stack, FocusTarget target) {
        this(solution, stack, target, ParaxialSettings.defaults());
    }

    /** A probe with other numerical settings (e.g. a looser tolerance for a bracket scan). */
    FocusProbe(FieldSolution solution, Stack stack, FocusTarget target, ParaxialSettings settings) {
        this.solution = solution;
        this.stack = stack;
        this.target = target;
        this.settings = settings;
        this.searchRange = ParaxialOptics.searchRange_m(stack);
    }

    /** Looser settings for scanning: relative tolerance 1e-7 and 200 axis samples (the plane search is unchanged in kind). */
    static ParaxialSettings scanSettings() {
        return ParaxialSettings.defaults().withRelativeTolerance(1e-7).withScanPoints(200);
    }

    FocusTarget target() {
        return target;
    }

    /**
     * One evaluation.
     *
     * @param field biased field
     * @param optics optics of that field (null after a reflection)
     * @param miss  height of the probe ray at the image plane (dimensionless, 1 without a lens), NaN after a
     *              reflection
     * @param imageZ_m where the ray meets the axis, from its height and slope at the image plane (exact beyond the
     *              field, linearised at the plane inside it); NaN after a reflection, infinite when it leaves parallel
     */
    record Point(double[] biases_V, BiasedField field, ParaxialOptics optics, double miss, double imageZ_m) {
        boolean valid() {
            return optics != null;
        }
    }

    Point at(double[] biases_V) {
        BiasedField field = solution.withBiases(biases_V);
        ParaxialOptics optics;
        try {
            optics = ParaxialOptics.auto(new AccelerationPotential(field, stack.beam()), searchRange[0], searchRange[1],
                    stack.beam().startZ_m(), settings);
        } catch (ReflectionException | StartPlaneException e) {
            // a mirror, or reference planes that no longer enclose the beam start: no optics at these biases
            return new Point(biases_V, field, null, Double.NaN, Double.NaN);
        }
        double z = target.imageZ_m();
        double height;
        double slope;
        if (target.objectAtInfinity()) {
            // a parallel beam: parallel where the beam really starts, else along its asymptote from infinity
            TransferMatrix t = stack.beam().startZ_m().isPresent()
                    ? optics.transfer(stack.beam().startZ_m().getAsDouble(), z) : optics.fromObjectAsymptote(z);
            height = t.a();
            slope = t.c();
        } else {
            double zo = target.objectZ_m().getAsDouble();
            TransferMatrix t = optics.transfer(zo, z);
            double scale = z - zo;
            height = t.b() / scale;
            slope = t.d() / scale;
        }
        double image = slope == 0 ? Double.POSITIVE_INFINITY : z - height / slope;
        return new Point(biases_V, field, optics, height, image);
    }
}
