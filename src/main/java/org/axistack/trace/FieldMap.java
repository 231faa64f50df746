package org.axistack.trace;

import org.axistack.model.PhysicsMessage;
import java.util.concurrent.CancellationException;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.stream.IntStream;

import org.axistack.field.BiasedField;
import org.axistack.field.Field;

/**
 * A precomputed map of a slow field (optionally of its difference from a smooth cheap base field) on a uniform (z, r) grid, interpolated by bicubic Hermite
 * patches (potential and its first derivatives at the nodes, the cross derivative by central
 * differences of E_r along z; classical bicubic Hermite interpolation, e.g. Press et al.,
 * "Numerical Recipes", 3rd ed., section 3.6.1). The field returned is minus the exact gradient of the
 * interpolated potential, so a ray in the map conserves T + q phi up to the integrator's error; since
 * the second derivatives of the patches jump at cell edges, which the step-size control only partly
 * sees, that is about 1e-8 relative in practice (measured in the tests) instead of the 1e-11 reached in
 * smooth fields.
 * Cells that touch an electrode surface (closer than one and a half cell diagonals) or lie inside one
 * are not mapped: there, and outside the grid, the source field is called directly. The map's error
 * against the source is measured when it is built, at the centres of a sample of the mapped cells:
 * {@link #maxPotentialError_V()} and {@link #maxFieldError_V_per_m()}. Immutable and thread-safe.
 */
public final class FieldMap implements Field {

    private final Field source;
    private final Field base;
    private final double z0;
    private final double hz;
    private final double hr;
    private final int nz;
    private final int nr;
    private final double[] phi;
    private final double[] pz;
    private final double[] pr;
    private final double[] pzr;
    private final boolean[] cellOk;
    private final double maxPotentialError_V;
    private final double maxFieldError_V_per_m;
    private final int mappedCells;

    /** Most nodes a map may have (three arrays of doubles: about 100 MB). */
    public static final int MAX_NODES = 4_000_000;

    /**
     * The number of nodes of a map over [zMin, zMax] x [0, rMax] with this step, computed in floating point so that
     * a tiny step gives a huge number (never an overflowed one); infinity for a step that is not positive.
     */
    public static double nodeCount(double zMin_m, double zMax_m, double rMax_m, double step_m) {
        if (!(step_m > 0)) {
            return Double.POSITIVE_INFINITY;
        }
        return (Math.max(1, Math.ceil((zMax_m - zMin_m) / step_m)) + 1) * (Math.max(1, Math.ceil(rMax_m / step_m)) + 1);
    }

    /**
     * Refuses a step that would make a map of more than {@link #MAX_NODES} nodes, naming the smallest step that fits
     * (5 % above the bound, so that it really fits); callers check before the field solve.
     */
    public static void checkStep(double zMin_m, double zMax_m, double rMax_m, double step_m) {
        double count = nodeCount(zMin_m, zMax_m, rMax_m, step_m);
        if (count > MAX_NODES) {
            double minimum = Math.sqrt(Math.max(zMax_m - zMin_m, step_m) * rMax_m / MAX_NODES) * 1.05;
            throw PhysicsMessage.FIELD_MAP_TOO_FINE.exception("step", step_m * 1e3, "nodes", count, "limit", MAX_NODES,
                    "minimum", Double.parseDouble(String.format(java.util.Locale.ROOT, "%.3g", minimum * 1e3)));
        }
    }

    /** Node spacings per mapped radius when no step is given: the default step is a fortieth of the bore. */
    public static final int STEPS_PER_BORE = 40;

    /** The default node spacing for a map out to this bore radius, m. */
    public static double defaultStep_m(double bore_m) {
        return bore_m / STEPS_PER_BORE;
    }

    /**
     * The z range of a map for rays traced from startZ to endZ: four steps beyond each end, inside the geometry's
     * region, m ({zMin, zMax}).
     */
    public static double[] zRange_m(ElectrodeGeometry geometry, double startZ_m, double endZ_m, double step_m) {
        return new double[] {Math.max(geometry.regionZMin_m(), Math.min(startZ_m, endZ_m) - 4 * step_m),
                Math.min(geometry.regionZMax_m(), endZ_m + 4 * step_m)};
    }

    /**
     * The map every ray bundle uses (trace command, plan figure, window table): the difference of the solved field
     * from its near-axis series, from four steps before the start to four after the end, out to the bore.
     *
     * @param field    the solved field at its biases
     * @param geometry the electrodes
     * @param startZ_m where the rays start, m
     * @param endZ_m   where they end (screen), m
     * @param bore_m   outer radius of the map (the narrowest open bore), m
     * @param step_m   node spacing, m (see {@link #defaultStep_m(double)})
     * @param progress told about the nodes done; may cancel
     */
    public static FieldMap forRays(BiasedField field, ElectrodeGeometry geometry, double startZ_m, double endZ_m,
            double bore_m, double step_m, TraceProgress progress) {
        double[] z = zRange_m(geometry, startZ_m, endZ_m, step_m);
        return new FieldMap(field, new NearAxisField(field), geometry, z[0], z[1], bore_m, step_m, progress);
    }

