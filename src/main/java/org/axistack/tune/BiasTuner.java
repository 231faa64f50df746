package org.axistack.tune;

import org.axistack.model.PhysicsMessage;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.TreeMap;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.function.DoubleFunction;
import java.util.stream.IntStream;

import org.axistack.field.FieldSolution;
import org.axistack.model.Biases;
import org.axistack.model.Stack;
import org.axistack.optics.TransferMatrix;
import org.hipparchus.analysis.solvers.AllowedSolution;
import org.hipparchus.analysis.solvers.BracketingNthOrderBrentSolver;
import org.hipparchus.exception.MathIllegalStateException;

/**
 * Finds every bias of one electrode, within a range, at which the lens images an object onto a given plane.
 *
 * <p>Method: a bracket scan of the continuous focusing condition of {@link FocusProbe} (height at the image plane
 * of the paraxial ray from the object) on {@value #SCAN_POINTS} equally spaced biases (in parallel, with a looser
 * integration tolerance, {@link FocusProbe#scanSettings()}), refined by bisection near the edge of any reflecting
 * part of the range and around every dip of |height| that does not change sign (so close pairs of roots are not
 * missed); the brackets are solved in parallel; each sign change is solved by the bracketing n-th order Brent method (Hipparchus
 * {@code BracketingNthOrderBrentSolver}; R. P. Brent, Algorithms for Minimization without Derivatives, 1973, with
 * inverse polynomial interpolation of order 5) and polished by Newton-secant steps (started with the slope of
 * Brent's last two points) on the condition computed with the
 * {@code optics} command's own settings, so a tuned bias reproduces the image plane in an {@code optics} run. Einzel lenses give two roots, one
 * decelerating and one accelerating. Each bias set is applied by superposition of the stored unit solutions;
 * the field is never solved again. Thread-safe (immutable).
 */
public final class BiasTuner {

    /** Equally spaced biases of the first scan. */
    public static final int SCAN_POINTS = 25;
    /** Upper bound on optics evaluations per tune (scan, refinement and roots). */
    static final int MAX_EVALUATIONS = 400;
    private static final int EDGE_BISECTIONS = 10;
    private static final int DIP_BISECTIONS = 5;

    private final FieldSolution solution;
    private final Stack stack;

    /**
     * @param solution the stack's field solution (unit solutions per electrode)
     * @param stack    the stack (its biases are the starting biases of every electrode not varied)
     */
    public BiasTuner(FieldSolution solution, Stack stack) {
        solution.requireGeometryOf(stack);
        this.solution = solution;
        this.stack = stack;
    }

    /** Object from the stack's beam (object_z, else at infinity), default supply range. */
    public TuneResult focus(String electrode, double imageZ_m) {
        return focus(electrode, new FocusTarget(imageZ_m, stack.beam().objectZ_m()), BiasRange.supplyDefault(stack.beam()));
    }

