package org.axistack.field;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;

import org.axistack.mesh.BoundaryMesh;
import org.axistack.model.Sectors;

/**
 * The non-round part of the field of a stack with split electrodes: for every split electrode e and every
 * harmonic m = 1..maxOrder its sectors carry (m not a multiple of the sector count), the density that holds
 * electrode e at cos(m phi) times the slit factor (1 without slits) and every other electrode at 0 V, on the
 * round solution's mesh ({@link HarmonicOperator}, one factorisation per m shared by all split electrodes).
 * Sector biases enter only through the Fourier coefficients a_m, b_m of each electrode's sector pattern
 * ({@link Sectors#harmonic}), so re-biasing never solves again. Harmonics above maxOrder are dropped: near
 * the axis harmonic m falls as (r/R)^m (R the bore of the split electrode), so the truncation error at radius
 * r is of the order of the first dropped coefficient times (r/R)^(maxOrder+1). Immutable.
 */
public final class SectorField {

    private final FieldSolution round;
    private final Map<Integer, Sectors> split;
    private final int maxOrder;
    private final Map<Integer, HarmonicOperator> operators;
    /** density[m][electrode] for the unit pattern cos(m phi) (times the slit factor) on the electrode. */
    private final Map<Integer, Map<Integer, double[]>> density;
    private final double seconds;
    /** Tables of the unit axial functions by electrode and order, built on first request ({@link #unitFunction}). */
    private final java.util.concurrent.ConcurrentHashMap<Long, HermiteTable> tables =
            new java.util.concurrent.ConcurrentHashMap<>();

    /**
     * Relative error of the linear-ramp slit model in the dipole (m = 1) per (slit width / bore)^2: a real open slit
     * lets the enclosure's potential in, and the interior dipole falls below the model's by 0.18 (w/R)^2 (enclosure
     * at 3 R) to 0.33 (w/R)^2 (enclosure at 1.5 R), measured against a two-dimensional reference with open slits
     * (SlitModelTest, harmonic-field.md); the larger figure is quoted.
     */
    public static final double SLIT_DIPOLE_ERROR = 0.33;

    /** As {@link #SLIT_DIPOLE_ERROR} for the quadrupole (m = 2): 0.085 (w/R)^2 for both enclosures. */
    public static final double SLIT_QUADRUPOLE_ERROR = 0.085;

    /** Relative accuracy asked of the tabulated axial functions (midpoint error over the peak). */
    public static final double TABLE_TOLERANCE = 1e-10;

    private SectorField(FieldSolution round, Map<Integer, Sectors> split, int maxOrder,
            Map<Integer, HarmonicOperator> operators, Map<Integer, Map<Integer, double[]>> density, double seconds) {
        this.round = round;
        this.split = split;
        this.maxOrder = maxOrder;
        this.operators = operators;
        this.density = density;
        this.seconds = seconds;
    }

    /**
     * Solves the harmonics 1..maxOrder that the split electrodes carry.
     *
     * @param split sectors by electrode index (into the round solution's electrodes)
     */
    public static SectorField solve(FieldSolution round, Map<Integer, Sectors> split, int maxOrder,
            SolveProgress progress) {
        long t0 = System.nanoTime();
        Map<Integer, Sectors> sp = new TreeMap<>(split);
        BoundaryMesh mesh = round.mesh();
        int n = mesh.size();
        List<Integer> orders = new java.util.ArrayList<>();
        for (int m = 1; m <= maxOrder; m++) {
            final int mm = m;
            if (sp.values().stream().anyMatch(s -> s.carries(mm))) {
                orders.add(m);
            }
        }
        Map<Integer, HarmonicOperator> ops = new LinkedHashMap<>();
        Map<Integer, Map<Integer, double[]>> dens = new LinkedHashMap<>();
        for (int k = 0; k < orders.size(); k++) {
            int m = orders.get(k);
            double from = (double) k / orders.size();
            double span = 1.0 / orders.size();
            HarmonicOperator op = HarmonicOperator.factor(round, m,
                    (stage, f) -> progress.update(stage, from + span * f));
            ops.put(m, op);
            dens.put(m, densities(mesh, sp, m, op));
        }
        return new SectorField(round, sp, maxOrder, ops, dens, (System.nanoTime() - t0) * 1e-9);
    }

    /**
     * The dipole harmonic alone (m = 1) of the split electrodes on an operator already factored (for example the
     * misalignment study's), no second factorisation.
     */
    public static SectorField dipole(FieldSolution round, Map<Integer, Sectors> split, HarmonicOperator dipole) {
        if (dipole.order() != 1 || dipole.round() != round) {
            throw new IllegalArgumentException("need the harmonic-1 operator of the same solved stack");
        }
        long t0 = System.nanoTime();
        Map<Integer, Sectors> sp = new TreeMap<>(split);
        Map<Integer, HarmonicOperator> ops = new LinkedHashMap<>();
        ops.put(1, dipole);
        Map<Integer, Map<Integer, double[]>> dens = new LinkedHashMap<>();
        dens.put(1, densities(round.mesh(), sp, 1, dipole));
        return new SectorField(round, sp, 1, ops, dens, (System.nanoTime() - t0) * 1e-9);
    }

