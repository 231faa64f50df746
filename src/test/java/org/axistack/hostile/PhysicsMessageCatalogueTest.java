package org.axistack.hostile;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.catchThrowable;

import java.util.EnumMap;
import java.util.EnumSet;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.OptionalDouble;
import org.axistack.beam.CurrentScan;
import org.axistack.beam.ElectrostaticChannel;
import org.axistack.beam.Emittance;
import org.axistack.beam.EnvelopeProblem;
import org.axistack.beam.EnvelopeRequest;
import org.axistack.beam.EnvelopeSolver;
import org.axistack.beam.EnvelopeStart;
import org.axistack.field.BemSolver;
import org.axistack.field.FieldSolution;
import org.axistack.field.SolveProgress;
import org.axistack.io.BuiltInStacks;
import org.axistack.model.Electrode;
import org.axistack.model.Particle;
import org.axistack.model.PhysicsException;
import org.axistack.model.PhysicsMessage;
import org.axistack.model.Stack;
import org.axistack.optics.ParaxialOptics;
import org.axistack.probe.ProbeSource;
import org.axistack.probe.ProbeStudy;
import org.axistack.probe.ProbeWorkingPoint;
import org.axistack.trace.ElectrodeGeometry;
import org.axistack.trace.FieldMap;
import org.axistack.trace.RaySet;
import org.axistack.trace.RaySets;
import org.axistack.trace.RayStart;
import org.axistack.trace.TraceSettings;
import org.axistack.trace.TraceTargets;
import org.axistack.trace.TracedAberrations;
import org.axistack.trace.UniformField;
import org.axistack.trace.Tracer;
import org.axistack.tune.BiasRange;
import org.axistack.tune.BiasSweep;
import org.axistack.tune.BiasTuner;
import org.axistack.tune.FocusTarget;
import org.axistack.tune.PairTuner;
import org.axistack.tune.SecondCondition;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * The catalogue of physics failures (style.md item 5, as for the input-file catalogue): every entry has a problem
 * and a fix, fills cleanly, and is produced by the physics code it names, through the public API a command uses.
 */
class PhysicsMessageCatalogueTest {

    private static final Particle EL = Particle.electron();
    private static Stack demo;
    private static FieldSolution solution;

    @BeforeAll
    static void solveTheDemo() throws Exception {
        demo = BuiltInStacks.demo();
        solution = BemSolver.solve(demo.electrodes(), demo.mesh(), SolveProgress.NONE);
    }

