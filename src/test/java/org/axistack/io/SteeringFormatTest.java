package org.axistack.io;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.List;

import org.axistack.model.Monitor;
import org.axistack.model.Stack;
import org.axistack.model.StartRay;
import org.junit.jupiter.api.Test;

/**
 * The steering keys of the stack format: the central ray's start offset and slope in [beam], [[monitor]] planes,
 * the writer round trip, and the stack transformations and rebuilds that must keep them (and the sectors).
 */
class SteeringFormatTest {

    private static final String TEXT = MalformedStacks.edit("energy_eV = 500.0\n", """
            energy_eV = 500.0
            start_z_mm = -15.0
            start_x_mm = 0.25
            start_y_mm = -0.1
            start_slope_x_mrad = 1.5
            start_slope_y_mrad = -0.75
            """).replace("bias_V = -300.0", "sectors = 4\ndeflection_x_V = 2.0\nbias_V = -300.0") + """
            [[monitor]]
            name = "wire scanner"
            z_mm = 35.0

            [[monitor]]
            z_mm = 60.0
            """;

    @Test
    void startRayAndMonitorsAreRead() throws Exception {
        Stack s = StackReader.parse(TEXT, "steer.toml");
        StartRay r = s.beam().startRay();
        assertThat(r.x_m()).isCloseTo(0.25e-3, within(1e-18));
        assertThat(r.y_m()).isCloseTo(-0.1e-3, within(1e-18));
        assertThat(r.slopeX_rad()).isCloseTo(1.5e-3, within(1e-18));
        assertThat(r.slopeY_rad()).isCloseTo(-0.75e-3, within(1e-18));
        assertThat(s.monitors()).containsExactly(new Monitor("wire scanner", 0.035), new Monitor("", 0.06));
        assertThat(s.monitorLabel(0)).isEqualTo("wire scanner");
        assertThat(s.monitorLabel(1)).isEqualTo("monitor 2");
    }

    @Test
    void absentKeysMeanOnTheAxisAndNoMonitors() throws Exception {
        Stack s = StackReader.parse(MalformedStacks.BASE, "plain.toml");
        assertThat(s.beam().startRay()).isEqualTo(StartRay.ON_AXIS);
        assertThat(s.monitors()).isEmpty();
        assertThat(StackWriter.toToml(s)).doesNotContain("start_x_mm").doesNotContain("[[monitor]]");
    }

    @Test
    void writerRoundTripsStartRayAndMonitors() throws Exception {
        Stack s = StackReader.parse(TEXT, "steer.toml");
        Stack again = StackReader.parse(StackWriter.toToml(s), "again.toml");
        assertThat(again).isEqualTo(s);
    }

    /** Scaling scales offsets and planes; a mirror turns the slopes over; a new title keeps everything else. */
    @Test
    void transformationsKeepTheSteeringKeys() throws Exception {
        Stack s = StackReader.parse(TEXT, "steer.toml");
        Stack big = s.scaled(2);
        assertThat(big.beam().startRay().x_m()).isCloseTo(0.5e-3, within(1e-18));
        assertThat(big.beam().startRay().slopeX_rad()).isCloseTo(1.5e-3, within(1e-18));
        assertThat(big.monitors().get(0).z_m()).isCloseTo(0.07, within(1e-15));
        Stack m = s.mirrored();
        assertThat(m.beam().startRay().slopeY_rad()).isCloseTo(0.75e-3, within(1e-18));
        assertThat(m.monitors().get(1).z_m()).isCloseTo(-0.06, within(1e-15));
        Stack t = s.withTitle("sized");
        assertThat(t.title()).isEqualTo("sized");
        assertThat(t.sectors()).isEqualTo(s.sectors()).isNotEmpty();
        assertThat(t.monitors()).isEqualTo(s.monitors());
        assertThat(t.beam()).isEqualTo(s.beam());
        assertThat(s.withBiases(s.biases_V()).monitors()).isEqualTo(s.monitors());
        assertThat(s.withMonitors(List.of()).monitors()).isEmpty();
    }
}
