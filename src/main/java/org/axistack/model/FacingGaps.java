package org.axistack.model;

import java.util.ArrayList;
import java.util.List;

/**
 * The gaps between facing electrodes: for each pair of electrodes, the shortest straight line in the meridian
 * half-plane from one surface to the other that no other electrode blocks (it may not cross or touch a third
 * electrode, nor pass through either of the two). Pairs with no such line (shielded by a third electrode) do not
 * face each other and are left out.
 *
 * <p>Between two surfaces of revolution the shortest 3D distance joins points of the same azimuth, so the meridian
 * distance is the true gap. Method: the outlines are cut into pieces (arcs into {@value #ARC_PIECES} chords per quarter circle, any
 * piece at most 1/{@value #PIECES_PER_EXTENT} of the stack's extent), the closest points of every pair of pieces
 * are found (segment-to-segment distance, the endpoint cases of de Berg et al., Computational Geometry, 3rd ed.,
 * ch. 2, as in {@link GeometryCheck}), and the candidates are tried shortest first until one is not blocked. The
 * gap is exact for straight outlines and good to the chord sagitta (0.03 % of an arc's radius) on arcs; a line of
 * sight that leaves the meridian half-plane (across the axis at the opposite azimuth) is not sought.
 */
public final class FacingGaps {

    /** Chords per quarter circle of arc (sagitta below 0.03 % of the radius). */
    static final int ARC_PIECES = 32;

    /** Longest straight piece as a fraction of the stack's extent. */
    static final int PIECES_PER_EXTENT = 300;

    /**
     * One gap between two facing electrodes.
     *
     * @param first  index of the first electrode in the stack's list
     * @param second index of the second (greater than first)
     * @param gap_m  the shortest unblocked distance, m
     * @param from   its end on the first electrode
     * @param to     its end on the second electrode
     */
    public record Gap(int first, int second, double gap_m, ZR from, ZR to) {
    }

    private FacingGaps() {
    }

    /** Every facing pair, in electrode order (first, then second). */
    public static List<Gap> of(List<Electrode> electrodes) {
        double extent = 0;
        for (Electrode e : electrodes) {
            Contour c = e.contour();
            extent = Math.max(extent, Math.max(c.maxZ_m() - c.minZ_m(), c.maxR_m()));
        }
        double zLo = electrodes.stream().mapToDouble(e -> e.contour().minZ_m()).min().orElse(0);
        double zHi = electrodes.stream().mapToDouble(e -> e.contour().maxZ_m()).max().orElse(0);
        extent = Math.max(extent, zHi - zLo);
        double maxPiece = extent / PIECES_PER_EXTENT;
        List<double[][]> pieces = new ArrayList<>();
        List<double[][]> coarse = new ArrayList<>();
        List<double[][]> rings = new ArrayList<>();
        for (Electrode e : electrodes) {
            List<ZR> v = Outlines.vertices(e.contour(),
                    arc -> (int) Math.ceil(ARC_PIECES * Math.abs(arc.sweep_rad()) / (0.5 * Math.PI) - 1e-9));
            coarse.add(rows(v));
            pieces.add(subdivide(rows(v), maxPiece));
            rings.add(Outlines.solidRing(e.contour(), v));
        }
        List<Gap> out = new ArrayList<>();
        for (int i = 0; i < electrodes.size(); i++) {
            for (int j = i + 1; j < electrodes.size(); j++) {
                Gap g = pair(i, j, pieces, coarse, rings);
                if (g != null) {
                    out.add(g);
                }
            }
        }
        return out;
    }

    private static double[][] rows(List<ZR> v) {
        double[][] p = new double[v.size()][];
        for (int k = 0; k < p.length; k++) {
            p[k] = new double[] {v.get(k).z_m(), v.get(k).r_m()};
        }
        return p;
    }

    private static double[][] subdivide(double[][] p, double maxPiece) {
        List<double[]> out = new ArrayList<>();
        out.add(p[0]);
        for (int k = 0; k + 1 < p.length; k++) {
            double dz = p[k + 1][0] - p[k][0], dr = p[k + 1][1] - p[k][1];
            int n = Math.max(1, (int) Math.ceil(Math.hypot(dz, dr) / maxPiece));
            for (int m = 1; m <= n; m++) {
                out.add(m == n ? p[k + 1] : new double[] {p[k][0] + dz * m / n, p[k][1] + dr * m / n});
            }
        }
        return out.toArray(double[][]::new);
    }

