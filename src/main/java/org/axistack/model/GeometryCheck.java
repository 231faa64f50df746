package org.axistack.model;

import java.util.ArrayList;
import java.util.List;

/**
 * Pure geometric sanity checks of a stack's meridian outlines: outlines that cross themselves, and
 * electrodes that overlap or touch. Arcs are flattened into 16 chords each ({@link Outlines});
 * segment distances and crossings use the standard orientation (signed-area) tests of computational
 * geometry (de Berg et al., Computational Geometry, 3rd ed., ch. 2). Containment uses the even-odd
 * ray-crossing rule.
 *
 * <p>Tolerance: two outlines closer than {@link #TOUCH_TOLERANCE_M} (plus 1e-9 of the stack's extent)
 * count as touching. The check knows nothing of files; callers attach file positions to the problems.
 */
public final class GeometryCheck {

    /** Gap below which two surfaces count as touching, m (0.1 micrometre). */
    public static final double TOUCH_TOLERANCE_M = 1e-7;

    /** Chords per arc when flattening (sagitta below 0.5 % of the radius for a half circle). */
    static final int ARC_PIECES = 16;

    /** What is wrong. */
    public enum Kind {
        /** An outline crosses or touches itself. */
        SELF_CROSSING,
        /** Two electrodes cross each other, or one lies inside the other (any biases). */
        OVERLAP,
        /** Two electrodes touch while at different biases. */
        TOUCH
    }

    /**
     * One problem found.
     *
     * @param kind   the kind
     * @param first  index of the (first) electrode in the stack's list
     * @param second index of the second electrode, or -1 for a self-crossing
     * @param where  a point near the problem, m
     */
    public record Problem(Kind kind, int first, int second, ZR where) {
    }

    private GeometryCheck() {
    }

    /** All problems of a list of electrodes, in electrode order; empty when the geometry is sound. */
    public static List<Problem> check(List<Electrode> electrodes) {
        List<Problem> out = new ArrayList<>();
        List<double[][]> flat = new ArrayList<>();
        double extent = 0;
        for (Electrode e : electrodes) {
            double[][] p = flatten(e.contour());
            flat.add(p);
            for (double[] q : p) {
                extent = Math.max(extent, Math.max(Math.abs(q[0]), Math.abs(q[1])));
            }
        }
        double tol = TOUCH_TOLERANCE_M + 1e-9 * extent;
        for (int i = 0; i < electrodes.size(); i++) {
            ZR w = selfCrossing(flat.get(i), electrodes.get(i).contour().closed(), tol);
            if (w != null) {
                out.add(new Problem(Kind.SELF_CROSSING, i, -1, w));
            }
        }
        for (int i = 0; i < electrodes.size(); i++) {
            for (int j = i + 1; j < electrodes.size(); j++) {
                Problem p = pair(electrodes, flat, i, j, tol);
                if (p != null) {
                    out.add(p);
                }
            }
        }
        return out;
    }

    /**
     * Smallest distance between the outlines of two electrodes, m (0 when they touch or cross). Arcs
     * are flattened as in {@link #check}, so the result is good to 0.5 % of an arc's radius.
     */
    public static double gap_m(Electrode a, Electrode b) {
        double[][] p = flatten(a.contour()), q = flatten(b.contour());
        // upper bound from a subsample of vertex pairs, so that the sweep window starts narrow
        double best = Double.POSITIVE_INFINITY;
        int sp = Math.max(1, p.length / 64), sq = Math.max(1, q.length / 64);
        for (int u = 0; u < p.length; u += sp) {
            for (int v = 0; v < q.length; v += sq) {
                double dz = p[u][0] - q[v][0], dr = p[u][1] - q[v][1];
                best = Math.min(best, Math.sqrt(dz * dz + dr * dr));
            }
        }
        // sweep with a window that shrinks with the best distance found so far
        int[] op = sortedByMinZ(p), oq = sortedByMinZ(q);
        int start = 0;
        for (int u : op) {
            double uMin = Math.min(p[u][0], p[u + 1][0]), uMax = Math.max(p[u][0], p[u + 1][0]);
            while (start < oq.length && Math.max(q[oq[start]][0], q[oq[start] + 1][0]) < uMin - best) {
                start++;
            }
            for (int y = start; y < oq.length; y++) {
                int v = oq[y];
                if (Math.min(q[v][0], q[v + 1][0]) > uMax + best) {
                    break;
                }
                if (boxesNear(p[u], p[u + 1], q[v], q[v + 1], best)) {
                    best = Math.min(best, segmentDistance(p[u], p[u + 1], q[v], q[v + 1]));
                }
            }
        }
        return best;
    }