    /**
     * Builds the map (in parallel).
     *
     * @param source   the field to map (thread-safe)
     * @param base       a smooth, cheap approximation of the source (for example the near-axis series of
     *                   tabulated axial derivatives), or null: only the difference source - base is mapped,
     *                   so the interpolation error and the derivative jumps at cell edges scale with that
     *                   difference instead of with the field
     * @param geometry the electrodes (cells near them are left to the source)
     * @param zMin_m   left end of the grid, m
     * @param zMax_m   right end of the grid, m
     * @param rMax_m   outer radius of the grid, m
     * @param step_m   largest node spacing, m
     * @param progress told about the fraction done as rays (done, total) = (nodes done, nodes); may cancel
     */
    public FieldMap(Field source, Field base, ElectrodeGeometry geometry, double zMin_m, double zMax_m,
            double rMax_m, double step_m, TraceProgress progress) {
        if (!(zMax_m > zMin_m) || !(rMax_m > 0) || !(step_m > 0) || !Double.isFinite(zMax_m - zMin_m + rMax_m)) {
            throw new IllegalArgumentException("field map needs z_max > z_min, r_max > 0 and a positive step");
        }
        this.source = source;
        this.base = base;
        checkStep(zMin_m, zMax_m, rMax_m, step_m);
        this.nz = Math.max(1, (int) Math.ceil((zMax_m - zMin_m) / step_m));
        this.nr = Math.max(1, (int) Math.ceil(rMax_m / step_m));
        long nodes = (long) (nz + 1) * (nr + 1);
        this.z0 = zMin_m;
        this.hz = (zMax_m - zMin_m) / nz;
        this.hr = rMax_m / nr;
        int n = (int) nodes;
        phi = new double[n];
        pz = new double[n];
        pr = new double[n];
        pzr = new double[n];
        double margin = 1.5 * Math.hypot(hz, hr);
        boolean[] nodeOk = new boolean[n];
        AtomicInteger done = new AtomicInteger();
        IntStream.range(0, n).parallel().forEach(k -> {
            if (progress.isCancelled()) {
                throw new CancellationException("field map cancelled");
            }
            int i = k / (nr + 1), j = k % (nr + 1);
            double z = z0 + i * hz, r = j * hr;
            nodeOk[k] = geometry.insideElectrode(z, r).isEmpty() && geometry.distanceToSurface_m(z, r) > margin;
            if (nodeOk[k]) {
                double[] f = new double[2], fb = new double[2];
                phi[k] = source.evaluate(z, r, f);
                if (base != null) {
                    phi[k] -= base.evaluate(z, r, fb);
                }
                pz[k] = -(f[0] - fb[0]);
                pr[k] = j == 0 ? 0 : -(f[1] - fb[1]);
            }
            int d = done.incrementAndGet();
            if (d % 1000 == 0 || d == n) {
                progress.raysDone(d, n);
            }
        });
        // cross derivative d2 phi / dz dr by central differences of d phi / dr along z
        for (int i = 0; i <= nz; i++) {
            for (int j = 0; j <= nr; j++) {
                int k = idx(i, j);
                if (!nodeOk[k] || j == 0) {
                    continue;
                }
                boolean left = i > 0 && nodeOk[idx(i - 1, j)], right = i < nz && nodeOk[idx(i + 1, j)];
                if (left && right) {
                    pzr[k] = (pr[idx(i + 1, j)] - pr[idx(i - 1, j)]) / (2 * hz);
                } else if (right) {
                    pzr[k] = (pr[idx(i + 1, j)] - pr[k]) / hz;
                } else if (left) {
                    pzr[k] = (pr[k] - pr[idx(i - 1, j)]) / hz;
                }
            }
        }
        cellOk = new boolean[nz * nr];
        int mapped = 0;
        for (int i = 0; i < nz; i++) {
            for (int j = 0; j < nr; j++) {
                boolean ok = nodeOk[idx(i, j)] && nodeOk[idx(i + 1, j)] && nodeOk[idx(i, j + 1)]
                        && nodeOk[idx(i + 1, j + 1)] && i > 0 && i < nz - 1 && nodeOk[idx(i - 1, j)]
                        && nodeOk[idx(i + 2, j)];
                cellOk[i * nr + j] = ok;
                if (ok) {
                    mapped++;
                }
            }
        }
        this.mappedCells = mapped;
        // measured error at the centres of a sample of mapped cells
        int stride = Math.max(1, mapped / 400);
        double[] errs = IntStream.range(0, nz * nr).parallel().filter(c -> cellOk[c] && c % stride == 0)
                .mapToObj(c -> {
                    double z = z0 + (c / nr + 0.5) * hz, r = (c % nr + 0.5) * hr;
                    double[] fe = new double[2], fm = new double[2];
                    double pe = source.evaluate(z, r, fe);
                    double pm = evaluate(z, r, fm);
                    return new double[] {Math.abs(pe - pm), Math.hypot(fe[0] - fm[0], fe[1] - fm[1])};
                }).reduce(new double[2], (a, b) -> new double[] {Math.max(a[0], b[0]), Math.max(a[1], b[1])});
        this.maxPotentialError_V = errs[0];
        this.maxFieldError_V_per_m = errs[1];
    }