    /**
     * Every bias of {@code electrode} in {@code range} that images {@code target}'s object onto its image plane.
     *
     * @throws IllegalArgumentException for an unknown electrode name
     */
    public TuneResult focus(String electrode, FocusTarget target, BiasRange range) {
        int index = stack.indexOf(electrode);
        if (index < 0) {
            throw PhysicsMessage.UNKNOWN_ELECTRODE.exception("name", electrode, "names", String.join(", ", stack.names()));
        }
        FocusProbe coarse = new FocusProbe(solution, stack, target, FocusProbe.scanSettings());
        FocusProbe fine = new FocusProbe(solution, stack, target);
        Biases base = stack.biases();
        AtomicInteger count = new AtomicInteger();
        DoubleFunction<FocusProbe.Point> scanEval = v -> coarse.at(with(base, electrode, v, count));
        DoubleFunction<FocusProbe.Point> fineEval = v -> fine.at(with(base, electrode, v, count));
        TreeMap<Double, FocusProbe.Point> scan = new TreeMap<>();
        double[] grid = new double[SCAN_POINTS];
        for (int i = 0; i < SCAN_POINTS; i++) {
            grid[i] = range.from_V() + range.width_V() * i / (SCAN_POINTS - 1);
        }
        FocusProbe.Point[] first = new FocusProbe.Point[SCAN_POINTS];
        IntStream.range(0, SCAN_POINTS).parallel().forEach(i -> first[i] = scanEval.apply(grid[i]));
        for (int i = 0; i < SCAN_POINTS; i++) {
            scan.put(grid[i], first[i]);
        }
        refineEdges(scan, scanEval, range, count);
        refineDips(scan, scanEval, range, count);

        double scale = Math.max(range.width_V(), Math.max(Math.abs(range.from_V()), Math.abs(range.to_V())));
        List<double[]> brackets = new ArrayList<>();
        Map.Entry<Double, FocusProbe.Point> prev = null;
        double reflectFrom = Double.NaN;
        double reflectTo = Double.NaN;
        for (Map.Entry<Double, FocusProbe.Point> e : scan.entrySet()) {
            FocusProbe.Point p = e.getValue();
            if (!p.valid()) {
                reflectFrom = Double.isNaN(reflectFrom) ? e.getKey() : Math.min(reflectFrom, e.getKey());
                reflectTo = Double.isNaN(reflectTo) ? e.getKey() : Math.max(reflectTo, e.getKey());
            }
            boolean bracket = prev != null && prev.getValue().valid() && p.valid()
                    && (p.miss() == 0 || prev.getValue().miss() != 0 && Math.signum(prev.getValue().miss()) != Math.signum(p.miss()));
            if (bracket || prev == null && p.valid() && p.miss() == 0) {
                brackets.add(new double[] {prev == null ? e.getKey() : prev.getKey(), e.getKey()});
            }
            prev = e;
        }
        // The brackets are independent: solve them in parallel (in scan order in the result).
        FocusSolution[] found = new FocusSolution[brackets.size()];
        IntStream.range(0, found.length).parallel().forEach(i -> found[i] = root(brackets.get(i)[0],
                brackets.get(i)[1], scale, scanEval, fineEval, electrode, index, target));
        List<FocusSolution> solutions = new ArrayList<>();
        for (FocusSolution f : found) {
            if (f != null) {
                solutions.add(f);
            }
        }
        Optional<TuneResult.NearestApproach> nearest = Optional.empty();
        if (solutions.isEmpty()) {
            FocusProbe.Point best = null;
            for (FocusProbe.Point p : scan.values()) {
                if (p.valid() && (best == null
                        || Math.abs(p.imageZ_m() - target.imageZ_m()) < Math.abs(best.imageZ_m() - target.imageZ_m()))) {
                    best = p;
                }
            }
            if (best != null) {
                nearest = Optional.of(new TuneResult.NearestApproach(best.biases_V()[index], best.imageZ_m(),
                        best.imageZ_m() - target.imageZ_m()));
            }
        }
        return new TuneResult(electrode, target, range, solutions, nearest, count.get(), reflectFrom, reflectTo);
    }

    /**
     * The root in one bracket: n-th order Brent on the scan-accuracy condition, then Newton-secant polishing on the
     * full-accuracy one; null when a reflecting island sits inside the bracket.
     */
    private FocusSolution root(double lo, double hi, double scale, DoubleFunction<FocusProbe.Point> scanEval,
            DoubleFunction<FocusProbe.Point> fineEval, String electrode, int index, FocusTarget target) {
        BracketingNthOrderBrentSolver solver = new BracketingNthOrderBrentSolver(1e-12, 1e-8 * scale, 1e-12, 5);
        double[][] last = new double[2][]; // the two latest (bias, miss) of the scan-accuracy condition
        try {
            double approx = lo == hi ? lo : solver.solve(200, v -> {
                FocusProbe.Point q = scanEval.apply(v);
                if (!q.valid()) {
                    throw new IllegalStateException("reflection inside a bracket");
                }
                last[1] = last[0];
                last[0] = new double[] {v, q.miss()};
                return q.miss();
            }, lo, hi, AllowedSolution.ANY_SIDE);
            // Brent's last two points lie next to the root: their secant is the slope to start Newton with
            double slope = last[1] != null && last[0][0] != last[1][0]
                    ? (last[0][1] - last[1][1]) / (last[0][0] - last[1][0]) : Double.NaN;
            FocusProbe.Point root = polish(fineEval, approx, slope, lo, hi, 1e-12 * scale);
            return root == null ? null : describe(stack, electrode, index, root, target);
        } catch (IllegalStateException | MathIllegalStateException ex) {
            return null; // a reflecting island inside the bracket: no clean root here
        }
    }

