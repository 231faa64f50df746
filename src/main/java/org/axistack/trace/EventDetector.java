package org.axistack.trace;

import java.util.function.ToDoubleFunction;

import org.hipparchus.analysis.UnivariateFunction;
import org.hipparchus.analysis.solvers.BracketedUnivariateSolver;
import org.hipparchus.analysis.solvers.BracketingNthOrderBrentSolver;
import org.hipparchus.ode.ODEStateAndDerivative;
import org.hipparchus.ode.events.AdaptableInterval;
import org.hipparchus.ode.events.ODEEventDetector;
import org.hipparchus.ode.events.ODEEventHandler;

/**
 * A switching function for the integrator's event search (root bracketing by the Brent-type
 * BracketingNthOrderBrentSolver of Hipparchus). The check interval adapts to the particle's speed
 * so that the particle moves at most a fixed distance between checks.
 */
final class EventDetector implements ODEEventDetector {

    private final ToDoubleFunction<ODEStateAndDerivative> g;
    private final ODEEventHandler handler;
    private final AdaptableInterval interval;
    private final BracketedUnivariateSolver<UnivariateFunction> solver;

    /**
     * @param g            the switching function; its zero crossings are the events
     * @param handler      what to do at an event
     * @param checkDist_m  largest distance moved between checks, m
     * @param accuracy_tau absolute accuracy of the event time, in light path (m)
     */
    EventDetector(ToDoubleFunction<ODEStateAndDerivative> g, ODEEventHandler handler, double checkDist_m,
            double accuracy_tau) {
        this.g = g;
        this.handler = handler;
        this.interval = (state, forward) -> {
            double[] s = state.getPrimaryState();
            double u2 = s[3] * s[3] + s[4] * s[4] + s[5] * s[5];
            double beta = Math.sqrt(u2 / (1 + u2));
            return checkDist_m / Math.max(beta, 1e-12);
        };
        this.solver = new BracketingNthOrderBrentSolver(1e-15, accuracy_tau, 0, 5);
    }

    @Override
    public AdaptableInterval getMaxCheckInterval() {
        return interval;
    }

    @Override
    public int getMaxIterationCount() {
        return 200;
    }

    @Override
    public BracketedUnivariateSolver<UnivariateFunction> getSolver() {
        return solver;
    }

    @Override
    public ODEEventHandler getHandler() {
        return handler;
    }

    @Override
    public double g(ODEStateAndDerivative state) {
        return g.applyAsDouble(state);
    }
}
