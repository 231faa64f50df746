package org.axistack.optics;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.List;
import java.util.Map;
import java.util.OptionalDouble;

import org.axistack.field.BemSolver;
import org.axistack.field.FieldSolution;
import org.axistack.field.MisalignmentResponse.Motion;
import org.axistack.field.SectorField;
import org.axistack.field.SolveProgress;
import org.axistack.model.Beam;
import org.axistack.model.Electrode;
import org.axistack.model.MeshSettings;
import org.axistack.model.Monitor;
import org.axistack.model.Particle;
import org.axistack.model.Sectors;
import org.axistack.model.Stack;
import org.axistack.model.StartRay;
import org.axistack.trace.SteeredRays;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * The misalignment study at the monitor planes and the steering that cancels it: a monitor at the screen sees the
 * budget's screen shift, a monitor farther on sees the ray's slope carried by a drift (the field has ended there;
 * straight-line propagation, common practice, no source), the dipole of a split electrode on the misalignment
 * study's operator equals the one from its own factorisation, and the cancelling bias undoes the screen shift
 * through the steerer's offset per volt. Three tubes, the middle one split into four sectors; demo numbers.
 */
class MonitorAlignmentTest {

    static Stack stack;
    static FieldSolution solution;
    static MisalignmentStudy study;
    static MonitorAlignment bench;
    static final double SCREEN = 0.06;

    @BeforeAll
    static void solve() {
        List<Electrode> es = List.of(new Electrode.Tube("in", 0, 0.005, -0.04, -0.0055, 0),
                new Electrode.Tube("steer", 300, 0.005, -0.005, 0.005, 0),
                new Electrode.Tube("out", 0, 0.005, 0.0055, 0.04, 0));
        // the beam enters off the axis and tilted, at a start plane in the entry tube
        Beam beam = new Beam(Particle.proton(), 1000, OptionalDouble.of(-0.035), OptionalDouble.empty(),
                new StartRay(3e-5, -2e-5, 1e-4, 2e-4));
        stack = new Stack("t", beam, es).withSectors("steer",
                Sectors.fromDifferentials(4, 0, 0, 300, 0, 0)).withMonitors(List.of(new Monitor("at screen", SCREEN),
                        new Monitor("far", 0.09)));
        solution = BemSolver.solve(stack.electrodes(), new MeshSettings(360, 6), SolveProgress.NONE);
        study = MisalignmentStudy.run(stack, solution, "steer", SCREEN, 5e-5, SolveProgress.NONE);
        bench = MonitorAlignment.of(stack, solution, study);
    }

    @Test
    void monitorsSeeTheBudgetShiftAndADriftBeyond() {
        assertThat(bench.monitorNames()).containsExactly("at screen", "far");
        for (int k = 0; k < 3; k++) {
            MisalignmentBudget.Row r = study.budget().rows().get(k);
            assertThat(bench.shift()[k][0][0]).isCloseTo(r.decentreShift(), within(1e-12 * Math.abs(r.decentreShift())));
            assertThat(bench.shift()[k][1][0]).isCloseTo(r.tiltShift(), within(1e-12 * Math.abs(r.tiltShift())));
            assertThat(study.optics().zEnd_m()).isLessThan(SCREEN);
            double drift = r.decentreShift() + (0.09 - SCREEN) * r.decentreSlope();
            assertThat(bench.shift()[k][0][1]).isCloseTo(drift, within(1e-9 * Math.abs(drift) + 1e-15));
        }
    }

    /**
     * The aligned central ray (start offset and slopes, stored 300 V x differential) against exact relativistic rays
     * in the three-dimensional field of the round lens plus the split electrode's harmonics ({@link SteeredRays}):
     * first order in the offsets and the sector bias, so they agree to the second-order terms (measured 1.6e-3).
     */
    @Test
    void alignedCentralRayIsTheExactlyTracedOne() {
        Map<Integer, Sectors> split = Map.of(1, stack.sectors().get("steer"));
        SectorField sectors = SectorField.solve(solution, split, 3, SolveProgress.NONE);
        SteeredRays exact = new SteeredRays(solution.withBiases(stack.biases_V()), sectors,
                Map.of(1, stack.sectors().get("steer").biases_V()), stack.beam().particle(),
                stack.beam().energyPerCharge_V(), stack.openBore_m(), 1e-10);
        StartRay s = stack.beam().startRay();
        double[][] traced = exact.trace(-0.035, new double[] {s.x_m(), s.y_m(), s.slopeX_rad(), s.slopeY_rad()},
                new double[] {SCREEN, 0.09});
        assertThat(bench.startZ_m()).isEqualTo(-0.035);
        double[][] first = {bench.aligned()[0], bench.aligned()[2]};
        for (int p = 0; p < 2; p++) {
            double scale = Math.hypot(first[p][0], first[p][1]);
            System.out.printf(java.util.Locale.ROOT, "aligned central ray at plane %d: x %.6g / %.6g, y %.6g / %.6g m"
                    + " (first order / exact)%n", p, first[p][0], traced[p][0], first[p][1], traced[p][1]);
            assertThat(Math.abs(first[p][0] - traced[p][0])).isLessThan(0.01 * scale);
            assertThat(Math.abs(first[p][1] - traced[p][1])).isLessThan(0.01 * scale);
        }
        // the monitor at the screen sees the screen's ray
        assertThat(bench.aligned()[1][0]).isCloseTo(bench.aligned()[0][0], within(1e-12 * Math.abs(bench.aligned()[0][0])));
    }

    @Test
    void dipoleOnTheSharedOperatorEqualsItsOwnSolveAndTheBiasCancels() {
        Map<Integer, Sectors> split = Map.of(1, stack.sectors().get("steer"));
        SectorField own = SectorField.solve(solution, split, 1, SolveProgress.NONE);
        SectorField shared = SectorField.dipole(solution, split, study.dipole());
        for (double z : new double[] {-0.01, 0, 0.004, 0.02}) {
            double a = own.unitDipole_V_per_m(1, z);
            assertThat(shared.unitDipole_V_per_m(1, z)).isCloseTo(a, within(1e-10 * Math.abs(a)));
        }
        assertThat(bench.steerers()).containsExactly("steer");
        SplitDeflection d = SplitDeflection.of(shared, study.optics(), study.optics().zStart_m(), new double[] {SCREEN});
        double per = d.perVolt(0, 1).xPerVx_m();
        for (int k = 0; k < 3; k++) {
            for (Motion m : Motion.values()) {
                double shift = study.shift().at(k, m, SCREEN)[0];
                assertThat(shift + bench.cancelBias_V()[0][k][m.ordinal()] * per).isCloseTo(0,
                        within(1e-12 * Math.abs(shift)));
            }
        }
    }
}
