package org.axistack.trace;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.List;
import java.util.concurrent.CancellationException;
import java.util.concurrent.atomic.AtomicInteger;

import org.axistack.model.Particle;
import org.junit.jupiter.api.Test;

class BundleTracerTest {

    private final RingLens lens = RingLens.withCentre(-1500);
    private final Tracer tracer = new Tracer(lens.field(), lens.geometry(), TraceSettings.defaults());
    private final TraceTargets targets = new TraceTargets(List.of(-0.02, 0.0, 0.03), 0.05);

    @Test
    void theResultDoesNotDependOnTheNumberOfThreads() {
        RaySet set = RaySets.uniformDisk(Particle.electron(), 1000, -0.04, 1.5e-3, 40, 7);
        BundleResult one = new BundleTracer(tracer, 1).trace(set, targets, TraceProgress.none());
        BundleResult two = new BundleTracer(tracer, 2).trace(set, targets, TraceProgress.none());
        for (int i = 0; i < set.size(); i++) {
            assertEquals(one.trajectories().get(i).end(), two.trajectories().get(i).end());
            assertEquals(i + 1, two.trajectories().get(i).id());
        }
        assertThat(two.statusCounts()).containsEntry(TraceStatus.SCREEN, 40);
        assertThat(two.maxEnergyError()).isLessThan(1e-9);
    }

    @Test
    void planeStatisticsAreTheRmsAndMaxOfTheRaysOnThePlane() {
        // before the lens field matters (z = -20 mm, potential ~ 1e-2 V) a parallel uniform disk keeps
        // its radius: rms radius of a uniform disk of radius R is R / sqrt(2) (textbook), sampled with
        // 200 rays: relative standard error of the rms ~ 0.29 / sqrt(200) ~ 2 %; tolerance 3 sigma
        RaySet set = RaySets.uniformDisk(Particle.electron(), 1000, -0.04, 1.5e-3, 200, 11);
        BundleResult res = new BundleTracer(tracer, 2).trace(set, targets, TraceProgress.none());
        PlaneStatistics first = res.planeStatistics().get(0);
        assertThat(first.rays()).isEqualTo(200);
        assertEquals(1.5e-3 / Math.sqrt(2), first.rmsRadius_m(), 0.06 * 1.5e-3 / Math.sqrt(2));
        assertThat(first.maxRadius_m()).isLessThanOrEqualTo(1.5e-3 * 1.0001).isGreaterThan(1.4e-3);
        // recomputed directly from the trajectories
        double s = 0, m = 0;
        for (Trajectory t : res.trajectories()) {
            double r = t.at(2).orElseThrow().r_m();
            s += r * r;
            m = Math.max(m, r);
        }
        assertEquals(Math.sqrt(s / 200), res.planeStatistics().get(2).rmsRadius_m(), 1e-15);
        assertEquals(m, res.planeStatistics().get(2).maxRadius_m(), 0);
    }

    @Test
    void progressIsReportedAndCancellationStopsTheWork() {
        RaySet set = RaySets.ring(Particle.electron(), 1000, -0.04, 1e-3, 0, 30);
        AtomicInteger calls = new AtomicInteger();
        new BundleTracer(tracer, 2).trace(set, targets, (d, t) -> calls.incrementAndGet());
        assertThat(calls.get()).isEqualTo(30);

        AtomicInteger seen = new AtomicInteger();
        TraceProgress cancelAfterFive = new TraceProgress() {
            @Override
            public void raysDone(int done, int total) {
                seen.incrementAndGet();
            }

            @Override
            public boolean isCancelled() {
                return seen.get() >= 5;
            }
        };
        assertThatThrownBy(() -> new BundleTracer(tracer, 2).trace(set, targets, cancelAfterFive))
                .isInstanceOf(CancellationException.class);
        assertThat(seen.get()).isLessThan(30);
    }

