package org.axistack.field;

import java.util.Arrays;
import java.util.function.DoublePredicate;

import org.axistack.mesh.BoundaryMesh;
import org.ejml.data.DMatrixRMaj;

/**
 * Solves the collocation system of a stack that is mirror-symmetric about a plane z = z0 (an einzel lens
 * with equal outer electrodes, say) as two systems of half the size. If every node i has a mirror node
 * s(i) and the matrix keeps the mirror, A[s(i)][s(j)] = A[i][j], then every right-hand side splits into
 * an even and an odd part, and on the representatives H (one node of each mirror pair) the even part
 * solves (A[i][j] + A[i][s(j)]) and the odd part (A[i][j] - A[i][s(j)]) (the reduction of a problem with
 * a reflection symmetry by its symmetric and antisymmetric subspaces; e.g. the group-theoretic reduction
 * of boundary-element systems in A. Bossavit, "Boundary value problems with symmetry and their
 * approximation by finite elements", SIAM J. Appl. Math. 53 (1993) 1352, cited from memory). Each half is factored as any
 * other collocation matrix ({@link SchurLuSolver}); the arithmetic falls to a quarter.
 *
 * <p>The mirror is looked for, never assumed: the node coordinates must match to 1e-9 of the stack's size,
 * electrodes must map onto electrodes, and sampled matrix entries must agree to 1e-9 relative; the caller
 * checks the residual of the unfolded solution in the full system as for every other solve.
 */
final class MirrorFold {

    /** Relative tolerance for matching mirrored nodes (of the stack's extent). */
    static final double NODE_TOLERANCE = 1e-9;
    /** Relative tolerance for mirrored matrix entries. */
    static final double ENTRY_TOLERANCE = 1e-9;

    private MirrorFold() {
    }

    /**
     * The mirror permutation of the mesh's nodes, or null when the mesh is not mirror-symmetric about the
     * middle of its z extent (or a node lies on the mirror plane).
     */
    static int[] mirror(BoundaryMesh mesh) {
        int n = mesh.size();
        double zMin = Double.POSITIVE_INFINITY, zMax = Double.NEGATIVE_INFINITY, rMax = 0;
        for (int i = 0; i < n; i++) {
            zMin = Math.min(zMin, mesh.nodeZ(i));
            zMax = Math.max(zMax, mesh.nodeZ(i));
            rMax = Math.max(rMax, mesh.nodeR(i));
        }
        double z0 = 0.5 * (zMin + zMax);
        double tol = NODE_TOLERANCE * (zMax - zMin + rMax);
        // nodes sorted by r, then z: a mirror partner has the same r
        Integer[] byR = new Integer[n];
        for (int i = 0; i < n; i++) {
            byR[i] = i;
        }
        Arrays.sort(byR, (p, q) -> Double.compare(mesh.nodeR(p), mesh.nodeR(q)));
        double[] sortedR = new double[n];
        for (int k = 0; k < n; k++) {
            sortedR[k] = mesh.nodeR(byR[k]);
        }
        int[] s = new int[n];
        Arrays.fill(s, -1);
        for (int i = 0; i < n; i++) {
            double zm = 2 * z0 - mesh.nodeZ(i);
            double r = mesh.nodeR(i);
            if (Math.abs(zm - mesh.nodeZ(i)) <= tol) {
                return null; // a node on the mirror plane: no clean split
            }
            int k = lowerBound(sortedR, r - tol);
            int found = -1;
            for (; k < n && sortedR[k] <= r + tol; k++) {
                int j = byR[k];
                if (Math.abs(mesh.nodeZ(j) - zm) <= tol) {
                    found = j;
                    break;
                }
            }
            if (found < 0) {
                return null;
            }
            s[i] = found;
        }
        int ne = 0;
        for (int i = 0; i < n; i++) {
            ne = Math.max(ne, mesh.electrodeOf(i) + 1);
        }
        int[] electrodeMap = new int[ne];
        Arrays.fill(electrodeMap, -1);
        for (int i = 0; i < n; i++) {
            if (s[s[i]] != i) {
                return null;
            }
            int e = mesh.electrodeOf(i);
            int f = mesh.electrodeOf(s[i]);
            if (electrodeMap[e] < 0) {
                electrodeMap[e] = f;
            } else if (electrodeMap[e] != f) {
                return null;
            }
        }
        return s;
    }

