package org.axistack.io;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.List;

import org.axistack.model.Sectors;
import org.axistack.model.Stack;
import org.junit.jupiter.api.Test;

/** The sector keys of the stack format: both ways to state sector biases, the writer round trip, --set. */
class SectorsFormatTest {

    private static final String SPLIT = MalformedStacks.replaceB("""
            shape = "tube"
            radius_mm = 5.0
            z_start_mm = 1.0
            z_end_mm = 20.0
            sectors = 4
            sector_biases_V = [-280.0, -300.0, -320.0, -300.0]
            split_rotation_deg = 45.0
            slit_width_mm = 0.3
            """);

    @Test
    void sectorBiasesGiveTheRoundBiasAsTheirMean() throws Exception {
        Stack s = StackReader.parse(SPLIT, "split.toml");
        Sectors sec = s.sectors().get("b");
        assertThat(sec.count()).isEqualTo(4);
        assertThat(sec.biases_V()).containsExactly(-280.0, -300.0, -320.0, -300.0);
        assertThat(sec.rotation_rad()).isCloseTo(Math.PI / 4, within(1e-15));
        assertThat(sec.slitWidth_m()).isCloseTo(0.0003, within(1e-15));
        assertThat(s.electrode("b").bias_V()).isEqualTo(-300.0);
        assertThat(s.sectors()).doesNotContainKey("a");
    }

    @Test
    void writerRoundTripsSplitElectrodes() throws Exception {
        Stack s = StackReader.parse(SPLIT, "split.toml");
        Stack again = StackReader.parse(StackWriter.toToml(s), "again.toml");
        assertThat(again).isEqualTo(s);
    }

    @Test
    void commonBiasAndDifferentialsSetTheSectors() throws Exception {
        Stack s = StackReader.parse(MalformedStacks.replaceB("""
                shape = "tube"
                bias_V = -300.0
                radius_mm = 5.0
                z_start_mm = 1.0
                z_end_mm = 20.0
                sectors = 4
                deflection_x_V = 20.0
                deflection_y_V = -5.0
                """), "diff.toml");
        Sectors sec = s.sectors().get("b");
        // sectors at 0, 90, 180, 270 degrees: common + dx cos + dy sin
        List<Double> b = sec.biases_V();
        assertThat(b.get(0)).isCloseTo(-280.0, within(1e-12));
        assertThat(b.get(1)).isCloseTo(-305.0, within(1e-12));
        assertThat(b.get(2)).isCloseTo(-320.0, within(1e-12));
        assertThat(b.get(3)).isCloseTo(-295.0, within(1e-12));
        assertThat(sec.xDifferential_V()).isCloseTo(20.0, within(1e-12));
        assertThat(sec.yDifferential_V()).isCloseTo(-5.0, within(1e-12));
        assertThat(s.electrode("b").bias_V()).isCloseTo(-300.0, within(1e-12));
    }

    @Test
    void settingTheBiasOfASplitElectrodeMovesEverySector() throws Exception {
        Stack s = BiasOverrides.apply(StackReader.parse(SPLIT, "split.toml"), List.of("b=-100"));
        assertThat(s.sectors().get("b").biases_V()).containsExactly(-80.0, -100.0, -120.0, -100.0);
        assertThat(s.electrode("b").bias_V()).isEqualTo(-100.0);
    }
}
