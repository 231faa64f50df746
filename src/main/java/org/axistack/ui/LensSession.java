package org.axistack.ui;

import java.lang.management.ManagementFactory;
import java.lang.management.ThreadMXBean;
import java.util.Locale;
import java.util.concurrent.CancellationException;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;

import org.axistack.field.BemSolver;
import org.axistack.field.BiasedField;
import org.axistack.field.FieldSolution;
import org.axistack.field.SectorField;
import org.axistack.field.SolveProgress;
import org.axistack.model.Units;
import org.axistack.model.Stack;
import org.axistack.report.GeometryChart;
import org.axistack.report.LensChart;

/**
 * One geometry in the window: the stack as loaded, its boundary-element solution and the unit-bias
 * potential grid. Both are made once ({@link #open}, the expensive step, run off the event thread); every
 * bias change after that re-biases the stored solution ({@link FieldSolution#withBiases}) and the stored
 * grid, and never solves again. Immutable and thread-safe.
 */
public final class LensSession {

    /** Grid columns along z and rows along r of the equipotential map. */
    static final int GRID_NZ = 181;
    static final int GRID_NR = 49;
    /** Points of the axial potential curve. */
    static final int AXIS_POINTS = 400;
    /** About this many equipotential levels are drawn. */
    static final int LEVELS = 16;

    private static final ThreadMXBean THREADS = ManagementFactory.getThreadMXBean();
    /** One helper thread for the part of a view that runs beside the caller's (two cores are the design target). */
    private static final ExecutorService HELPER = Executors.newSingleThreadExecutor(r -> {
        Thread t = new Thread(r, "axistack-view-helper");
        t.setDaemon(true);
        return t;
    });

    private final Stack stack;
    private final FieldSolution solution;
    private final PotentialGrid grid;
    private final double zMin_m;
    private final double zMax_m;
    /** The dipole harmonic of the split electrodes (null when every electrode is round). */
    private final SectorField sectors;

    private LensSession(Stack stack, FieldSolution solution, PotentialGrid grid, double zMin_m, double zMax_m,
            SectorField sectors) {
        this.stack = stack;
        this.solution = solution;
        this.sectors = sectors;
        this.grid = grid;
        this.zMin_m = zMin_m;
        this.zMax_m = zMax_m;
    }

    /**
     * Solves the stack's field and maps the unit potentials. Progress goes 0..0.7 for the solve and 0.7..1
     * for the map; return false from it to cancel.
     *
     * @throws CancellationException when cancelled
     */
    public static LensSession open(Stack stack, SolveProgress progress) {
        FieldSolution sol = BemSolver.solve(stack.electrodes(), stack.mesh(),
                (stage, f) -> progress.update("field solve: " + stage, 0.7 * f));
        double z0 = stack.minZ_m(), z1 = stack.maxZ_m();
        double pad = 0.04 * (z1 - z0);
        double rTop = Units.mmToM(1.08 * maxRadius_mm(stack));
        org.axistack.trace.ElectrodeGeometry geometry = org.axistack.trace.ElectrodeGeometry.of(stack);
        double near = 0.5 * rTop / (GRID_NR - 1);
        PotentialGrid.Inside inside = (z, r) -> geometry.insideElectrode(z, r)
                .or(() -> geometry.onSurface(z, r, near)).map(stack::indexOf).orElse(-1);
        PotentialGrid grid = PotentialGrid.compute(sol, z0 - pad, z1 + pad, rTop, GRID_NZ, GRID_NR, inside,
                f -> progress.update("equipotential map", 0.7 + 0.3 * f));
        BiasedField first = sol.biased();
        first.axial(0.5 * (z0 + z1), 0, new double[1]); // builds the axial expansion once, here, not on the first move
        SectorField sectors = null;
        if (stack.hasSectors()) {
            // the dipole harmonic only: the central ray's deflection is first order in it
            sectors = SectorField.solve(sol, stack.sectorsByIndex(), 1, (stage, f) -> progress.update("split electrodes: " + stage, 1));
        }
        return new LensSession(stack, sol, grid, z0 - pad, z1 + pad, sectors);
    }

    private static double maxRadius_mm(Stack stack) {
        return stack.electrodes().stream().mapToDouble(e -> Units.mToMm(e.contour().maxR_m())).max().orElse(1);
    }

    /** The stack as opened (its own biases). */
    public Stack stack() {
        return stack;
    }

    public FieldSolution solution() {
        return solution;
    }

    /**
     * Everything drawn and listed for these biases (volts, electrode order): re-biased field, equipotentials,
     * live rays, axial potential, properties. Costs milliseconds (no solve): the rays and properties are computed
     * on a helper thread while the calling thread sums the grid and draws the equipotentials. The envelope is not
     * included (see {@link EnvelopeLayer}).
     */
    public LensView view(double[] biases_V) {
        return view(biases_V, java.util.Map.of());
    }

