package org.axistack.field;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;

import org.axistack.field.MisalignmentResponse.Motion;
import org.axistack.model.Contour;
import org.axistack.model.Electrode;
import org.axistack.model.MeshSettings;
import org.axistack.model.Segment;
import org.axistack.model.ZR;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * Checks of the first-order rigid-motion responses against exact invariants of electrostatics (derived in
 * misalignment.md; common practice, no source): a rigid motion of the whole stack moves the field with it,
 * a sphere turned about its centre is the same conductor, mirror symmetry maps responses onto each other; and
 * against a finite decentre computed by an independent round solve of the moved geometry.
 */
class MisalignmentResponseTest {

    static final double R = 0.002;
    static final double D = 0.006;
    static final double[] SPHERE_V = {30, 100};
    static FieldSolution einzel;
    static MisalignmentResponse einzelResponse;
    static FieldSolution spheres;
    static MisalignmentResponse sphereResponse;

    static Electrode sphere(String name, double bias, double zc, double radius) {
        return new Electrode.Outline(name, bias, new Contour(List.of(new Segment.Arc(new ZR(zc - radius, 0),
                new ZR(zc, radius), new ZR(zc + radius, 0))), false));
    }

    @BeforeAll
    static void solve() {
        // a mirror-symmetric three-aperture einzel lens (demo geometry of our own)
        List<Electrode> es = List.of(new Electrode.Aperture("a", 0, -0.004, 0.002, 0.008, 0.0005),
                new Electrode.Aperture("b", 700, 0, 0.002, 0.008, 0.0005),
                new Electrode.Aperture("c", 0, 0.004, 0.002, 0.008, 0.0005));
        einzel = BemSolver.solve(es, new MeshSettings(500, 6), SolveProgress.NONE);
        einzelResponse = MisalignmentResponse.solve(einzel.biased(),
                HarmonicOperator.factor(einzel, 1, SolveProgress.NONE));
        spheres = BemSolver.solve(List.of(sphere("A", SPHERE_V[0], 0, R), sphere("B", SPHERE_V[1], D, R)),
                new MeshSettings(300, 6), SolveProgress.NONE);
        sphereResponse = MisalignmentResponse.solve(spheres.biased(),
                HarmonicOperator.factor(spheres, 1, SolveProgress.NONE));
    }

    static double[] axial(BiasedField f, double z) {
        double[] out = new double[3];
        f.exactAxial(z, 2, out);
        return out;
    }

    /**
     * Decentring every electrode by d gives the translated field: the potential change is -d dphi/dx, and near
     * the axis phi = Phi_0 - (r^2/4) Phi_0'', so Phi_1 = (d/2) Phi_0''; turning every electrode by theta about
     * the y axis through z = c turns the field: Phi_1 = theta ((z - c) Phi_0''/2 + Phi_0'). A tilt of k about
     * its own centre z_k and about c differ by the decentre theta (z_k - c).
     */
    @Test
    void movingTheWholeStackMovesTheField() {
        double c = 0.0013;
        double[][] out = new double[3][2];
        double scale = 0;
        double worstDecentre = 0;
        double worstTilt = 0;
        for (double z = -0.012; z <= 0.012; z += 0.0005) {
            einzelResponse.dipoles(z, out);
            double[] a = axial(einzelResponse.field(), z);
            double dec = 0;
            double tilt = 0;
            for (int k = 0; k < 3; k++) {
                dec += out[k][0];
                tilt += out[k][1] + (einzelResponse.centreZ_m(k) - c) * out[k][0];
            }
            scale = Math.max(scale, Math.abs(0.5 * a[2]));
            worstDecentre = Math.max(worstDecentre, Math.abs(dec - 0.5 * a[2]));
            worstTilt = Math.max(worstTilt, Math.abs(tilt - ((z - c) * 0.5 * a[2] + a[1])));
        }
        assertThat(worstDecentre / scale).isLessThan(1e-9);
        assertThat(worstTilt / (scale * 0.01)).isLessThan(1e-9);
    }

