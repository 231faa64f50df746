package org.axistack.ode;

import java.util.function.ToDoubleFunction;

import org.hipparchus.analysis.UnivariateFunction;
import org.hipparchus.analysis.solvers.BracketedUnivariateSolver;
import org.hipparchus.ode.ODEStateAndDerivative;
import org.hipparchus.ode.events.AdaptableInterval;
import org.hipparchus.ode.events.ODEEventDetector;
import org.hipparchus.ode.events.ODEEventHandler;

/**
 * An event for a Hipparchus integrator given as a plain switching function g(state), whose zero
 * crossings are the events: the integrator checks g at most {@code interval} apart and locates each
 * sign change with the given bracketing solver (Hipparchus' event handling; the method of
 * L. F. Shampine and others, "Event location for ordinary differential equations", 2000). One adapter
 * for every package that integrates with events (ray tracing, envelopes).
 */
public final class SwitchingFunction implements ODEEventDetector {

    /** Largest number of solver iterations per event. */
    public static final int MAX_ITERATIONS = 200;

    private final ToDoubleFunction<ODEStateAndDerivative> g;
    private final ODEEventHandler handler;
    private final AdaptableInterval interval;
    private final BracketedUnivariateSolver<UnivariateFunction> solver;

    /**
     * @param g        the switching function; its zero crossings are the events
     * @param handler  what to do at an event
     * @param interval largest step of the independent variable between two checks of g
     * @param solver   the root solver that locates a crossing once it is bracketed
     */
    public SwitchingFunction(ToDoubleFunction<ODEStateAndDerivative> g, ODEEventHandler handler,
            AdaptableInterval interval, BracketedUnivariateSolver<UnivariateFunction> solver) {
        this.g = g;
        this.handler = handler;
        this.interval = interval;
        this.solver = solver;
    }

    @Override
    public AdaptableInterval getMaxCheckInterval() {
        return interval;
    }

    @Override
    public int getMaxIterationCount() {
        return MAX_ITERATIONS;
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
