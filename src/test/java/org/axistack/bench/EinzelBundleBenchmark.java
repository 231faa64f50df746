package org.axistack.bench;

import java.util.concurrent.TimeUnit;

import org.axistack.field.BemSolver;
import org.axistack.field.BiasedField;
import org.axistack.field.SolveProgress;
import org.axistack.io.BuiltInStacks;
import org.axistack.model.Stack;
import org.axistack.trace.BundleResult;
import org.axistack.trace.BundleTracer;
import org.axistack.trace.ElectrodeGeometry;
import org.axistack.trace.AxialTable;
import org.axistack.trace.FieldMap;
import org.axistack.trace.NearAxisField;
import org.axistack.trace.RaySet;
import org.axistack.trace.RaySets;
import org.axistack.trace.TraceProgress;
import org.axistack.trace.TraceSettings;
import org.axistack.trace.TraceTargets;
import org.axistack.trace.Tracer;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;

/**
 * Target (issue 5): a 1000-ray parallel bundle through the built-in demo einzel lens to its screen in
 * at most 1 s median on 2 cores. The field solve is done once in the setup (it is not part of the
 * target). Rays: uniform disk of radius 2 mm (40 % of the bore), seeded. Field: boundary-element
 * solution; near-axis series of tabulated axial derivatives (AxialTable, 0.1 mm) plus a bicubic
 * Hermite map of the remainder on a 0.125 mm (z, r) grid (FieldMap), both built in the setup; what
 * the trace command uses by default.
 *
 * <p>Run: see DEVELOPERS.md (java ... org.openjdk.jmh.Main EinzelBundle). A quick run without JMH:
 * {@code java ... org.axistack.bench.EinzelBundleBenchmark}.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.SampleTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Fork(value = 1, jvmArgsAppend = "-Xmx2g")
@Warmup(iterations = 2, time = 5)
@Measurement(iterations = 3, time = 10)
public class EinzelBundleBenchmark {

    Tracer tracer;
    RaySet rays;
    TraceTargets targets;
    FieldMap map;
    static double STEP_M = Double.parseDouble(System.getProperty("step", "0.125e-3"));
    static double TOL = Double.parseDouble(System.getProperty("tol", "1e-11"));

    @Setup
    public void setup() throws Exception {
        Stack stack = BuiltInStacks.demo();
        BiasedField field = BemSolver.solve(stack.electrodes(), stack.mesh(), SolveProgress.NONE)
                .withBiases(stack.biases_V());
        ElectrodeGeometry geometry = ElectrodeGeometry.of(stack);
        double z0 = stack.beam().startZ_m().orElseThrow(), z1 = stack.screenZ_m().orElseThrow();
        AxialTable table = new AxialTable(field, z0 - 2e-3, z1 + 2e-3, 0.1e-3);
        map = new FieldMap(field, new NearAxisField(table), geometry, z0 - 1e-3, z1 + 1e-3, 5e-3, STEP_M,
                TraceProgress.none());
        tracer = new Tracer(map, geometry, TraceSettings.defaults().withRelativeTolerance(TOL));
        rays = RaySets.uniformDisk(stack.beam().particle(), stack.beam().energy_eV(),
                stack.beam().startZ_m().orElseThrow(), 2e-3, 1000, 42);
        targets = TraceTargets.screenOnly(stack.screenZ_m().orElseThrow());
    }

    @Benchmark
    public BundleResult bundle1000() {
        return new BundleTracer(tracer, 2).trace(rays, targets, TraceProgress.none());
    }

    /** Quick timing without JMH: setup, then ten bundles, printing each time and the median. */
    public static void main(String[] args) throws Exception {
        EinzelBundleBenchmark b = new EinzelBundleBenchmark();
        long t0 = System.nanoTime();
        b.setup();
        System.out.printf("setup %.2f s, map %d of %d cells, max errors %.3g V, %.3g V/m%n", (System.nanoTime() - t0) * 1e-9,
                b.map.mappedCells(), b.map.cells(), b.map.maxPotentialError_V(), b.map.maxFieldError_V_per_m());
        double[] times = new double[Integer.getInteger("n", 10)];
        for (int i = 0; i < times.length; i++) {
            BundleResult r = b.bundle1000();
            times[i] = r.seconds();
            System.out.printf("bundle %d: %.3f s, statuses %s, mean evaluations %.0f, max energy error %.2e,"
                    + " rms at screen %.6f mm%n", i, r.seconds(), r.statusCounts(),
                    r.trajectories().stream().mapToInt(t -> t.evaluations()).average().orElse(0), r.maxEnergyError(),
                    1e3 * Math.sqrt(r.trajectories().stream().mapToDouble(t -> t.end().r_m() * t.end().r_m()).average().orElse(0)));
        }
        java.util.Arrays.sort(times);
        System.out.printf("median %.3f s%n", times[times.length / 2]);
    }
}
