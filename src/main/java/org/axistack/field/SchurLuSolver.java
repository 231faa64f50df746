package org.axistack.field;

import java.util.concurrent.CancellationException;
import java.util.function.DoublePredicate;

import org.ejml.data.DMatrixRBlock;
import org.ejml.data.DMatrixRMaj;
import org.ejml.data.DSubmatrixD1;
import org.ejml.dense.block.MatrixMult_MT_DDRB;
import org.ejml.dense.block.MatrixOps_DDRB;
import org.ejml.dense.block.TriangularSolver_MT_DDRB;
import org.ejml.dense.row.CommonOps_DDRM;
import org.ejml.dense.row.decomposition.lu.LUDecompositionAlt_DDRM;
import org.ejml.dense.row.factory.LinearSolverFactory_DDRM;
import org.ejml.interfaces.linsol.LinearSolverDense;

/**
 * Solves the dense collocation system A X = B on all cores by recursive block elimination with the
 * Schur complement (Golub and Van Loan, Matrix Computations, 4th ed., sec. 3.2.10, "block LU"; the
 * recursive form as in S. Toledo, SIAM J. Matrix Anal. Appl. 18 (1997) 1065). The system is held as
 * one augmented matrix [A | B] in EJML's tiled (block) storage, and with A split at a tile boundary
 * into [[A11, A12], [A21, A22]]:
 *
 * <pre>
 *   [A12 | B1]  &lt;- A11^-1 [A12 | B1]              (recursion; leaves: EJML LU + tiled triangular solves)
 *   [A22 | B2]  &lt;- [A22 | B2] - A21 [A12 | B1]     (EJML multi-threaded tiled product: S and B2')
 *   B2          &lt;- S^-1 B2                          (recursion on the Schur complement)
 *   B1          &lt;- B1 - (A11^-1 A12) B2            (EJML multi-threaded tiled product)
 * </pre>
 *
 * leaving X in place of B. Every factorisation, triangular solve and product is EJML's; this class
 * only arranges them. The arithmetic is that of one LU of A (2/3 N^3 flops), but nearly all of it
 * runs in EJML's multi-threaded tiled kernels, where EJML's row-major LU of the whole matrix runs on
 * one core.
 *
 * <p>Rows are pivoted inside each leaf block, not across the splits. That is safe for the first-kind
 * single-layer matrices this package builds (every diagonal block discretises the same positive
 * operator on part of the surface), and the caller checks it: {@link #solve} returns null when a leaf
 * is singular or the residual of the solution exceeds the tolerance, and the caller then factors A
 * whole with partial pivoting.
 */
final class SchurLuSolver {

    /** Below this size one EJML LU on one core is as fast (measured on 2 cores). */
    static final int MIN_SIZE = 400;
    /** Tile edge of EJML's block storage; every split falls on a multiple of it. */
    static final int TILE = 60;
    /** Largest diagonal block factored directly (EJML LU with partial pivoting). */
    static final int LEAF = 4 * TILE;

    private final DMatrixRBlock aug;
    private final DoublePredicate progress;
    private final int leaves;
    private int leavesDone;

    private SchurLuSolver(DMatrixRBlock aug, int size, DoublePredicate progress) {
        this.aug = aug;
        this.progress = progress;
        this.leaves = leafCount(size);
    }

    /** A solution X of A X = B with its largest residual |A X - B|. */
    record Solution(DMatrixRMaj x, double residual) {
    }

    /**
     * Solves A X = B (A not modified) by this block elimination where it pays and meets {@code tolerance},
     * else by one EJML LU of the whole matrix with partial pivoting (single core); null when that LU finds A
     * singular. The one place that chooses between the two.
     */
    static Solution solveOrPivot(DMatrixRMaj a, DMatrixRMaj b, double tolerance, DoublePredicate progress) {
        if (a.numRows >= MIN_SIZE) {
            Solution s = solve(a, b, tolerance, progress);
            if (s != null) {
                return s;
            }
        }
        LinearSolverDense<DMatrixRMaj> lu = LinearSolverFactory_DDRM.lu(a.numRows);
        if (!lu.setA(a)) {
            return null;
        }
        DMatrixRMaj x = new DMatrixRMaj(a.numRows, b.numCols);
        lu.solve(b, x);
        return new Solution(x, residual(a, x, b));
    }

