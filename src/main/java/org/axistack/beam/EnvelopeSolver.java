package org.axistack.beam;

import org.axistack.model.PhysicsMessage;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.concurrent.CancellationException;
import java.util.function.DoublePredicate;
import java.util.function.ToDoubleFunction;

import org.axistack.ode.SwitchingFunction;
import org.hipparchus.analysis.UnivariateFunction;
import org.hipparchus.analysis.solvers.BracketingNthOrderBrentSolver;
import org.hipparchus.exception.MathRuntimeException;
import org.hipparchus.ode.DenseOutputModel;
import org.hipparchus.ode.ODEState;
import org.hipparchus.ode.ODEStateAndDerivative;
import org.hipparchus.ode.OrdinaryDifferentialEquation;
import org.hipparchus.ode.events.Action;
import org.hipparchus.ode.events.AdaptableInterval;
import org.hipparchus.ode.events.ODEEventDetector;
import org.hipparchus.ode.events.ODEEventHandler;
import org.hipparchus.ode.nonstiff.DormandPrince853Integrator;
import org.hipparchus.ode.sampling.ODEStateInterpolator;
import org.hipparchus.ode.sampling.ODEStepHandler;

/**
 * Round-beam envelope equation with emittance and space charge (the Kapchinskij-Vladimirskij envelope
 * equation, I. M. Kapchinskij and V. V. Vladimirskij, Proc. Int. Conf. High-Energy Accelerators, CERN
 * 1959, p. 274; with acceleration as in M. Reiser, <i>Theory and Design of Charged Particle Beams</i>,
 * 2nd ed., Wiley 2008, eq. 4.83):
 * <pre>R'' + a(z) R' + kappa(z) R - K(z)/R - eps(z)^2/R^3 = 0,</pre>
 * a = gamma U'/(2U*), kappa = gamma U''/(4U*), K the generalised perveance and eps = eps_n/(beta gamma)
 * the geometric edge emittance. Integrated in z with the Dormand-Prince 8(5,3) method (E. Hairer,
 * S. P. Norsett and G. Wanner, <i>Solving Ordinary Differential Equations I</i>, 2nd ed., Springer 1993,
 * section II.10) from Hipparchus, with event detection for waists (R' = 0), reflection (U -&gt; 0) and
 * deep crossovers.
 *
 * <p>Deep crossovers: the repulsive terms keep R &gt; 0 but a nearly laminar beam can shrink by many
 * orders of magnitude. Below the floor radius Rf (a tiny fraction of the start radius) the external
 * terms a R' and kappa R are negligible over the crossover length (about 2 Rf/|R'|), and the remaining
 * equation R'' = K/R + eps^2/R^3 conserves R'^2/2 - K ln R + eps^2/(2 R^2). The solver therefore
 * reflects the slope (R' -&gt; -R') at Rf and takes the waist radius from that invariant; the relative
 * error in the slope after the crossover is of order Rf/R, below 1e-6 with the default floor.
 *
 * <p>With zero current and zero emittance the equation is linear; the solver then follows the signed
 * paraxial ray through the axis and reports |R| (axis crossings are waists of radius 0).
 */
public final class EnvelopeSolver {

    private static final double TINY = 1e-300;

    private final EnvelopeSettings settings;

    public EnvelopeSolver(EnvelopeSettings settings) {
        this.settings = settings;
    }

    public EnvelopeSolver() {
        this(EnvelopeSettings.defaults());
    }

    public EnvelopeSettings settings() {
        return settings;
    }

    /**
     * Integrates the envelope. Honours thread interruption (throws {@link CancellationException}).
     *
     * @throws IllegalArgumentException when the beam cannot exist at the start plane
     */
    public EnvelopeCurve solve(EnvelopeChannel channel, EnvelopeProblem p) {
        return solve(channel, p, f -> true);
    }

    /**
     * Integrates the envelope, telling {@code progress} the share of the range done after every step (return false
     * to cancel: the solver then throws {@link CancellationException}, as it does on thread interruption).
     *
     * @throws IllegalArgumentException when the beam cannot exist at the start plane
     */
    public EnvelopeCurve solve(EnvelopeChannel channel, EnvelopeProblem p, DoublePredicate progress) {
        double[] c0 = new double[3];
        channel.coefficients(p.zStart_m(), c0);
        double bg2Start = c0[EnvelopeChannel.BETA_GAMMA_SQUARED];
        double v0 = channel.restPotential_V();
        if (!(bg2Start > 0)) {
            // U from (beta gamma)^2 = 2U* / V0, U* = U(1 + U/(2V0)): U = V0 (sqrt(1 + (beta gamma)^2) - 1)
            double u = v0 * (Math.sqrt(Math.max(0, 1 + bg2Start)) - 1);
            throw PhysicsMessage.NOT_REACHING_START.exception("z", p.zStart_m() * 1e3, "energy", u);
        }
        Run run = new Run(channel, p, bg2Start * settings.reflectionFraction(), progress);
        return run.integrate();
    }

