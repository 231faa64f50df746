package org.axistack.model;

import java.util.ArrayList;
import java.util.List;
import java.util.function.ToIntFunction;

/**
 * Meridian outlines as polygons: arc flattening and the point-in-solid test, in one place for the geometry
 * check ({@link GeometryCheck}) and the tracer's electrode outlines (trace.ElectrodeGeometry). Each caller
 * chooses how finely arcs are cut (a fixed count for the checks, a sagitta bound for the tracer); the way they
 * are cut and the containment rule are the same. Containment: the even-odd ray-crossing rule (a ray toward +z;
 * e.g. J. O'Rourke, Computational Geometry in C, 2nd ed., sec. 7.4).
 */
public final class Outlines {

    private Outlines() {
    }

    /**
     * The vertices of a contour with each arc cut into {@code chordsPerArc} chords of equal parameter steps
     * (straight segments stay whole): its start, then every segment's inner points and end. A closed contour
     * repeats its first vertex at the end.
     */
    public static List<ZR> vertices(Contour c, ToIntFunction<Segment.Arc> chordsPerArc) {
        List<ZR> pts = new ArrayList<>();
        pts.add(c.segments().get(0).start());
        for (Segment s : c.segments()) {
            int n = s instanceof Segment.Arc arc ? Math.max(1, chordsPerArc.applyAsInt(arc)) : 1;
            for (int k = 1; k <= n; k++) {
                pts.add(k == n ? s.end() : s.at((double) k / n));
            }
        }
        return pts;
    }

    /**
     * The boundary of the solid a contour encloses, as a ring of (z, r) rows whose last row equals its first:
     * a closed outline as it is, an open outline (both ends on the axis) closed along the axis. Null for a thin
     * sheet, which has no inside.
     */
    public static double[][] solidRing(Contour c, List<ZR> vertices) {
        if (c.isSheet()) {
            return null;
        }
        int n = vertices.size() + (c.closed() ? 0 : 1);
        double[][] ring = new double[n][];
        for (int i = 0; i < vertices.size(); i++) {
            ring[i] = new double[] {vertices.get(i).z_m(), vertices.get(i).r_m()};
        }
        if (!c.closed()) {
            ring[n - 1] = ring[0];
        }
        return ring;
    }

    /** True when (z, r) lies inside the ring (rows (z, r), last equal to first), by the even-odd rule. */
    public static boolean contains(double[][] ring, double z, double r) {
        boolean in = false;
        for (int k = 0; k + 1 < ring.length; k++) {
            double[] p = ring[k], q = ring[k + 1];
            if ((p[1] > r) != (q[1] > r)) {
                double zCross = p[0] + (r - p[1]) * (q[0] - p[0]) / (q[1] - p[1]);
                if (z < zCross) {
                    in = !in;
                }
            }
        }
        return in;
    }
}
