package org.axistack.trace;

import org.axistack.model.PhysicsMessage;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.CancellationException;
import java.util.function.ToDoubleFunction;

import org.axistack.field.Field;
import org.axistack.model.Codata2018;
import org.axistack.model.Particle;
import org.axistack.ode.SwitchingFunction;
import org.hipparchus.analysis.solvers.BracketingNthOrderBrentSolver;
import org.hipparchus.exception.MathIllegalStateException;
import org.hipparchus.ode.ODEState;
import org.hipparchus.ode.ODEStateAndDerivative;
import org.hipparchus.ode.events.Action;
import org.hipparchus.ode.events.AdaptableInterval;
import org.hipparchus.ode.events.ODEEventHandler;
import org.hipparchus.ode.nonstiff.DormandPrince853Integrator;
import org.hipparchus.ode.sampling.ODEStateInterpolator;
import org.hipparchus.ode.sampling.ODEStepHandler;

/**
 * Exact ray tracing: the relativistic Lorentz-force equations ({@link LorentzEquations}) integrated
 * by the adaptive Dormand-Prince 8(5,3) Runge-Kutta method (Hairer, Norsett and Wanner, "Solving
 * Ordinary Differential Equations I", section II.10; Hipparchus DormandPrince853Integrator) with
 * event detection for the observation planes, the screen, turning points (u_z = 0) and leaving the
 * region. Electrode impacts are found after every step by testing chords of the step's dense
 * output against the electrode outlines in the meridian plane, then refined by bisection on the
 * dense output. Immutable and thread-safe: one tracer can serve many threads.
 */
public final class Tracer {

    private static final double E = Codata2018.ELEMENTARY_CHARGE_C;
    private static final double C = Codata2018.SPEED_OF_LIGHT_M_PER_S;

    private final Field field;
    private final ElectrodeGeometry geometry;
    private final TraceSettings settings;

    public Tracer(Field field, ElectrodeGeometry geometry, TraceSettings settings) {
        if (field == null || geometry == null || settings == null) {
            throw new IllegalArgumentException("the tracer needs a field, a geometry and settings");
        }
        this.field = field;
        this.geometry = geometry;
        this.settings = settings;
    }

    public Field field() {
        return field;
    }

    public ElectrodeGeometry geometry() {
        return geometry;
    }

    public TraceSettings settings() {
        return settings;
    }

    /** Checks that the screen and the planes lie inside the traced region. */
    public void validateTargets(TraceTargets targets) {
        checkTargets(geometry, targets);
    }

    /** Checks that the screen and the planes lie inside the region of the geometry (no field needed). */
    public static void checkTargets(ElectrodeGeometry geometry, TraceTargets targets) {
        double zs = targets.screenZ_m();
        if (zs < geometry.regionZMin_m() || zs > geometry.regionZMax_m()) {
            throw PhysicsMessage.SCREEN_OUTSIDE_REGION.exception("z", zs * 1e3, "region", geometry.describeRegion());
        }
        for (double z : targets.planes_m()) {
            if (z < geometry.regionZMin_m() || z > geometry.regionZMax_m()) {
                throw PhysicsMessage.PLANE_OUTSIDE_REGION.exception("z", z * 1e3, "region", geometry.describeRegion());
            }
            if (z > zs) {
                throw PhysicsMessage.PLANE_BEYOND_SCREEN.exception("z", z * 1e3, "screen", zs * 1e3);
            }
        }
    }

    /**
     * Checks a ray's start and returns its kinetic energy per charge there, V (T0/|q| - sign(q) phi).
     */
    public double validateStart(Particle particle, RayStart ray, TraceTargets targets) {
        checkPlacement(geometry, ray, targets);
        double r = ray.r_m();
        double w = particle.energyPerCharge_V(ray.energy_eV());
        double phi0 = field.potential_V(ray.z_m(), r);
        double t = w - particle.chargeSign() * phi0;
        if (!(t > 0)) {
            throw PhysicsMessage.RAY_NO_ENERGY.exception("ray", ray.id(), "z", ray.z_m() * 1e3, "r", r * 1e3, "potential", phi0,
                    "energy", ray.energy_eV());
        }
        return t;
    }

