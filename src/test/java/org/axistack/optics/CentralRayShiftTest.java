package org.axistack.optics;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;

import org.axistack.field.BemSolver;
import org.axistack.field.FieldSolution;
import org.axistack.field.HarmonicOperator;
import org.axistack.field.MisalignmentResponse;
import org.axistack.field.MisalignmentResponse.Motion;
import org.axistack.field.SolveProgress;
import org.axistack.model.Electrode;
import org.axistack.model.MeshSettings;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * The central ray of a misaligned stack against the round lens moved as a whole (exact to first order:
 * the ray meets the moved lens at a known height and slope in the lens's own frame) and the decentred-lens
 * result: a lens decentred by d deflects the axial ray by d/f on its image side (textbook thin-lens result,
 * e.g. any geometrical-optics text on prism effect of decentred lenses, cited from memory; exact for a thick
 * lens with f its image-side focal length, since the central ray is the parallel ray at height -d).
 */
class CentralRayShiftTest {

    static FieldSolution solution;
    static MisalignmentResponse response;
    static ParaxialOptics optics;
    static CentralRayShift shift;

    @BeforeAll
    static void solve() {
        // a weak three-aperture einzel lens for 2 keV positive ions (demo numbers of our own)
        List<Electrode> es = List.of(new Electrode.Aperture("a", 0, -0.004, 0.002, 0.008, 0.0005),
                new Electrode.Aperture("b", 300, 0, 0.002, 0.008, 0.0005),
                new Electrode.Aperture("c", 0, 0.004, 0.002, 0.008, 0.0005));
        solution = BemSolver.solve(es, new MeshSettings(500, 6), SolveProgress.NONE);
        response = MisalignmentResponse.solve(solution.biased(), HarmonicOperator.factor(solution, 1, SolveProgress.NONE));
        AccelerationPotential p = new AccelerationPotential(solution.biased(), 2000, 1, Double.POSITIVE_INFINITY);
        optics = ParaxialOptics.of(p, -0.03, 0.03, ParaxialSettings.defaults());
        shift = CentralRayShift.of(response, optics);
    }

    @Test
    void decentringTheWholeLensDeflectsByDOverF() {
        double screen = 0.2;
        double x = 0;
        double s = 0;
        for (int k = 0; k < 3; k++) {
            double[] a = shift.at(k, Motion.DECENTRE, screen);
            x += a[0];
            s += a[1];
        }
        // lens axis at x = 1 (per metre of decentre): the ray enters at height -1 in the lens frame
        TransferMatrix t = optics.transfer(optics.zStart_m(), screen);
        assertThat(Math.abs(x - (1 - t.a())) / Math.abs(1 - t.a())).isLessThan(1e-7);
        assertThat(Math.abs(s + t.c()) / Math.abs(t.c())).isLessThan(1e-7);
        double f = optics.cardinal().focalLengthImage_m();
        assertThat(f).isGreaterThan(0.01);
        assertThat(Math.abs(s - 1 / f) * f).isLessThan(1e-6);
    }

    @Test
    void tiltingTheWholeLensTurnsTheRay() {
        double c = 0.001;
        double screen = 0.15;
        double x = 0;
        double s = 0;
        for (int k = 0; k < 3; k++) {
            double[] tilt = shift.at(k, Motion.TILT, screen);
            double[] dec = shift.at(k, Motion.DECENTRE, screen);
            x += tilt[0] + (response.centreZ_m(k) - c) * dec[0];
            s += tilt[1] + (response.centreZ_m(k) - c) * dec[1];
        }
        // lens axis x = theta (z - c): in the lens frame the ray enters at height -(zs - c), slope -1 (per rad)
        TransferMatrix t = optics.transfer(optics.zStart_m(), screen);
        double zs = optics.zStart_m();
        double xl = t.height(-(zs - c), -1);
        double sl = t.slope(-(zs - c), -1);
        double expectX = xl + (screen - c);
        double expectS = sl + 1;
        assertThat(Math.abs(x - expectX) / Math.abs(expectX)).isLessThan(1e-7);
        assertThat(Math.abs(s - expectS) / Math.abs(expectS)).isLessThan(1e-7);
    }

    @Test
    void quadratureHasConverged() {
        CentralRayShift fine = CentralRayShift.of(response, optics, 192);
        for (int k = 0; k < 3; k++) {
            for (Motion m : Motion.values()) {
                double[] a = shift.at(k, m, 0.2);
                double[] b = fine.at(k, m, 0.2);
                assertThat(Math.abs(a[0] - b[0])).isLessThan(1e-9 * Math.abs(b[0]));
            }
        }
        // a plane inside the traced range
        double[] in = shift.at(0, Motion.DECENTRE, 0.01);
        double[] inFine = fine.at(0, Motion.DECENTRE, 0.01);
        assertThat(Math.abs(in[0] - inFine[0])).isLessThan(1e-9 * Math.abs(inFine[0]));
    }

    /**
     * The budget's tolerances put every term at an equal share: the quadrature sum of sensitivity x tolerance over
     * the 2 x electrodes terms is the allowance; alone, one error at its single tolerance moves the spot by the
     * allowance (arithmetic of the stated assumption).
     */
    @Test
    void budgetSharesTheAllowanceInQuadrature() {
        MisalignmentBudget b = MisalignmentBudget.of(List.of("a", "b", "c"), shift, -1, null, null, 1, 0.2, 5e-5);
        double sum = 0;
        double tightest = Double.POSITIVE_INFINITY;
        for (MisalignmentBudget.Row r : b.rows()) {
            sum += Math.pow(r.decentreShift() * r.decentreTolerance_m(), 2) + Math.pow(r.tiltShift() * r.tiltTolerance_rad(), 2);
            assertThat(Math.abs(r.decentreShift() * r.decentreAlone_m())).isCloseTo(5e-5,
                    org.assertj.core.data.Offset.offset(1e-15));
            assertThat(r.decentreWalk_per_V()).isNaN();
            tightest = Math.min(tightest, r.decentreTolerance_m());
        }
        assertThat(Math.sqrt(sum)).isCloseTo(5e-5, org.assertj.core.data.Offset.offset(1e-15));
        assertThat(b.rows().get(b.tightestDecentre()).decentreTolerance_m()).isEqualTo(tightest);
        // the middle (biased) electrode of an einzel lens is the sensitive one
        assertThat(b.tightestDecentre()).isEqualTo(1);
    }
}
