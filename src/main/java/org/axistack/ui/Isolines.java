package org.axistack.ui;

import java.util.ArrayList;
import java.util.List;

import org.axistack.io.Units;
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
     * Line pieces of every level through the grid values v[iz][ir] on the grid's nodes, in mm, drawn above the
     * axis and mirrored below it.
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
        double[] seg = new double[8];
        for (double level : levels) {
            for (int i = 0; i < nz - 1; i++) {
                for (int j = 0; j < nr - 1; j++) {
                    int n = cell(v[i][j], v[i + 1][j], v[i + 1][j + 1], v[i][j + 1], level, zs[i], zs[i + 1], rs[j],
                            rs[j + 1], seg);
                    for (int s = 0; s < n; s++) {
                        int k = 4 * s;
                        out.add(seg[k], seg[k + 1]).add(seg[k + 2], seg[k + 3]).breakLine();
                        out.add(seg[k], -seg[k + 1]).add(seg[k + 2], -seg[k + 3]).breakLine();
                    }
                }
            }
        }
        return out.build();
    }

    /**
     * Segments of one cell with corners a (z0, r0), b (z1, r0), c (z1, r1), d (z0, r1); returns the number of
     * segments (0, 1 or 2) written as z, r, z, r into out.
     */
    static int cell(double a, double b, double c, double d, double level, double z0, double z1, double r0, double r1,
            double[] out) {
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
            case 1: case 14: return put(out, 0, lz, lr, bz, br);
            case 2: case 13: return put(out, 0, bz, br, rz, rr);
            case 3: case 12: return put(out, 0, lz, lr, rz, rr);
            case 4: case 11: return put(out, 0, rz, rr, tz, tr);
            case 6: case 9: return put(out, 0, bz, br, tz, tr);
            case 7: case 8: return put(out, 0, lz, lr, tz, tr);
            case 5: case 10: {
                boolean centreHigh = (a + b + c + d) / 4 > level;
                boolean aHigh = code == 5;
                if (centreHigh == aHigh) {
                    put(out, 0, lz, lr, tz, tr);
                    return 1 + put(out, 4, bz, br, rz, rr);
                }
                put(out, 0, lz, lr, bz, br);
                return 1 + put(out, 4, rz, rr, tz, tr);
            }
            default: return 0;
        }
    }

    private static double frac(double p, double q, double level) {
        return (level - p) / (q - p);
    }

    private static int put(double[] out, int at, double z0, double r0, double z1, double r1) {
        out[at] = z0;
        out[at + 1] = r0;
        out[at + 2] = z1;
        out[at + 3] = r1;
        return 1;
    }
}