    private static Gap pair(int i, int j, List<double[][]> pieces, List<double[][]> coarse, List<double[][]> rings) {
        double[][] p = pieces.get(i), q = pieces.get(j);
        int np = p.length - 1, nq = q.length - 1;
        double[] dist = new double[np * nq];
        for (int u = 0; u < np; u++) {
            for (int v = 0; v < nq; v++) {
                dist[u * nq + v] = closest(p[u], p[u + 1], q[v], q[v + 1], null);
            }
        }
        Integer[] order = new Integer[dist.length];
        for (int k = 0; k < order.length; k++) {
            order[k] = k;
        }
        java.util.Arrays.sort(order, (a, b) -> Double.compare(dist[a], dist[b]));
        double[] ends = new double[4];
        for (Integer k : order) {
            int u = k / nq, v = k % nq;
            double d = closest(p[u], p[u + 1], q[v], q[v + 1], ends);
            if (!(d > 0)) {
                return null; // touching electrodes are refused at input; no gap to assess
            }
            double[] a = {ends[0], ends[1]}, b = {ends[2], ends[3]};
            if (!blocked(a, b, d, i, j, coarse, rings)) {
                return new Gap(i, j, d, new ZR(a[0], a[1]), new ZR(b[0], b[1]));
            }
        }
        return null;
    }

    /** Whether the line a-b is blocked: it comes within a small tolerance of a third electrode, or passes through i or j. */
    private static boolean blocked(double[] a, double[] b, double d, int i, int j, List<double[][]> coarse,
            List<double[][]> rings) {
        double tol = 1e-3 * d;
        for (int k = 0; k < coarse.size(); k++) {
            double[][] c = coarse.get(k);
            if (k == i || k == j) {
                for (int m = 0; m + 1 < c.length; m++) {
                    if (GeometryCheck.properCrossing(a, b, c[m], c[m + 1])) {
                        return true;
                    }
                }
                double[][] ring = rings.get(k);
                if (ring != null && Outlines.contains(ring, 0.5 * (a[0] + b[0]), 0.5 * (a[1] + b[1]))) {
                    return true;
                }
            } else {
                for (int m = 0; m + 1 < c.length; m++) {
                    if (GeometryCheck.segmentDistance(a, b, c[m], c[m + 1]) <= tol) {
                        return true;
                    }
                }
            }
        }
        return false;
    }

    /**
     * Distance between segments a-b and c-d; with ends non-null, also the closest points (z, r on a-b, then on
     * c-d). Crossing segments are at distance 0.
     */
    static double closest(double[] a, double[] b, double[] c, double[] d, double[] ends) {
        if (GeometryCheck.properCrossing(a, b, c, d)) {
            return 0;
        }
        double best = Double.POSITIVE_INFINITY;
        double[][] cand = {a, b, c, d};
        for (int k = 0; k < 4; k++) {
            double[] pt = cand[k];
            double[] s0 = k < 2 ? c : a, s1 = k < 2 ? d : b;
            double dz = s1[0] - s0[0], dr = s1[1] - s0[1];
            double len2 = dz * dz + dr * dr;
            double t = len2 == 0 ? 0 : ((pt[0] - s0[0]) * dz + (pt[1] - s0[1]) * dr) / len2;
            t = Math.max(0, Math.min(1, t));
            double fz = s0[0] + t * dz, fr = s0[1] + t * dr;
            double e = Math.hypot(pt[0] - fz, pt[1] - fr);
            if (e < best) {
                best = e;
                if (ends != null) {
                    if (k < 2) {
                        ends[0] = pt[0];
                        ends[1] = pt[1];
                        ends[2] = fz;
                        ends[3] = fr;
                    } else {
                        ends[0] = fz;
                        ends[1] = fr;
                        ends[2] = pt[0];
                        ends[3] = pt[1];
                    }
                }
            }
        }
        return best;
    }
}
