package org.axistack.field;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;
import java.util.Random;

import org.axistack.mesh.BoundaryMesh;
import org.axistack.mesh.Mesher;
import org.axistack.model.Electrode;
import org.axistack.model.MeshSettings;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.factory.LinearSolverFactory_DDRM;
import org.ejml.interfaces.linsol.LinearSolverDense;
import org.junit.jupiter.api.Test;

/**
 * The mirror-symmetric split against EJML's LU of the whole system (a general-purpose reference library)
 * and against a solve of the same lens made slightly asymmetric (so it cannot be folded).
 */
class MirrorFoldTest {

    private static List<Electrode> einzel(double outletShift_m) {
        return List.of(new Electrode.Tube("inlet", 0, 0.005, -0.06, -0.0065, 0.001),
                new Electrode.Tube("focus", -500, 0.005, -0.0055, 0.0055, 0.001),
                new Electrode.Tube("outlet", 0, 0.005, 0.0065 + outletShift_m, 0.06, 0.001));
    }

    @Test
    void findsTheMirrorOfASymmetricLensAndNoneOfAnAsymmetricOne() {
        BoundaryMesh sym = Mesher.mesh(einzel(0), new MeshSettings(600, 4));
        int[] s = MirrorFold.mirror(sym);
        assertThat(s).isNotNull();
        for (int i = 0; i < s.length; i++) {
            assertThat(s[s[i]]).isEqualTo(i);
            assertThat(sym.nodeR(s[i])).isCloseTo(sym.nodeR(i), org.assertj.core.data.Offset.offset(1e-12));
        }
        assertThat(MirrorFold.mirror(Mesher.mesh(einzel(0.0005), new MeshSettings(600, 4)))).isNull();
    }

    @Test
    void foldedSolutionEqualsTheWholeLuOnAMirroredMatrix() {
        BoundaryMesh mesh = Mesher.mesh(einzel(0), new MeshSettings(900, 4));
        int[] s = MirrorFold.mirror(mesh);
        int n = mesh.size();
        double z0 = 0; // the lens is symmetric about z = 0
        Random rnd = new Random(5);
        double[] noise = new double[n * n];
        for (int i = 0; i < noise.length; i++) {
            noise[i] = 0.01 * rnd.nextGaussian();
        }
        // a nonsymmetric kernel-like matrix that keeps the mirror: A[s(i)][s(j)] = A[i][j]
        DMatrixRMaj a = new DMatrixRMaj(n, n);
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                int ci = Math.min(i, s[i]);
                int cj = i == ci ? j : s[j];
                double d = Math.hypot(mesh.nodeZ(i) - mesh.nodeZ(j), mesh.nodeR(i) - mesh.nodeR(j));
                a.set(i, j, 1 / (1e-3 + d) * (1 + 0.2 * Math.signum(mesh.nodeZ(ci) - z0 + 1e-30))
                        + noise[ci * n + cj]);
            }
        }
        DMatrixRMaj b = new DMatrixRMaj(n, 3);
        for (int i = 0; i < n; i++) {
            b.set(i, mesh.electrodeOf(i), 1.0);
        }
        DMatrixRMaj x = MirrorFold.solve(mesh, a, b, 1e-8, f -> true);
        assertThat(x).isNotNull();
        LinearSolverDense<DMatrixRMaj> lu = LinearSolverFactory_DDRM.lu(n);
        lu.setA(a.copy());
        DMatrixRMaj ref = new DMatrixRMaj(n, 3);
        lu.solve(b, ref);
        double worst = 0, scale = 0;
        for (int i = 0; i < x.data.length; i++) {
            worst = Math.max(worst, Math.abs(x.data[i] - ref.data[i]));
            scale = Math.max(scale, Math.abs(ref.data[i]));
        }
        assertThat(worst / scale).isLessThan(1e-10);
        assertThat(SchurLuSolver.residual(a, x, b)).isLessThan(1e-10);
    }

    @Test
    void refusesAMatrixThatDoesNotKeepTheMirror() {
        BoundaryMesh mesh = Mesher.mesh(einzel(0), new MeshSettings(600, 4));
        int n = mesh.size();
        Random rnd = new Random(9);
        DMatrixRMaj a = new DMatrixRMaj(n, n);
        for (int i = 0; i < a.data.length; i++) {
            a.data[i] = rnd.nextDouble();
        }
        for (int i = 0; i < n; i++) {
            a.add(i, i, n);
        }
        assertThat(MirrorFold.solve(mesh, a, new DMatrixRMaj(n, 1), 1e-8, f -> true)).isNull();
    }

    @Test
    void foldedFieldSolveAgreesWithAnUnfoldableNeighbour() {
        // The same lens with the outlet moved by 1 nm cannot be folded (its mesh is not mirrored to the
        // 1e-9 tolerance... of 0.12 m, i.e. 0.12 nm) and is solved whole; the physics differs by the 1 nm.
        FieldSolution folded = BemSolver.solve(einzel(0), new MeshSettings(900, 4), SolveProgress.NONE);
        FieldSolution whole = BemSolver.solve(einzel(1e-9), new MeshSettings(900, 4), SolveProgress.NONE);
        assertThat(folded.residual()).isLessThan(1e-12);
        assertThat(whole.residual()).isLessThan(1e-12);
        BiasedField f1 = folded.biased();
        BiasedField f2 = whole.biased();
        for (double z = -0.02; z <= 0.02; z += 0.001) {
            assertThat(f1.exactAxial0(z)).isCloseTo(f2.exactAxial0(z), org.assertj.core.data.Offset.offset(1e-6 * 500));
        }
        double[][] c1 = folded.capacitanceMatrix_F();
        double[][] c2 = whole.capacitanceMatrix_F();
        for (int i = 0; i < 3; i++) {
            for (int j = 0; j < 3; j++) {
                assertThat(Math.abs(c1[i][j] - c2[i][j])).isLessThan(1e-6 * Math.abs(c2[i][i]));
            }
        }
        // and the folded capacitance matrix keeps the mirror exactly where physics says so
        assertThat(Math.abs(c1[0][0] - c1[2][2])).isLessThan(1e-12 * c1[0][0]);
    }
}