    /** Unit densities of harmonic m for every split electrode that carries it (slit factors in the right-hand side). */
    private static Map<Integer, double[]> densities(BoundaryMesh mesh, Map<Integer, Sectors> sp, int m,
            HarmonicOperator op) {
        int n = mesh.size();
        Map<Integer, double[]> perElectrode = new LinkedHashMap<>();
        List<Integer> es = sp.entrySet().stream().filter(x -> x.getValue().carries(m)).map(Map.Entry::getKey).toList();
        boolean slits = es.stream().anyMatch(e -> sp.get(e).slitWidth_m() > 0);
        if (!slits) {
            for (int e : es) {
                perElectrode.put(e, op.unitDensity(e));
            }
        } else {
            double[][] rhs = new double[es.size()][n];
            for (int c = 0; c < es.size(); c++) {
                Sectors s = sp.get(es.get(c));
                for (int i = 0; i < n; i++) {
                    if (mesh.electrodeOf(i) == es.get(c)) {
                        rhs[c][i] = s.slitFactor(m, mesh.nodeR(i));
                    }
                }
            }
            double[][] x = op.solve(rhs);
            for (int c = 0; c < es.size(); c++) {
                perElectrode.put(es.get(c), x[c]);
            }
        }
        return perElectrode;
    }

    public FieldSolution round() {
        return round;
    }

    /** Split electrodes by index. */
    public Map<Integer, Sectors> split() {
        return split;
    }

    /** Highest harmonic kept. */
    public int maxOrder() {
        return maxOrder;
    }

    /** The harmonic orders solved (ascending). */
    public List<Integer> orders() {
        return List.copyOf(operators.keySet());
    }

    /** The operator of harmonic m (for further right-hand sides), or null if m was not solved. */
    public HarmonicOperator operator(int m) {
        return operators.get(m);
    }

    /** Wall-clock seconds for all harmonic solves. */
    public double seconds() {
        return seconds;
    }

    /**
     * Axial multipole function of harmonic m per volt of the cos(m phi) coefficient of electrode e's sector pattern
     * and its z-derivatives: out[n] = d^n/dz^n Phi_m, Phi_m the coefficient of r^m cos(m phi) near the axis,
     * V/m^m (0 when e does not carry m).
     */
    public void unitAxial(int electrode, int m, double z_m, int order, double[] out) {
        Map<Integer, double[]> d = density.get(m);
        double[] dens = d == null ? null : d.get(electrode);
        if (dens == null) {
            java.util.Arrays.fill(out, 0, order + 1, 0);
            return;
        }
        HarmonicSums.axial(round, m, dens, z_m, order, out);
    }

    /**
     * Phi_m(z) per volt of electrode e's cos(m phi) coefficient as a fast function of z, for quadratures that ask
     * for it at hundreds of planes and again after every common-mode change (deflection responses, stigmation): a
     * table of Phi_m, Phi_m' and Phi_m'' ({@link #unitAxial}, exact element sums) over the mesh's z extent widened
     * by two of its largest radii, interpolated by quintic Hermite polynomials, the step halved from 1/64 of the
     * extent until the error at every interval midpoint is within {@link #TABLE_TOLERANCE} of the function's peak
     * (at most 2048 intervals; {@link #tableError} gives what was reached); exact sums outside the table. Built
     * once per electrode and order on the first call (call it before a parallel loop, not inside one); the
     * returned function is thread-safe.
     */
    public java.util.function.DoubleUnaryOperator unitFunction(int electrode, int m) {
        Map<Integer, double[]> d = density.get(m);
        if (d == null || d.get(electrode) == null) {
            return z -> 0;
        }
        HermiteTable t = tables.computeIfAbsent(((long) electrode << 32) | m, k -> table(electrode, m));
        return t::value;
    }

    /** The measured relative error of the table behind {@link #unitFunction} (built if need be). */
    public double tableError(int electrode, int m) {
        unitFunction(electrode, m);
        HermiteTable t = tables.get(((long) electrode << 32) | m);
        return t == null ? 0 : t.relativeError();
    }

    private HermiteTable table(int electrode, int m) {
        BoundaryMesh mesh = round.mesh();
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        double rMax = 0;
        for (int i = 0; i < mesh.size(); i++) {
            lo = Math.min(lo, mesh.nodeZ(i));
            hi = Math.max(hi, mesh.nodeZ(i));
            rMax = Math.max(rMax, mesh.nodeR(i));
        }
        lo -= 2 * rMax;
        hi += 2 * rMax;
        return HermiteTable.of((z, out) -> unitAxial(electrode, m, z, 2, out), lo, hi, (hi - lo) / 64,
                TABLE_TOLERANCE, 5);
    }

    /** Dipole function Phi_1(z) (V/m) per volt of electrode e's cos(phi) coefficient a_1 (exact element sums). */
    public double unitDipole_V_per_m(int electrode, double z_m) {
        double[] out = new double[1];
        unitAxial(electrode, 1, z_m, 0, out);
        return out[0];
    }

    /**
     * Non-round part of the potential at (x, y, z) for the given sector biases of every split electrode, volts:
     * sum over m and e of [a_m cos(m phi) + b_m sin(m phi)] u_{e,m}(z, r), by direct element sums (near panels
     * by the graded rule). The round part is the round solution's field at the electrodes' mean biases.
     */
    public double potential_V(double x_m, double y_m, double z_m, Map<Integer, List<Double>> sectorBiases_V) {
        double r = Math.hypot(x_m, y_m);
        if (r == 0) {
            return 0;
        }
        double phi = Math.atan2(y_m, x_m);
        double sum = 0;
        for (var em : density.entrySet()) {
            int m = em.getKey();
            double c = Math.cos(m * phi);
            double s = Math.sin(m * phi);
            for (var ed : em.getValue().entrySet()) {
                List<Double> b = sectorBiases_V.get(ed.getKey());
                if (b == null) {
                    continue;
                }
                double[] ab = split.get(ed.getKey()).harmonic(m, b);
                double w = ab[0] * c + ab[1] * s;
                if (w != 0) {
                    sum += w * HarmonicSums.potential(round, m, ed.getValue(), z_m, r);
                }
            }
        }
        return sum;
    }
}
