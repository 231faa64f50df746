package org.axistack.optics;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import org.axistack.field.SectorField;
import org.axistack.model.Sectors;
import org.axistack.model.StartRay;
import org.hipparchus.linear.Array2DRowRealMatrix;
import org.hipparchus.linear.ArrayRealVector;
import org.hipparchus.linear.RealVector;
import org.hipparchus.linear.SingularValueDecomposition;

/**
 * The sector biases of one or two split electrodes (steerers) that put the central ray where it is wanted. The
 * central ray is linear in each steerer's x and y differential bias (first order, {@link SplitDeflection}) and in
 * its start offset and slope ({@link CentralRayDeflection}), so the changes of the differential biases solve a
 * small square linear system: one steerer (two unknowns) sets the position (x, y) at one plane; two steerers
 * (four unknowns) set the position and the slopes at one plane, or the positions at two planes. The other split
 * electrodes keep their sector biases; a steerer keeps whatever else its sector pattern holds (its common bias,
 * any stigmator part): only its dipole patterns cos(theta_s), sin(theta_s) change. Solved by singular value
 * decomposition of the row-equilibrated system; a system whose smallest singular value is below
 * {@link #MIN_RELATIVE_SINGULAR_VALUE} of the largest is refused (the steerers cannot do it: a two-sector electrode
 * deflects along one direction only, two steerers at nearly one place cannot set an angle). Immutable.
 */
public final class SteeringSolve {

    /** Smallest accepted ratio of the smallest to the largest singular value of the equilibrated system. */
    public static final double MIN_RELATIVE_SINGULAR_VALUE = 1e-6;

    /**
     * What is wanted at one plane: the central ray's position, and its slopes when {@code slopes} is true.
     *
     * @param z_m        plane, m
     * @param x_m        wanted x, m
     * @param y_m        wanted y, m
     * @param slopes     whether the slopes are set too
     * @param slopeX_rad wanted dx/dz (if slopes)
     * @param slopeY_rad wanted dy/dz (if slopes)
     */
    public record Target(double z_m, double x_m, double y_m, boolean slopes, double slopeX_rad, double slopeY_rad) {
        /** Number of conditions this target sets. */
        public int conditions() {
            return slopes ? 4 : 2;
        }
    }

    /** The steerers cannot meet the targets. */
    public static final class Infeasible extends RuntimeException {
        private static final long serialVersionUID = 1L;

        Infeasible(String message) {
            super(message);
        }
    }

    private final List<Integer> steerers;
    private final double[] change_V;
    private final Map<Integer, Sectors> after;
    private final double[] planes;
    private final double[][] rayBefore;
    private final double[][] rayAfter;
    private final double relativeSingularValue;
    private final SplitDeflection deflection;

    private SteeringSolve(List<Integer> steerers, double[] change_V, Map<Integer, Sectors> after, double[] planes,
            double[][] rayBefore, double[][] rayAfter, double relativeSingularValue, SplitDeflection deflection) {
        this.steerers = steerers;
        this.change_V = change_V;
        this.after = after;
        this.planes = planes;
        this.rayBefore = rayBefore;
        this.rayAfter = rayAfter;
        this.relativeSingularValue = relativeSingularValue;
        this.deflection = deflection;
    }