    private static Map<PhysicsMessage, Runnable> cases() {
        Electrode stop = new Electrode.Aperture("stop", 0, 0.03, 1e-3, 6e-3, 1e-3);
        ElectrodeGeometry g = new ElectrodeGeometry(List.of(stop), -0.01, 0.07, 0.02);
        ElectrodeGeometry open = new ElectrodeGeometry(List.of(), -0.01, 0.07, 0.02);
        Tracer drift = new Tracer(new UniformField(0, 0), g, TraceSettings.defaults());
        Tracer freeDrift = new Tracer(new UniformField(0, 0), open, TraceSettings.defaults());
        Tracer retarding = new Tracer(new UniformField(-200, 0), g, TraceSettings.defaults());
        TraceTargets screen = TraceTargets.screenOnly(0.06);
        RaySet fan = RaySets.pointFan(EL, 100, 0, 0, 0.01, 2, 1);
        ElectrostaticChannel mirror = new ElectrostaticChannel((z, order, out) -> {
            for (int k = 0; k <= order; k++) {
                out[k] = k == 0 ? -2000 : 0;
            }
        }, EL, 1000);
        EnvelopeProblem base = new EnvelopeProblem(0, 0.1, 1e-3, 0, 0, 0);
        ElectrostaticChannel plain = new ElectrostaticChannel(new UniformField(0, 0), EL, 1000);
        FocusTarget parallel = FocusTarget.parallelBeam(0.2);

        Map<PhysicsMessage, Runnable> c = new EnumMap<>(PhysicsMessage.class);
        c.put(PhysicsMessage.CURRENT_NEGATIVE, () -> new EnvelopeRequest(-1e-3, new EnvelopeStart.Source(1e-3, 1e-3)));
        c.put(PhysicsMessage.CURRENT_SCAN_TOP, () -> new CurrentScan(new EnvelopeSolver()).scan(plain, base, -1, 10, null));
        c.put(PhysicsMessage.CURRENT_SCAN_STEPS, () -> new CurrentScan(new EnvelopeSolver()).scan(plain, base, 1e-6, 0, null));
        c.put(PhysicsMessage.EMITTANCE_NEGATIVE, () -> Emittance.edge(-1e-6));
        c.put(PhysicsMessage.START_RADIUS, () -> new EnvelopeStart.Source(0, 1e-3));
        c.put(PhysicsMessage.START_SLOPE, () -> new EnvelopeStart.RadiusSlope(1e-3, Double.NaN, Emittance.edge(0)));
        c.put(PhysicsMessage.SOURCE_DIVERGENCE, () -> new EnvelopeStart.Source(1e-3, -1e-3));
        c.put(PhysicsMessage.ENVELOPE_RANGE, () -> new EnvelopeProblem(1, 0, 1e-3, 0, 0, 0));
        c.put(PhysicsMessage.NOT_REACHING_START, () -> new EnvelopeSolver().solve(mirror, base, z -> true));
        c.put(PhysicsMessage.TRACE_TOLERANCE, () -> TraceSettings.defaults().withRelativeTolerance(1));
        c.put(PhysicsMessage.SCREEN_OUTSIDE_REGION, () -> Tracer.checkTargets(g, TraceTargets.screenOnly(0.5)));
        c.put(PhysicsMessage.PLANE_OUTSIDE_REGION, () -> Tracer.checkTargets(g, new TraceTargets(List.of(-0.5), 0.06)));
        c.put(PhysicsMessage.PLANE_BEYOND_SCREEN, () -> Tracer.checkTargets(g, new TraceTargets(List.of(0.065), 0.06)));
        c.put(PhysicsMessage.RAY_OUTSIDE_REGION, () -> drift.trace(EL, RayStart.withSlopes(1, 0, 0, -0.05, 0, 0, 100), screen));
        c.put(PhysicsMessage.RAY_INSIDE_ELECTRODE, () -> drift.trace(EL, RayStart.withSlopes(3, 2e-3, 0, 0.03, 0, 0, 100),
                screen));
        c.put(PhysicsMessage.RAY_AT_SCREEN, () -> drift.trace(EL, RayStart.withSlopes(1, 0, 0, 0.065, 0, 0, 100), screen));
        c.put(PhysicsMessage.PLANE_BEFORE_START, () -> drift.trace(EL, RayStart.withSlopes(1, 0, 0, 0.02, 0, 0, 100),
                new TraceTargets(List.of(0.01), 0.06)));
        c.put(PhysicsMessage.RAY_NO_ENERGY, () -> retarding.trace(EL, RayStart.withSlopes(1, 0, 0, 0, 0, 0, 100), screen));
        c.put(PhysicsMessage.RAY_START_NOT_FINITE, () -> new RayStart(1, Double.NaN, 0, 0, 0, 0, 1, 100));
        c.put(PhysicsMessage.RAY_START_BACKWARD, () -> new RayStart(1, 0, 0, 0, 1, 0, -1, 100));
        c.put(PhysicsMessage.RAY_ENERGY, () -> new RayStart(1, 0, 0, 0, 0, 0, 1, -5));
        c.put(PhysicsMessage.RAY_COUNT, () -> RaySets.pointFan(EL, 100, 0, 0, 0.01, 0, 1));
        c.put(PhysicsMessage.RAY_SET_NEGATIVE, () -> RaySets.uniformDisk(EL, 100, 0, -1e-3, 5, 1));
        c.put(PhysicsMessage.FAN_ANGLE, () -> RaySets.pointFan(EL, 100, 0, 0, 2, 2, 1));
        c.put(PhysicsMessage.GAUSSIAN_CUTOFF, () -> RaySets.gaussianBeam(EL, 100, 0, 1e-3, 1e-5, 5, 1));
        c.put(PhysicsMessage.ENERGY_OFFSETS_EMPTY, () -> fan.withEnergyOffsets(List.of()));
        c.put(PhysicsMessage.ENERGY_OFFSET_NOT_FINITE, () -> fan.withEnergyOffsets(List.of(Double.NaN)));
        c.put(PhysicsMessage.ENERGY_OFFSET_TOO_LOW, () -> fan.withEnergyOffsets(List.of(-150.0)));
        c.put(PhysicsMessage.ENERGY_SPREAD_NEGATIVE, () -> fan.withGaussianEnergy(-1, 1));
        c.put(PhysicsMessage.FIELD_MAP_TOO_FINE, () -> FieldMap.checkStep(0, 0.1, 0.01, 1e-9));
        c.put(PhysicsMessage.ABERRATION_HEIGHT, () -> TracedAberrations.measure(drift, EL, 100, 0, 0.06, -1e-3,
                OptionalDouble.empty()));
        c.put(PhysicsMessage.ABERRATION_RAY_LOST, () -> TracedAberrations.measure(drift, EL, 100, 0, 0.06, 16e-3,
                OptionalDouble.empty()));
        c.put(PhysicsMessage.ABERRATION_NOT_CONVERGING, () -> TracedAberrations.measure(freeDrift, EL, 100, 0, 0.06,
                1e-3, OptionalDouble.empty()));
        ProbeSource source = new ProbeSource(1e7, 1, OptionalDouble.empty());
        c.put(PhysicsMessage.PROBE_BRIGHTNESS, () -> new ProbeSource(-1, 1, OptionalDouble.empty()));
        c.put(PhysicsMessage.PROBE_ENERGY_SPREAD, () -> new ProbeSource(1e7, Double.NaN, OptionalDouble.empty()));
        c.put(PhysicsMessage.PROBE_SOURCE_SIZE, () -> new ProbeSource(1e7, 1, OptionalDouble.of(0)));
        c.put(PhysicsMessage.PROBE_ANGLE_RANGE, () -> new ProbeStudy.Settings(source, 2e-3, 1e-3, 1e-12, 1e-6, 10));
        c.put(PhysicsMessage.PROBE_CURRENT_RANGE, () -> new ProbeStudy.Settings(source, 1e-3, 2e-3, 1e-6, 1e-12, 10));
        c.put(PhysicsMessage.PROBE_CURVE_POINTS, () -> new ProbeStudy.Settings(source, 1e-3, 2e-3, 1e-12, 1e-6, 1));
        // the demo's focus electrode: at 0 V no lens (afocal), at -30 V a weak lens whose focal point lies far before
        // the field, so an object between it and the lens has a virtual image; at its stored bias a real one
        c.put(PhysicsMessage.PROBE_NOT_CONVERGING, () -> workingPoint(0, OptionalDouble.empty()));
        c.put(PhysicsMessage.PROBE_OBJECT_IN_FIELD, () -> workingPoint(demo.biases_V()[1], OptionalDouble.of(0)));
        c.put(PhysicsMessage.PROBE_NO_REAL_IMAGE, () -> workingPoint(-30, OptionalDouble.of(-0.06)));
        c.put(PhysicsMessage.BIAS_RANGE, () -> new BiasRange(100, -100));
        c.put(PhysicsMessage.UNKNOWN_ELECTRODE, () -> BiasSweep.run(solution, demo, "no-such", 0, 100, 2,
                OptionalDouble.empty(), null));
        String first = demo.names().get(0);
        String second = demo.names().get(1);
        c.put(PhysicsMessage.SAME_ELECTRODE_TWICE, () -> new PairTuner(solution, demo).solve(first, first, parallel,
                new SecondCondition.FocalLength(0.05), new BiasRange(-100, 100), new BiasRange(-100, 100)));
        c.put(PhysicsMessage.MAGNIFICATION_NEEDS_OBJECT, () -> new PairTuner(solution, demo).solve(first, second,
                parallel, new SecondCondition.Magnification(-1), new BiasRange(-100, 100), new BiasRange(-100, 100)));
        c.put(PhysicsMessage.MAGNIFICATION_VALUE, () -> new SecondCondition.Magnification(0));
        c.put(PhysicsMessage.FOCAL_LENGTH_VALUE, () -> new SecondCondition.FocalLength(Double.NaN));
        c.put(PhysicsMessage.IMAGE_PLANE, () -> FocusTarget.parallelBeam(Double.NaN));
        c.put(PhysicsMessage.OBJECT_AFTER_IMAGE, () -> FocusTarget.object(0.3, 0.2));
        return c;
    }

