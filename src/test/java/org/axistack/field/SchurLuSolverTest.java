package org.axistack.field;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.List;
import java.util.Random;
import java.util.concurrent.CancellationException;

import org.axistack.model.Electrode;
import org.axistack.model.MeshSettings;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.factory.LinearSolverFactory_DDRM;
import org.ejml.interfaces.linsol.LinearSolverDense;
import org.junit.jupiter.api.Test;

/**
 * The parallel block elimination against EJML's pivoted LU of the whole matrix (a general-purpose
 * reference library), on sizes that are not multiples of the tile, and its refusals.
 */
class SchurLuSolverTest {

    /** A nonsymmetric, well-conditioned matrix with a slowly decaying kernel, like a collocation matrix. */
    private static DMatrixRMaj kernelLike(int n, long seed) {
        Random rnd = new Random(seed);
        DMatrixRMaj a = new DMatrixRMaj(n, n);
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                a.set(i, j, 1.0 / (1 + Math.abs(i - j)) * (1 + 0.3 * rnd.nextDouble()) + 0.01 * rnd.nextGaussian());
            }
        }
        return a;
    }

    private static DMatrixRMaj reference(DMatrixRMaj a, DMatrixRMaj b) {
        LinearSolverDense<DMatrixRMaj> lu = LinearSolverFactory_DDRM.lu(a.numRows);
        lu.setA(a.copy());
        DMatrixRMaj x = new DMatrixRMaj(b.numRows, b.numCols);
        lu.solve(b, x);
        return x;
    }

    @Test
    void agreesWithEjmlLuOnSizesOffTheTile() {
        for (int n : new int[] {401, 457, 780, 1003}) {
            DMatrixRMaj a = kernelLike(n, n);
            DMatrixRMaj b = new DMatrixRMaj(n, 3);
            Random rnd = new Random(7);
            for (int i = 0; i < b.data.length; i++) {
                b.data[i] = rnd.nextDouble() - 0.5;
            }
            DMatrixRMaj keep = a.copy();
            SchurLuSolver.Solution solved = SchurLuSolver.solve(a, b, 1e-10, f -> true);
            assertThat(solved).as("n = %d", n).isNotNull();
            DMatrixRMaj x = solved.x();
            assertThat(a.data).as("A is not modified").isEqualTo(keep.data);
            DMatrixRMaj ref = reference(a, b);
            double worst = 0;
            double scale = 0;
            for (int i = 0; i < x.data.length; i++) {
                worst = Math.max(worst, Math.abs(x.data[i] - ref.data[i]));
                scale = Math.max(scale, Math.abs(ref.data[i]));
            }
            assertThat(worst / scale).as("n = %d", n).isLessThan(1e-11);
            assertThat(SchurLuSolver.residual(a, x, b)).isLessThan(1e-12);
        }
    }

    @Test
    void tileIndexIsEjmlsLayout() {
        org.ejml.data.DMatrixRBlock m = new org.ejml.data.DMatrixRBlock(250, 187, SchurLuSolver.TILE);
        for (int row = 0; row < m.numRows; row++) {
            for (int c = 0; c * SchurLuSolver.TILE < m.numCols; c++) {
                assertThat(SchurLuSolver.tileIndex(m, row, c)).isEqualTo(m.getIndex(row, c * SchurLuSolver.TILE));
            }
        }
    }

    @Test
    void pivotsInsideALeafWhereTheDiagonalVanishes() {
        int n = 500;
        DMatrixRMaj a = kernelLike(n, 3);
        for (int i = 0; i < n; i += 2) {
            a.set(i, i, 0.0); // needs row exchanges inside the leaves
        }
        DMatrixRMaj b = new DMatrixRMaj(n, 2);
        b.set(0, 0, 1);
        b.set(n - 1, 1, 1);
        SchurLuSolver.Solution solved = SchurLuSolver.solve(a, b, 1e-10, f -> true);
        assertThat(solved).isNotNull();
        assertThat(SchurLuSolver.residual(a, solved.x(), b)).isLessThan(1e-10);
    }

    @Test
    void refusesWhenALeafBlockIsSingularSoTheCallerCanPivotWhole() {
        // [[0, I], [I, 0]] is a permutation (perfectly conditioned) whose diagonal blocks are zero.
        int n = 480;
        DMatrixRMaj a = new DMatrixRMaj(n, n);
        for (int i = 0; i < n / 2; i++) {
            a.set(i, n / 2 + i, 1);
            a.set(n / 2 + i, i, 1);
        }
        DMatrixRMaj b = new DMatrixRMaj(n, 1);
        b.set(5, 0, 1);
        assertThat(SchurLuSolver.solve(a, b, 1e-10, f -> true)).isNull();
    }

    @Test
    void cancelsBetweenLeaves() {
        int n = 900;
        DMatrixRMaj a = kernelLike(n, 11);
        DMatrixRMaj b = new DMatrixRMaj(n, 1);
        b.set(0, 0, 1);
        assertThatThrownBy(() -> SchurLuSolver.solve(a, b, 1e-10, f -> f < 0.3))
                .isInstanceOf(CancellationException.class);
    }

    @Test
    void fieldSolveUsesItAndKeepsTheResidualAndCapacitance() {
        // The same tube lens solved below and above the block-elimination threshold of unknowns: the
        // block path must give the residual of a direct solve and a capacitance that settles with the mesh.
        List<Electrode> tubes = List.of(new Electrode.Tube("a", 0, 0.01, -0.05, -0.001, 0),
                new Electrode.Tube("b", 1000, 0.01, 0.001, 0.05, 0));
        FieldSolution small = BemSolver.solve(tubes, new MeshSettings(120, 1), SolveProgress.NONE);
        FieldSolution large = BemSolver.solve(tubes, new MeshSettings(900, 1), SolveProgress.NONE);
        assertThat(small.unknowns()).isLessThan(SchurLuSolver.MIN_SIZE);
        assertThat(large.unknowns()).isGreaterThan(SchurLuSolver.MIN_SIZE);
        assertThat(large.residual()).isLessThan(1e-12);
        double c0 = small.capacitanceMatrix_F()[0][0];
        double c1 = large.capacitanceMatrix_F()[0][0];
        assertThat(Math.abs(c1 - c0) / Math.abs(c1)).isLessThan(1e-5);
    }
}
