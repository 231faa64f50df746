package org.axistack.tune;

import org.axistack.model.PhysicsMessage;
import java.util.Arrays;
import java.util.List;
import java.util.OptionalDouble;
import java.util.concurrent.CancellationException;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.stream.IntStream;

import org.axistack.field.FieldSolution;
import org.axistack.model.Biases;
import org.axistack.model.Stack;
import org.axistack.optics.Aberrations;
import org.axistack.optics.CardinalElements;
import org.axistack.optics.Imaging;
import org.axistack.optics.ParaxialOptics;
import org.axistack.optics.ReflectionException;
import org.axistack.optics.StartPlaneException;

/**
 * Optical properties against one electrode's bias: focal lengths, focal points, principal planes, image and
 * magnification of a finite object, Cs and Cc, at equally spaced biases. Every point is computed exactly as the
 * {@code optics} command computes it ({@link ParaxialOptics#of(org.axistack.field.AxialField, Stack)},
 * cardinal elements, imaging, aberration integrals), on the field re-biased by superposition of the stored unit
 * solutions ({@link FieldSolution#withBiases}; no new field solve). Points run in parallel on the common
 * fork-join pool; progress is reported and the sweep can be cancelled.
 */
public final class BiasSweep {

    /** Progress of a sweep; return false to cancel (the sweep then throws {@link CancellationException}). */
    @FunctionalInterface
    public interface Progress {
        boolean update(int done, int total);

        Progress NONE = (done, total) -> true;
    }

    private BiasSweep() {
    }

    /**
     * @param steps number of intervals (steps + 1 points, both ends included), at least 1
     */
    public static List<SweepPoint> run(FieldSolution solution, Stack stack, String electrode, double from_V,
            double to_V, int steps, OptionalDouble objectZ_m, Progress progress) {
        int index = stack.indexOf(electrode);
        if (index < 0) {
            throw PhysicsMessage.UNKNOWN_ELECTRODE.exception("name", electrode, "names", String.join(", ", stack.names()));
        }
        if (steps < 1 || !Double.isFinite(from_V) || !Double.isFinite(to_V) || from_V == to_V) {
            throw new IllegalArgumentException("a sweep needs finite, different ends and at least one step");
        }
        Biases base = stack.biases();
        int n = steps + 1;
        SweepPoint[] out = new SweepPoint[n];
        AtomicInteger done = new AtomicInteger();
        AtomicBoolean cancelled = new AtomicBoolean();
        IntStream.range(0, n).parallel().forEach(i -> {
            if (cancelled.get()) {
                return;
            }
            double v = i == steps ? to_V : from_V + (to_V - from_V) * i / steps;
            double[] b = base.with(electrode, v).toArray_V();
            out[i] = point(solution, stack, b, v, objectZ_m);
            int k = done.incrementAndGet();
            if (!progress.update(k, n)) {
                cancelled.set(true);
            }
        });
        if (cancelled.get()) {
            throw new CancellationException("sweep cancelled");
        }
        return Arrays.asList(out);
    }

    /** One point, computed as the optics command does. */
    static SweepPoint point(FieldSolution solution, Stack stack, double[] biases_V, double bias_V, OptionalDouble objectZ_m) {
        ParaxialOptics optics;
        try {
            optics = ParaxialOptics.of(solution.withBiases(biases_V), stack);
        } catch (ReflectionException e) {
            return SweepPoint.failed(bias_V, "reflected");
        } catch (StartPlaneException e) {
            return SweepPoint.failed(bias_V, "no planes");
        }
        CardinalElements c = optics.cardinal();
        double imageZ = Double.NaN;
        double m = Double.NaN;
        boolean finiteObject = objectZ_m.isPresent() && objectZ_m.getAsDouble() < optics.zEnd_m();
        double realImageZ = Double.NaN;
        Imaging im = null;
        if (finiteObject) {
            im = optics.imaging(objectZ_m.getAsDouble());
            imageZ = im.imageZ_m();
            m = im.lateralMagnification();
            realImageZ = im.realImageZ_m().orElse(Double.NaN);
        }
        double cs = Double.NaN;
        double cc = Double.NaN;
        java.util.Optional<Aberrations> ab = optics.quotedAberrations(java.util.Optional.ofNullable(im));
        if (ab.isPresent()) {
            cs = ab.get().sphericalImage_m();
            cc = ab.get().chromaticImage_m();
        }
        return new SweepPoint(bias_V, "ok", c.focalLengthObject_m(), c.focalLengthImage_m(), c.focalPointObjectZ_m(),
                c.focalPointImageZ_m(), c.principalPlaneObjectZ_m(), c.principalPlaneImageZ_m(), imageZ, m, cs, cc, realImageZ,
                c.errorEstimate());
    }
}
