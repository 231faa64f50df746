package org.axistack.field;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.TimeUnit;
import java.util.stream.IntStream;

import org.axistack.model.Electrode;
import org.axistack.model.MeshSettings;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;

/**
 * Regression: the first axial evaluation of a fresh solution builds the expansion under a lock; when many
 * common-pool tasks and an outside thread ask for it at once, the build must not wait for pool workers that
 * are themselves waiting for the lock.
 */
class AxialExpansionConcurrencyTest {

    /** Two coaxial tubes with a 2 mm gap, both at 0 V (each test sets its biases). */
    private static final List<Electrode> TWO_TUBES = List.of(new Electrode.Tube("a", 0, 0.004, -0.03, -0.001, 0),
            new Electrode.Tube("b", 0, 0.004, 0.001, 0.03, 0));

    @Test
    @Timeout(value = 120, unit = TimeUnit.SECONDS)
    void firstUseFromPoolTasksAndOutsideThreadsDoesNotDeadlock() throws Exception {
        FieldSolution s = BemSolver.solve(TWO_TUBES, new MeshSettings(200, 4), SolveProgress.NONE);
        ExecutorService outside = Executors.newFixedThreadPool(3);
        try {
            Future<Double> f = outside.submit(() -> s.withBiases(new double[] {-250, 250}).axialPotential_V(0.0));
            double[] fromPool = IntStream.range(0, 16).parallel()
                    .mapToDouble(i -> s.withBiases(new double[] {-250, 250}).axialPotential_V(0.0)).toArray();
            double v = f.get(100, TimeUnit.SECONDS);
            for (double x : fromPool) {
                assertThat(x).isEqualTo(v);
            }
            // antisymmetric biases on a mirror-symmetric pair: the mid-gap potential is 0 by symmetry
            assertThat(v).isCloseTo(0.0, org.assertj.core.data.Offset.offset(1e-6 * 250));
        } finally {
            outside.shutdownNow();
        }
    }

    @Test
    @Timeout(value = 120, unit = TimeUnit.SECONDS)
    void aSweepStartedInsideAPoolTaskOnAFreshSolutionFinishes() throws Exception {
        // the case that once needed callers to build the expansion before going parallel: a bias sweep (parallel
        // over the common pool) run from inside a common-pool task, first use of the solution's expansion
        FieldSolution s = BemSolver.solve(TWO_TUBES, new MeshSettings(200, 4), SolveProgress.NONE);
        org.axistack.model.Stack stack = new org.axistack.model.Stack("two tubes",
                new org.axistack.model.Beam(org.axistack.model.Particle.electron(), 1000), TWO_TUBES);
        var points = java.util.concurrent.ForkJoinPool.commonPool().submit(() -> org.axistack.tune.BiasSweep.run(s,
                stack, "b", 500, 2000, 8, java.util.OptionalDouble.empty(), org.axistack.tune.BiasSweep.Progress.NONE))
                .get(100, TimeUnit.SECONDS);
        assertThat(points).hasSize(9);
    }
}
