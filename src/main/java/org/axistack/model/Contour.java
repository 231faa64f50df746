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

    /**
     * Closed polygon through the given points with every corner replaced by a tangent circular arc of the given
     * radius (0: sharp corners, the plain polygon). At a corner where the outline turns by phi the arc starts and
     * ends rho tan(phi/2) from the corner along the two sides; a side shorter than its two tangent lengths is
     * rejected, a side exactly as long is left out (the arcs meet).
     */
    public static Contour rounded(double radius_m, ZR... points) {
        if (!(radius_m > 0)) {
            return polyline(true, points);
        }
        int n = points.length;
        ZR[] a = new ZR[n];
        ZR[] b = new ZR[n];
        ZR[] mid = new ZR[n];
        for (int i = 0; i < n; i++) {
            ZR p = points[i];
            ZR prev = points[(i + n - 1) % n];
            ZR next = points[(i + 1) % n];
            double[] din = unit(prev, p);
            double[] dout = unit(p, next);
            double turn = Math.atan2(din[0] * dout[1] - din[1] * dout[0], din[0] * dout[0] + din[1] * dout[1]);
            double t = radius_m * Math.tan(Math.abs(turn) / 2);
            a[i] = new ZR(p.z_m() - t * din[0], p.r_m() - t * din[1]);
            b[i] = new ZR(p.z_m() + t * dout[0], p.r_m() + t * dout[1]);
            // centre on the inside of the turn, radius_m from both sides
            double s = Math.signum(turn);
            ZR c = new ZR(a[i].z_m() - s * radius_m * din[1], a[i].r_m() + s * radius_m * din[0]);
            double cp = c.distanceTo(p);
            mid[i] = new ZR(c.z_m() + radius_m * (p.z_m() - c.z_m()) / cp, c.r_m() + radius_m * (p.r_m() - c.r_m()) / cp);
        }
        List<Segment> segs = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            segs.add(new Segment.Arc(a[i], mid[i], b[i]));
            ZR next = a[(i + 1) % n];
            double side = points[i].distanceTo(points[(i + 1) % n]);
            double gap = b[i].distanceTo(next);
            double used = points[i].distanceTo(b[i]) + points[(i + 1) % n].distanceTo(next);
            if (used > side * (1 + 1e-9)) {
                throw new IllegalArgumentException("edge radius " + radius_m + " m is too large for a side of "
                        + side + " m");
            }
            if (gap > 1e-9 * side) {
                segs.add(new Segment.Line(b[i], next));
            } else {
                // the arcs meet: join them exactly at the same point
                segs.set(segs.size() - 1, new Segment.Arc(a[i], mid[i], next));
            }
        }
        // the first arc must start where the last piece ends
        Segment last = segs.get(segs.size() - 1);
        if (last.end().distanceTo(segs.get(0).start()) > 0 && last instanceof Segment.Arc arc) {
            segs.set(segs.size() - 1, new Segment.Arc(arc.start(), arc.via(), segs.get(0).start()));
        }
        return new Contour(segs, true);
    }

    private static double[] unit(ZR from, ZR to) {
        double d = from.distanceTo(to);
        return new double[] {(to.z_m() - from.z_m()) / d, (to.r_m() - from.r_m()) / d};
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
