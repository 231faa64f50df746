package org.axistack.ui;

import java.util.ArrayList;
import java.util.List;

import org.axistack.model.Units;
import org.axistack.report.LensChart;

/**
 * Equipotential lines by marching squares (Lorensen and Cline, "Marching cubes", SIGGRAPH 1987, in its
 * two-dimensional form): on each grid cell the level crosses the edges whose end values straddle it, at the
 * linearly interpolated point; saddle cells are split by the cell-centre average. The lines are straight
 * inside a cell, so their position error is of the order of the grid spacing times the relative curvature
 * of the potential over a cell: a picture, not a measurement.
 */
public final class Isolines {

    private Isolines() {
    }

    /**
     * Evenly spaced "round" levels (1, 2 or 5 times a power of ten) strictly between min and max, about
     * {@code wanted} of them.
     */
    public static double[] levels(double min, double max, int wanted) {
        if (!(max > min) || wanted < 1 || !Double.isFinite(min) || !Double.isFinite(max)) {
            return new double[0];
        }
        double step = nearestRoundStep((max - min) / (wanted + 1));
        List<Double> out = new ArrayList<>();
        for (double v = Math.floor(min / step) * step; v < max; v += step) {
            double rounded = Math.rint(v / step) * step;
            if (rounded > min && rounded < max) {
                out.add(rounded);
            }
        }
        return out.stream().mapToDouble(Double::doubleValue).toArray();
    }

    /** The round step (1, 2 or 5 times a power of ten) nearest to raw on a logarithmic scale. */
    public static double nearestRoundStep(double raw) {
        double p = Math.pow(10, Math.floor(Math.log10(raw)));
        double best = p;
        for (double m : new double[] {1, 2, 5, 10}) {
            if (Math.abs(Math.log(m * p / raw)) < Math.abs(Math.log(best / raw))) {
                best = m * p;
            }
        }
        return best;
    }

    /** The round step (1, 2 or 5 times a power of ten) at or just above raw. */
    public static double roundStep(double raw) {
        double p = Math.pow(10, Math.floor(Math.log10(raw)));
        for (double m : new double[] {1, 2, 5, 10}) {
            if (m * p >= raw * (1 - 1e-12)) {
                return m * p;
            }
        }
        return 10 * p;
    }

    /**
     * Lines of every level through the grid values v[iz][ir] on the grid's nodes, in mm, drawn above the axis and
     * mirrored below it. The cell segments of a level are joined into poly-lines where they meet on a cell edge
     * (the two cells compute the same crossing from the same two node values), so a line is drawn as one piece
     * rather than as many short strokes.
     */
    public static LensChart.Lines trace(PotentialGrid grid, double[][] v, double[] levels) {
        LensChart.LinesBuilder out = new LensChart.LinesBuilder();
        int nz = grid.nz(), nr = grid.nr();
        double[] zs = new double[nz];
        double[] rs = new double[nr];
        for (int i = 0; i < nz; i++) {
            zs[i] = Units.mToMm(grid.z_m(i));
        }
        for (int j = 0; j < nr; j++) {
            rs[j] = Units.mToMm(grid.r_m(j));
        }
        Chains chains = new Chains(nz, nr);
        double[] seg = new double[8];
        int[] edge = new int[4];
        for (double level : levels) {
            chains.clear();
            for (int i = 0; i < nz - 1; i++) {
                for (int j = 0; j < nr - 1; j++) {
                    int n = cell(v[i][j], v[i + 1][j], v[i + 1][j + 1], v[i][j + 1], level, zs[i], zs[i + 1], rs[j],
                            rs[j + 1], seg, edge);
                    for (int s = 0; s < n; s++) {
                        chains.add(seg, 4 * s, Chains.edgeId(nr, i, j, edge[2 * s]),
                                Chains.edgeId(nr, i, j, edge[2 * s + 1]));
                    }
                }
            }
            chains.emit(out);
        }
        return out.build();
    }

    /** The segments of one level, joined into poly-lines through the grid edges they share. */
    private static final class Chains {
        private final int[] first;
        private final int[] second;
        private int[] touched = new int[256];
        private int touchedCount;
        private double[] pts = new double[1024];
        private int[] ends = new int[512];
        private int count;

        Chains(int nz, int nr) {
            first = new int[2 * nz * nr];
            second = new int[2 * nz * nr];
            java.util.Arrays.fill(first, -1);
            java.util.Arrays.fill(second, -1);
        }

        /** Grid edge of cell (i, j): 0 bottom, 1 right, 2 top, 3 left; even ids along z, odd ids along r. */
        static int edgeId(int nr, int i, int j, int local) {
            switch (local) {
                case 0: return 2 * (i * nr + j);
                case 1: return 2 * ((i + 1) * nr + j) + 1;
                case 2: return 2 * (i * nr + j + 1);
                default: return 2 * (i * nr + j) + 1;
            }
        }

        void clear() {
            for (int k = 0; k < touchedCount; k++) {
                first[touched[k]] = -1;
                second[touched[k]] = -1;
            }
            touchedCount = 0;
            count = 0;
        }

        void add(double[] seg, int at, int e0, int e1) {
            if (4 * count + 4 > pts.length) {
                pts = java.util.Arrays.copyOf(pts, 2 * pts.length);
                ends = java.util.Arrays.copyOf(ends, 2 * ends.length);
            }
            System.arraycopy(seg, at, pts, 4 * count, 4);
            ends[2 * count] = e0;
            ends[2 * count + 1] = e1;
            link(e0, count);
            link(e1, count);
            count++;
        }

