package org.axistack.optics;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.stream.IntStream;

import org.axistack.model.Beam;
import org.axistack.model.Particle;
import org.junit.jupiter.api.Test;

/** One ParaxialOptics read from many threads gives exactly the single-threaded answers (sweeps share it). */
class SharedUseTest {

    @Test
    void concurrentReadsMatchSequentialReads() {
        AnalyticAxialField field = AnalyticAxialField.tanhStep(0, 5000, 3e-3);
        ParaxialOptics optics = ParaxialOptics.auto(field, new Beam(Particle.electron(), 1000), -0.05, 0.05);
        double[] objects = IntStream.range(0, 400).mapToDouble(i -> -0.2 + i * 1e-4).toArray();
        double[] sequential = new double[objects.length];
        for (int i = 0; i < objects.length; i++) {
            sequential[i] = optics.imaging(objects[i]).imageZ_m() + optics.transfer(objects[i] + 0.15, 0.01).c();
        }
        double[] parallel = IntStream.range(0, objects.length).parallel()
                .mapToDouble(i -> optics.imaging(objects[i]).imageZ_m() + optics.transfer(objects[i] + 0.15, 0.01).c())
                .toArray();
        assertThat(parallel).containsExactly(sequential);
    }
}
