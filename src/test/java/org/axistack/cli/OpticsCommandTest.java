package org.axistack.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;
import static org.axistack.cli.CliRun.run;

import java.nio.file.Path;

import org.axistack.cli.CliRun.Run;
import org.axistack.model.Particle;
import org.axistack.report.SafetyNotice;
import org.junit.jupiter.api.Test;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;

/** The optics command: contract keys of interface.md, exit codes, and one physics check through the CLI. */
class OpticsCommandTest {

    private static String stack() throws Exception {
        return Path.of(OpticsCommandTest.class.getResource("optics-two-tube.toml").toURI()).toString();
    }

    /**
     * JSON keys of interface.md, and Helmholtz-Lagrange f2/f1 = sqrt(U2* / U1*) (physics brief) for the accelerating
     * two-tube lens: protons at 1 keV into a -3 kV tube, U1 = 1000 V, U2 = 4000 V.
     */
    @Test
    void jsonCarriesTheContractKeysAndHelmholtzLagrangeHolds() throws Exception {
        Run r = run("optics", stack(), "--json", "--object-z=-80", "--object-height-mm=0.5", "--aperture-mrad=4");
        assertThat(r.code()).as(r.err()).isZero();
        JsonNode j = new ObjectMapper().readTree(r.out());
        for (String key : new String[] {"object_z_mm", "focal_length_object_mm", "focal_length_image_mm",
            "focal_point_object_z_mm", "focal_point_image_z_mm", "principal_plane_object_z_mm",
            "principal_plane_image_z_mm", "image_z_mm", "magnification", "spherical_aberration_mm",
            "chromatic_aberration_mm", "aberration_convention", "relativistic", "real_focus_image_z_mm"}) {
            assertThat(j.has(key)).as(key).isTrue();
        }
        double vr = Particle.proton().restPotential_V();
        double expected = Math.sqrt(4000 * (1 + 4000 / (2 * vr)) / (1000 * (1 + 1000 / (2 * vr))));
        double ratio = j.get("focal_length_image_mm").asDouble() / j.get("focal_length_object_mm").asDouble();
        // the tubes are finite and open, so the reference planes are field-free only to plane_sensitivity
        assertThat(ratio).isCloseTo(expected, within(10 * j.get("plane_sensitivity").asDouble() * expected + 1e-9));
        assertThat(j.get("object_z_mm").asDouble()).isEqualTo(-80.0);
        assertThat(j.get("spherical_aberration_mm").asDouble()).isPositive();
        assertThat(j.get("chromatic_aberration_mm").asDouble()).isPositive();
        assertThat(j.get("spherical_aberration_object_side_mm").asDouble()).isPositive();
        assertThat(j.get("relativistic").asBoolean()).isTrue();
        assertThat(j.get("aberration_convention").asText()).contains("object side");
        // Newton in stack coordinates: (z_o - F1)(z_i - F2) = -f1 f2
        double lhs = (-80 - j.get("focal_point_object_z_mm").asDouble())
                * (j.get("image_z_mm").asDouble() - j.get("focal_point_image_z_mm").asDouble());
        double rhs = -j.get("focal_length_object_mm").asDouble() * j.get("focal_length_image_mm").asDouble();
        assertThat(lhs).isCloseTo(rhs, within(1e-8 * Math.abs(rhs)));
        // the 1/M polynomials (object side) reproduce the object-side coefficients at this object's magnification
        JsonNode cs = j.get("spherical_aberration_poly_mm");
        JsonNode cc = j.get("chromatic_aberration_poly_mm");
        assertThat(cs.size()).isEqualTo(5);
        assertThat(cc.size()).isEqualTo(3);
        assertThat(j.get("reference_plane_object_z_mm").asDouble()).isGreaterThan(-80.0);
        double inv = 1 / j.get("magnification").asDouble();
        double csPoly = 0;
        for (int k = 4; k >= 0; k--) {
            csPoly = csPoly * inv + cs.get(k).asDouble();
        }
        double ccPoly = (cc.get(2).asDouble() * inv + cc.get(1).asDouble()) * inv + cc.get(0).asDouble();
        double csDirect = j.get("spherical_aberration_object_side_mm").asDouble();
        double ccDirect = j.get("chromatic_aberration_object_side_mm").asDouble();
        assertThat(csPoly).isCloseTo(csDirect, within(1e-8 * csDirect));
        assertThat(ccPoly).isCloseTo(ccDirect, within(1e-8 * ccDirect));
        assertThat(j.get("aberration_poly_convention").asText()).contains("1/M");
        // off-axis aberrations (issue 18): C is the object-side Cs of the same object, P = F - 2A, and the effects at
        // the image follow the convention's formulas (checked against tracing in optics.OffAxisAberrationsTest)
        JsonNode o = j.get("off_axis_aberrations");
        double m = j.get("magnification").asDouble();
        assertThat(o.get("spherical_C_mm").asDouble()).isCloseTo(csDirect, within(1e-9 * csDirect));
        assertThat(o.get("petzval_P_per_mm").asDouble()).isCloseTo(o.get("field_curvature_F_per_mm").asDouble()
                - 2 * o.get("astigmatism_A_per_mm").asDouble(), within(1e-12));
        double alpha = 4e-3;
        double h = 0.5;
        assertThat(o.get("spherical_um").asDouble()).isCloseTo(m * csDirect * alpha * alpha * alpha * 1e3,
                within(1e-9 * Math.abs(m * csDirect * alpha * alpha * alpha * 1e3)));
        double dist = m * o.get("distortion_D_per_mm2").asDouble() * h * h * h * 1e3;
        assertThat(o.get("distortion_um").asDouble()).isCloseTo(dist, within(1e-9 * Math.abs(dist)));
        double coma = 3 * m * o.get("coma_K").asDouble() * h * alpha * alpha * 1e3;
        assertThat(o.get("coma_tangential_um").asDouble()).isCloseTo(coma, within(1e-9 * Math.abs(coma)));
        assertThat(o.get("convention").asText()).contains("Petzval");
    }

