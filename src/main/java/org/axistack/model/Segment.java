package org.axistack.model;

/**
 * One piece of an electrode's meridian outline, parametrised by t in [0, 1]: a straight line or a
 * circular arc. Lengths in metres.
 */
public sealed interface Segment permits Segment.Line, Segment.Arc {

    ZR start();

    ZR end();

    /** Point at parameter t in [0, 1]. */
    ZR at(double t);

    /** d(z, r)/dt at t, metres per unit parameter; its length is the arc-length density (constant). */
    double[] derivative(double t);

    double length_m();

    /** Parameter t in [0, 1] of the segment point nearest to (z, r). */
    double closestParameter(double z_m, double r_m);

    Segment scaled(double k);

    Segment shifted(double dz_m);

    /** Reflection z -> -z (orientation kept from start to end). */
    Segment mirrored();

    /** A straight segment from start to end. */
    record Line(ZR start, ZR end) implements Segment {
        public Line {
            if (start.distanceTo(end) == 0) {
                throw new IllegalArgumentException("zero-length segment at " + start);
            }
        }

        @Override
        public ZR at(double t) {
            return new ZR(start.z_m() + t * (end.z_m() - start.z_m()), start.r_m() + t * (end.r_m() - start.r_m()));
        }

        @Override
        public double[] derivative(double t) {
            return new double[] {end.z_m() - start.z_m(), end.r_m() - start.r_m()};
        }

        @Override
        public double length_m() {
            return start.distanceTo(end);
        }

        @Override
        public double closestParameter(double z_m, double r_m) {
            double dz = end.z_m() - start.z_m();
            double dr = end.r_m() - start.r_m();
            double t = ((z_m - start.z_m()) * dz + (r_m - start.r_m()) * dr) / (dz * dz + dr * dr);
            return Math.max(0, Math.min(1, t));
        }

        @Override
        public Segment scaled(double k) {
            return new Line(start.scaled(k), end.scaled(k));
        }

        @Override
        public Segment shifted(double dz_m) {
            return new Line(start.shifted(dz_m), end.shifted(dz_m));
        }

        @Override
        public Segment mirrored() {
            return new Line(start.mirrored(), end.mirrored());
        }
    }

    /**
     * A circular arc from start through via to end (three distinct, non-collinear points). Immutable value
     * class (not a record, so that the centre and angles are computed once).
     */
    final class Arc implements Segment {
        private final ZR start;
        private final ZR via;
        private final ZR end;
        private final double zc;
        private final double rc;
        private final double radius;
        private final double angle0;
        private final double sweep;

        public Arc(ZR start, ZR via, ZR end) {
            double cross = (via.z_m() - start.z_m()) * (end.r_m() - start.r_m())
                    - (via.r_m() - start.r_m()) * (end.z_m() - start.z_m());
            double scale = Math.max(start.distanceTo(via), via.distanceTo(end));
            if (!(Math.abs(cross) > 1e-12 * scale * scale)) {
                throw new IllegalArgumentException("arc points are collinear or coincide: " + start + ", " + via + ", " + end);
            }
            this.start = start;
            this.via = via;
            this.end = end;
            double ax = start.z_m(), ay = start.r_m(), bx = via.z_m(), by = via.r_m(), cx = end.z_m(), cy = end.r_m();
            double d = 2 * (ax * (by - cy) + bx * (cy - ay) + cx * (ay - by));
            double a2 = ax * ax + ay * ay, b2 = bx * bx + by * by, c2 = cx * cx + cy * cy;
            zc = (a2 * (by - cy) + b2 * (cy - ay) + c2 * (ay - by)) / d;
            rc = (a2 * (cx - bx) + b2 * (ax - cx) + c2 * (bx - ax)) / d;
            radius = Math.hypot(ax - zc, ay - rc);
            double t0 = Math.atan2(ay - rc, ax - zc);
            double t1 = Math.atan2(by - rc, bx - zc);
            double t2 = Math.atan2(cy - rc, cx - zc);
            double sweepToEnd = normalise(t2 - t0);
            double sweepToVia = normalise(t1 - t0);
            angle0 = t0;
            sweep = sweepToVia <= sweepToEnd ? sweepToEnd : sweepToEnd - 2 * Math.PI;
        }

        private static double normalise(double a) {
            double x = a % (2 * Math.PI);
            return x < 0 ? x + 2 * Math.PI : x;
        }

        @Override
        public ZR start() {
            return start;
        }

        public ZR via() {
            return via;
        }

        @Override
        public ZR end() {
            return end;
        }

        /** Centre of the circle through the three points. */
        public ZR centre() {
            return new ZR(zc, rc);
        }

        public double radius_m() {
            return radius;
        }

        /** Signed sweep angle from start to end through via, radians. */
        public double sweep_rad() {
            return sweep;
        }

        @Override
        public ZR at(double t) {
            if (t == 0) {
                return start;
            }
            if (t == 1) {
                return end;
            }
            double th = angle0 + t * sweep;
            return new ZR(zc + radius * Math.cos(th), rc + radius * Math.sin(th));
        }

        @Override
        public double[] derivative(double t) {
            double th = angle0 + t * sweep;
            return new double[] {-radius * Math.sin(th) * sweep, radius * Math.cos(th) * sweep};
        }

        @Override
        public double length_m() {
            return radius * Math.abs(sweep);
        }

        @Override
        public double closestParameter(double z_m, double r_m) {
            if (z_m == zc && r_m == rc) {
                return 0;
            }
            double th = Math.atan2(r_m - rc, z_m - zc);
            double along = sweep > 0 ? normalise(th - angle0) : normalise(angle0 - th);
            double t = along / Math.abs(sweep);
            if (t <= 1) {
                return t;
            }
            // beyond the arc: the nearer end
            return at(0).distanceTo(new ZR(z_m, r_m)) <= at(1).distanceTo(new ZR(z_m, r_m)) ? 0 : 1;
        }

        @Override
        public Segment scaled(double k) {
            return new Arc(start.scaled(k), via.scaled(k), end.scaled(k));
        }

        @Override
        public Segment shifted(double dz_m) {
            return new Arc(start.shifted(dz_m), via.shifted(dz_m), end.shifted(dz_m));
        }

        @Override
        public Segment mirrored() {
            return new Arc(start.mirrored(), via.mirrored(), end.mirrored());
        }

        @Override
        public boolean equals(Object o) {
            return o instanceof Arc a && a.start.equals(start) && a.via.equals(via) && a.end.equals(end);
        }

        @Override
        public int hashCode() {
            return java.util.Objects.hash(start, via, end);
        }

        @Override
        public String toString() {
            return "Arc[start=" + start + ", via=" + via + ", end=" + end + "]";
        }
    }
}