    /**
     * Solves A X = B, A square (not modified). Returns null when a leaf block is singular or the
     * largest residual |A X - B| exceeds {@code tolerance}. {@code progress} gets the fraction done
     * (0..1) after each leaf; when it returns false the solve stops with a CancellationException.
     */
    static Solution solve(DMatrixRMaj a, DMatrixRMaj b, double tolerance, DoublePredicate progress) {
        int n = a.numRows;
        int m = b.numCols;
        // The tiled kernels work on views that start on tile boundaries, so A is padded with an
        // identity block to a multiple of the tile: [[A, 0], [0, I]] [X; 0] = [B; 0].
        int padded = (n + TILE - 1) / TILE * TILE;
        DMatrixRBlock aug = new DMatrixRBlock(padded, padded + m, TILE);
        for (int i = 0; i < n; i++) {
            for (int c = 0; c * TILE < n; c++) {
                System.arraycopy(a.data, i * n + c * TILE, aug.data, tileIndex(aug, i, c), Math.min(TILE, n - c * TILE));
            }
            for (int j = 0; j < m; j++) {
                aug.set(i, padded + j, b.get(i, j));
            }
        }
        for (int i = n; i < padded; i++) {
            aug.set(i, i, 1.0);
        }
        SchurLuSolver s = new SchurLuSolver(aug, padded, progress);
        if (!s.eliminate(0, padded)) {
            return null;
        }
        DMatrixRMaj x = new DMatrixRMaj(n, m);
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < m; j++) {
                x.data[i * m + j] = aug.get(i, padded + j);
            }
        }
        double r = residual(a, x, b);
        return r <= tolerance ? new Solution(x, r) : null;
    }

    /**
     * Overwrites the right-hand columns [r1, end) of rows [r0, r1) with A(r0:r1, r0:r1)^-1 times
     * themselves, where A(r0:r1, r0:r1) is the current content of the diagonal block (false: singular).
     */
    private boolean eliminate(int r0, int r1) {
        int size = r1 - r0;
        int end = aug.numCols;
        if (size <= LEAF) {
            return leaf(r0, r1);
        }
        int h = r0 + split(size);
        if (!eliminate(r0, h)) {
            return false;
        }
        // [A22 | B2] -= A21 [W | Y1]: the Schur complement and the reduced right-hand side at once.
        MatrixMult_MT_DDRB.multMinus(TILE, view(h, r1, r0, h), view(r0, h, h, end), view(h, r1, h, end));
        if (!eliminate(h, r1)) {
            return false;
        }
        // [B1] -= W X2 (only the right-hand columns beyond this block).
        MatrixMult_MT_DDRB.multMinus(TILE, view(r0, h, h, r1), view(h, r1, r1, end), view(r0, h, r1, end));
        return true;
    }

    /** Factors one diagonal block with EJML's pivoted LU and applies it to the columns to its right. */
    private boolean leaf(int r0, int r1) {
        int size = r1 - r0;
        int end = aug.numCols;
        DMatrixRMaj block = new DMatrixRMaj(size, size);
        for (int i = 0; i < size; i++) {
            for (int j = 0; j < size; j++) {
                block.data[i * size + j] = aug.get(r0 + i, r0 + j);
            }
        }
        LUDecompositionAlt_DDRM lu = new LUDecompositionAlt_DDRM();
        if (!lu.decompose(block) || lu.isSingular()) {
            return false;
        }
        int[] pivot = lu.getRowPivotV(null);
        // Row exchanges of the leaf applied to every column to its right, one tile column at a time (a row's
        // part of a tile is contiguous in the tiled storage).
        double[] rows = new double[size * TILE];
        for (int c = r1 / TILE; c * TILE < end; c++) {
            int width = Math.min(TILE, end - c * TILE);
            for (int i = 0; i < size; i++) {
                System.arraycopy(aug.data, tileIndex(aug, r0 + pivot[i], c), rows, i * TILE, width);
            }
            for (int i = 0; i < size; i++) {
                System.arraycopy(rows, i * TILE, aug.data, tileIndex(aug, r0 + i, c), width);
            }
        }
        DSubmatrixD1 rhs = view(r0, r1, r1, end);
        DMatrixRBlock lower = MatrixOps_DDRB.convert(lu.getLower((DMatrixRMaj) null), TILE);
        DMatrixRBlock upper = MatrixOps_DDRB.convert(lu.getUpper((DMatrixRMaj) null), TILE);
        TriangularSolver_MT_DDRB.lsolve(TILE, false, new DSubmatrixD1(lower), rhs, false);
        TriangularSolver_MT_DDRB.lsolve(TILE, true, new DSubmatrixD1(upper), rhs, false);
        leavesDone++;
        if (!progress.test((double) leavesDone / leaves)) {
            throw new CancellationException("field solve cancelled");
        }
        return true;
    }

    /**
     * Index in the tiled storage of the first element of row {@code row} inside tile column {@code c}
     * (EJML's layout: tiles stored row of tiles after row of tiles, each tile row-major).
     */
    static int tileIndex(DMatrixRBlock m, int row, int c) {
        int tileRow = row / TILE;
        int height = Math.min(TILE, m.numRows - tileRow * TILE);
        int width = Math.min(TILE, m.numCols - c * TILE);
        return tileRow * TILE * m.numCols + c * TILE * height + (row - tileRow * TILE) * width;
    }

    /** Rows in the first half of a block of {@code size} rows (a multiple of the tile). */
    private static int split(int size) {
        return Math.max(1, Math.round(size / 2f / TILE)) * TILE;
    }

    /** Number of leaf blocks the recursion makes for {@code size} rows. */
    private static int leafCount(int size) {
        return size <= LEAF ? 1 : leafCount(split(size)) + leafCount(size - split(size));
    }

    private DSubmatrixD1 view(int row0, int row1, int col0, int col1) {
        return new DSubmatrixD1(aug, row0, row1, col0, col1);
    }

    /** Largest |A X - B| (infinite when X holds NaN). */
    static double residual(DMatrixRMaj a, DMatrixRMaj x, DMatrixRMaj b) {
        DMatrixRMaj check = new DMatrixRMaj(b.numRows, b.numCols);
        CommonOps_DDRM.mult(a, x, check);
        double r = 0;
        for (int i = 0; i < check.data.length; i++) {
            double d = Math.abs(check.data[i] - b.data[i]);
            r = Math.max(r, Double.isNaN(d) ? Double.POSITIVE_INFINITY : d);
        }
        return r;
    }
}