    /** Evaluates new scan points in parallel (independent optics runs). */
    private static void putAll(TreeMap<Double, FocusProbe.Point> scan, List<Double> add,
            DoubleFunction<FocusProbe.Point> eval) {
        List<Double> distinct = add.stream().distinct().toList();
        FocusProbe.Point[] pts = new FocusProbe.Point[distinct.size()];
        IntStream.range(0, pts.length).parallel().forEach(i -> pts[i] = eval.apply(distinct.get(i)));
        for (int i = 0; i < pts.length; i++) {
            scan.put(distinct.get(i), pts[i]);
        }
    }

    private static double[] with(Biases base, String electrode, double v, AtomicInteger count) {
        count.incrementAndGet();
        return base.with(electrode, v).toArray_V();
    }

    /**
     * Newton-secant steps on the full-accuracy condition from the scan-accuracy root (the two differ only by
     * the looser integration tolerance, so the root moves by a tiny amount), starting with the scan
     * condition's slope there; stops when the predicted next correction is below {@code tol}; kept inside
     * the bracket; null if the full-accuracy probe reflects there.
     */
    private static FocusProbe.Point polish(DoubleFunction<FocusProbe.Point> fine, double x0, double slope0, double lo,
            double hi, double tol) {
        FocusProbe.Point p0 = fine.apply(x0);
        if (!p0.valid()) {
            return null;
        }
        if (p0.miss() == 0) {
            return p0;
        }
        double slope = slope0;
        if (!(Double.isFinite(slope) && slope != 0)) {
            double step = Math.max(1e-7 * (hi - lo), 10 * tol);
            double x1 = x0 + step <= hi ? x0 + step : x0 - step;
            FocusProbe.Point p1 = fine.apply(x1);
            if (!p1.valid() || p1.miss() == p0.miss()) {
                return p0;
            }
            slope = (p1.miss() - p0.miss()) / (x1 - x0);
            if (Math.abs(p1.miss()) < Math.abs(p0.miss())) {
                x0 = x1;
                p0 = p1;
            }
        }
        for (int it = 0; it < 6; it++) {
            double x1 = x0 - p0.miss() / slope;
            if (!(x1 >= lo && x1 <= hi) || !Double.isFinite(x1) || x1 == x0) {
                break;
            }
            FocusProbe.Point p1 = fine.apply(x1);
            if (!p1.valid()) {
                break;
            }
            if (p1.miss() != p0.miss()) {
                slope = (p1.miss() - p0.miss()) / (x1 - x0);
            }
            boolean better = Math.abs(p1.miss()) <= Math.abs(p0.miss());
            if (better) {
                x0 = x1;
                p0 = p1;
            }
            if (!better || p1.miss() == 0 || Math.abs(p1.miss() / slope) <= tol) {
                break;
            }
        }
        return p0;
    }

    /** Bisect every interval between a reflecting and a transmitting bias, so roots near the edge are bracketed. */
    private static void refineEdges(TreeMap<Double, FocusProbe.Point> scan,
            DoubleFunction<FocusProbe.Point> eval, BiasRange range, AtomicInteger count) {
        for (int pass = 0; pass < EDGE_BISECTIONS && count.get() < MAX_EVALUATIONS; pass++) {
            List<Double> add = new ArrayList<>();
            Map.Entry<Double, FocusProbe.Point> prev = null;
            for (Map.Entry<Double, FocusProbe.Point> e : scan.entrySet()) {
                if (prev != null && prev.getValue().valid() != e.getValue().valid()
                        && e.getKey() - prev.getKey() > 1e-9 * range.width_V()) {
                    add.add(0.5 * (prev.getKey() + e.getKey()));
                }
                prev = e;
            }
            if (add.isEmpty()) {
                return;
            }
            putAll(scan, add, eval);
        }
    }