    /** State of one integration. */
    private final class Run implements OrdinaryDifferentialEquation {
        final EnvelopeChannel channel;
        final EnvelopeProblem p;
        final double bg2Floor;
        final double length;
        final double floor;
        final boolean linear;
        final double perveanceFactor;
        final double[] c = new double[3];
        final List<Waist> waists = new ArrayList<>();
        Termination termination;
        double lastCrossover_m = Double.NaN;
        final DoublePredicate progress;

        Run(EnvelopeChannel channel, EnvelopeProblem p, double bg2Floor, DoublePredicate progress) {
            this.progress = progress;
            this.channel = channel;
            this.p = p;
            this.bg2Floor = bg2Floor;
            this.length = p.zEnd_m() - p.zStart_m();
            this.floor = settings.floorFraction() * p.radius_m();
            this.linear = p.isLinear();
            this.perveanceFactor = BeamKinematics.perveance(p.current_A(), channel.restPotential_V(), 1.0);
        }

        @Override
        public int getDimension() {
            return 2;
        }

        /** Perveance K and geometric emittance at z into out[0], out[1]; returns a and kappa in c. */
        void local(double z, double[] out) {
            channel.coefficients(z, c);
            double bg = Math.sqrt(Math.max(c[EnvelopeChannel.BETA_GAMMA_SQUARED], bg2Floor));
            out[0] = perveanceFactor / (bg * bg * bg);
            out[1] = p.normalisedEmittance_m_rad() / bg;
        }

        @Override
        public double[] computeDerivatives(double z, double[] y) {
            double r = y[0];
            double rp = y[1];
            if (linear) {
                channel.coefficients(z, c);
                return new double[] {rp, -c[EnvelopeChannel.DAMPING] * rp - c[EnvelopeChannel.FOCUSING] * r};
            }
            double[] ke = new double[2];
            local(z, ke);
            double rs = Math.max(r, 0.5 * floor);
            double acc = -c[EnvelopeChannel.DAMPING] * rp - c[EnvelopeChannel.FOCUSING] * r + ke[0] / rs
                    + ke[1] * ke[1] / (rs * rs * rs);
            return new double[] {rp, acc};
        }

