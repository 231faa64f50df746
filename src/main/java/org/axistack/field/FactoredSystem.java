package org.axistack.field;

import java.util.concurrent.CompletableFuture;

import org.axistack.mesh.BoundaryMesh;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.factory.LinearSolverFactory_DDRM;
import org.ejml.interfaces.linsol.LinearSolverDense;

/**
 * A collocation matrix factored once and kept, for any number of later right-hand sides. A mirror-symmetric
 * mesh (same test as {@link MirrorFold}: node partners, electrode map, sampled entries) is factored as its even
 * and odd halves (two EJML LUs with partial pivoting, one per core, each an eighth of the whole LU's
 * arithmetic); any other mesh as one EJML LU of the whole matrix. Every solve checks its residual in the
 * full system. Thread-safe (solves are serialised: EJML's solvers keep workspace).
 */
final class FactoredSystem {

    private final DMatrixRMaj a;
    private final int[] mirror;
    private final int[] rep;
    private final LinearSolverDense<DMatrixRMaj> even;
    private final LinearSolverDense<DMatrixRMaj> odd;
    private final LinearSolverDense<DMatrixRMaj> whole;

    private FactoredSystem(DMatrixRMaj a, int[] mirror, int[] rep, LinearSolverDense<DMatrixRMaj> even,
            LinearSolverDense<DMatrixRMaj> odd, LinearSolverDense<DMatrixRMaj> whole) {
        this.a = a;
        this.mirror = mirror;
        this.rep = rep;
        this.even = even;
        this.odd = odd;
        this.whole = whole;
    }

    /** Factors A (kept, not modified); throws {@link SolveException} when A is singular. */
    static FactoredSystem factor(BoundaryMesh mesh, DMatrixRMaj a) {
        int n = a.numRows;
        int[] s = MirrorFold.mirror(mesh);
        if (s != null && MirrorFold.entriesMirror(a, s)) {
            int h = n / 2;
            int[] rep = new int[n];
            int k = 0;
            for (int i = 0; i < n; i++) {
                if (i < s[i]) {
                    rep[k++] = i;
                }
            }
            if (k == h) {
                DMatrixRMaj ev = new DMatrixRMaj(h, h);
                DMatrixRMaj od = new DMatrixRMaj(h, h);
                for (int p = 0; p < h; p++) {
                    int row = rep[p] * n;
                    for (int q = 0; q < h; q++) {
                        double direct = a.data[row + rep[q]];
                        double mirrored = a.data[row + s[rep[q]]];
                        ev.data[p * h + q] = direct + mirrored;
                        od.data[p * h + q] = direct - mirrored;
                    }
                }
                CompletableFuture<LinearSolverDense<DMatrixRMaj>> fe = CompletableFuture.supplyAsync(() -> lu(ev));
                LinearSolverDense<DMatrixRMaj> lo = lu(od);
                LinearSolverDense<DMatrixRMaj> le = fe.join();
                if (le != null && lo != null) {
                    return new FactoredSystem(a, s, rep, le, lo, null);
                }
            }
        }
        LinearSolverDense<DMatrixRMaj> w = lu(a);
        if (w == null) {
            throw new SolveException(SolveException.Reason.SINGULAR, "the collocation matrix is singular: two electrodes coincide or overlap; separate them");
        }
        return new FactoredSystem(a, null, null, null, null, w);
    }

    private static LinearSolverDense<DMatrixRMaj> lu(DMatrixRMaj m) {
        LinearSolverDense<DMatrixRMaj> lu = LinearSolverFactory_DDRM.lu(m.numRows);
        return lu.setA(m.copy()) ? lu : null;
    }

    /** Whether the system was factored as mirror halves. */
    boolean mirrorHalves() {
        return mirror != null;
    }

    int size() {
        return a.numRows;
    }

    /** Solves A X = B for every column of B; returns X with its largest residual. */
    synchronized SchurLuSolver.Solution solve(DMatrixRMaj b) {
        int n = a.numRows;
        int m = b.numCols;
        DMatrixRMaj x = new DMatrixRMaj(n, m);
        if (mirror == null) {
            whole.solve(b, x);
        } else {
            int h = n / 2;
            DMatrixRMaj bEven = new DMatrixRMaj(h, m);
            DMatrixRMaj bOdd = new DMatrixRMaj(h, m);
            for (int p = 0; p < h; p++) {
                int i = rep[p];
                for (int c = 0; c < m; c++) {
                    double bi = b.get(i, c);
                    double bs = b.get(mirror[i], c);
                    bEven.set(p, c, 0.5 * (bi + bs));
                    bOdd.set(p, c, 0.5 * (bi - bs));
                }
            }
            DMatrixRMaj xEven = new DMatrixRMaj(h, m);
            DMatrixRMaj xOdd = new DMatrixRMaj(h, m);
            even.solve(bEven, xEven);
            odd.solve(bOdd, xOdd);
            for (int p = 0; p < h; p++) {
                int i = rep[p];
                for (int c = 0; c < m; c++) {
                    double e = xEven.get(p, c);
                    double o = xOdd.get(p, c);
                    x.set(i, c, e + o);
                    x.set(mirror[i], c, e - o);
                }
            }
        }
        return new SchurLuSolver.Solution(x, SchurLuSolver.residual(a, x, b));
    }
}