    /**
     * Checks where a ray starts against the geometry and the targets (no field needed): inside the
     * region, outside every electrode, before the screen and the planes.
     */
    public static void checkPlacement(ElectrodeGeometry geometry, RayStart ray, TraceTargets targets) {
        double r = ray.r_m();
        if (!geometry.inRegion(ray.z_m(), r)) {
            throw PhysicsMessage.RAY_OUTSIDE_REGION.exception("ray", ray.id(), "z", ray.z_m() * 1e3, "r", r * 1e3, "region",
                    geometry.describeRegion());
        }
        Optional<String> in = geometry.insideElectrode(ray.z_m(), r);
        if (in.isEmpty()) {
            in = geometry.onSurface(ray.z_m(), r, 1e-9 * geometry.scale_m());
        }
        if (in.isPresent()) {
            throw PhysicsMessage.RAY_INSIDE_ELECTRODE.exception("ray", ray.id(), "electrode", in.get(), "z", ray.z_m() * 1e3,
                    "r", r * 1e3);
        }
        if (!(targets.screenZ_m() > ray.z_m())) {
            throw PhysicsMessage.RAY_AT_SCREEN.exception("ray", ray.id(), "z", ray.z_m() * 1e3, "screen",
                    targets.screenZ_m() * 1e3);
        }
        for (double z : targets.planes_m()) {
            if (z < ray.z_m()) {
                throw PhysicsMessage.PLANE_BEFORE_START.exception("z", z * 1e3, "ray", ray.id(), "start", ray.z_m() * 1e3);
            }
        }
    }

    public Trajectory trace(Particle particle, RayStart ray, TraceTargets targets) {
        return trace(particle, ray, targets, TraceProgress.none());
    }

    /** Traces one ray. Bad starts and targets throw IllegalArgumentException with a message for the user. */
    public Trajectory trace(Particle particle, RayStart ray, TraceTargets targets, TraceProgress progress) {
        validateTargets(targets);
        double tStart = validateStart(particle, ray, targets);
        double vRest = particle.restPotential_V();
        double tr = tStart / vRest;
        double uMag = Math.sqrt(tr * (2 + tr));
        double[] y0 = {ray.x_m(), ray.y_m(), ray.z_m(), uMag * ray.dirX(), uMag * ray.dirY(), uMag * ray.dirZ()};
        double beta0 = uMag / Math.sqrt(1 + uMag * uMag);

        Run run = new Run(particle, ray, targets, progress, particle.energyPerCharge_V(ray.energy_eV()));
        double scale = geometry.scale_m();
        double[] absTol = new double[6], relTol = new double[6];
        for (int i = 0; i < 6; i++) {
            relTol[i] = settings.relativeTolerance();
            absTol[i] = settings.relativeTolerance() * (i < 3 ? scale : uMag);
        }
        double maxStep = 0.1 * scale / beta0;
        DormandPrince853Integrator integrator = new DormandPrince853Integrator(0, maxStep, absTol, relTol);
        integrator.setMaxEvaluations(settings.maxEvaluations());
        // smooth switching functions (z - plane, u_z, distance to the region's edge) change sign at most
        // once per crossing, so checking every 1/50 of the region is ample; hits use the finer chords
        double check = Math.max(settings.checkFraction(), 0.02) * scale;
        double acc = 1e-14 * scale / beta0;
        List<Double> planes = targets.planes_m();
        for (int i = 0; i < planes.size(); i++) {
            final int k = i;
            final double zp = planes.get(i);
            integrator.addEventDetector(event(s -> s.getPrimaryState()[2] - zp, (s, d, inc) -> {
                run.cross(k, s);
                return Action.CONTINUE;
            }, check, acc));
        }
        double zs = targets.screenZ_m();
        integrator.addEventDetector(event(s -> s.getPrimaryState()[2] - zs, (s, d, inc) -> {
            if (!inc) {
                return Action.CONTINUE;
            }
            run.finish(TraceStatus.SCREEN, s);
            for (int i = 0; i < planes.size(); i++) {
                if (Math.abs(planes.get(i) - zs) <= 1e-12 * scale) {
                    run.cross(i, s);
                }
            }
            return Action.STOP;
        }, check, acc));
        integrator.addEventDetector(event(s -> s.getPrimaryState()[5], (s, d, inc) -> {
            if (inc) {
                return Action.CONTINUE;
            }
            run.finish(TraceStatus.REFLECTED, s);
            return Action.STOP;
        }, check, acc));
        double rMax = geometry.regionR_m(), zMin = geometry.regionZMin_m(), zMax = geometry.regionZMax_m();
        integrator.addEventDetector(event(s -> {
            double[] p = s.getPrimaryState();
            return Math.min(rMax - Math.hypot(p[0], p[1]), Math.min(p[2] - zMin, zMax - p[2]));
        }, (s, d, inc) -> {
            if (inc) {
                return Action.CONTINUE;
            }
            run.finish(TraceStatus.LEFT_REGION, s);
            return Action.STOP;
        }, check, acc));
        integrator.addStepHandler(run);

        LorentzEquations eq = new LorentzEquations(field, particle);
        double tauMax = 1e6 * scale / beta0;
        try {
            integrator.integrate(eq, new ODEState(0, y0), tauMax);
        } catch (HitSignal hit) {
            run.hit(hit);
        } catch (MathIllegalStateException e) {
            if (integrator.getEvaluations() < settings.maxEvaluations()) {
                throw e;
            }
            run.status = TraceStatus.STEP_LIMIT;
        }
        return run.result(integrator.getEvaluations());
    }