    /**
     * Bisect both intervals beside a scan point where |miss| has a local minimum without a sign change and is
     * small compared with its change to the neighbours: a pair of roots may hide there.
     */
    private static void refineDips(TreeMap<Double, FocusProbe.Point> scan,
            DoubleFunction<FocusProbe.Point> eval, BiasRange range, AtomicInteger count) {
        for (int pass = 0; pass < DIP_BISECTIONS && count.get() < MAX_EVALUATIONS; pass++) {
            List<Double> add = new ArrayList<>();
            List<Map.Entry<Double, FocusProbe.Point>> list = new ArrayList<>(scan.entrySet());
            for (int i = 1; i + 1 < list.size(); i++) {
                FocusProbe.Point a = list.get(i - 1).getValue();
                FocusProbe.Point b = list.get(i).getValue();
                FocusProbe.Point c = list.get(i + 1).getValue();
                if (!a.valid() || !b.valid() || !c.valid()) {
                    continue;
                }
                double ma = a.miss();
                double mb = b.miss();
                double mc = c.miss();
                boolean sameSign = Math.signum(ma) == Math.signum(mb) && Math.signum(mb) == Math.signum(mc);
                boolean dip = Math.abs(mb) <= Math.abs(ma) && Math.abs(mb) <= Math.abs(mc);
                boolean small = Math.abs(mb) < Math.max(Math.abs(ma - mb), Math.abs(mc - mb));
                if (sameSign && dip && small) {
                    add.add(0.5 * (list.get(i - 1).getKey() + list.get(i).getKey()));
                    add.add(0.5 * (list.get(i).getKey() + list.get(i + 1).getKey()));
                }
            }
            if (add.isEmpty()) {
                return;
            }
            add.removeIf(scan::containsKey);
            putAll(scan, add, eval);
        }
    }

    /** Full description of an evaluated bias set as a solution (cardinal elements, surface fields, crossings). */
    static FocusSolution describe(Stack stack, String electrode, int index, FocusProbe.Point p, FocusTarget target) {
        double bias = p.biases_V()[index];
        double sign = stack.beam().particle().chargeSign();
        FocusSolution.Mode mode = sign * bias > 0 ? FocusSolution.Mode.DECELERATING : FocusSolution.Mode.ACCELERATING;
        double magnification = Double.NaN;
        if (!target.objectAtInfinity()) {
            TransferMatrix t = p.optics().transfer(target.objectZ_m().getAsDouble(), target.imageZ_m());
            magnification = t.a();
        }
        double[] fields = p.field().maxSurfaceFieldPerElectrode_V_per_m();
        int worst = 0;
        for (int i = 1; i < fields.length; i++) {
            if (fields[i] > fields[worst]) {
                worst = i;
            }
        }
        return new FocusSolution(electrode, bias, p.biases_V(), mode, p.imageZ_m(), magnification,
                p.optics().cardinal(), fields[worst], fields, stack.electrodes().get(worst).name(),
                SurfaceFieldCheck.of(fields[worst], stack.limits()), crossings(p, target));
    }

    /** Real crossings of the probe ray strictly before the image plane (sampled at 400 planes). */
    private static int crossings(FocusProbe.Point p, FocusTarget target) {
        var optics = p.optics();
        double z0 = target.objectAtInfinity() ? optics.zStart_m() : target.objectZ_m().getAsDouble();
        double h0 = target.objectAtInfinity() ? 1 : 0;
        double s0 = target.objectAtInfinity() ? 0 : 1;
        double from = Math.max(z0, optics.zStart_m());
        double to = Math.min(target.imageZ_m(), optics.zEnd_m());
        int n = 400;
        int crossings = 0;
        double prev = Double.NaN;
        double stop = target.imageZ_m() - 1e-6 * Math.abs(target.imageZ_m() - z0);
        for (int i = 0; i <= n; i++) {
            double z = from + (to - from) * i / n;
            if (z > stop || (i == 0 && !target.objectAtInfinity() && z <= z0)) {
                continue;
            }
            double h = optics.ray(z0, h0, s0, z)[0];
            if (!Double.isNaN(prev) && Math.signum(h) != Math.signum(prev) && h != 0) {
                crossings++;
            }
            prev = h;
        }
        return crossings;
    }
}
