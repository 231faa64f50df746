package org.axistack.tune;

import static org.assertj.core.api.Assertions.assertThat;

import org.axistack.field.FieldSolution;
import org.axistack.model.Stack;
import org.axistack.optics.ParaxialOptics;
import org.junit.jupiter.api.Test;

class DemoTuneTest {

    @Test
    void demoLensHasBothEinzelSolutionsForTheScreen() {
        Stack stack = SolvedDemo.STACK;
        FieldSolution sol = SolvedDemo.SOLUTION;
        BiasTuner tuner = new BiasTuner(sol, stack);
        TuneResult r = tuner.focus("focus", 0.035);
        for (int i = 0; i < 5; i++) {
            long t = System.nanoTime();
            r = tuner.focus("focus", 0.035);
            System.out.printf("tune: %.1f ms, %d evaluations%n", (System.nanoTime() - t) / 1e6, r.evaluations());
        }
        for (FocusSolution s : r.solutions()) {
            System.out.printf("%s %.6f V image %.6f mm F2 %.6f mm Emax %.1f V/mm %s crossings %d%n", s.mode(), s.bias_V(),
                    s.imageZ_m() * 1e3, s.cardinal().focalPointImageZ_m() * 1e3, s.maxSurfaceField_V_per_m() / 1e3,
                    s.worstElectrode(), s.axisCrossings());
        }
        System.out.println(r.range() + " reflect " + r.reflectingFrom_V() + " .. " + r.reflectingTo_V());
        assertThat(r.solutions()).hasSizeGreaterThanOrEqualTo(2);
        for (FocusSolution s : r.solutions()) {
            double[] b = s.biases_V();
            double f2 = ParaxialOptics.of(sol.withBiases(b), stack).cardinal().focalPointImageZ_m();
            assertThat(Math.abs(f2 - 0.035)).isLessThan(1e-9);
        }
    }

    @Test
    void tunersRefuseASolutionOfAnotherGeometryWithAsManyElectrodes() {
        // the demo with its last electrode 1 mm longer: same count and names, another geometry
        Stack stack = SolvedDemo.STACK;
        java.util.List<org.axistack.model.Electrode> es = new java.util.ArrayList<>(stack.electrodes());
        int last = es.size() - 1;
        es.set(last, es.get(last).scaled(1.001));
        Stack other = new Stack(stack.title(), stack.beam(), es, stack.screenZ_m(), stack.mesh(), stack.limits());
        org.assertj.core.api.Assertions.assertThatThrownBy(() -> new BiasTuner(SolvedDemo.SOLUTION, other))
                .hasMessageContaining("other electrodes");
        org.assertj.core.api.Assertions.assertThatThrownBy(() -> new PairTuner(SolvedDemo.SOLUTION, other))
                .hasMessageContaining("other electrodes");
        // the same geometry at other biases is accepted
        new BiasTuner(SolvedDemo.SOLUTION, stack.withBiases(new double[stack.electrodes().size()]));
    }
}