    /**
     * The view at these biases and, for split electrodes, these x and y differential biases (volts, by electrode
     * name; electrodes not named keep their stored sector biases). With split electrodes the view carries the
     * central ray's x(z) and y(z) ({@link CentralRayView}).
     */
    public LensView view(double[] biases_V, java.util.Map<String, double[]> differentials_V) {
        long t0 = System.nanoTime();
        long c0 = THREADS.getCurrentThreadCpuTime();
        Stack biased = CentralRayView.withDifferentials(stack.withBiases(biases_V), differentials_V);
        BiasedField field = solution.withBiases(biases_V);
        // rays and optics on the helper thread while this one sums the grid and traces the equipotentials
        Future<Side> side = HELPER.submit(() -> {
            long h0 = THREADS.getCurrentThreadCpuTime();
            LiveRays.Result rays = LiveRays.trace(biased, field);
            org.axistack.optics.ParaxialOptics[] optics = new org.axistack.optics.ParaxialOptics[1];
            PropertySheet props = PropertySheet.of(biased, field, o -> optics[0] = o);
            java.util.Optional<CentralRayView> central = java.util.Optional.empty();
            if (sectors != null && optics[0] != null) {
                try {
                    // the round optics of the property table, not computed a second time
                    central = java.util.Optional.of(CentralRayView.of(biased, optics[0], sectors));
                    props = props.withCentralRay(central.get());
                } catch (RuntimeException e) {
                    props = props.withRow(new PropertySheet.Row("central ray", "not available: " + e.getMessage(),
                            PropertySheet.Level.CAUTION));
                }
            }
            return new Side(rays, props, central, (THREADS.getCurrentThreadCpuTime() - h0) / 1e6);
        });
        double[][] v = grid.combine(biases_V);
        double lo = Double.POSITIVE_INFINITY, hi = Double.NEGATIVE_INFINITY;
        for (double[] row : v) {
            for (double x : row) {
                lo = Math.min(lo, x);
                hi = Math.max(hi, x);
            }
        }
        double[] levels = withoutBiases(Isolines.levels(lo, hi, LEVELS), biases_V, 1e-3 * (hi - lo));
        LensChart.Lines iso = Isolines.trace(grid, v, levels);
        double spacing = !(hi > lo) ? 0 : Isolines.nearestRoundStep((hi - lo) / (LEVELS + 1));
        String levelsNote = levels.length < 1 ? "no equipotentials (all electrodes at one potential)"
                : String.format(Locale.ROOT, "equipotentials every %s V", UiFormat.num(spacing));
        LensChart.LinesBuilder axis = new LensChart.LinesBuilder();
        double[] out = new double[1];
        for (int i = 0; i < AXIS_POINTS; i++) {
            double z = zMin_m + (zMax_m - zMin_m) * i / (AXIS_POINTS - 1);
            field.axial(z, 0, out);
            axis.add(Units.mToMm(z), out[0]);
        }
        Side s = join(side);
        LensChart.Layers layers = new LensChart.Layers(biased, iso, levelsNote, s.rays().kept(), s.rays().lost(),
                s.rays().note(), LensChart.Lines.none(), axis.build(), s.props().marks(),
                s.central().map(CentralRayView::x).orElse(LensChart.Lines.none()),
                s.central().map(CentralRayView::y).orElse(LensChart.Lines.none()));
        double ms = (System.nanoTime() - t0) / 1e6;
        double cpuMs = (THREADS.getCurrentThreadCpuTime() - c0) / 1e6 + s.cpu_ms();
        return new LensView(biased, field, layers, s.props(), s.rays(), ms, cpuMs);
    }

    /** The rays and properties of a view, with the processor time they took. */
    private record Side(LiveRays.Result rays, PropertySheet props, java.util.Optional<CentralRayView> central,
            double cpu_ms) {
    }

    private static Side join(Future<Side> f) {
        try {
            return f.get();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new CancellationException("view interrupted");
        } catch (ExecutionException e) {
            if (e.getCause() instanceof RuntimeException r) {
                throw r;
            }
            throw new IllegalStateException(e.getCause());
        }
    }

    /**
     * Drops levels at an electrode's own potential: that equipotential is the electrode surface, and tracing
     * it through the grid only draws round-off (loops where the tiny field beside a wall changes sign).
     */
    static double[] withoutBiases(double[] levels, double[] biases_V, double tolerance_V) {
        return java.util.Arrays.stream(levels)
                .filter(l -> java.util.Arrays.stream(biases_V).noneMatch(b -> Math.abs(l - b) <= tolerance_V))
                .toArray();
    }

    /** Recommended chart size in pixels for this stack. */
    public int[] chartSize() {
        int[] s = GeometryChart.preferredSize(stack);
        return new int[] {s[0], s[1] + 260};
    }
}