    /** Thrown from the step handler to stop the integration at an electrode impact. */
    private static final class HitSignal extends RuntimeException {
        private static final long serialVersionUID = 1L;
        final transient ODEStateAndDerivative state;
        final String electrode;

        HitSignal(ODEStateAndDerivative state, String electrode) {
            super(null, null, false, false);
            this.state = state;
            this.electrode = electrode;
        }
    }

    /** The bookkeeping of one ray: step handler and event sink. */
    private final class Run implements ODEStepHandler {
        final Particle particle;
        final RayStart ray;
        final TraceProgress progress;
        final double w0; // energy per charge where phi = 0, V
        final double restEnergy_eV;
        final List<PlaneCrossing> crossings = new ArrayList<>();
        final boolean[] crossed;
        final List<RayPoint> path = new ArrayList<>();
        TraceStatus status = TraceStatus.STEP_LIMIT;
        ODEStateAndDerivative end;
        ODEStateAndDerivative last;
        ElectrodeHit hit;
        double maxEnergyError;

        Run(Particle particle, RayStart ray, TraceTargets targets, TraceProgress progress, double w0) {
            this.particle = particle;
            this.ray = ray;
            this.progress = progress;
            this.w0 = w0;
            this.restEnergy_eV = particle.mass_kg() * C * C / E;
            this.crossed = new boolean[targets.planes_m().size()];
        }

        RayPoint point(ODEStateAndDerivative s) {
            double[] p = s.getPrimaryState();
            double gm1 = LorentzEquations.gammaMinusOne(p[3], p[4], p[5]);
            return new RayPoint(p[2], p[0], p[1], p[3], p[4], p[5], gm1 * restEnergy_eV, s.getTime() / C);
        }

        void cross(int plane, ODEStateAndDerivative s) {
            if (!crossed[plane]) {
                crossed[plane] = true;
                crossings.add(new PlaneCrossing(plane, point(s)));
            }
        }

        void finish(TraceStatus st, ODEStateAndDerivative s) {
            status = st;
            end = s;
        }

        void hit(HitSignal h) {
            status = TraceStatus.HIT;
            end = h.state;
            double[] p = h.state.getPrimaryState();
            hit = new ElectrodeHit(h.electrode, p[2], Math.hypot(p[0], p[1]));
            double tHit = h.state.getTime() / C;
            crossings.removeIf(c -> c.point().time_s() > tHit);
            if (settings.recordPath()) {
                path.add(point(h.state));
            }
        }

        @Override
        public void init(ODEStateAndDerivative s0, double t) {
            last = s0;
            if (settings.recordPath()) {
                path.add(point(s0));
            }
        }

