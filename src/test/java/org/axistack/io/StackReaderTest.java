package org.axistack.io;

import org.axistack.model.Units;
import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.nio.file.Files;
import java.nio.file.Path;
import org.axistack.model.Codata2018;
import org.axistack.model.Contour;
import org.axistack.model.Electrode;
import org.axistack.model.GapRule;
import org.axistack.model.MeshSettings;
import org.axistack.model.Segment;
import org.axistack.model.Stack;
import org.axistack.model.SurfaceFieldLimits;
import org.axistack.model.ZR;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The mapping from stack-file keys (mm, V, eV) to the SI model, and the writer's inverse. */
class StackReaderTest {

    @Test
    void convertsMillimetresToMetresAndReadsEveryShape() throws Exception {
        String text = """
                title = "all shapes"
                [beam]
                particle = "ion"
                mass_u = 39.962
                charge_state = -2
                energy_eV = 3000
                start_z_mm = -40.0
                object_z_mm = -80.0
                [[electrode]]
                name = "t"
                shape = "tube"
                bias_V = 10
                radius_mm = 5.0
                z_start_mm = -45.0
                z_end_mm = -4.0
                wall_mm = 0.5
                [[electrode]]
                name = "ap"
                shape = "aperture"
                bias_V = -1400.0
                z_mm = 20.0
                hole_radius_mm = 1.0
                outer_radius_mm = 12.0
                [[electrode]]
                name = "d"
                shape = "disk"
                bias_V = 0.0
                z_mm = 40.0
                radius_mm = 8.0
                thickness_mm = 1.0
                [[electrode]]
                name = "r"
                shape = "ring"
                bias_V = 0.0
                z_mm = 30.0
                radius_mm = 9.0
                wire_radius_mm = 0.25
                [[electrode]]
                name = "o"
                shape = "outline"
                bias_V = 5.0
                closed = false
                points_mm = [[0.0, 15.0], [4.0, 15.0], [8.0, 19.0, 6.828427, 16.171573]]
                [screen]
                z_mm = 60.0
                [mesh]
                target_elements = 900
                edge_levels = 8
                [limits]
                comfort_surface_field_V_per_mm = 4000.0
                aggressive_surface_field_V_per_mm = 9000.0
                """;
        Stack s = StackReader.parse(text, "all.toml");
        assertThat(s.beam().particle().charge_C()).isEqualTo(-2 * Codata2018.ELEMENTARY_CHARGE_C);
        assertThat(s.beam().particle().mass_kg()).isEqualTo(39.962 * Codata2018.ATOMIC_MASS_UNIT_KG);
        assertThat(s.beam().startZ_m().getAsDouble()).isEqualTo(-0.040);
        assertThat(s.beam().objectZ_m().getAsDouble()).isEqualTo(-0.080);
        assertThat(s.electrode("t")).isEqualTo(new Electrode.Tube("t", 10, 0.005, -0.045, -0.004, 0.0005));
        assertThat(s.electrode("ap")).isEqualTo(new Electrode.Aperture("ap", -1400, 0.020, 0.001, 0.012, 0));
        assertThat(s.electrode("d")).isEqualTo(new Electrode.Disk("d", 0, 0.040, 0.008, 0.001));
        assertThat(s.electrode("r")).isEqualTo(new Electrode.Ring("r", 0, 0.030, 0.009, 0.00025));
        Contour c = s.electrode("o").contour();
        assertThat(c.closed()).isFalse();
        assertThat(c.segments()).hasSize(2);
        Segment.Arc arc = (Segment.Arc) c.segments().get(1);
        // a quarter circle of radius 4 mm centred at (4, 19) mm: centre and radius from the three points
        assertThat(arc.centre().z_m()).isCloseTo(0.004, within(1e-9));
        assertThat(arc.centre().r_m()).isCloseTo(0.019, within(1e-9));
        assertThat(arc.radius_m()).isCloseTo(0.004, within(1e-9));
        assertThat(s.screenZ_m().getAsDouble()).isEqualTo(0.060);
        assertThat(s.mesh().targetElements()).isEqualTo(900);
        assertThat(s.mesh().edgeLevels()).isEqualTo(8);
        assertThat(s.limits().comfort_V_per_m()).isEqualTo(4e6);
        assertThat(s.limits().aggressive_V_per_m()).isEqualTo(9e6);

        Stack again = StackReader.parse(StackWriter.toToml(s), "again.toml");
        assertThat(again).isEqualTo(s);
    }

