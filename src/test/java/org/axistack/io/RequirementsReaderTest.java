package org.axistack.io;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.nio.file.Path;
import java.util.EnumSet;
import java.util.Set;

import org.axistack.size.Family;
import org.axistack.size.Objective;
import org.axistack.size.Requirements;
import org.junit.jupiter.api.Test;

/** Requirements files: the library example reads; each malformed file names file, line, field and the fix. */
class RequirementsReaderTest {

    /** Catalogue entries these cases produce (for the catalogue coverage check). */
    static final Set<StackMessage> COVERED = EnumSet.of(StackMessage.REQ_NO_TABLE, StackMessage.REQ_UNKNOWN_FAMILY,
            StackMessage.REQ_UNKNOWN_OBJECTIVE, StackMessage.REQ_RANGE_SHAPE, StackMessage.REQ_RANGE_ORDER,
            StackMessage.REQ_TARGET, StackMessage.REQ_IMAGE_ORDER);

    static final String GOOD = """
            title = "t"
            [beam]
            particle = "electron"
            energy_eV = 1000.0
            [target]
            object_z_mm = -80.0
            image_z_mm = 120.0
            [limits]
            min_bore_radius_mm = 3.0
            max_length_mm = 80.0
            max_bias_V = 10000.0
            max_surface_field_V_per_mm = 5000.0
            [family]
            kind = "einzel-tubes"
            bore_radius_mm = [3.0, 8.0]
            gap_mm = 2.0
            [search]
            objective = "bias"
            evaluations = 12
            """;

    @Test
    void theLibraryExampleReads() throws Exception {
        Requirements r = RequirementsReader.read(Path.of("lens-library/requirements/argon-einzel-sizing.toml"));
        assertThat(r.family()).isEqualTo(Family.EINZEL_TUBES);
        assertThat(r.objectZ_m().getAsDouble()).isEqualTo(-0.08);
        assertThat(r.maxSurfaceField_V_per_m()).isEqualTo(5e6);
        assertThat(r.varied()).hasSize(3);
    }

    @Test
    void defaultsScaleWithTheBore() throws Exception {
        Requirements r = RequirementsReader.parse(GOOD, "good.toml");
        assertThat(r.objective()).isEqualTo(Objective.BIAS);
        assertThat(r.parameters().get(1).varied()).isFalse();
        // centre_length defaults to 2 x the middle of the bore range (5.5 mm)
        assertThat(r.parameters().get(2).min_m()).isCloseTo(0.011, within(1e-15));
        assertThat(r.search().evaluations()).isEqualTo(12);
    }

    private static void fails(String text, StackMessage id, int line, String field, String... words) {
        assertThatThrownBy(() -> RequirementsReader.parse(text, "req.toml")).isInstanceOfSatisfying(
                StackInputException.class, e -> {
                    assertThat(e.id()).isEqualTo(id);
                    assertThat(e.line()).isEqualTo(line);
                    assertThat(e.field()).isEqualTo(field);
                    assertThat(e.getMessage()).startsWith("req.toml").contains("Fix:").contains(words);
                });
    }

    @Test
    void malformedFilesGiveOneParagraphMessages() {
        fails(GOOD.replace("\"einzel-tubes\"", "\"einzel-tube\""), StackMessage.REQ_UNKNOWN_FAMILY, 14, "kind",
                "did you mean 'einzel-tubes'");
        fails(GOOD.replace("\"bias\"", "\"spherikal\""), StackMessage.REQ_UNKNOWN_OBJECTIVE, 18, "objective",
                "did you mean 'spherical'");
        fails(GOOD.replace("[3.0, 8.0]", "[8.0, 3.0]"), StackMessage.REQ_RANGE_ORDER, 15, "bore_radius_mm", "smaller");
        fails(GOOD.replace("[3.0, 8.0]", "[3.0, 5.0, 8.0]"), StackMessage.REQ_RANGE_SHAPE, 15, "bore_radius_mm",
                "array of 3");
        fails(GOOD.replace("gap_mm = 2.0", "gap_mm = \"2\""), StackMessage.REQ_RANGE_SHAPE, 16, "gap_mm", "text");
        fails(GOOD.replace("image_z_mm = 120.0", "image_z_mm = -90.0"), StackMessage.REQ_IMAGE_ORDER, 7, "image_z_mm",
                "-90");
        fails(GOOD.replace("image_z_mm = 120.0", "image_z_mm = 120.0\nfocal_length_mm = 50.0"), StackMessage.REQ_TARGET,
                8, "focal_length_mm", "both");
        fails(GOOD.replace("image_z_mm = 120.0", ""), StackMessage.REQ_TARGET, 5, null, "neither");
        fails(GOOD.replace("[limits]", "[limitz]"), StackMessage.UNKNOWN_KEY, 8, "limitz", "did you mean 'limits'");
        fails(GOOD.replace("gap_mm = 2.0", ""), StackMessage.MISSING_KEY, 13, "gap_mm", "gap_mm");
        fails(GOOD.replace("gap_mm = 2.0", "gap_mm = -2.0"), StackMessage.NOT_POSITIVE, 16, "gap_mm", "-2");
        fails(GOOD.replace("energy_eV = 1000.0", "energy_eV = 1000.0\nstart_z_mm = -40.0"), StackMessage.UNKNOWN_KEY,
                5, "start_z_mm", "[beam]");
    }

    @Test
    void aMissingTableIsNamed() {
        String noLimits = GOOD.replaceAll("(?s)\\[limits].*?(?=\\[family])", "");
        assertThatThrownBy(() -> RequirementsReader.parse(noLimits, "req.toml")).isInstanceOfSatisfying(
                StackInputException.class, e -> {
                    assertThat(e.id()).isEqualTo(StackMessage.REQ_NO_TABLE);
                    assertThat(e.getMessage()).contains("[limits]");
                });
    }
}