        @Override
        public void handleStep(ODEStateInterpolator interp) {
            if (progress.isCancelled()) {
                throw new CancellationException("trace cancelled");
            }
            ODEStateAndDerivative a = interp.getPreviousState(), b = interp.getCurrentState();
            checkHit(interp, a, b);
            double[] p = b.getPrimaryState();
            double r = Math.hypot(p[0], p[1]);
            double w = LorentzEquations.gammaMinusOne(p[3], p[4], p[5]) * particle.restPotential_V()
                    + particle.chargeSign() * field.potential_V(p[2], r);
            maxEnergyError = Math.max(maxEnergyError, Math.abs(w - w0) / w0);
            last = b;
            if (settings.recordPath()) {
                path.add(point(b));
            }
        }

        private void checkHit(ODEStateInterpolator interp, ODEStateAndDerivative a, ODEStateAndDerivative b) {
            double[] pa = a.getPrimaryState(), pb = b.getPrimaryState();
            double len = Math.sqrt(sq(pb[0] - pa[0]) + sq(pb[1] - pa[1]) + sq(pb[2] - pa[2]));
            double piece = settings.checkFraction() * geometry.scale_m();
            int n = (int) Math.min(256, Math.max(2, Math.ceil(len / piece)));
            double ta = a.getTime(), dt = (b.getTime() - ta) / n;
            ODEStateAndDerivative prev = a;
            for (int k = 1; k <= n; k++) {
                ODEStateAndDerivative cur = k == n ? b : interp.getInterpolatedState(ta + k * dt);
                double[] p0 = prev.getPrimaryState(), p1 = cur.getPrimaryState();
                Optional<ElectrodeGeometry.Crossing> c = geometry.firstCrossing(p0[2], Math.hypot(p0[0], p0[1]), p1[2],
                        Math.hypot(p1[0], p1[1]));
                if (c.isPresent()) {
                    throw new HitSignal(refine(interp, prev, cur, c.get()), c.get().electrode());
                }
                prev = cur;
            }
        }

        private ODEStateAndDerivative refine(ODEStateInterpolator interp, ODEStateAndDerivative a,
                ODEStateAndDerivative b, ElectrodeGeometry.Crossing c) {
            double t0 = a.getTime(), t1 = b.getTime();
            double s0 = side(a, c), s1 = side(b, c);
            if (!(s0 * s1 < 0)) {
                return interp.getInterpolatedState(t0 + c.fraction() * (t1 - t0));
            }
            for (int i = 0; i < 100 && t1 - t0 > 1e-15 * Math.abs(t1); i++) {
                double tm = 0.5 * (t0 + t1);
                double sm = side(interp.getInterpolatedState(tm), c);
                if (sm * s0 > 0) {
                    t0 = tm;
                    s0 = sm;
                } else {
                    t1 = tm;
                }
            }
            return interp.getInterpolatedState(0.5 * (t0 + t1));
        }

        private double side(ODEStateAndDerivative s, ElectrodeGeometry.Crossing c) {
            double[] p = s.getPrimaryState();
            return geometry.side(c, p[2], Math.hypot(p[0], p[1]));
        }

        Trajectory result(int evaluations) {
            ODEStateAndDerivative e = end != null ? end : last;
            crossings.sort((x, y) -> Integer.compare(x.planeIndex(), y.planeIndex()));
            return new Trajectory(ray, status, point(e), crossings, Optional.ofNullable(hit), maxEnergyError,
                    evaluations, path);
        }
    }

    private static double sq(double x) {
        return x * x;
    }

    /**
     * An event whose check interval adapts to the particle's speed, so that the particle moves at most
     * {@code checkDist_m} between checks; located to {@code accuracy_tau} (light path, m) by the n-th order
     * Brent method.
     */
    private static SwitchingFunction event(ToDoubleFunction<ODEStateAndDerivative> g, ODEEventHandler handler,
            double checkDist_m, double accuracy_tau) {
        AdaptableInterval interval = (state, forward) -> {
            double[] s = state.getPrimaryState();
            double u2 = s[3] * s[3] + s[4] * s[4] + s[5] * s[5];
            double beta = Math.sqrt(u2 / (1 + u2));
            return checkDist_m / Math.max(beta, 1e-12);
        };
        return new SwitchingFunction(g, handler, interval, new BracketingNthOrderBrentSolver(1e-15, accuracy_tau, 0, 5));
    }
}