    /**
     * --stop-z-mm: the off-axis coefficients about the chief ray through the stop follow the stop-shift formulas of
     * optics.md from those about the object (checked against exact rays in optics.OffAxisAberrationsTest): K' = K +
     * kappa C, C_L' = C_L + kappa Cc, the Petzval coefficient and C unchanged; a stop at the object is refused.
     */
    @Test
    void aStopPositionShiftsTheOffAxisCoefficients() throws Exception {
        Run plain = run("optics", stack(), "--json", "--object-z=-80");
        Run stopped = run("optics", stack(), "--json", "--object-z=-80", "--stop-z-mm=-40");
        assertThat(stopped.code()).as(stopped.err()).isZero();
        JsonNode o = new ObjectMapper().readTree(plain.out()).get("off_axis_aberrations");
        JsonNode s = new ObjectMapper().readTree(stopped.out()).get("off_axis_aberrations");
        assertThat(o.get("stop_slope_per_mm").asDouble()).isZero();
        double kappa = s.get("stop_slope_per_mm").asDouble();
        assertThat(kappa).isNotZero();
        double c = o.get("spherical_C_mm").asDouble();
        assertThat(s.get("spherical_C_mm").asDouble()).isEqualTo(c);
        assertThat(s.get("coma_K").asDouble()).isCloseTo(o.get("coma_K").asDouble() + kappa * c,
                within(1e-12 * Math.abs(kappa * c)));
        assertThat(s.get("lateral_chromatic_CL").asDouble()).isCloseTo(o.get("lateral_chromatic_CL").asDouble()
                + kappa * o.get("axial_chromatic_Cc_mm").asDouble(), within(1e-12 * Math.abs(kappa * c)));
        assertThat(s.get("petzval_P_per_mm").asDouble()).isCloseTo(o.get("petzval_P_per_mm").asDouble(),
                within(1e-9 * Math.abs(o.get("field_curvature_F_per_mm").asDouble())));
        assertThat(s.get("convention").asText()).contains("chief ray of slope kappa a");
        Run atObject = run("optics", stack(), "--object-z=-80", "--stop-z-mm=-80");
        assertThat(atObject.code()).isEqualTo(2);
        assertThat(atObject.err()).contains("--stop-z-mm").contains("at the object");
    }

    @Test
    void offAxisOptionsAreCheckedBeforeTheSolve() throws Exception {
        Run negative = run("optics", stack(), "--object-z=-80", "--object-height-mm=-1");
        assertThat(negative.code()).isEqualTo(2);
        assertThat(negative.err()).contains("--object-height-mm must be a positive");
        Run alone = run("optics", stack(), "--object-z=-80", "--aperture-mrad=3");
        assertThat(alone.code()).isEqualTo(2);
        assertThat(alone.err()).contains("--aperture-mrad needs --object-height-mm");
        // an object height without a finite object: refused before any solve (no progress lines)
        Run noObject = run("optics", stack(), "--object-height-mm=0.5");
        assertThat(noObject.code()).isEqualTo(2);
        assertThat(noObject.err()).contains("needs a finite object").doesNotContain("field solve");
    }

    @Test
    void textShowsTheTableAndTheCautions() throws Exception {
        Run r = run("optics", stack());
        assertThat(r.code()).as(r.err()).isZero();
        assertThat(r.out()).contains("focal length f1, f2").contains("principal plane H1, H2")
                .contains("spherical aberration Cs").contains(SafetyNotice.TITLE);
    }

    @Test
    void reflectionExitsOneAndSaysWhere() throws Exception {
        Run r = run("optics", stack(), "--set", "second=2500", "--json");
        assertThat(r.code()).isEqualTo(1);
        JsonNode j = new ObjectMapper().readTree(r.out());
        assertThat(j.get("reflected").asBoolean()).isTrue();
        assertThat(j.get("turning_point_z_mm").asDouble()).isBetween(-5.0, 5.0);
        assertThat(r.err()).contains("reflected").doesNotContain("Exception");
    }

    @Test
    void objectAfterTheLensIsBadUsage() throws Exception {
        Run r = run("optics", stack(), "--object-z", "55");
        assertThat(r.code()).isEqualTo(2);
        assertThat(r.err()).contains("--object-z").doesNotContain("\tat ");
        // without a stack, the built-in demo lens (issue 23)
        Run demo = run("optics");
        assertThat(demo.code()).isEqualTo(0);
        assertThat(demo.out()).contains("built-in demo");
    }

    @Test
    void startAfterTheLensIsBadInputNamingTheField(@org.junit.jupiter.api.io.TempDir Path dir) throws Exception {
        String text = java.nio.file.Files.readString(Path.of(stack()))
                .replace("energy_eV = 1000.0", "energy_eV = 1000.0\nstart_z_mm = 50.0");
        Path file = java.nio.file.Files.writeString(dir.resolve("late-start.toml"), text);
        Run r = run("optics", file.toString());
        assertThat(r.code()).isEqualTo(2);
        assertThat(r.err()).contains("late-start.toml").contains("start_z_mm").doesNotContain("internal error");
    }
}