        EnvelopeCurve integrate() {
            double rScale = p.radius_m() > 0 ? p.radius_m() : Math.max(Math.abs(p.slope_rad()) * length, 1e-12);
            double tol = settings.absoluteTolerance();
            double[] abs = {tol * rScale, tol * rScale / length};
            double[] rel = {settings.relativeTolerance(), settings.relativeTolerance()};
            double maxStep = length / 200;
            DormandPrince853Integrator integ = new DormandPrince853Integrator(1e-15 * length, maxStep, abs, rel);
            integ.setMaxEvaluations(5_000_000);
            DenseOutputModel dense = new DenseOutputModel();
            integ.addStepHandler(dense);
            integ.addStepHandler(new ODEStepHandler() {
                @Override
                public void handleStep(ODEStateInterpolator interpolator) {
                    double done = (interpolator.getCurrentState().getTime() - p.zStart_m()) / length;
                    if (Thread.currentThread().isInterrupted() || !progress.test(Math.max(0, Math.min(1, done)))) {
                        throw new CancellationException("envelope calculation cancelled");
                    }
                }
            });
            double check = maxStep / 4;
            integ.addEventDetector(detector(check, s -> {
                channel.coefficients(s.getTime(), c);
                return c[EnvelopeChannel.BETA_GAMMA_SQUARED] - bg2Floor;
            }, (s, d, increasing) -> {
                if (increasing) {
                    return Action.CONTINUE;
                }
                termination = new Termination(Termination.Kind.REFLECTED, s.getTime(), BeamMessages.fmt(
                        "the beam's kinetic energy falls below %.3g of its start value at z = %.6g mm: it turns back "
                        + "(electrostatic mirror); the envelope beyond is not computed",
                        settings.reflectionFraction(), s.getTime() * 1e3));
                return Action.STOP;
            }));
            // the tiny offsets keep the g functions away from exact zero when R' or R vanish identically
            // (a parallel ray in a drift), which would stall the root finder; they move a waist by ~1e-300 rad
            integ.addEventDetector(detector(check, s -> s.getPrimaryState()[1] - TINY, (s, d, increasing) -> {
                double r = s.getPrimaryState()[0];
                boolean minimum = linear ? (r > 0) == increasing : increasing;
                boolean atCrossover = Math.abs(s.getTime() - lastCrossover_m) <= 1e-9 * length;
                if (minimum && !atCrossover && s.getTime() > p.zStart_m() + 1e-9 * length) {
                    waists.add(new Waist(s.getTime(), Math.abs(r), Waist.Kind.SMOOTH));
                }
                return Action.CONTINUE;
            }));
            if (linear) {
                integ.addEventDetector(detector(check, s -> s.getPrimaryState()[0] - TINY, (s, d, increasing) -> {
                    if (s.getTime() > p.zStart_m() + 1e-9 * length) {
                        waists.add(new Waist(s.getTime(), 0, Waist.Kind.AXIS_CROSSING));
                    }
                    return Action.CONTINUE;
                }));
            } else {
                integ.addEventDetector(detector(check, s -> s.getPrimaryState()[0] - floor, new ODEEventHandler() {
                    @Override
                    public Action eventOccurred(ODEStateAndDerivative s, ODEEventDetector d, boolean increasing) {
                        return increasing ? Action.CONTINUE : Action.RESET_STATE;
                    }

                    @Override
                    public ODEState resetState(ODEEventDetector d, ODEStateAndDerivative s) {
                        double[] y = s.getPrimaryState();
                        double[] ke = new double[2];
                        local(s.getTime(), ke);
                        waists.add(new Waist(s.getTime(), crossoverRadius(floor, y[1], ke[0], ke[1]),
                                Waist.Kind.CROSSOVER));
                        lastCrossover_m = s.getTime();
                        return new ODEState(s.getTime(), new double[] {floor, -y[1]});
                    }
                }));
            }
            ODEState start = new ODEState(p.zStart_m(), new double[] {p.radius_m(), p.slope_rad()});
            boolean stepped = false;
            try {
                ODEStateAndDerivative end = integ.integrate(this, start, p.zEnd_m());
                stepped = true;
                if (termination == null) {
                    termination = new Termination(Termination.Kind.END_PLANE, end.getTime(), "end plane reached");
                }
            } catch (MathRuntimeException e) {
                double z = p.zStart_m();
                try {
                    z = dense.getFinalTime();
                    stepped = true;
                } catch (RuntimeException none) {
                    stepped = false;
                }
                termination = new Termination(Termination.Kind.FAILED, z, BeamMessages.fmt(
                        "the envelope integrator stopped at z = %.6g mm: %s", z * 1e3, e.getLocalizedMessage()));
            }
            waists.sort(Comparator.comparingDouble(Waist::z_m));
            EnvelopeCurve draft = new EnvelopeCurve(p, channel, List.of(), waists, termination,
                    stepped ? dense : null, bg2Floor);
            List<EnvelopePoint> pts = new ArrayList<>();
            double z1 = termination.z_m();
            int n = settings.samples();
            for (int i = 0; i <= n; i++) {
                pts.add(draft.at(p.zStart_m() + (z1 - p.zStart_m()) * i / n));
            }
            for (Waist w : waists) {
                EnvelopePoint at = draft.at(w.z_m());
                pts.add(new EnvelopePoint(w.z_m(), w.radius_m(), w.kind() == Waist.Kind.SMOOTH ? 0 : at.slope_rad(),
                        at.perveance(), at.emittance_m_rad()));
            }
            pts.sort(Comparator.comparingDouble(EnvelopePoint::z_m));
            return new EnvelopeCurve(p, channel, pts, waists, termination, stepped ? dense : null, bg2Floor);
        }
    }

    /**
     * Waist radius of a crossover entered at radius rf with slope s under R'' = K/R + eps^2/R^3, from the
     * invariant R'^2/2 - K ln R + eps^2/(2R^2): K x + (eps^2/(2 rf^2)) (e^(2x) - 1) = s^2/2, x = ln(rf/Rmin).
     */
    static double crossoverRadius(double rf, double s, double k, double eps) {
        double half = 0.5 * s * s;
        double a = eps * eps / (2 * rf * rf);
        double hi = Double.POSITIVE_INFINITY;
        if (k > 0) {
            hi = half / k;
        }
        if (a > 0) {
            hi = Math.min(hi, 0.5 * Math.log1p(half / a));
        }
        if (!(hi > 0) || Double.isInfinite(hi)) {
            return rf;
        }
        UnivariateFunction f = x -> k * x + a * Math.expm1(2 * x) - half;
        double x;
        if (a == 0) {
            x = hi;
        } else {
            x = new BracketingNthOrderBrentSolver(1e-15, 1e-14, 1e-300, 5).solve(200, f, 0, hi);
        }
        return rf * Math.exp(-x);
    }

    /** An event checked at most {@code maxCheck} apart, located by the n-th order Brent method. */
    private static SwitchingFunction detector(double maxCheck, ToDoubleFunction<ODEStateAndDerivative> g,
            ODEEventHandler handler) {
        return new SwitchingFunction(g, handler, AdaptableInterval.of(maxCheck),
                new BracketingNthOrderBrentSolver(1e-14, Math.max(1e-18, maxCheck * 1e-12), 5));
    }
}
