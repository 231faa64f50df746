package org.axistack.optics;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.List;
import java.util.OptionalDouble;

import org.axistack.field.BemSolver;
import org.axistack.field.BiasedField;
import org.axistack.field.SolveProgress;
import org.axistack.model.Beam;
import org.axistack.model.Electrode;
import org.axistack.model.MeshSettings;
import org.axistack.model.Particle;
import org.axistack.model.Stack;
import org.junit.jupiter.api.Test;

/**
 * A thin disk across the axis (the shrunk sample of a property-test failure: the ray equation was integrated
 * through the conductor until the step size collapsed) is reported as a blocked axis; a disk behind the beam's
 * start is not in the way.
 */
class BlockedAxisTest {

    private static Stack stack(OptionalDouble start) {
        List<Electrode> es = List.of(new Electrode.Tube("e0", 0, 0.0025, 0, 0.001, 0),
                new Electrode.Disk("e1", 0.002, 0.0015, 0.0045, 0));
        Beam beam = new Beam(Particle.electron(), 20.01, start, OptionalDouble.empty());
        return new Stack("blocked", beam, es).withMesh(new MeshSettings(200, 3));
    }

    @Test
    void diskInTheBeamPathIsReportedNotIntegratedThrough() {
        Stack s = stack(OptionalDouble.empty());
        BiasedField f = BemSolver.solve(s.electrodes(), s.mesh(), SolveProgress.NONE).biased();
        assertThatThrownBy(() -> ParaxialOptics.of(f, s)).isInstanceOf(BlockedAxisException.class)
                .hasMessageContaining("'e1' crosses the axis at z = 1.5000");
    }

    @Test
    void diskBehindTheBeamStartIsNoObstacle() {
        List<Electrode> es = List.of(new Electrode.Disk("back", 0, -0.02, 0.01, 0),
                new Electrode.Tube("in", 0, 0.004, -0.015, -0.001, 0), new Electrode.Tube("out", 300, 0.004, 0.001, 0.03, 0));
        Stack s = new Stack("back plate", new Beam(Particle.electron(), 500, OptionalDouble.of(-0.012), OptionalDouble.empty()),
                es).withMesh(new MeshSettings(400, 3));
        BiasedField f = BemSolver.solve(s.electrodes(), s.mesh(), SolveProgress.NONE).biased();
        assertThat(ParaxialOptics.of(f, s).cardinal().zStart_m()).isEqualTo(-0.012);
    }
}
