package org.axistack.model;

import java.util.ArrayList;
import java.util.List;

/**
 * An electrode's meridian outline: a chain of segments in the r &gt;= 0 half-plane. A closed contour
 * bounds a solid conductor; an open contour whose ends are off the axis is a thin sheet (zero
 * thickness, charge on both faces); an open contour whose ends lie on the axis bounds a solid of
 * revolution (for example a thick disk).
 *
 * @param segments the chain, each segment starting where the previous one ends
 * @param closed   whether the last segment ends where the first starts
 */
public record Contour(List<Segment> segments, boolean closed) {

    public Contour {
        segments = List.copyOf(segments);
        if (segments.isEmpty()) {
            throw new IllegalArgumentException("a contour needs at least one segment");
        }
        for (int i = 1; i < segments.size(); i++) {
            if (segments.get(i - 1).end().distanceTo(segments.get(i).start()) > 1e-12 * scale(segments)) {
                throw new IllegalArgumentException("contour segments " + (i - 1) + " and " + i + " do not join");
            }
        }
    }

    private static double scale(List<Segment> segs) {
        double s = 0;
        for (Segment g : segs) {
            s += g.length_m();
        }
        return Math.max(s, Double.MIN_NORMAL);
    }

    /** Polyline through the given points, straight segments. */
    public static Contour polyline(boolean closed, ZR... points) {
        List<Segment> segs = new ArrayList<>();
        for (int i = 0; i + 1 < points.length; i++) {
            segs.add(new Segment.Line(points[i], points[i + 1]));
        }
        if (closed) {
            segs.add(new Segment.Line(points[points.length - 1], points[0]));
        }
        return new Contour(segs, closed);
    }

    public double length_m() {
        return scale(segments);
    }

    /** True when this open contour is a zero-thickness sheet (an end lies off the axis). */
    public boolean isSheet() {
        if (closed) {
            return false;
        }
        return !(onAxis(segments.get(0).start()) && onAxis(segments.get(segments.size() - 1).end()));
    }

    /** True when a point lies on the axis (r = 0 within round-off of the contour's size). */
    public boolean onAxis(ZR p) {
        return Math.abs(p.r_m()) <= 1e-12 * length_m();
    }

    public double minZ_m() {
        return bound(true, false);
    }

    public double maxZ_m() {
        return bound(true, true);
    }

    public double maxR_m() {
        return bound(false, true);
    }

    public double minR_m() {
        return bound(false, false);
    }

    private double bound(boolean z, boolean max) {
        double v = max ? Double.NEGATIVE_INFINITY : Double.POSITIVE_INFINITY;
        for (Segment s : segments) {
            for (int k = 0; k <= 32; k++) {
                ZR p = s.at(k / 32.0);
                double x = z ? p.z_m() : p.r_m();
                v = max ? Math.max(v, x) : Math.min(v, x);
            }
        }
        return v;
    }

    public Contour scaled(double k) {
        return new Contour(segments.stream().map(s -> s.scaled(k)).toList(), closed);
    }

    public Contour shifted(double dz_m) {
        return new Contour(segments.stream().map(s -> s.shifted(dz_m)).toList(), closed);
    }

    public Contour mirrored() {
        return new Contour(segments.stream().map(Segment::mirrored).toList(), closed);
    }
}
