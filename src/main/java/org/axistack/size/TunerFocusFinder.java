package org.axistack.size;

import org.axistack.field.FieldSolution;
import org.axistack.model.Stack;
import org.axistack.tune.BiasRange;
import org.axistack.tune.BiasTuner;
import org.axistack.tune.FocusSolution;
import org.axistack.tune.FocusTarget;

/**
 * Focusing biases from the project's bias tuner ({@link BiasTuner}: every bias in the range that images the
 * object onto the plane). A focal-length condition, which the tuner does not pose, goes to a
 * {@link ScanFocusFinder}.
 */
public final class TunerFocusFinder implements FocusFinder {

    private final FocusFinder focalLength;

    public TunerFocusFinder(int samplesPerSign) {
        this.focalLength = new ScanFocusFinder(samplesPerSign);
    }

    @Override
    public double[] focusingBiases(FieldSolution solution, Stack stack, int electrode, FocusCondition c,
            double maxBias_V) {
        if (c.focalLength_m().isPresent()) {
            return focalLength.focusingBiases(solution, stack, electrode, c, maxBias_V);
        }
        FocusTarget t = new FocusTarget(c.imageZ_m().getAsDouble(), c.objectZ_m());
        return new BiasTuner(solution, stack)
                .focus(stack.electrodes().get(electrode).name(), t, new BiasRange(-maxBias_V, maxBias_V))
                .solutions().stream().mapToDouble(FocusSolution::bias_V).sorted().toArray();
    }
}