    private static ProbeWorkingPoint workingPoint(double focus_V, OptionalDouble objectZ_m) {
        double[] b = demo.biases_V().clone();
        b[1] = focus_V;
        ParaxialOptics optics = ParaxialOptics.of(solution.withBiases(b), demo);
        return ProbeWorkingPoint.of("test", b, optics, objectZ_m, demo.beam().particle());
    }

    @Test
    void everyEntryHasAProblemAndAFixAndFillsCleanly() {
        for (PhysicsMessage m : PhysicsMessage.values()) {
            assertThat(m.problemTemplate()).as(m.name()).isNotBlank().doesNotEndWith(".").doesNotContain("\n");
            assertThat(m.fixTemplate()).as(m.name()).isNotBlank().doesNotEndWith(".").doesNotContain("\n");
            Map<String, Object> values = new HashMap<>();
            for (String p : m.placeholders()) {
                values.put(p, "<" + p + ">");
            }
            assertThat(m.format(values)).as(m.name()).contains(". Fix: ").doesNotContain("{").endsWith(".");
            String t = m.problemTemplate() + " " + m.fixTemplate();
            assertThat(t).as(m.name() + ": user units (mm, mrad), not SI").doesNotContain(" m ").doesNotContain(" rad ")
                    .doesNotContain("V/m ");
        }
    }