    private static int lowerBound(double[] a, double v) {
        int lo = 0, hi = a.length;
        while (lo < hi) {
            int mid = (lo + hi) >>> 1;
            if (a[mid] < v) {
                lo = mid + 1;
            } else {
                hi = mid;
            }
        }
        return lo;
    }

    /**
     * Solves A X = B by folding, or returns null when the mesh or the matrix is not mirror-symmetric or a
     * half system cannot be solved. A is not modified.
     */
    static DMatrixRMaj solve(BoundaryMesh mesh, DMatrixRMaj a, DMatrixRMaj b, double tolerance,
            DoublePredicate progress) {
        int[] s = mirror(mesh);
        if (s == null) {
            return null;
        }
        int n = a.numRows;
        int m = b.numCols;
        if (!entriesMirror(a, s)) {
            return null;
        }
        int h = n / 2;
        int[] rep = new int[h];
        int k = 0;
        for (int i = 0; i < n; i++) {
            if (i < s[i]) {
                rep[k++] = i;
            }
        }
        if (k != h) {
            return null;
        }
        DMatrixRMaj even = new DMatrixRMaj(h, h);
        DMatrixRMaj odd = new DMatrixRMaj(h, h);
        DMatrixRMaj bEven = new DMatrixRMaj(h, m);
        DMatrixRMaj bOdd = new DMatrixRMaj(h, m);
        for (int p = 0; p < h; p++) {
            int i = rep[p];
            int row = i * n;
            for (int q = 0; q < h; q++) {
                int j = rep[q];
                double direct = a.data[row + j];
                double mirrored = a.data[row + s[j]];
                even.data[p * h + q] = direct + mirrored;
                odd.data[p * h + q] = direct - mirrored;
            }
            for (int c = 0; c < m; c++) {
                double bi = b.get(i, c);
                double bs = b.get(s[i], c);
                bEven.set(p, c, 0.5 * (bi + bs));
                bOdd.set(p, c, 0.5 * (bi - bs));
            }
        }
        SchurLuSolver.Solution sEven = SchurLuSolver.solveOrPivot(even, bEven, tolerance, f -> progress.test(0.5 * f));
        if (sEven == null) {
            return null;
        }
        SchurLuSolver.Solution sOdd = SchurLuSolver.solveOrPivot(odd, bOdd, tolerance, f -> progress.test(0.5 + 0.5 * f));
        if (sOdd == null) {
            return null;
        }
        DMatrixRMaj xEven = sEven.x();
        DMatrixRMaj xOdd = sOdd.x();
        DMatrixRMaj x = new DMatrixRMaj(n, m);
        for (int p = 0; p < h; p++) {
            int i = rep[p];
            for (int c = 0; c < m; c++) {
                double e = xEven.get(p, c);
                double o = xOdd.get(p, c);
                x.set(i, c, e + o);
                x.set(s[i], c, e - o);
            }
        }
        return x;
    }

    /** Sampled entries (every diagonal and a spread of others) keep the mirror to ENTRY_TOLERANCE. */
    static boolean entriesMirror(DMatrixRMaj a, int[] s) {
        int n = a.numRows;
        double scale = 0;
        for (int i = 0; i < n; i++) {
            scale = Math.max(scale, Math.abs(a.data[i * n + i]));
        }
        int stride = Math.max(1, n / 97);
        for (int i = 0; i < n; i++) {
            for (int j = i % stride; j < n; j += stride) {
                double v = a.data[i * n + j];
                double w = a.data[s[i] * n + s[j]];
                if (!(Math.abs(v - w) <= ENTRY_TOLERANCE * scale)) {
                    return false;
                }
            }
        }
        return true;
    }
}