        private void link(int e, int s) {
            if (first[e] < 0) {
                first[e] = s;
                if (touchedCount == touched.length) {
                    touched = java.util.Arrays.copyOf(touched, 2 * touched.length);
                }
                touched[touchedCount++] = e;
            } else {
                second[e] = s;
            }
        }

        /** The other unused segment on edge e, or -1. */
        private int next(int e, int from, boolean[] used) {
            int s = first[e] == from ? second[e] : first[e];
            return s >= 0 && !used[s] ? s : -1;
        }

        /** Writes every chain, then its mirror image below the axis. */
        void emit(LensChart.LinesBuilder out) {
            boolean[] used = new boolean[count];
            double[] line = new double[16];
            for (int s = 0; s < count; s++) {
                if (used[s]) {
                    continue;
                }
                // walk back from the segment's start edge to the chain's first segment (or once round a loop)
                int start = s;
                int enter = ends[2 * s];
                for (int p = next(enter, s, used); p >= 0 && p != s; p = next(enter, start, used)) {
                    enter = ends[2 * p] == enter ? ends[2 * p + 1] : ends[2 * p];
                    start = p;
                }
                // the chain runs from start, entering through edge 'enter'
                int n = 0;
                int cur = start;
                int in = enter;
                boolean firstSeg = true;
                while (cur >= 0) {
                    boolean forward = ends[2 * cur] == in;
                    int k = 4 * cur;
                    if (n + 4 > line.length) {
                        line = java.util.Arrays.copyOf(line, 2 * line.length);
                    }
                    if (firstSeg) {
                        line[n++] = forward ? pts[k] : pts[k + 2];
                        line[n++] = forward ? pts[k + 1] : pts[k + 3];
                        firstSeg = false;
                    }
                    line[n++] = forward ? pts[k + 2] : pts[k];
                    line[n++] = forward ? pts[k + 3] : pts[k + 1];
                    used[cur] = true;
                    in = forward ? ends[2 * cur + 1] : ends[2 * cur];
                    int nx = first[in] == cur ? second[in] : first[in];
                    cur = nx >= 0 && !used[nx] ? nx : -1;
                }
                for (double sign : new double[] {1, -1}) {
                    for (int q = 0; q < n; q += 2) {
                        out.add(line[q], sign * line[q + 1]);
                    }
                    out.breakLine();
                }
            }
        }
    }

    /**
     * Segments of one cell with corners a (z0, r0), b (z1, r0), c (z1, r1), d (z0, r1); returns the number of
     * segments (0, 1 or 2) written as z, r, z, r into out.
     */
    static int cell(double a, double b, double c, double d, double level, double z0, double z1, double r0, double r1,
            double[] out) {
        return cell(a, b, c, d, level, z0, z1, r0, r1, out, new int[4]);
    }

    /**
     * As {@link #cell(double, double, double, double, double, double, double, double, double, double[])}, also
     * writing the cell edge of each segment end into edges (0 bottom, 1 right, 2 top, 3 left), two per segment.
     */
    static int cell(double a, double b, double c, double d, double level, double z0, double z1, double r0, double r1,
            double[] out, int[] edges) {
        int code = (a > level ? 1 : 0) | (b > level ? 2 : 0) | (c > level ? 4 : 0) | (d > level ? 8 : 0);
        if (code == 0 || code == 15) {
            return 0;
        }
        // edge points: bottom (a-b), right (b-c), top (d-c), left (a-d)
        double bz = z0 + (z1 - z0) * frac(a, b, level), br = r0;
        double rz = z1, rr = r0 + (r1 - r0) * frac(b, c, level);
        double tz = z0 + (z1 - z0) * frac(d, c, level), tr = r1;
        double lz = z0, lr = r0 + (r1 - r0) * frac(a, d, level);
        switch (code) {
            case 1: case 14: return put(out, edges, 0, lz, lr, 3, bz, br, 0);
            case 2: case 13: return put(out, edges, 0, bz, br, 0, rz, rr, 1);
            case 3: case 12: return put(out, edges, 0, lz, lr, 3, rz, rr, 1);
            case 4: case 11: return put(out, edges, 0, rz, rr, 1, tz, tr, 2);
            case 6: case 9: return put(out, edges, 0, bz, br, 0, tz, tr, 2);
            case 7: case 8: return put(out, edges, 0, lz, lr, 3, tz, tr, 2);
            case 5: case 10: {
                boolean centreHigh = (a + b + c + d) / 4 > level;
                boolean aHigh = code == 5;
                if (centreHigh == aHigh) {
                    put(out, edges, 0, lz, lr, 3, tz, tr, 2);
                    return 1 + put(out, edges, 1, bz, br, 0, rz, rr, 1);
                }
                put(out, edges, 0, lz, lr, 3, bz, br, 0);
                return 1 + put(out, edges, 1, rz, rr, 1, tz, tr, 2);
            }
            default: return 0;
        }
    }

    private static double frac(double p, double q, double level) {
        return (level - p) / (q - p);
    }

    /** Writes segment number k (z0, r0 on edge e0 to z1, r1 on edge e1). */
    private static int put(double[] out, int[] edges, int k, double z0, double r0, int e0, double z1, double r1,
            int e1) {
        int at = 4 * k;
        out[at] = z0;
        out[at + 1] = r0;
        out[at + 2] = z1;
        out[at + 3] = r1;
        edges[2 * k] = e0;
        edges[2 * k + 1] = e1;
        return 1;
    }
}