    /** Vertices of the flattened outline; a closed contour repeats its first vertex at the end. */
    static double[][] flatten(Contour c) {
        return Outlines.vertices(c, arc -> ARC_PIECES).stream().map(p -> new double[] {p.z_m(), p.r_m()})
                .toArray(double[][]::new);
    }

    private static ZR selfCrossing(double[][] p, boolean closed, double tol) {
        int n = p.length - 1; // pieces
        int[] order = sortedByMinZ(p);
        for (int x = 0; x < n; x++) {
            int a0 = order[x];
            double zMax = Math.max(p[a0][0], p[a0 + 1][0]) + tol;
            for (int y = x + 1; y < n; y++) {
                int b0 = order[y];
                if (Math.min(p[b0][0], p[b0 + 1][0]) > zMax) {
                    break;
                }
                int a = Math.min(a0, b0), b = Math.max(a0, b0);
                boolean adjacent = b == a + 1 || (closed && a == 0 && b == n - 1);
                if (adjacent) {
                    int shared = b == a + 1 ? a + 1 : 0;
                    int ea = b == a + 1 ? a : 1;
                    int eb = b == a + 1 ? b + 1 : n - 1;
                    if (foldsBack(p[shared], p[ea], p[eb], tol)) {
                        return new ZR(p[shared][0], p[shared][1]);
                    }
                    continue;
                }
                if (boxesNear(p[a], p[a + 1], p[b], p[b + 1], tol)
                        && segmentDistance(p[a], p[a + 1], p[b], p[b + 1]) <= tol) {
                    return new ZR(p[b][0], p[b][1]);
                }
            }
        }
        return null;
    }

    /** Piece indices (piece k runs from vertex k to k+1) sorted by their smallest z. */
    private static int[] sortedByMinZ(double[][] p) {
        Integer[] idx = new Integer[p.length - 1];
        for (int k = 0; k < idx.length; k++) {
            idx[k] = k;
        }
        java.util.Arrays.sort(idx, java.util.Comparator.comparingDouble(k -> Math.min(p[k][0], p[k + 1][0])));
        int[] out = new int[idx.length];
        for (int k = 0; k < idx.length; k++) {
            out[k] = idx[k];
        }
        return out;
    }

    /** Whether the piece from shared to x and the piece from shared to y lie on top of each other. */
    private static boolean foldsBack(double[] shared, double[] x, double[] y, double tol) {
        double ax = x[0] - shared[0], ar = x[1] - shared[1], bx = y[0] - shared[0], br = y[1] - shared[1];
        double la = Math.hypot(ax, ar), lb = Math.hypot(bx, br);
        double cross = ax * br - ar * bx, dot = ax * bx + ar * br;
        return dot > 0 && Math.abs(cross) <= tol * Math.max(la, lb);
    }

    private static Problem pair(List<Electrode> es, List<double[][]> flat, int i, int j, double tol) {
        double[][] a = flat.get(i), b = flat.get(j);
        double[] ba = bounds(a), bb = bounds(b);
        if (ba[0] > bb[1] + tol || bb[0] > ba[1] + tol || ba[2] > bb[3] + tol || bb[2] > ba[3] + tol) {
            return null;
        }
        // sweep over both piece lists sorted by smallest z: only pieces whose z ranges meet are compared
        int[] oa = sortedByMinZ(a), ob = sortedByMinZ(b);
        double minD = Double.POSITIVE_INFINITY;
        ZR where = null;
        int start = 0;
        for (int u : oa) {
            double uMin = Math.min(a[u][0], a[u + 1][0]) - tol, uMax = Math.max(a[u][0], a[u + 1][0]) + tol;
            // a b-piece ending before this a-piece starts also ends before every later one
            while (start < ob.length && Math.max(b[ob[start]][0], b[ob[start] + 1][0]) < uMin) {
                start++;
            }
            for (int y = start; y < ob.length; y++) {
                int v = ob[y];
                if (Math.min(b[v][0], b[v + 1][0]) > uMax) {
                    break;
                }
                if (!boxesNear(a[u], a[u + 1], b[v], b[v + 1], tol)) {
                    continue;
                }
                if (properCrossing(a[u], a[u + 1], b[v], b[v + 1])) {
                    return new Problem(Kind.OVERLAP, i, j, new ZR(b[v][0], b[v][1]));
                }
                double d = segmentDistance(a[u], a[u + 1], b[v], b[v + 1]);
                if (d < minD) {
                    minD = d;
                    where = new ZR(b[v][0], b[v][1]);
                }
            }
        }
        // without a crossing or a touch, one contour lies wholly inside the other or wholly outside:
        // one test point decides; when they touch, every vertex and midpoint is tested
        boolean touching = minD <= tol;
        ZR inside = insideSolid(es.get(i).contour(), a, b, tol, !touching);
        if (inside == null) {
            inside = insideSolid(es.get(j).contour(), b, a, tol, !touching);
        }
        if (inside != null) {
            return new Problem(Kind.OVERLAP, i, j, inside);
        }
        if (touching && es.get(i).bias_V() != es.get(j).bias_V()) {
            return new Problem(Kind.TOUCH, i, j, where);
        }
        return null;
    }

