package org.axistack.optics;

import java.util.ArrayList;
import java.util.List;

import org.hipparchus.ode.sampling.ODEStateInterpolator;
import org.hipparchus.ode.sampling.ODEStepHandler;

/**
 * Dense output of one forward integration: the integrator's step interpolators (immutable in Hipparchus) and
 * their end times, searched by bisection without shared mutable state, so any number of threads may read it
 * (Hipparchus' own DenseOutputModel caches the last step index in a field and is not safe for that).
 */
final class StepStore implements ODEStepHandler {

    private final List<ODEStateInterpolator> steps = new ArrayList<>();
    private double[] ends;
    private ODEStateInterpolator[] frozen;

    @Override
    public void handleStep(ODEStateInterpolator interpolator) {
        steps.add(interpolator);
    }

    /** Called once after the integration; the store is read-only afterwards. */
    StepStore freeze() {
        frozen = steps.toArray(new ODEStateInterpolator[0]);
        ends = new double[frozen.length];
        for (int i = 0; i < frozen.length; i++) {
            ends[i] = frozen[i].getCurrentState().getTime();
        }
        return this;
    }

    /** The state vector at t (clamped to the integrated range). */
    double[] state(double t) {
        int lo = 0;
        int hi = ends.length - 1;
        while (lo < hi) {
            int mid = (lo + hi) >>> 1;
            if (ends[mid] < t) {
                lo = mid + 1;
            } else {
                hi = mid;
            }
        }
        ODEStateInterpolator step = frozen[lo];
        double start = step.getPreviousState().getTime();
        double tc = Math.min(Math.max(t, start), ends[lo]);
        return step.getInterpolatedState(tc).getPrimaryState();
    }
}