    @Test
    void raySetsHaveTheAskedShapes() {
        Particle el = Particle.electron();
        RaySet fan = RaySets.pointFan(el, 1000, -0.04, 0, 0.01, 5, 1);
        double[] expected = {Math.tan(-0.01), Math.tan(-0.005), 0.0, Math.tan(0.005), Math.tan(0.01)};
        for (int i = 0; i < 5; i++) {
            assertEquals(expected[i], fan.rays().get(i).dirX() / fan.rays().get(i).dirZ(), 1e-16);
        }
        RaySet cone = RaySets.pointFan(el, 1000, -0.04, 1e-3, 0.01, 2, 4);
        assertThat(cone.size()).isEqualTo(9);
        assertThat(cone.rays()).allSatisfy(r -> assertEquals(1e-3, r.x_m()));
        RaySet ring = RaySets.ring(el, 1000, -0.04, 1e-3, -0.002, 6);
        assertThat(ring.rays()).allSatisfy(r -> assertEquals(1e-3, r.r_m(), 1e-15));
        RaySet gauss = RaySets.gaussianBeam(el, 1000, -0.04, 0.5e-3, 1.5e-3, 2000, 3);
        double s2 = gauss.rays().stream().mapToDouble(r -> r.x_m() * r.x_m()).average().orElseThrow();
        // truncated at 3 sigma in r: the x variance is sigma^2 (1 - 4.5 e^-4.5 / (1 - e^-4.5)) ~ 0.949 sigma^2
        // (integral of the 2D normal; computed for this test); 2000 draws: ~3 % statistical error
        assertEquals(0.949 * 0.25e-6, s2, 0.08 * 0.25e-6);
        RaySet spread = fan.withEnergyOffsets(List.of(-1.0, 0.0, 1.0));
        assertThat(spread.size()).isEqualTo(15);
        assertThat(spread.rays().get(14).energy_eV()).isEqualTo(1001);
        assertThat(spread.rays().get(14).id()).isEqualTo(15);
        RaySet g = fan.withGaussianEnergy(0.5, 1);
        assertThat(g.rays()).allSatisfy(r -> assertThat(r.energy_eV()).isBetween(995.0, 1005.0));
        assertThat(RaySets.pointFan(el, 1000, -0.04, 0, 0.01, 5, 1).withGaussianEnergy(0.5, 1).rays())
                .isEqualTo(g.rays()); // seeded: repeatable
    }

    @Test
    void badRaySetsAreRefusedWithClearMessages() {
        Particle el = Particle.electron();
        assertThatThrownBy(() -> RaySets.uniformDisk(el, 1000, 0, 1e-3, 0, 1)).hasMessageContaining("at least one ray");
        assertThatThrownBy(() -> RaySets.uniformDisk(el, 1000, 0, -1e-3, 5, 1))
                .hasMessageContaining("disk radius must be zero or positive");
        assertThatThrownBy(() -> RaySets.pointFan(el, 1000, 0, 0, 0.01, 3, 1).withGaussianEnergy(-2, 1))
                .hasMessageContaining("energy spread must be zero or positive");
        assertThatThrownBy(() -> RaySets.pointFan(el, 1000, 0, 0, 0.01, 3, 1).withEnergyOffsets(List.of(-2000.0)))
                .hasMessageContaining("leaves ray 1 with no energy");
        assertThatThrownBy(() -> new RaySet(el, List.of(), "x")).hasMessageContaining("the ray set is empty");
        // a ray inside a wire: refused before any tracing
        RaySet bad = RaySets.of(el, List.of(RayStart.withSlopes(1, 0, 0, -0.04, 0, 0, 1000),
                RayStart.withSlopes(9, 5e-3, 0, 0, 0, 0, 1000)), "bad");
        assertThatThrownBy(() -> new BundleTracer(tracer, 2).trace(bad, targets, TraceProgress.none()))
                .hasMessageContaining("ray 2 starts inside electrode 'centre'");
    }
}
