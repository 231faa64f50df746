package org.axistack.model;

import java.util.List;

/**
 * A conductor of the stack held at a fixed bias. Every shape reduces to a meridian {@link Contour},
 * which is all the field solver sees. Lengths in metres, bias in volts.
 */
public sealed interface Electrode permits Electrode.Tube, Electrode.Aperture, Electrode.Disk, Electrode.Ring,
        Electrode.Outline {

    String name();

    double bias_V();

    Electrode withBias_V(double bias_V);

    /** Every length multiplied by k (k &gt; 0). */
    Electrode scaled(double k);

    /** Every z shifted by dz. */
    Electrode shifted(double dz_m);

    /** Reflected z -> -z. */
    Electrode mirrored();

    /** The meridian outline the solver meshes. */
    Contour contour();

    /** Shape keyword, as written in stack files: one of {@link #SHAPES}. */
    String shape();

    /**
     * The shape keywords of stack files, one per permitted record (same order), as the reader, writer and
     * messages name them: the one list of shapes (a test ties it to the records and the reader's keys).
     */
    List<String> SHAPES = List.of("tube", "aperture", "disk", "ring", "outline");

    private static void requireName(String name) {
        if (name == null || name.isBlank()) {
            throw new IllegalArgumentException("electrode name must not be blank");
        }
    }

    private static void requireFinite(double... v) {
        for (double x : v) {
            if (!Double.isFinite(x)) {
                throw new IllegalArgumentException("non-finite electrode value " + x);
            }
        }
    }

    /**
     * An edge radius must be 0 or positive, needs a solid section (thickness &gt; 0) and may be at most half of
     * the section's thickness and half of its other side, so that neighbouring rounded corners do not overlap.
     */
    private static void requireEdgeRadius(String name, double edgeRadius_m, double thickness_m, double otherSide_m) {
        if (edgeRadius_m < 0) {
            throw new IllegalArgumentException("'" + name + "': edge radius must not be negative");
        }
        if (edgeRadius_m > 0 && (thickness_m == 0 || edgeRadius_m > 0.5 * thickness_m * (1 + 1e-12)
                || edgeRadius_m > 0.5 * otherSide_m * (1 + 1e-12))) {
            throw new IllegalArgumentException("'" + name + "': edge radius " + edgeRadius_m
                    + " m needs a solid section at least twice as thick and twice as wide");
        }
    }

    /**
     * Hollow cylinder of inner radius radius_m from zStart_m to zEnd_m; wall_m = 0 is a thin sheet. With
     * edgeRadius_m &gt; 0 every corner of the wall's rectangular section is a tangent quarter circle of that
     * radius (at most half the wall and half the length; a sheet has no corners to round).
     */
    record Tube(String name, double bias_V, double radius_m, double zStart_m, double zEnd_m, double wall_m,
            double edgeRadius_m) implements Electrode {
        public Tube {
            requireName(name);
            requireFinite(bias_V, radius_m, zStart_m, zEnd_m, wall_m, edgeRadius_m);
            if (!(radius_m > 0) || !(zEnd_m > zStart_m) || wall_m < 0) {
                throw new IllegalArgumentException("tube '" + name + "': need radius > 0, z_end > z_start, wall >= 0");
            }
            requireEdgeRadius(name, edgeRadius_m, wall_m, zEnd_m - zStart_m);
        }

        /** A tube with sharp corners. */
        public Tube(String name, double bias_V, double radius_m, double zStart_m, double zEnd_m, double wall_m) {
            this(name, bias_V, radius_m, zStart_m, zEnd_m, wall_m, 0);
        }

        @Override
        public Electrode withBias_V(double b) {
            return new Tube(name, b, radius_m, zStart_m, zEnd_m, wall_m, edgeRadius_m);
        }

        @Override
        public Electrode scaled(double k) {
            return new Tube(name, bias_V, radius_m * k, zStart_m * k, zEnd_m * k, wall_m * k, edgeRadius_m * k);
        }

        @Override
        public Electrode shifted(double dz) {
            return new Tube(name, bias_V, radius_m, zStart_m + dz, zEnd_m + dz, wall_m, edgeRadius_m);
        }

        @Override
        public Electrode mirrored() {
            return new Tube(name, bias_V, radius_m, -zEnd_m, -zStart_m, wall_m, edgeRadius_m);
        }

        @Override
        public Contour contour() {
            if (wall_m == 0) {
                return Contour.polyline(false, new ZR(zStart_m, radius_m), new ZR(zEnd_m, radius_m));
            }
            double ro = radius_m + wall_m;
            return Contour.rounded(edgeRadius_m, new ZR(zStart_m, radius_m), new ZR(zEnd_m, radius_m),
                    new ZR(zEnd_m, ro), new ZR(zStart_m, ro));
        }

        @Override
        public String shape() {
            return "tube";
        }
    }

    /**
     * Flat plate with a round hole, mid-plane at z_m; thickness_m = 0 is a thin sheet. With edgeRadius_m &gt; 0
     * every corner of the plate's section is a tangent quarter circle of that radius (at most half the
     * thickness and half the plate's radial width).
     */
    record Aperture(String name, double bias_V, double z_m, double holeRadius_m, double outerRadius_m,
            double thickness_m, double edgeRadius_m) implements Electrode {
        public Aperture {
            requireName(name);
            requireFinite(bias_V, z_m, holeRadius_m, outerRadius_m, thickness_m, edgeRadius_m);
            if (!(holeRadius_m > 0) || !(outerRadius_m > holeRadius_m) || thickness_m < 0) {
                throw new IllegalArgumentException(
                        "aperture '" + name + "': need 0 < hole radius < outer radius, thickness >= 0");
            }
            requireEdgeRadius(name, edgeRadius_m, thickness_m, outerRadius_m - holeRadius_m);
        }

        /** An aperture with sharp corners. */
        public Aperture(String name, double bias_V, double z_m, double holeRadius_m, double outerRadius_m,
                double thickness_m) {
            this(name, bias_V, z_m, holeRadius_m, outerRadius_m, thickness_m, 0);
        }

        @Override
        public Electrode withBias_V(double b) {
            return new Aperture(name, b, z_m, holeRadius_m, outerRadius_m, thickness_m, edgeRadius_m);
        }

        @Override
        public Electrode scaled(double k) {
            return new Aperture(name, bias_V, z_m * k, holeRadius_m * k, outerRadius_m * k, thickness_m * k,
                    edgeRadius_m * k);
        }

        @Override
        public Electrode shifted(double dz) {
            return new Aperture(name, bias_V, z_m + dz, holeRadius_m, outerRadius_m, thickness_m, edgeRadius_m);
        }

        @Override
        public Electrode mirrored() {
            return new Aperture(name, bias_V, -z_m, holeRadius_m, outerRadius_m, thickness_m, edgeRadius_m);
        }

        @Override
        public Contour contour() {
            if (thickness_m == 0) {
                return Contour.polyline(false, new ZR(z_m, holeRadius_m), new ZR(z_m, outerRadius_m));
            }
            double h = thickness_m / 2;
            return Contour.rounded(edgeRadius_m, new ZR(z_m - h, holeRadius_m), new ZR(z_m + h, holeRadius_m),
                    new ZR(z_m + h, outerRadius_m), new ZR(z_m - h, outerRadius_m));
        }

        @Override
        public String shape() {
            return "aperture";
        }
    }

    /** Solid plate without a hole, mid-plane at z_m; thickness_m = 0 is a thin sheet. */
    record Disk(String name, double bias_V, double z_m, double radius_m, double thickness_m) implements Electrode {
        public Disk {
            requireName(name);
            requireFinite(bias_V, z_m, radius_m, thickness_m);
            if (!(radius_m > 0) || thickness_m < 0) {
                throw new IllegalArgumentException("disk '" + name + "': need radius > 0, thickness >= 0");
            }
        }

        @Override
        public Electrode withBias_V(double b) {
            return new Disk(name, b, z_m, radius_m, thickness_m);
        }

        @Override
        public Electrode scaled(double k) {
            return new Disk(name, bias_V, z_m * k, radius_m * k, thickness_m * k);
        }

        @Override
        public Electrode shifted(double dz) {
            return new Disk(name, bias_V, z_m + dz, radius_m, thickness_m);
        }

        @Override
        public Electrode mirrored() {
            return new Disk(name, bias_V, -z_m, radius_m, thickness_m);
        }

        @Override
        public Contour contour() {
            if (thickness_m == 0) {
                return Contour.polyline(false, new ZR(z_m, 0), new ZR(z_m, radius_m));
            }
            double h = thickness_m / 2;
            return Contour.polyline(false, new ZR(z_m - h, 0), new ZR(z_m - h, radius_m), new ZR(z_m + h, radius_m),
                    new ZR(z_m + h, 0));
        }

        @Override
        public String shape() {
            return "disk";
        }
    }

    /** Thin wire loop (a torus): loop radius radius_m, wire radius wireRadius_m, at z_m. */
    record Ring(String name, double bias_V, double z_m, double radius_m, double wireRadius_m) implements Electrode {
        public Ring {
            requireName(name);
            requireFinite(bias_V, z_m, radius_m, wireRadius_m);
            if (!(wireRadius_m > 0) || !(radius_m > wireRadius_m)) {
                throw new IllegalArgumentException("ring '" + name + "': need 0 < wire radius < ring radius");
            }
        }

        @Override
        public Electrode withBias_V(double b) {
            return new Ring(name, b, z_m, radius_m, wireRadius_m);
        }

        @Override
        public Electrode scaled(double k) {
            return new Ring(name, bias_V, z_m * k, radius_m * k, wireRadius_m * k);
        }

        @Override
        public Electrode shifted(double dz) {
            return new Ring(name, bias_V, z_m + dz, radius_m, wireRadius_m);
        }

        @Override
        public Electrode mirrored() {
            return new Ring(name, bias_V, -z_m, radius_m, wireRadius_m);
        }

        @Override
        public Contour contour() {
            double w = wireRadius_m;
            ZR left = new ZR(z_m - w, radius_m), right = new ZR(z_m + w, radius_m);
            ZR top = new ZR(z_m, radius_m + w), bottom = new ZR(z_m, radius_m - w);
            return new Contour(List.of(new Segment.Arc(left, bottom, right), new Segment.Arc(right, top, left)), true);
        }

        @Override
        public String shape() {
            return "ring";
        }
    }

    /** Any meridian outline made of straight and circular-arc segments. */
    record Outline(String name, double bias_V, Contour outline) implements Electrode {
        public Outline {
            requireName(name);
            requireFinite(bias_V);
            if (outline == null) {
                throw new IllegalArgumentException("outline '" + name + "' needs points");
            }
        }

        @Override
        public Electrode withBias_V(double b) {
            return new Outline(name, b, outline);
        }

        @Override
        public Electrode scaled(double k) {
            return new Outline(name, bias_V, outline.scaled(k));
        }

        @Override
        public Electrode shifted(double dz) {
            return new Outline(name, bias_V, outline.shifted(dz));
        }

        @Override
        public Electrode mirrored() {
            return new Outline(name, bias_V, outline.mirrored());
        }

        @Override
        public Contour contour() {
            return outline;
        }

        @Override
        public String shape() {
            return "outline";
        }
    }
}
