package org.axistack.size;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import java.util.OptionalDouble;

import org.axistack.field.BemSolver;
import org.axistack.field.BiasedField;
import org.axistack.field.SolveProgress;
import org.axistack.io.StackReader;
import org.axistack.io.StackWriter;
import org.axistack.model.Beam;
import org.axistack.model.MeshSettings;
import org.axistack.model.Particle;
import org.axistack.model.Stack;
import org.axistack.optics.ParaxialOptics;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The three checks of the sizing issue, on a coarse mesh and a small budget (a three-aperture einzel lens for
 * 2 keV protons, two varied parameters): the scaling law of electrostatic optics, the chosen design re-run
 * through the optics from its written stack file, and requirements no design can meet.
 */
class SizingChecksTest {

    static Requirements base;
    static SizingResult result;

    static Requirements requirements(double maxField_V_per_m, double maxBias_V) {
        return new Requirements("test plates", new Beam(Particle.proton(), 2000), OptionalDouble.of(-0.06),
                OptionalDouble.of(0.09), OptionalDouble.empty(), 0.002, 0.05, maxBias_V, maxField_V_per_m,
                Family.EINZEL_PLATES, List.of(new Parameter("bore_radius", 0.002, 0.005),
                        new Parameter("gap", 0.002, 0.006), new Parameter("thickness", 0.001, 0.001),
                        new Parameter("outer_radius", 0.014, 0.014)),
                Objective.SPHERICAL, new SearchSettings(10, 120, 160, 16, 2));
    }

    @BeforeAll
    static void size() {
        base = requirements(5e6, 8000);
        result = SizingStudy.run(base, new TunerFocusFinder(8), SizingProgress.NONE);
    }

    /**
     * Scaling law (classical; e.g. Hawkes and Kasper, Principles of Electron Optics, vol. 1: the paraxial and
     * aberration equations are invariant when every length is multiplied by k at fixed potentials, Cs and Cc
     * scale by k and surface fields by 1/k). Sizing the doubled problem (lengths x2, field limit /2) must give
     * the same design scaled by two, within the optimiser's parameter tolerance.
     */
    @Test
    void everyLengthDoubledGivesTheSameDesignScaledByTwo() {
        SizingResult twice = SizingStudy.run(base.scaled(2), new TunerFocusFinder(8), SizingProgress.NONE);
        Design a = result.winner().orElseThrow();
        Design b = twice.winner().orElseThrow();
        for (int i = 0; i < a.parameters_m().size(); i++) {
            Parameter p = base.parameters().get(i);
            double tol = Math.max(Sizer.PARAMETER_TOLERANCE * (p.max_m() - p.min_m()), 1e-9);
            assertThat(b.parameters_m().get(i) / 2).as(p.name()).isCloseTo(a.parameters_m().get(i), within(tol));
        }
        assertThat(b.bias_V()).isCloseTo(a.bias_V(), within(1e-3 * Math.abs(a.bias_V())));
        assertThat(b.spherical_m() / 2).isCloseTo(a.spherical_m(), within(1e-3 * a.spherical_m()));
        assertThat(b.maxSurfaceField_V_per_m() * 2).isCloseTo(a.maxSurfaceField_V_per_m(),
                within(1e-2 * a.maxSurfaceField_V_per_m()));
    }

    /** The chosen design, written as a stack file, read back and re-run through the optics, meets every claim. */
    @Test
    void theChosenDesignMeetsEveryRequirementItClaims(@TempDir Path dir) throws Exception {
        Design d = result.winner().orElseThrow();
        assertThat(d.feasible()).isTrue();
        Stack written = new DesignEvaluator(base, null).stack(d.electrodes(),
                MeshSettings.defaults().withTargetElements(base.search().finalElements()));
        Path file = dir.resolve("chosen.toml");
        StackWriter.write(written, file);
        Stack s = StackReader.read(file);
        BiasedField f = BemSolver.solve(s.electrodes(), s.mesh(), SolveProgress.NONE).biased();
        ParaxialOptics o = ParaxialOptics.of(f, s);
        double image = o.imaging(s.beam().objectZ_m().getAsDouble()).realImageZ_m().getAsDouble();
        // the image plane is the requirement; 1 um on a 150 mm object-image distance is far inside any bench use
        assertThat(image).isCloseTo(base.imageZ_m().getAsDouble(), within(1e-6));
        double field = Arrays.stream(f.maxSurfaceFieldPerElectrode_V_per_m()).max().orElseThrow();
        assertThat(field).isLessThanOrEqualTo(base.maxSurfaceField_V_per_m());
        assertThat(Arrays.stream(s.biases_V()).map(Math::abs).max().orElseThrow()).isLessThanOrEqualTo(base.maxBias_V());
        assertThat(s.maxZ_m() - s.minZ_m()).isLessThanOrEqualTo(base.maxLength_m());
        assertThat(s.minBore_m()).isGreaterThanOrEqualTo(base.minBore_m() * (1 - 1e-12));
        // every facing gap of the written design within plan's gap rule (issue 19: size rejects designs over it)
        assertThat(org.axistack.tune.GapMargins.of(s)).allMatch(r -> r.voltage_V() <= r.comfort_V());
        assertThat(s.minZ_m()).isGreaterThan(base.objectZ_m().getAsDouble());
        assertThat(s.maxZ_m()).isLessThan(base.imageZ_m().getAsDouble());
        // the claimed Cs is what the optics of the written file gives (object side, same mesh)
        assertThat(o.aberrations(s.beam().objectZ_m().getAsDouble()).sphericalObject_m().getAsDouble())
                .isCloseTo(d.spherical_m(), within(1e-6 * d.spherical_m()));
        assertThat(result.front()).isNotEmpty().allMatch(Design::feasible);
        assertThat(Tolerances.mostCritical(result.tolerances())).isNotNull();
    }

    /** A surface-field limit far below what any focusing einzel lens of this size needs binds, and is named. */
    @Test
    void anImpossibleFieldLimitIsNamedAsBinding() {
        Requirements r = requirements(2e4, 8000).withSearch(new SearchSettings(4, 120, 160, 16, 2));
        SizingResult res = SizingStudy.run(r, new TunerFocusFinder(8), SizingProgress.NONE);
        assertThat(res.winner()).isEmpty();
        Infeasibility inf = res.infeasible().orElseThrow();
        assertThat(inf.noFocus()).isFalse();
        assertThat(inf.binding()).containsExactly(Limit.SURFACE_FIELD);
        assertThat(inf.bestValue().get(Limit.SURFACE_FIELD)).isGreaterThan(2e4);
    }

    /** A supply far too weak to focus: nothing focuses, and the supply is named. */
    @Test
    void aSupplyTooWeakToFocusIsNamed() {
        Requirements r = requirements(5e6, 20).withSearch(new SearchSettings(4, 120, 160, 16, 2));
        SizingResult res = SizingStudy.run(r, new TunerFocusFinder(8), SizingProgress.NONE);
        Infeasibility inf = res.infeasible().orElseThrow();
        assertThat(inf.noFocus()).isTrue();
        assertThat(inf.binding()).containsExactly(Limit.BIAS);
    }

    @Test
    void frontKeepsOnlyUndominatedDesigns() {
        List<Design> front = result.front();
        for (Design a : front) {
            for (Design b : front) {
                assertThat(Front.dominates(b, a)).isFalse();
            }
        }
        assertThat(Files.exists(Path.of("."))).isTrue();
    }
}