    @Test
    void everyEntryIsProducedByThePhysicsItNames() {
        Map<PhysicsMessage, Runnable> cases = cases();
        assertThat(EnumSet.complementOf(EnumSet.copyOf(cases.keySet()))).as("entries without a producing case").isEmpty();
        for (Map.Entry<PhysicsMessage, Runnable> e : cases.entrySet()) {
            Throwable t = catchThrowable(() -> e.getValue().run());
            assertThat(t).as(e.getKey().name()).isInstanceOf(PhysicsException.class);
            PhysicsException p = (PhysicsException) t;
            assertThat(p.entry()).as(p.getMessage()).isEqualTo(e.getKey());
            assertThat(p.getMessage()).as(e.getKey().name()).contains(". Fix: ").doesNotContain("{").doesNotContain("E-")
                    .doesNotContain("NaN mm mrad");
        }
    }

    @Test
    void numbersAreWrittenInTheUsersUnitsByTheOneFormatter() {
        PhysicsException e = PhysicsMessage.SCREEN_OUTSIDE_REGION.exception("z", 500.0, "region", "z from -10 to 70 mm");
        assertThat(e.getMessage()).startsWith("screen at z = 500 mm lies outside the traced region (z from -10 to 70 mm)")
                .endsWith("Fix: put the screen inside it.");
        assertThat(e.kind()).isEqualTo(PhysicsMessage.Kind.REQUEST);
        assertThat(PhysicsMessage.NOT_REACHING_START.kind()).isEqualTo(PhysicsMessage.Kind.OUTCOME);
    }
}