    /**
     * Solves for the steerers' differential-bias changes.
     *
     * @param field     the solved harmonics of every split electrode (at least m = 1)
     * @param optics    the round lens at the stack's biases
     * @param zStart_m  where the central ray starts (with {@code start}), m
     * @param start     the central ray's offset and slopes there
     * @param sectors   every split electrode's sectors as stored, by electrode index
     * @param steerers  the one or two split electrodes to set (indices)
     * @param targets   what is wanted: one target with position (one steerer), or one with position and slopes, or
     *                  two with positions (two steerers)
     * @param report    further planes where the central ray is reported (monitors), m
     * @throws IllegalArgumentException if the number of conditions is not twice the number of steerers
     * @throws Infeasible if the steerers cannot meet the targets
     */
    public static SteeringSolve solve(SectorField field, ParaxialOptics optics, double zStart_m, StartRay start,
            Map<Integer, Sectors> sectors, List<Integer> steerers, List<Target> targets, double[] report) {
        int n = 2 * steerers.size();
        int conditions = targets.stream().mapToInt(Target::conditions).sum();
        if (steerers.isEmpty() || steerers.size() > 2 || conditions != n || steerers.stream().distinct().count() != n / 2) {
            throw new IllegalArgumentException("need one steerer for a position, or two for a position and slopes or"
                    + " positions at two planes; got " + steerers.size() + " steerer(s) and " + conditions
                    + " conditions");
        }
        for (int e : steerers) {
            if (!sectors.containsKey(e) || !field.split().containsKey(e)) {
                throw new IllegalArgumentException("electrode " + e + " is not split");
            }
        }
        double[] planes = new double[targets.size() + report.length];
        for (int t = 0; t < targets.size(); t++) {
            planes[t] = targets.get(t).z_m();
        }
        System.arraycopy(report, 0, planes, targets.size(), report.length);
        SplitDeflection d = SplitDeflection.of(field, optics, zStart_m, planes);
        Map<Integer, List<Double>> stored = new LinkedHashMap<>();
        sectors.forEach((e, s) -> stored.put(e, s.biases_V()));
        double[][] before = new double[planes.length][];
        for (int p = 0; p < planes.length; p++) {
            before[p] = d.ray(p, stored, start);
        }
        double[][] a = new double[n][n];
        double[] rhs = new double[n];
        int row = 0;
        int[] targetOf = new int[n];
        for (int t = 0; t < targets.size(); t++) {
            Target tg = targets.get(t);
            double[] want = {tg.x_m(), tg.y_m(), tg.slopeX_rad(), tg.slopeY_rad()};
            for (int c = 0; c < tg.conditions(); c++) {
                for (int s = 0; s < steerers.size(); s++) {
                    SplitDeflection.PerVolt pv = d.perVolt(t, steerers.get(s));
                    a[row][2 * s] = pv.perVx()[c];
                    a[row][2 * s + 1] = pv.perVy()[c];
                }
                rhs[row] = want[c] - before[t][c];
                targetOf[row] = t;
                row++;
            }
        }
        // equilibrate rows (metres and radians) before judging the rank
        for (int r = 0; r < n; r++) {
            double norm = 0;
            for (int c = 0; c < n; c++) {
                norm = Math.hypot(norm, a[r][c]);
            }
            if (norm == 0) {
                throw new Infeasible(String.format(java.util.Locale.ROOT, "the steerers do not move the central ray"
                        + " at z = %.6g mm (they lie after that plane)", planes[targetOf[r]] * 1e3));
            }
            for (int c = 0; c < n; c++) {
                a[r][c] /= norm;
            }
            rhs[r] /= norm;
        }
        SingularValueDecomposition svd = new SingularValueDecomposition(new Array2DRowRealMatrix(a, false));
        double[] sv = svd.getSingularValues();
        double ratio = sv[sv.length - 1] / sv[0];
        if (!(ratio >= MIN_RELATIVE_SINGULAR_VALUE)) {
            throw new Infeasible(String.format(java.util.Locale.ROOT, "the chosen steerers cannot set these conditions"
                    + " independently (smallest to largest singular value %.2g): a two-sector electrode deflects along"
                    + " one direction only, and two steerers close together cannot set a position and an angle apart",
                    ratio));
        }
        RealVector x = svd.getSolver().solve(new ArrayRealVector(rhs, false));
        double[] change = x.toArray();
        Map<Integer, Sectors> after = new LinkedHashMap<>(sectors);
        Map<Integer, List<Double>> afterBiases = new LinkedHashMap<>(stored);
        for (int s = 0; s < steerers.size(); s++) {
            int e = steerers.get(s);
            Sectors sec = sectors.get(e);
            double[] px = sec.xPattern();
            double[] py = sec.yPattern();
            List<Double> b = new ArrayList<>();
            for (int k = 0; k < sec.count(); k++) {
                b.add(sec.biases_V().get(k) + change[2 * s] * px[k] + change[2 * s + 1] * py[k]);
            }
            after.put(e, sec.withBiases_V(b));
            afterBiases.put(e, b);
        }
        double[][] rayAfter = new double[planes.length][];
        for (int p = 0; p < planes.length; p++) {
            rayAfter[p] = d.ray(p, afterBiases, start);
        }
        return new SteeringSolve(List.copyOf(steerers), change, Map.copyOf(after), planes, before, rayAfter, ratio, d);
    }

    /** The steerers, electrode indices. */
    public List<Integer> steerers() {
        return steerers;
    }

    /** Change of steerer s's x differential bias, V. */
    public double changeX_V(int s) {
        return change_V[2 * s];
    }

    /** Change of steerer s's y differential bias, V. */
    public double changeY_V(int s) {
        return change_V[2 * s + 1];
    }

    /** Every split electrode's sectors after the solve, by index. */
    public Map<Integer, Sectors> after() {
        return after;
    }

    /** Target planes first, then the report planes, m. */
    public double[] planes_m() {
        return planes.clone();
    }

    /** {x, y, x', y'} of the central ray at plane p before the change (stored biases), m and rad. */
    public double[] rayBefore(int plane) {
        return rayBefore[plane].clone();
    }

    /** {x, y, x', y'} at plane p with the biases found. */
    public double[] rayAfter(int plane) {
        return rayAfter[plane].clone();
    }

    /** Smallest over largest singular value of the equilibrated system (1: perfectly independent conditions). */
    public double relativeSingularValue() {
        return relativeSingularValue;
    }

    /** The unit responses used. */
    public SplitDeflection deflection() {
        return deflection;
    }
}