    /** zMin, zMax, rMin, rMax of a vertex list. */
    private static double[] bounds(double[][] p) {
        double[] r = {Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY};
        for (double[] q : p) {
            r[0] = Math.min(r[0], q[0]);
            r[1] = Math.max(r[1], q[0]);
            r[2] = Math.min(r[2], q[1]);
            r[3] = Math.max(r[3], q[1]);
        }
        return r;
    }

    /** A point of {@code other} strictly inside the solid bounded by {@code c}, or null. */
    private static ZR insideSolid(Contour c, double[][] poly, double[][] other, double tol, boolean onePoint) {
        if (c.isSheet()) {
            return null;
        }
        // a solid is bounded by its closed outline, or by an open outline closed along the axis
        double[][] ring = poly;
        if (!c.closed()) {
            ring = java.util.Arrays.copyOf(poly, poly.length + 1);
            ring[poly.length] = poly[0];
        }
        for (int k = 0; k < other.length; k++) {
            double[] q = other[k];
            double[] mid = k + 1 < other.length
                    ? new double[] {(q[0] + other[k + 1][0]) / 2, (q[1] + other[k + 1][1]) / 2} : q;
            for (double[] t : new double[][] {q, mid}) {
                if (distanceToPolyline(t, ring) > tol) {
                    if (Outlines.contains(ring, t[0], t[1])) {
                        return new ZR(t[0], t[1]);
                    }
                    if (onePoint) {
                        return null;
                    }
                }
            }
        }
        return null;
    }

    private static double distanceToPolyline(double[] t, double[][] ring) {
        double d = Double.POSITIVE_INFINITY;
        for (int k = 0; k + 1 < ring.length; k++) {
            d = Math.min(d, pointSegment(t, ring[k], ring[k + 1]));
        }
        return d;
    }

    private static boolean boxesNear(double[] a, double[] b, double[] c, double[] d, double tol) {
        return Math.max(a[0], b[0]) + tol >= Math.min(c[0], d[0]) && Math.max(c[0], d[0]) + tol >= Math.min(a[0], b[0])
                && Math.max(a[1], b[1]) + tol >= Math.min(c[1], d[1]) && Math.max(c[1], d[1]) + tol >= Math.min(a[1], b[1]);
    }

    private static double orient(double[] a, double[] b, double[] c) {
        return (b[0] - a[0]) * (c[1] - a[1]) - (b[1] - a[1]) * (c[0] - a[0]);
    }

    /** Segments cross at a single interior point of both (strict sign changes). */
    static boolean properCrossing(double[] a, double[] b, double[] c, double[] d) {
        double o1 = orient(a, b, c), o2 = orient(a, b, d), o3 = orient(c, d, a), o4 = orient(c, d, b);
        return o1 * o2 < 0 && o3 * o4 < 0;
    }

    static double segmentDistance(double[] a, double[] b, double[] c, double[] d) {
        if (properCrossing(a, b, c, d)) {
            return 0;
        }
        return Math.min(Math.min(pointSegment(a, c, d), pointSegment(b, c, d)),
                Math.min(pointSegment(c, a, b), pointSegment(d, a, b)));
    }

    static double pointSegment(double[] p, double[] a, double[] b) {
        double dz = b[0] - a[0], dr = b[1] - a[1];
        double len2 = dz * dz + dr * dr;
        double t = len2 == 0 ? 0 : ((p[0] - a[0]) * dz + (p[1] - a[1]) * dr) / len2;
        t = Math.max(0, Math.min(1, t));
        double ez = p[0] - (a[0] + t * dz), er = p[1] - (a[1] + t * dr);
        return Math.sqrt(ez * ez + er * er);
    }
}