    /** Mirror z -> -z maps electrode a onto c: decentre responses equal at mirrored z, tilt responses opposite. */
    @Test
    void mirroredElectrodesHaveMirroredResponses() {
        double[][] plus = new double[3][2];
        double[][] minus = new double[3][2];
        double scale = 0;
        double worst = 0;
        for (double z = 0; z <= 0.012; z += 0.0007) {
            einzelResponse.dipoles(z, plus);
            einzelResponse.dipoles(-z, minus);
            scale = Math.max(scale, Math.abs(plus[0][0]));
            worst = Math.max(worst, Math.abs(plus[0][0] - minus[2][0]));
            worst = Math.max(worst, Math.abs(plus[0][1] + minus[2][1]) / 0.004);
            worst = Math.max(worst, Math.abs(plus[1][0] - minus[1][0]));
        }
        assertThat(scale).isGreaterThan(1e5);
        assertThat(worst / scale).isLessThan(1e-8);
    }

    /**
     * Two spheres: a sphere turned about its centre is the same conductor (zero response); decentring sphere
     * B by d is, to first order, turning the pair by d/D about A's centre, so its response is the rotated field
     * (a non-trivial check of the harmonic-1 solve: every right-hand side is non-zero here).
     */
    @Test
    void decentringOneSphereTurnsThePair() {
        double[][] out = new double[2][2];
        double scale = 0;
        double worstTurn = 0;
        double worstTilt = 0;
        for (double z = -0.006; z <= 0.012; z += 0.0004) {
            if (Math.abs(z) < R * 1.02 || Math.abs(z - D) < R * 1.02) {
                continue;
            }
            sphereResponse.dipoles(z, out);
            double[] a = axial(sphereResponse.field(), z);
            double turned = (z * 0.5 * a[2] + a[1]) / D;
            scale = Math.max(scale, Math.abs(turned));
            worstTurn = Math.max(worstTurn, Math.abs(out[1][0] - turned));
            worstTilt = Math.max(worstTilt, Math.max(Math.abs(out[0][1]), Math.abs(out[1][1])) / D);
        }
        assertThat(worstTurn / scale).isLessThan(1e-6);
        assertThat(worstTilt / scale).isLessThan(1e-6);
    }

    /**
     * Finite decentre d = 1e-3 R of sphere B, solved exactly as a round pair at distance sqrt(D^2 + d^2) along
     * the turned axis (an independent round solve), against the first-order response: the dipole function of
     * the turned field on the original axis, dphi/dx = -E_z sin(alpha) - E_r sign(xi) cos(alpha), alpha =
     * atan(d/D), xi = -z sin(alpha) (rotation of coordinates), agrees to 1e-4 relative.
     */
    @Test
    void finiteDecentreIsLinear() {
        for (double dOverR : new double[] {1e-3, -3e-4}) {
            double d = dOverR * R;
            double alpha = Math.atan2(d, D);
            double dPrime = Math.hypot(D, d);
            FieldSolution moved = BemSolver.solve(List.of(sphere("A", SPHERE_V[0], 0, R),
                    sphere("B", SPHERE_V[1], dPrime, R)), new MeshSettings(300, 6), SolveProgress.NONE);
            BiasedField f = moved.biased();
            double scale = 0;
            double worst = 0;
            double[] e = new double[2];
            for (double z : new double[] {-0.0045, -0.003, 0.0028, 0.003, 0.0035, 0.0095, 0.012}) {
                double xi = -z * Math.sin(alpha);
                f.evaluate(z * Math.cos(alpha), Math.abs(xi), e);
                double finite = (-e[0] * Math.sin(alpha) - e[1] * Math.signum(xi) * Math.cos(alpha)) / d;
                double linear = sphereResponse.dipole(1, Motion.DECENTRE, z);
                scale = Math.max(scale, Math.abs(linear));
                worst = Math.max(worst, Math.abs(finite - linear));
            }
            assertThat(worst / scale).as("d/R = %s", dOverR).isLessThan(1e-4);
        }
    }

    /** An isolated electrode moved rigidly carries its field exactly: no correction, Phi_1 = (d/2) Phi_0''. */
    @Test
    void isolatedElectrodeCarriesItsField() {
        FieldSolution one = BemSolver.solve(List.of(new Electrode.Tube("t", 50, R, -0.004, 0.004, 0.0005)),
                new MeshSettings(300, 6), SolveProgress.NONE);
        MisalignmentResponse r = MisalignmentResponse.solve(one.biased(), HarmonicOperator.factor(one, 1,
                SolveProgress.NONE));
        for (double v : r.correction(0, Motion.DECENTRE)) {
            assertThat(v).isEqualTo(0.0);
        }
        double[] a = axial(one.biased(), 0.003);
        assertThat(r.dipole(0, Motion.DECENTRE, 0.003)).isCloseTo(0.5 * a[2],
                org.assertj.core.data.Offset.offset(1e-9 * Math.abs(a[2])));
    }
}
