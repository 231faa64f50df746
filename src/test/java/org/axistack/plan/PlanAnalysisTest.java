package org.axistack.plan;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.CancellationException;

import org.axistack.field.BemSolver;
import org.axistack.field.FieldSolution;
import org.axistack.field.SolveProgress;
import org.axistack.io.BuiltInStacks;
import org.axistack.model.Stack;
import org.axistack.optics.CardinalElements;
import org.axistack.optics.ParaxialOptics;
import org.axistack.report.HtmlReport;
import org.axistack.report.PlanFolder;
import org.axistack.tune.FocusSensitivity;
import org.axistack.tune.FocusSolution;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The plan on a solution it is handed (the desktop window's way): no new solve, the optics package's numbers at the
 * stack's biases, a supply-stability budget per focusing bias, cancellation, and a report folder written whole or
 * not at all.
 */
class PlanAnalysisTest {

    static Stack stack;
    static FieldSolution solution;
    static LensPlan plan;

    @BeforeAll
    static void solveOnce() throws Exception {
        Stack demo = BuiltInStacks.demo();
        solution = BemSolver.solve(demo.electrodes(), demo.mesh(), SolveProgress.NONE);
        double[] b = demo.biases_V();
        b[demo.indexOf("focus")] = -140; // biases moved in the window: not the stack's own
        stack = demo.withBiases(b);
        plan = PlanAnalysis.run(stack, "test", PlanAnalysis.Settings.defaults().withChecks(false), solution,
                PlanAnalysis.Progress.NONE);
    }

    @Test
    void theHandedSolutionIsReBiasedNotSolvedAgain() {
        assertThat(plan.solution()).isSameAs(solution);
        assertThat(plan.stack().electrodes().get(stack.indexOf("focus")).bias_V()).isEqualTo(-140);
        // reference: the optics package on the same solution at the same biases
        CardinalElements ref = ParaxialOptics.of(solution.withBiases(stack.biases_V()), stack).cardinal();
        assertThat(plan.cardinal()).isPresent();
        assertThat(plan.cardinal().get().focalLengthImage_m()).isEqualTo(ref.focalLengthImage_m());
        assertThat(plan.cardinal().get().focalPointImageZ_m()).isEqualTo(ref.focalPointImageZ_m());
        assertThat(plan.checks()).isEmpty();
    }

    @Test
    void everyFocusingBiasHasASupplyBudgetThatMatchesFiniteDifferences() {
        assertThat(plan.tune()).isPresent();
        var solutions = plan.tune().get().solutions();
        assertThat(solutions).isNotEmpty();
        assertThat(plan.budgets()).hasSameSizeAs(solutions);
        int k = stack.indexOf("focus");
        for (int i = 0; i < solutions.size(); i++) {
            assertThat(plan.budgets().get(i).biases_V()).containsExactly(solutions.get(i).biases_V());
            assertThat(plan.budgets().get(i).depth_m()).isEqualTo(FocusSensitivity.DEFAULT_DEPTH_M);
        }
        // the mildest solution: image shift per volt of the tuned bias against a central difference of the real
        // axis crossing from the optics package (second-order accurate; h = 0.05 V moves the image by ~0.04 mm)
        FocusSolution s = solutions.stream().min((x, y) -> Double.compare(
                Math.abs(plan.budgets().get(solutions.indexOf(x)).imageShift_m_per_V()[k]),
                Math.abs(plan.budgets().get(solutions.indexOf(y)).imageShift_m_per_V()[k]))).orElseThrow();
        FocusSensitivity budget = plan.budgets().get(solutions.indexOf(s));
        double h = 0.05;
        double fd = (crossing(s.biases_V(), k, h) - crossing(s.biases_V(), k, -h)) / (2 * h);
        assertThat(budget.imageShift_m_per_V()[k]).isCloseTo(fd, within(1e-3 * Math.abs(fd)));
        // the stability of the tuned supply alone keeps |V dZ/dV| e within the depth (its definition)
        assertThat(budget.stabilityPerSupply()[k] * Math.abs(s.bias_V() * budget.imageShift_m_per_V()[k]))
                .isCloseTo(budget.depth_m(), within(1e-12 * budget.depth_m()));
    }

    private static double crossing(double[] biases, int k, double dv) {
        double[] b = biases.clone();
        b[k] += dv;
        CardinalElements c = ParaxialOptics.of(solution.withBiases(b), stack.withBiases(b)).cardinal();
        return c.realFocusImageZ_m().orElse(c.focalPointImageZ_m());
    }

    @Test
    void progressCanCancelAndAnotherGeometryIsRefused() {
        assertThatThrownBy(() -> PlanAnalysis.run(stack, "test", PlanAnalysis.Settings.defaults(), solution,
                (what, f) -> !what.startsWith("tracing"))).isInstanceOf(CancellationException.class);
        Stack other = stack.shifted(1e-3);
        assertThatThrownBy(() -> PlanAnalysis.run(other, "test", PlanAnalysis.Settings.defaults(), solution,
                PlanAnalysis.Progress.NONE)).isInstanceOf(IllegalArgumentException.class)
                .hasMessageContaining("other electrodes");
    }

    @Test
    void theFolderIsWrittenWholeOrLeftAsItWas(@TempDir Path dir) throws IOException {
        Path out = dir.resolve("report");
        Files.createDirectories(out);
        Files.writeString(out.resolve(HtmlReport.FILE), "old report");
        assertThatThrownBy(() -> PlanFolder.writeWhole(plan, out, () -> true))
                .isInstanceOf(CancellationException.class);
        assertThat(Files.readString(out.resolve(HtmlReport.FILE))).isEqualTo("old report");
        try (var files = Files.list(out)) {
            assertThat(files).hasSize(1);
        }
        Path html = PlanFolder.writeWhole(plan, out, () -> false);
        assertThat(Files.readString(html)).contains("<h2>Supply-stability budget</h2>", "supply_budget.csv");
        assertThat(out.resolve("supply_budget.csv")).isNotEmptyFile();
        assertThat(out.resolve("sweep.csv")).isNotEmptyFile();
        try (var left = Files.list(dir)) {
            assertThat(left.map(p -> p.getFileName().toString())).containsExactly("report");
        }
    }

    /**
     * The probe section (issue 18): with a source brightness the plan carries the probe command's study (the same
     * org.axistack.probe.ProbeStudy, so the same numbers: common practice, one computation) at the given biases and
     * at every focusing bias of its own tune, and the report shows the section, the curve and the table; without it
     * the report says how to get one.
     */
    /**
     * The misalignment section is the misalign command's study (optics.MisalignmentStudy with its defaults, the
     * same computation: common practice, one computation) on the plan's solution and biases; the report shows the
     * table and the tightest electrode and writes misalignment.csv; without it the report says how to get one.
     */
    @Test
    void misalignmentSectionIsTheMisalignStudy(@TempDir Path dir) throws IOException {
        assertThat(plan.misalignment()).isEmpty();
        assertThat(Files.readString(HtmlReport.write(plan, dir.resolve("plain"), java.util.Map.of())))
                .contains("Decentre and tilt budget").contains("plan --misalign");
        LensPlan with = PlanAnalysis.run(stack, "test", PlanAnalysis.Settings.defaults().withChecks(false)
                .withMisalignment(true), solution, PlanAnalysis.Progress.NONE);
        assertThat(with.misalignment()).isPresent();
        org.axistack.optics.MisalignmentBudget m = with.misalignment().get().budget();
        org.axistack.optics.MisalignmentBudget ref = org.axistack.optics.MisalignmentStudy.run(stack, solution, "focus",
                stack.screenZ_m().getAsDouble(), org.axistack.optics.MisalignmentStudy.DEFAULT_ALLOWED_SHIFT_M, Double.NaN,
                org.axistack.optics.MisalignmentStudy.DEFAULT_ALLOWED_GROWTH_M, SolveProgress.NONE).budget();
        assertThat(m.rows()).hasSameSizeAs(ref.rows());
        for (int k = 0; k < ref.rows().size(); k++) {
            assertThat(m.rows().get(k).decentreTolerance_m()).isEqualTo(ref.rows().get(k).decentreTolerance_m());
            assertThat(m.rows().get(k).tiltTolerance_rad()).isEqualTo(ref.rows().get(k).tiltTolerance_rad());
        }
        assertThat(m.hasGrowth()).isTrue();
        Path html = HtmlReport.write(with, dir.resolve("mis"), java.util.Map.of());
        // the table's tilt shift is in um per mrad, as misalign prints it
        String tiltShift = org.axistack.model.Numbers.general(ref.rows().get(0).tiltShift() * 1e3,
                org.axistack.model.Numbers.REPORT_DIGITS);
        assertThat(Files.readString(html)).contains("Decentre and tilt budget").contains("Tightest: decentre of <strong>"
                + ref.rows().get(ref.tightestDecentre()).name()).contains("<td>" + tiltShift + "</td>");
        assertThat(dir.resolve("mis").resolve("misalignment.csv")).exists();
    }

    @Test
    void probeSectionIsTheProbeStudyAtTheGivenAndFocusingBiases(@TempDir Path dir) throws IOException {
        assertThat(plan.probe()).isEmpty();
        assertThat(Files.readString(HtmlReport.write(plan, dir.resolve("plain"), java.util.Map.of())))
                .contains("Probe size against current").contains("plan --brightness");
        double brightness = 1e8;
        LensPlan withProbe = PlanAnalysis.run(stack, "test", PlanAnalysis.Settings.defaults().withChecks(false)
                .withProbeBrightness(brightness), solution, PlanAnalysis.Progress.NONE);
        assertThat(withProbe.probe()).isPresent();
        org.axistack.probe.ProbeStudy study = withProbe.probe().get();
        org.axistack.probe.ProbeStudy reference = org.axistack.probe.ProbeStudy.run(solution, stack,
                org.axistack.probe.ProbeStudy.Settings.standard(new org.axistack.probe.ProbeSource(brightness, 1,
                        java.util.OptionalDouble.empty())), "focus");
        // the given biases and each focusing bias, less those named in the notes (a working point that images the
        // source to infinity or reflects the beam has no probe)
        assertThat(study.curves().size() + study.notes().size()).isGreaterThanOrEqualTo(1 + withProbe.tune().get().solutions().size());
        assertThat(study.curves().size()).isGreaterThanOrEqualTo(2);
        assertThat(study.curves()).hasSameSizeAs(reference.curves());
        for (org.axistack.probe.ProbeStudy.Curve curve : study.curves()) {
            // the plan lists the focusing biases in its ranking order: match by working point
            var a = curve.points();
            var b = reference.curves().stream().filter(r -> r.workingPoint().label().equals(curve.workingPoint().label()))
                    .findFirst().orElseThrow().points();
            assertThat(a).hasSameSizeAs(b).isNotEmpty();
            for (int k = 0; k < a.size(); k++) {
                assertThat(a.get(k).fw50_m()).isEqualTo(b.get(k).fw50_m());
            }
        }
        Path html = HtmlReport.write(withProbe, dir.resolve("probe"), java.util.Map.of());
        assertThat(Files.readString(html)).contains("Probe size against current").contains("probe.png")
                .contains(study.curves().get(0).dominanceInWords());
        assertThat(dir.resolve("probe").resolve("probe.csv")).exists();
        assertThat(dir.resolve("probe").resolve("probe.svg")).exists();
    }

    /**
     * A stack with a finite object (the demo with [beam] object_z_mm 100 mm before its first electrode): the plan
     * carries the off-axis aberrations that the optics package gives for that object (same computation on the same
     * solution; the coefficients themselves are checked against exact skew rays in OffAxisAberrationsTest), with the
     * height and aperture asked for, the report has the section with the effects, and the probe section says whether
     * off-axis blur at the edge of the source image matters. The blur estimate (coma length and field-curvature
     * diameter in quadrature) is compared with the diameter of the whole pencil's spot sampled from the five-term form
     * of OffAxisAberrations (which lies between their larger and their sum): within a factor sqrt(2).
     */
    @Test
    void aFiniteObjectGetsItsOffAxisAberrationsInThePlanAndTheProbeSection(@TempDir Path dir) throws IOException {
        double zo = stack.minZ_m() - 0.1;
        Stack imaging = stack.withBeam(stack.beam().withObjectZ_m(java.util.OptionalDouble.of(zo)));
        LensPlan p = PlanAnalysis.run(imaging, "test", PlanAnalysis.Settings.defaults().withChecks(false)
                .withProbeBrightness(1e8).withOffAxis(java.util.OptionalDouble.of(0.5e-3),
                        java.util.OptionalDouble.of(2e-3)), solution, PlanAnalysis.Progress.NONE);
        assertThat(p.offAxis()).isPresent();
        org.axistack.optics.OffAxisAberrations ref = ParaxialOptics.of(solution.withBiases(imaging.biases_V()), imaging)
                .offAxisAberrations(zo);
        org.axistack.optics.OffAxisAberrations got = p.offAxis().get().coefficients();
        assertThat(got.coma()).isEqualTo(ref.coma());
        assertThat(got.distortion_per_m2()).isEqualTo(ref.distortion_per_m2());
        assertThat(got.petzval_per_m()).isEqualTo(ref.petzval_per_m());
        assertThat(p.offAxis().get().objectHeight_m().getAsDouble()).isEqualTo(0.5e-3);
        String html = Files.readString(HtmlReport.write(p, dir.resolve("imaging"), java.util.Map.of()));
        assertThat(html).contains("Off-axis aberrations (finite object)").contains("coma K")
                .contains("object height h = 0.5 mm").contains("aperture a = 2 mrad");
        org.axistack.probe.ProbeStudy.Curve curve = p.probe().get().curves().get(0);
        assertThat(curve.offAxis()).isPresent();
        assertThat(html).contains(curve.offAxisInWords());
        for (org.axistack.probe.ProbePoint q : List.of(curve.points().get(0), curve.points().get(curve.points().size() - 1))) {
            double estimate = curve.offAxisBlur_m(q);
            double sampled = pencilDiameter(got, q.source_m() / (2 * Math.abs(got.magnification())),
                    q.alpha_rad() / Math.abs(got.imageSlopeRatio()));
            assertThat(estimate / sampled).isBetween(1 / Math.sqrt(2), Math.sqrt(2));
        }
        // without an object: a note, no section
        assertThat(plan.offAxis()).isEmpty();
        assertThat(plan.offAxisNote()).contains("object_z_mm");
    }

    /**
     * The diameter of the off-axis part of the spot (coma, field curvature, astigmatism: the five-term form less the
     * spherical term and the distortion shift) of the pencil of half-angle a from object height h, sampled over the
     * filled pencil (12 rings x 72 directions), m.
     */
    private static double pencilDiameter(org.axistack.optics.OffAxisAberrations oa, double h, double a) {
        List<double[]> pts = new java.util.ArrayList<>();
        for (int ring = 0; ring <= 12; ring++) {
            double r = a * ring / 12;
            for (int k = 0; k < 72; k++) {
                double phi = 2 * Math.PI * k / 72;
                double bx = r * Math.cos(phi), by = r * Math.sin(phi);
                // 2K h b conj(b) + K h b^2 + F h^2 b + A h^2 conj(b), times M
                double x = oa.coma() * h * (2 * r * r + bx * bx - by * by) + oa.fieldCurvature_per_m() * h * h * bx
                        + oa.astigmatism_per_m() * h * h * bx;
                double y = oa.coma() * h * (2 * bx * by) + oa.fieldCurvature_per_m() * h * h * by
                        - oa.astigmatism_per_m() * h * h * by;
                pts.add(new double[] {oa.magnification() * x, oa.magnification() * y});
            }
        }
        double d = 0;
        for (double[] u : pts) {
            for (double[] v : pts) {
                d = Math.max(d, Math.hypot(u[0] - v[0], u[1] - v[1]));
            }
        }
        return d;
    }
}
