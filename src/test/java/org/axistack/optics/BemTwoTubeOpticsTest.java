package org.axistack.optics;

import org.axistack.verify.TwoTubeBesselPotential;
import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;

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
 * Issue 4: focal properties of a small-gap two-tube lens computed by the project from its boundary-element field,
 * against the same properties computed from the zero-gap Bessel-integral axial potential
 * ({@link TwoTubeBesselPotential}, classical solution), within 1e-4 relative. The 0.02 mm gap changes the axial
 * potential by about 1e-6 of V2 - V1 (field package measurement), far below the tolerance.
 */
class BemTwoTubeOpticsTest {

    private static final double R = 5e-3;
    private static final double LENGTH = 0.1;
    private static final double GAP = 2e-5;

    @Test
    void bemFocalPropertiesMatchBesselIntegral() {
        double v2 = 20000;
        List<Electrode> tubes = List.of(new Electrode.Tube("upstream", 0, R, -LENGTH, -GAP / 2, 0),
                new Electrode.Tube("downstream", v2, R, GAP / 2, LENGTH, 0));
        Beam beam = new Beam(Particle.electron(), 5000);
        Stack stack = new Stack("two tubes", beam, tubes);
        BiasedField bem = BemSolver.solve(tubes, new MeshSettings(1200, 12), SolveProgress.NONE).biased();
        ParaxialOptics fromBem = ParaxialOptics.of(bem, stack);
        CardinalElements b = fromBem.cardinal();
        // the same planes for the reference (both fields are field-free there to ~1e-10)
        ParaxialOptics fromBessel = ParaxialOptics.of(new TwoTubeBesselPotential(R, 0, v2), beam,
                fromBem.zStart_m(), fromBem.zEnd_m());
        CardinalElements ref = fromBessel.cardinal();
        System.out.printf("BEM two-tube: planes %.3f..%.3f mm, f1 %.6f mm (ref %.6f), f2 %.6f mm (ref %.6f),"
                + " plane sensitivity %.2e, max rel diff %.2e%n", fromBem.zStart_m() * 1e3, fromBem.zEnd_m() * 1e3,
                b.focalLengthObject_m() * 1e3, ref.focalLengthObject_m() * 1e3, b.focalLengthImage_m() * 1e3,
                ref.focalLengthImage_m() * 1e3, b.planeSensitivity(), b.relativeDifference(ref));
        assertThat(fromBem.zStart_m()).isGreaterThan(-LENGTH);
        assertThat(fromBem.zEnd_m()).isLessThan(LENGTH);
        assertThat(b.relativeDifference(ref)).isLessThan(1e-4);
        assertThat(b.planeSensitivity()).isLessThan(1e-6);
    }
}
