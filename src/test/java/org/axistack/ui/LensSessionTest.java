package org.axistack.ui;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.nio.file.Path;
import org.axistack.field.SolveProgress;
import org.axistack.io.StackReader;
import org.axistack.model.Units;
import org.axistack.model.Stack;
import org.axistack.optics.CardinalElements;
import org.axistack.optics.ParaxialOptics;
import org.axistack.trace.TraceStatus;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * The window's view model without a display: re-biasing the stored solution gives the same properties as the
 * optics package computed from a fresh field at the new biases, the potential grid is the superposition the
 * field evaluator gives, and the live rays of an einzel lens cross the axis near its paraxial focus.
 */
class LensSessionTest {

    static LensSession session;
    static Stack stack;

    @BeforeAll
    static void open() throws Exception {
        stack = StackReader.read(Path.of("lens-library/electron-flood-einzel.toml"));
        session = LensSession.open(stack, SolveProgress.NONE);
    }

    @Test
    void rebiasedPropertiesEqualTheOpticsOfTheFieldAtThoseBiases() {
        double[] b = stack.biases_V();
        int focus = stack.indexOf("focus");
        b[focus] = b[focus] * 1.3;
        LensView v = session.view(b);
        // reference: the optics package on the stored solution at the same biases (its own API)
        CardinalElements ref = ParaxialOptics.of(session.solution().withBiases(b), stack.withBiases(b)).cardinal();
        assertThat(v.properties().cardinal()).isPresent();
        assertThat(v.properties().cardinal().get().focalLengthImage_m())
                .isCloseTo(ref.focalLengthImage_m(), within(1e-12));
        assertThat(v.properties().value(PropertySheet.FOCAL_LENGTH_IMAGE))
                .contains(UiFormat.num(Units.mToMm(ref.focalLengthImage_m())));
        // a stronger middle electrode shortens the focal length of an einzel lens (common practice, no source)
        LensView v0 = session.view(stack.biases_V());
        assertThat(v.properties().cardinal().get().focalLengthImage_m())
                .isLessThan(v0.properties().cardinal().get().focalLengthImage_m());
        assertThat(v.stack().electrodes().get(focus).bias_V()).isEqualTo(b[focus]);
        LensView again = session.view(b);
        System.out.printf("view compute: %.1f ms (first), %.1f ms wall, %.1f ms cpu%n", v0.compute_ms(),
                again.compute_ms(), again.cpu_ms());
    }

    @Test
    void gapMarginsFollowTheBiasesAsPlanAssessesThem() {
        // the window's gap rows are plan's assessment (tune.GapMargins) at the biases shown: the voltage across
        // inlet - focus follows the focus bias, and a bias far above the gap rule's voltages turns the row red
        double[] b = stack.biases_V();
        int focus = stack.indexOf("focus");
        for (double scale : new double[] {1, 100}) {
            double[] bb = b.clone();
            bb[focus] = b[focus] * scale;
            LensView v = session.view(bb);
            org.axistack.tune.GapMargins.Row plan = org.axistack.tune.GapMargins.of(stack.withBiases(bb)).get(0);
            PropertySheet.Row row = v.properties().rows().stream()
                    .filter(r -> r.label().equals(PropertySheet.gapLabel(plan))).findFirst().orElseThrow();
            assertThat(row.value()).startsWith(UiFormat.num(plan.voltage_V()) + " over ")
                    .contains(UiFormat.num(plan.percentOfComfort()) + " % of the gap rule's comfort");
            assertThat(plan.voltage_V()).isCloseTo(Math.abs(bb[focus]), within(1e-9));
            assertThat(row.level()).isEqualTo(scale == 1 ? PropertySheet.Level.PLAIN : PropertySheet.Level.OVER);
        }
    }