    private int idx(int i, int j) {
        return i * (nr + 1) + j;
    }

    /** Largest |phi_map - phi| found at the sampled cell centres, V. */
    public double maxPotentialError_V() {
        return maxPotentialError_V;
    }

    /** Largest |E_map - E| found at the sampled cell centres, V/m. */
    public double maxFieldError_V_per_m() {
        return maxFieldError_V_per_m;
    }

    /** Number of mapped cells (the rest are left to the source field). */
    public int mappedCells() {
        return mappedCells;
    }

    /** Total number of cells. */
    public int cells() {
        return nz * nr;
    }

    @Override
    public double evaluate(double z_m, double r_m, double[] out) {
        double s = (z_m - z0) / hz, q = r_m / hr;
        if (!(s >= 0 && s < nz && q < nr)) {
            return source.evaluate(z_m, r_m, out);
        }
        int i = (int) s, j = (int) q;
        if (!cellOk[i * nr + j]) {
            return source.evaluate(z_m, r_m, out);
        }
        double t = s - i, u = q - j;
        // cubic Hermite basis and derivatives in t and u
        double t2 = t * t, t3 = t2 * t, u2 = u * u, u3 = u2 * u;
        double a0 = 2 * t3 - 3 * t2 + 1, a1 = -2 * t3 + 3 * t2, b0 = t3 - 2 * t2 + t, b1 = t3 - t2;
        double da0 = 6 * t2 - 6 * t, da1 = -da0, db0 = 3 * t2 - 4 * t + 1, db1 = 3 * t2 - 2 * t;
        double c0 = 2 * u3 - 3 * u2 + 1, c1 = -2 * u3 + 3 * u2, e0 = u3 - 2 * u2 + u, e1 = u3 - u2;
        double dc0 = 6 * u2 - 6 * u, dc1 = -dc0, de0 = 3 * u2 - 4 * u + 1, de1 = 3 * u2 - 2 * u;
        int k00 = idx(i, j), k10 = idx(i + 1, j), k01 = k00 + 1, k11 = k10 + 1;
        double hzr = hz * hr;
        // node (a, b) contributes f A_a C_b + hz fz B_a C_b + hr fr A_a E_b + hz hr fzr B_a E_b
        double f00 = phi[k00], z00 = hz * pz[k00], r00 = hr * pr[k00], x00 = hzr * pzr[k00];
        double f01 = phi[k01], z01 = hz * pz[k01], r01 = hr * pr[k01], x01 = hzr * pzr[k01];
        double f10 = phi[k10], z10 = hz * pz[k10], r10 = hr * pr[k10], x10 = hzr * pzr[k10];
        double f11 = phi[k11], z11 = hz * pz[k11], r11 = hr * pr[k11], x11 = hzr * pzr[k11];
        // combine along u first: for each a, the value and u-derivative of the u-interpolant of f and fz
        double g0 = f00 * c0 + r00 * e0 + f01 * c1 + r01 * e1; // f-part at a = 0
        double q0 = z00 * c0 + x00 * e0 + z01 * c1 + x01 * e1; // fz-part at a = 0
        double g1 = f10 * c0 + r10 * e0 + f11 * c1 + r11 * e1;
        double q1 = z10 * c0 + x10 * e0 + z11 * c1 + x11 * e1;
        double gu0 = f00 * dc0 + r00 * de0 + f01 * dc1 + r01 * de1;
        double qu0 = z00 * dc0 + x00 * de0 + z01 * dc1 + x01 * de1;
        double gu1 = f10 * dc0 + r10 * de0 + f11 * dc1 + r11 * de1;
        double qu1 = z10 * dc0 + x10 * de0 + z11 * dc1 + x11 * de1;
        double p = g0 * a0 + q0 * b0 + g1 * a1 + q1 * b1;
        double dpt = g0 * da0 + q0 * db0 + g1 * da1 + q1 * db1;
        double dpu = gu0 * a0 + qu0 * b0 + gu1 * a1 + qu1 * b1;
        if (base == null) {
            out[0] = -dpt / hz;
            out[1] = -dpu / hr;
            return p;
        }
        double pb = base.evaluate(z_m, r_m, out);
        out[0] -= dpt / hz;
        out[1] -= dpu / hr;
        return pb + p;
    }
}
