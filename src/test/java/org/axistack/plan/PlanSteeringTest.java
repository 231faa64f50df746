package org.axistack.plan;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;

import org.axistack.field.BemSolver;
import org.axistack.field.FieldSolution;
import org.axistack.field.SolveProgress;
import org.axistack.io.BuiltInStacks;
import org.axistack.model.Monitor;
import org.axistack.model.Sectors;
import org.axistack.model.Stack;
import org.axistack.model.StartRay;
import org.axistack.optics.ParaxialOptics;
import org.axistack.optics.SplitDeflection;
import org.axistack.optics.SteeringTable;
import org.axistack.optics.TransferMatrix;
import org.axistack.report.HtmlReport;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The plan's steering section: the demo lens with its focus tube split into four sectors (a steerer), a monitor
 * plane and a beam entering off the axis. Checks: four-fold symmetry of the per-volt offsets (the x bias moves the
 * ray along x only, as much as the y bias along y: common practice, no source), a beam entering off the axis with
 * no steering follows the round lens's transfer matrix, and the report shows the section.
 */
class PlanSteeringTest {

    @Test
    void steeringTableAndReportSection(@TempDir Path dir) throws Exception {
        Stack demo = BuiltInStacks.demo();
        FieldSolution solution = BemSolver.solve(demo.electrodes(), demo.mesh(), SolveProgress.NONE);
        double focus = demo.electrode("focus").bias_V();
        Stack stack = demo.withSectors("focus", Sectors.fromDifferentials(4, 0, 0, focus, 0, 0))
                .withMonitors(List.of(new Monitor("viewer", 0.02)))
                .withBeam(demo.beam().withStartRay(new StartRay(5e-5, 0, 0, 0)));
        ParaxialOptics optics = ParaxialOptics.of(solution.withBiases(stack.biases_V()), stack);
        SteeringTable t = SteeringTable.of(stack, solution, optics, SolveProgress.NONE);
        assertThat(t.planeNames()).containsExactly("screen", "viewer");
        for (int p = 0; p < 2; p++) {
            SplitDeflection.PerVolt pv = t.perVolt().get(p).get(0);
            assertThat(Math.abs(pv.xPerVx_m())).isGreaterThan(1e-7);
            assertThat(Math.abs(pv.yPerVx_m())).isLessThan(1e-12 * Math.abs(pv.xPerVx_m()) + 1e-18);
            assertThat(pv.yPerVy_m()).isCloseTo(pv.xPerVx_m(), org.assertj.core.data.Offset.offset(1e-12 * Math.abs(pv.xPerVx_m())));
            // no steering: the entering offset is carried by the round lens alone
            TransferMatrix m = optics.transfer(t.zStart_m(), t.planes_m()[p]);
            assertThat(t.ray()[p][0]).isCloseTo(m.a() * 5e-5, org.assertj.core.data.Offset.offset(1e-15));
            assertThat(t.ray()[p][1]).isCloseTo(0, org.assertj.core.data.Offset.offset(1e-15));
        }
        LensPlan plan = PlanAnalysis.run(stack, "test", PlanAnalysis.Settings.defaults().withChecks(false), solution,
                PlanAnalysis.Progress.NONE);
        HtmlReport.write(plan, dir.resolve("report"), Map.of());
        String html = Files.readString(dir.resolve("report").resolve(HtmlReport.FILE));
        assertThat(html).contains("<h2>Steering</h2>", "x per V of x bias (um)", "viewer", "focus (4)");
    }
}