    @Test
    void windowQuotesCsAndCcForTheStacksObjectAsThePlanDoes() {
        // an object 60 mm before the lens: the window quotes, beside the image-side Cs and Cc, the object-side ones
        // for that object, as plan and optics do (the object side is chosen in one place)
        double zObject = stack.minZ_m() - 0.06;
        Stack withObject = stack.withBeam(stack.beam().withObjectZ_m(java.util.OptionalDouble.of(zObject)));
        LensSession s = LensSession.open(withObject, SolveProgress.NONE);
        ParaxialOptics optics = ParaxialOptics.of(s.solution().withBiases(withObject.biases_V()), withObject);
        var forObject = optics.aberrations(zObject);
        LensView v = s.view(withObject.biases_V());
        assertThat(v.properties().value(PropertySheet.CS))
                .contains(UiFormat.num(Units.mToMm(forObject.sphericalImage_m())));
        assertThat(v.properties().value(PropertySheet.CS_OBJECT))
                .contains(UiFormat.num(Units.mToMm(forObject.sphericalObject_m().getAsDouble())));
        assertThat(v.properties().value(PropertySheet.CC_OBJECT))
                .contains(UiFormat.num(Units.mToMm(forObject.chromaticObject_m().getAsDouble())));
        // the stored stack has no object: no object-side rows
        assertThat(session.view(stack.biases_V()).properties().value(PropertySheet.CS_OBJECT)).isEmpty();
    }

    @Test
    void aSteererMovesTheCentralRayLinearlyAndTheViewAgreesWithTheDeflectionResponse() throws Exception {
        // the library's steerer, with the beam started on the axis (only the steering moves the central ray) and
        // an x differential of 20 V
        Stack lib = StackReader.read(Path.of("lens-library/proton-beamline-steerer.toml"));
        lib = lib.withBeam(lib.beam().withStartRay(org.axistack.model.StartRay.ON_AXIS));
        Stack split = CentralRayView.withDifferentials(lib, java.util.Map.of("steer", new double[] {20, 0}));
        LensSession s = LensSession.open(split, SolveProgress.NONE);
        double[] b = split.biases_V();
        LensView stored = s.view(b);
        double x20 = Double.parseDouble(stored.properties().value(PropertySheet.CENTRAL_X).orElseThrow());
        // reference: the optics package's deflection response at the screen (its own API, as optics --json uses it)
        java.util.Map<Integer, org.axistack.model.Sectors> byIndex = java.util.Map.of(1, split.sectors().get("steer"));
        var sf = org.axistack.field.SectorField.solve(s.solution(), byIndex, 1, SolveProgress.NONE);
        ParaxialOptics optics = ParaxialOptics.of(s.solution().withBiases(b), split);
        var d = org.axistack.optics.SplitDeflection.of(sf, optics, split.beam().startZ_m().getAsDouble(),
                new double[] {split.screenZ_m().getAsDouble()});
        double expected = Units.mToMm(d.ray(0, java.util.Map.of(1, split.sectors().get("steer").biases_V()))[0]);
        assertThat(x20).isCloseTo(expected, within(1e-3 * Math.abs(expected))); // the window shows 4 digits
        assertThat(Math.abs(x20)).isGreaterThan(1e-3);
        // first order: twice the x differential, twice the offset; none of it in y; zero differential, no offset
        LensView doubled = s.view(b, java.util.Map.of("steer", new double[] {40, 0}));
        double x40 = Double.parseDouble(doubled.properties().value(PropertySheet.CENTRAL_X).orElseThrow());
        assertThat(x40).isCloseTo(2 * x20, within(2e-3 * Math.abs(x20)));
        assertThat(Double.parseDouble(doubled.properties().value(PropertySheet.CENTRAL_Y).orElseThrow()))
                .isCloseTo(0, within(1e-6 * Math.abs(x20)));
        LensView off = s.view(b, java.util.Map.of("steer", new double[] {0, 0}));
        assertThat(Double.parseDouble(off.properties().value(PropertySheet.CENTRAL_X).orElseThrow()))
                .isCloseTo(0, within(1e-9));
        assertThat(doubled.layers().centralX().size()).isEqualTo(CentralRayView.PLANES);
        double[] ms = new double[9];
        for (int i = 0; i < ms.length; i++) {
            ms[i] = s.view(b, java.util.Map.of("steer", new double[] {10 + i, -i})).compute_ms();
        }
        java.util.Arrays.sort(ms);
        System.out.printf("steerer view compute: median %.1f ms of %d (load affects it)%n", ms[ms.length / 2], ms.length);
        // a round stack has no central-ray rows
        assertThat(session.view(stack.biases_V()).properties().value(PropertySheet.CENTRAL_X)).isEmpty();
    }