    @Test
    void meshAccuracyIsReadAndWrittenBack() throws Exception {
        Stack s = StackReader.parse(MalformedStacks.append("[mesh]\naccuracy = 1e-7\n"), "acc.toml");
        assertThat(s.mesh().accuracyDriven()).isTrue();
        assertThat(s.mesh().accuracy()).isEqualTo(1e-7);
        // without target_elements the cap is the accuracy default, not the fixed-mesh count
        assertThat(s.mesh().targetElements()).isEqualTo(MeshSettings.DEFAULT_ACCURACY_CAP);
        assertThat(StackReader.parse(StackWriter.toToml(s), "again.toml")).isEqualTo(s);
    }

    @Test
    void gapRuleSettingsAreReadAndWrittenBack() throws Exception {
        Stack s = StackReader.parse(MalformedStacks.append("[limits]\ngap_comfort_V_at_1mm = 4000.0\n"
                + "gap_aggressive_V_at_1mm = 9000.0\ngap_exponent = 0.4\n"), "gaps.toml");
        assertThat(s.limits().gapRule()).isEqualTo(new GapRule(4000, 9000, 0.4));
        assertThat(s.limits().comfort_V_per_m()).isEqualTo(SurfaceFieldLimits.DEFAULT_COMFORT_V_PER_M);
        assertThat(StackReader.parse(StackWriter.toToml(s), "again.toml")).isEqualTo(s);
        // the defaults when [limits] leaves the rule out
        assertThat(StackReader.parse(MalformedStacks.BASE, "base.toml").limits().gapRule()).isEqualTo(GapRule.defaults());
    }

    @Test
    void edgeRadiiOfTubesAndAperturesAreReadAndWrittenBack() throws Exception {
        String text = MalformedStacks.edit("z_end_mm = -1.0", "z_end_mm = -1.0\nwall_mm = 1.0\nedge_radius_mm = 0.25")
                .replace("z_end_mm = 20.0", "z_end_mm = 20.0\n\n[[electrode]]\nname = \"p\"\nshape = \"aperture\"\n"
                        + "bias_V = 0.0\nz_mm = 30.0\nhole_radius_mm = 2.0\nouter_radius_mm = 9.0\nthickness_mm = 1.0\n"
                        + "edge_radius_mm = 0.5");
        Stack s = StackReader.parse(text, "rounded.toml");
        Electrode.Tube a = (Electrode.Tube) s.electrode("a");
        Electrode.Aperture p = (Electrode.Aperture) s.electrode("p");
        assertThat(a.edgeRadius_m()).isEqualTo(0.25e-3);
        assertThat(p.edgeRadius_m()).isEqualTo(0.5e-3);
        assertThat(((Electrode.Tube) s.electrode("b")).edgeRadius_m()).isZero();
        String written = StackWriter.toToml(s);
        assertThat(written).contains("edge_radius_mm = 0.25", "edge_radius_mm = 0.5");
        assertThat(StackReader.parse(written, "again.toml")).isEqualTo(s);
    }

    @Test
    void aClosedOutlineMayEndOnItsFirstPointToCloseWithAnArc() throws Exception {
        String text = MalformedStacks.replaceB("""
                shape = "outline"
                bias_V = 1.0
                closed = true
                points_mm = [[8.0, 8.0], [12.0, 8.0], [8.0, 8.0, 10.0, 10.0]]""");
        Electrode.Outline o = (Electrode.Outline) StackReader.parse(text, "arc.toml").electrode("b");
        assertThat(o.outline().segments()).hasSize(2);
        assertThat(o.outline().segments().get(1)).isInstanceOf(Segment.Arc.class);
        assertThat(o.outline().segments().get(1).end()).isEqualTo(new ZR(0.008, 0.008));
    }

    @Test
    void readsUtf8WithByteOrderMarkAndWritesAtomically(@TempDir Path dir) throws Exception {
        Path f = dir.resolve("bom.toml");
        Files.write(f, ("\uFEFF" + MalformedStacks.BASE.replace("\"t\"", "\"Linse f\u00fcr Ionen \\\"A\\\"\"")).getBytes("UTF-8"));
        Stack s = StackReader.read(f);
        assertThat(s.title()).isEqualTo("Linse f\u00fcr Ionen \"A\"");
        Path out = dir.resolve("sub/written.toml");
        StackWriter.write(s, out);
        assertThat(StackReader.read(out)).isEqualTo(s);
        try (var files = Files.list(out.getParent())) {
            assertThat(files.map(p -> p.getFileName().toString()).toList()).containsExactly("written.toml");
        }
    }

    @Test
    void writerNumbersKeepFifteenDigits() {
        assertThat(StackWriter.num(5.0)).isEqualTo("5.0");
        assertThat(StackWriter.num(-1400)).isEqualTo("-1400.0");
        assertThat(StackWriter.num(Units.mToMm(Units.mmToM(3.70711)))).isEqualTo("3.70711");
        assertThat(StackWriter.num(0.1 + 0.2)).isEqualTo("0.3");
    }
}
