package org.axistack.tune;

import static org.assertj.core.api.Assertions.assertThat;

import org.axistack.optics.Imaging;
import org.axistack.optics.ParaxialOptics;
import org.junit.jupiter.api.Test;

/**
 * Two conditions with two electrodes on the demo lens (demo data): every reported solution is checked by a
 * separate optics run at its biases (image position and magnification from {@link ParaxialOptics#imaging}, focal
 * length from the cardinal elements); an unreachable magnification gives no solution and a nearest approach.
 */
class PairTunerTest {

    private static final FocusTarget TARGET = FocusTarget.object(-0.06, 0.035);

    @Test
    void imagePositionAndMagnificationTogether() {
        PairTuner.PairResult r = new PairTuner(SolvedDemo.SOLUTION, SolvedDemo.STACK).solve("focus", "outlet", TARGET,
                new SecondCondition.Magnification(-0.5), new BiasRange(-180, 0), new BiasRange(-60, 200));
        System.out.println("pair: " + r.evaluations() + " evaluations");
        for (PairTuner.PairSolution s : r.solutions()) {
            ParaxialOptics o = ParaxialOptics.of(SolvedDemo.SOLUTION.withBiases(s.focus().biases_V()), SolvedDemo.STACK);
            Imaging im = o.imaging(-0.06);
            // the real crossing (the image plane lies just inside the outlet's fringe field here)
            double real = im.realImageZ_m().getAsDouble();
            double m = o.transfer(-0.06, real).a();
            System.out.printf("focus %.5f V, outlet %.5f V: real image %.6f mm (asymptotic %.6f), M %.7f (residual %.1e)%n",
                    s.firstBias_V(), s.secondBias_V(), real * 1e3, im.imageZ_m() * 1e3, m, s.residual());
            assertThat(real).isCloseTo(0.035, org.assertj.core.data.Offset.offset(1e-9));
            assertThat(m).isCloseTo(-0.5, org.assertj.core.data.Offset.offset(1e-8));
        }
        assertThat(r.found()).isTrue();
    }

    @Test
    void imagePositionAndFocalLengthTogether() {
        PairTuner.PairResult r = new PairTuner(SolvedDemo.SOLUTION, SolvedDemo.STACK).solve("focus", "outlet",
                FocusTarget.parallelBeam(0.035), new SecondCondition.FocalLength(0.03), new BiasRange(-180, 0),
                new BiasRange(-190, 200));
        for (PairTuner.PairSolution s : r.solutions()) {
            var c = ParaxialOptics.of(SolvedDemo.SOLUTION.withBiases(s.focus().biases_V()), SolvedDemo.STACK).cardinal();
            System.out.printf("focus %.5f V, outlet %.5f V: F2 %.6f mm, f2 %.7f mm%n", s.firstBias_V(),
                    s.secondBias_V(), c.focalPointImageZ_m() * 1e3, c.focalLengthImage_m() * 1e3);
            // the tuner focuses the ray that is parallel at the beam start (a real plane); the cardinal elements take
            // the field as ended at the tube plane: they agree within the elements' own error estimate (issue 23)
            double tol = Math.max(1e-9, 2 * c.errorEstimate() * Math.abs(c.focalLengthImage_m()));
            assertThat(c.focalPointImageZ_m()).isCloseTo(0.035, org.assertj.core.data.Offset.offset(tol));
            assertThat(c.focalLengthImage_m()).isCloseTo(0.03, org.assertj.core.data.Offset.offset(tol));
        }
        r.nearest().ifPresent(n -> System.out.printf("f2 nearest: focus %.4f V, outlet %.4f V, f2 %.4f mm, residual %.3g%n",
                n.firstBias_V(), n.secondBias_V(), n.achieved() * 1e3, n.residual()));
        assertThat(r.found()).isTrue();
    }

    @Test
    void unreachableMagnificationGivesNearestApproach() {
        PairTuner.PairResult r = new PairTuner(SolvedDemo.SOLUTION, SolvedDemo.STACK).solve("focus", "outlet", TARGET,
                new SecondCondition.Magnification(-20), new BiasRange(-150, 0), new BiasRange(-20, 20));
        assertThat(r.found()).isFalse();
        assertThat(r.nearest()).isPresent();
        PairTuner.PairSolution n = r.nearest().get();
        System.out.printf("nearest: focus %.4f V, outlet %.4f V, M %.4f, residual %.3g%n", n.firstBias_V(),
                n.secondBias_V(), n.achieved(), n.residual());
        assertThat(n.residual()).isGreaterThan(PairTuner.TOLERANCE);
    }
}