    @Test
    void trajectoryTableHasEveryRayAtEveryPlaneAndCancelWritesNothing(@org.junit.jupiter.api.io.TempDir Path dir)
            throws Exception {
        var field = session.solution().biased();
        var res = TableBundle.trace(stack, field, org.axistack.trace.TraceProgress.none());
        assertThat(res.trajectories()).hasSize(TableBundle.RAYS);
        Path csv = dir.resolve("rays.csv");
        org.axistack.io.TraceTableCsv.write(csv, res);
        var lines = java.nio.file.Files.readAllLines(csv);
        assertThat(lines.get(0)).startsWith("ray_id,z_mm,x_mm,y_mm,r_mm,slope_mrad");
        assertThat(lines).hasSize(1 + TableBundle.RAYS * res.targets().planes_m().size());
        // a bundle cancelled from the start stops with CancellationException (the window then writes nothing)
        org.assertj.core.api.Assertions.assertThatThrownBy(() -> TableBundle.trace(stack, field,
                new org.axistack.trace.TraceProgress() {
            @Override
            public void raysDone(int done, int total) {
            }

            @Override
            public boolean isCancelled() {
                return true;
            }
        })).isInstanceOf(java.util.concurrent.CancellationException.class);
    }

    @Test
    void potentialGridIsTheSuperpositionOfTheFieldAtTheNodes() {
        double[] b = stack.biases_V();
        PotentialGrid g = PotentialGrid.compute(session.solution(), stack.minZ_m(), stack.maxZ_m(), 2e-3, 5, 3,
                PotentialGrid.Inside.NOWHERE,
                PotentialGrid.Progress.NONE);
        double[][] v = g.combine(b);
        var field = session.solution().withBiases(b);
        for (int i = 0; i < g.nz(); i++) {
            for (int j = 0; j < g.nr(); j++) {
                // linearity of Laplace's equation: sum of unit solutions equals the biased evaluation
                assertThat(v[i][j]).isCloseTo(field.potential_V(g.z_m(i), g.r_m(j)), within(1e-9 * 200));
            }
        }
    }

    @Test
    void parallelLiveRaysCrossTheAxisNearTheParaxialRealFocus() {
        LensView v = session.view(stack.biases_V());
        CardinalElements c = v.properties().cardinal().orElseThrow();
        assertThat(v.rays().trajectories()).isNotEmpty();
        // the innermost ray (12 % of the bore) is nearly paraxial: where it crosses the axis after the lens it
        // should agree with the paraxial focus within a fraction of f (third-order aberration moves it toward
        // the lens; tolerance 5 % of f2 is generous for h/bore = 0.12)
        var inner = v.rays().trajectories().get(0);
        assertThat(inner.status()).isEqualTo(TraceStatus.SCREEN);
        double zCross = Double.NaN;
        var path = inner.path();
        for (int i = 1; i < path.size(); i++) {
            if (path.get(i - 1).x_m() > 0 && path.get(i).x_m() <= 0) {
                zCross = path.get(i - 1).z_m() + (path.get(i).z_m() - path.get(i - 1).z_m())
                        * path.get(i - 1).x_m() / (path.get(i - 1).x_m() - path.get(i).x_m());
                break;
            }
        }
        if (Double.isNaN(zCross)) { // beyond the screen: follow the straight drift from the end point
            var end = inner.end();
            zCross = end.z_m() - end.x_m() / end.slopeX();
        }
        double focus = c.realFocusImageZ_m().orElse(c.focalPointImageZ_m());
        System.out.printf("inner ray crosses at %.3f mm, paraxial %.3f mm, f2 %.3f mm%n", zCross * 1e3, focus * 1e3,
                c.focalLengthImage_m() * 1e3);
        assertThat(zCross).isCloseTo(focus, within(0.05 * Math.abs(c.focalLengthImage_m())));
    }
}
