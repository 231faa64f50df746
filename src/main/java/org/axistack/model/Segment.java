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

    /** A circular arc from start through via to end (three distinct, non-collinear points). */
    record Arc(ZR start, ZR via, ZR end) implements Segment {
        public Arc {
            double cross = (via.z_m() - start.z_m()) * (end.r_m() - start.r_m())
                    - (via.r_m() - start.r_m()) * (end.z_m() - start.z_m());
            double scale = Math.max(start.distanceTo(via), via.distanceTo(end));
            if (!(Math.abs(cross) > 1e-12 * scale * scale)) {
                throw new IllegalArgumentException("arc points are collinear or coincide: " + start + ", " + via + ", " + end);
            }
        }

        /** Centre of the circle through the three points. */
        public ZR centre() {
            double ax = start.z_m(), ay = start.r_m(), bx = via.z_m(), by = via.r_m(), cx = end.z_m(), cy = end.r_m();
            double d = 2 * (ax * (by - cy) + bx * (cy - ay) + cx * (ay - by));
            double a2 = ax * ax + ay * ay, b2 = bx * bx + by * by, c2 = cx * cx + cy * cy;
            double ux = (a2 * (by - cy) + b2 * (cy - ay) + c2 * (ay - by)) / d;
            double uy = (a2 * (cx - bx) + b2 * (ax - cx) + c2 * (bx - ax)) / d;
            return new ZR(ux, uy);
        }

        public double radius_m() {
            return centre().distanceTo(start);
        }

        private double angle(ZR p, ZR c) {
            return Math.atan2(p.r_m() - c.r_m(), p.z_m() - c.z_m());
        }

        /** Start angle and signed sweep (radians) of the arc, going through via. */
        private double[] angles() {
            ZR c = centre();
            double a0 = angle(start, c), a1 = angle(via, c), a2 = angle(end, c);
            double sweepToEnd = normalise(a2 - a0);
            double sweepToVia = normalise(a1 - a0);
            double sweep = sweepToVia <= sweepToEnd ? sweepToEnd : sweepToEnd - 2 * Math.PI;
            return new double[] {a0, sweep};
        }

        private static double normalise(double a) {
            double x = a % (2 * Math.PI);
            return x < 0 ? x + 2 * Math.PI : x;
        }

        @Override
        public ZR at(double t) {
            if (t == 0) {
                return start;
            }
            if (t == 1) {
                return end;
            }
            ZR c = centre();
            double[] a = angles();
            double rad = radius_m();
            double th = a[0] + t * a[1];
            return new ZR(c.z_m() + rad * Math.cos(th), c.r_m() + rad * Math.sin(th));
        }

        @Override
        public double[] derivative(double t) {
            double[] a = angles();
            double rad = radius_m();
            double th = a[0] + t * a[1];
            return new double[] {-rad * Math.sin(th) * a[1], rad * Math.cos(th) * a[1]};
        }

        @Override
        public double length_m() {
            return radius_m() * Math.abs(angles()[1]);
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
    }
}
