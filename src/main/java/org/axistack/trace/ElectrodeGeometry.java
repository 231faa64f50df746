package org.axistack.trace;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

import org.axistack.model.Contour;
import org.axistack.model.Electrode;
import org.axistack.model.Outlines;
import org.axistack.model.Segment;
import org.axistack.model.Stack;
import org.axistack.model.ZR;

/**
 * The electrode surfaces as seen by a ray: meridian outlines as polylines in the (z, r) half-plane,
 * with crossing tests (segment-segment intersection in the plane, Cormen et al., "Introduction to
 * Algorithms", section 33.1) and a point-in-solid test (even-odd crossing rule, the classical
 * point-in-polygon test). Circular arcs are replaced by inscribed polylines whose sagitta is at most
 * {@link #ARC_SAGITTA_FRACTION} of the arc radius; that is the stated error of hit positions on arcs.
 * Also fixes the traced region: a ray that leaves it is stopped. Immutable and thread-safe.
 */
public final class ElectrodeGeometry {

    /** Largest sagitta of the polyline that replaces an arc, as a fraction of the arc radius. */
    public static final double ARC_SAGITTA_FRACTION = 1e-5;

    private final List<Piece> pieces;
    private final List<Body> bodies;
    private final List<SolidOutline> solids;
    private final double regionZMin_m;
    private final double regionZMax_m;
    private final double regionR_m;
    private final double stackZMin_m;
    private final double stackZMax_m;
    private final double scale_m;

    /** One straight piece of an electrode surface in the meridian plane. */
    private record Piece(String electrode, double z0, double r0, double z1, double r1) {
    }

    /** The pieces of one electrode with their bounding box, to skip far electrodes quickly. */
    private record Body(double zMin, double zMax, double rMin, double rMax, List<Piece> pieces) {
    }

    /** A polygon bounding a solid electrode (closed outline, or open outline closed along the axis). */
    private record SolidOutline(String electrode, double[][] ring) {
    }

    /**
     * A ray's crossing of an electrode surface.
     *
     * @param electrode name of the electrode hit
     * @param fraction  where along the tested chord, 0..1
     * @param z_m       axial position of the hit, m
     * @param r_m       radius of the hit, m
     */
    public record Crossing(String electrode, double fraction, double z_m, double r_m) {
    }

    /**
     * Geometry of a stack with the default region: the stack's z extent widened on both sides by its
     * length, and radii up to twice the largest electrode radius.
     */
    public static ElectrodeGeometry of(Stack stack) {
        double zMin = stack.minZ_m(), zMax = stack.maxZ_m();
        double len = zMax - zMin;
        double rMax = stack.electrodes().stream().mapToDouble(e -> e.contour().maxR_m()).max().orElseThrow();
        double pad = Math.max(len, rMax);
        return new ElectrodeGeometry(stack.electrodes(), zMin - pad, zMax + pad, 2 * rMax);
    }

    /**
     * @param electrodes   the conductors
     * @param regionZMin_m left end of the traced region, m
     * @param regionZMax_m right end of the traced region, m
     * @param regionR_m    radius of the traced region, m
     */
    public ElectrodeGeometry(List<Electrode> electrodes, double regionZMin_m, double regionZMax_m, double regionR_m) {
        if (!(regionZMax_m > regionZMin_m) || !(regionR_m > 0) || !Double.isFinite(regionZMax_m - regionZMin_m)
                || !Double.isFinite(regionR_m)) {
            throw new IllegalArgumentException("the traced region needs z_max > z_min and a positive radius");
        }
        List<Piece> ps = new ArrayList<>();
        List<Body> bs = new ArrayList<>();
        List<SolidOutline> ss = new ArrayList<>();
        double zlo = Double.POSITIVE_INFINITY, zhi = Double.NEGATIVE_INFINITY;
        for (Electrode e : electrodes) {
            Contour c = e.contour();
            List<ZR> pts = polyline(c);
            List<Piece> own = new ArrayList<>();
            for (int i = 0; i + 1 < pts.size(); i++) {
                ZR a = pts.get(i), b = pts.get(i + 1);
                own.add(new Piece(e.name(), a.z_m(), a.r_m(), b.z_m(), b.r_m()));
            }
            ps.addAll(own);
            bs.add(body(own));
            if (!c.isSheet()) {
                ss.add(new SolidOutline(e.name(), Outlines.solidRing(c, Outlines.vertices(c, ElectrodeGeometry::chords))));
            }
            zlo = Math.min(zlo, c.minZ_m());
            zhi = Math.max(zhi, c.maxZ_m());
        }
        this.pieces = List.copyOf(ps);
        this.bodies = List.copyOf(bs);
        this.solids = List.copyOf(ss);
        this.regionZMin_m = regionZMin_m;
        this.regionZMax_m = regionZMax_m;
        this.regionR_m = regionR_m;
        this.stackZMin_m = electrodes.isEmpty() ? regionZMin_m : zlo;
        this.stackZMax_m = electrodes.isEmpty() ? regionZMax_m : zhi;
        this.scale_m = Math.max(regionZMax_m - regionZMin_m, regionR_m);
    }

    private static Body body(List<Piece> own) {
        double z0 = Double.POSITIVE_INFINITY, z1 = Double.NEGATIVE_INFINITY;
        double r0 = Double.POSITIVE_INFINITY, r1 = Double.NEGATIVE_INFINITY;
        for (Piece p : own) {
            z0 = Math.min(z0, Math.min(p.z0, p.z1));
            z1 = Math.max(z1, Math.max(p.z0, p.z1));
            r0 = Math.min(r0, Math.min(p.r0, p.r1));
            r1 = Math.max(r1, Math.max(p.r0, p.r1));
        }
        return new Body(z0, z1, r0, r1, List.copyOf(own));
    }

    /** Vertices of a contour, arcs subdivided; closed contours repeat the first point at the end. */
    private static List<ZR> polyline(Contour c) {
        List<ZR> pts = new ArrayList<>(Outlines.vertices(c, ElectrodeGeometry::chords));
        if (!c.closed() && !c.isSheet()) {
            // open outline with both ends on the axis: close it along the axis
            pts.add(pts.get(0));
        }
        return pts;
    }

    /** Chords for an arc: enough that each chord's sagitta stays below ARC_SAGITTA_FRACTION of the radius. */
    private static int chords(Segment.Arc arc) {
        double sweep = arc.length_m() / arc.radius_m();
        // sagitta of a chord spanning angle d: R (1 - cos(d/2)) ~ R d^2 / 8
        double d = Math.sqrt(8 * ARC_SAGITTA_FRACTION);
        return (int) Math.ceil(sweep / d);
    }

    public double regionZMin_m() {
        return regionZMin_m;
    }

    public double regionZMax_m() {
        return regionZMax_m;
    }

    public double regionR_m() {
        return regionR_m;
    }

    public double stackZMin_m() {
        return stackZMin_m;
    }

    public double stackZMax_m() {
        return stackZMax_m;
    }

    /** Typical length of the region, m (for tolerances). */
    public double scale_m() {
        return scale_m;
    }

    /** True when (z, r) lies inside the traced region. */
    public boolean inRegion(double z_m, double r_m) {
        return z_m >= regionZMin_m && z_m <= regionZMax_m && r_m <= regionR_m;
    }

    /** The electrode whose solid body contains (z, r), if any (sheets have no inside). */
    public Optional<String> insideElectrode(double z_m, double r_m) {
        for (SolidOutline s : solids) {
            if (contains(s, z_m, r_m)) {
                return Optional.of(s.electrode());
            }
        }
        return Optional.empty();
    }

    /** The electrode whose surface lies within tol of (z, r), if any. */
    public Optional<String> onSurface(double z_m, double r_m, double tol_m) {
        for (Piece p : pieces) {
            if (distance(p, z_m, r_m) <= tol_m) {
                return Optional.of(p.electrode());
            }
        }
        return Optional.empty();
    }

    /** Distance from (z, r) to the nearest electrode surface, m. */
    public double distanceToSurface_m(double z_m, double r_m) {
        double d = Double.POSITIVE_INFINITY;
        for (Piece p : pieces) {
            d = Math.min(d, distance(p, z_m, r_m));
        }
        return d;
    }

    private static double distance(Piece p, double z, double r) {
        double dz = p.z1 - p.z0, dr = p.r1 - p.r0;
        double len2 = dz * dz + dr * dr;
        double t = ((z - p.z0) * dz + (r - p.r0) * dr) / len2;
        t = Math.max(0, Math.min(1, t));
        return Math.hypot(z - p.z0 - t * dz, r - p.r0 - t * dr);
    }

    private static boolean contains(SolidOutline s, double z, double r) {
        return Outlines.contains(s.ring(), z, r);
    }

    /**
     * The first electrode surface crossed by the chord from (za, ra) to (zb, rb) in the meridian
     * plane, if any.
     */
    public Optional<Crossing> firstCrossing(double za, double ra, double zb, double rb) {
        double bestT = Double.POSITIVE_INFINITY;
        Piece best = null;
        double czMin = Math.min(za, zb), czMax = Math.max(za, zb), crMin = Math.min(ra, rb), crMax = Math.max(ra, rb);
        double ez = zb - za, er = rb - ra;
        for (Body b : bodies) {
            if (b.zMax < czMin || b.zMin > czMax || b.rMax < crMin || b.rMin > crMax) {
                continue;
            }
            for (Piece p : b.pieces) {
                if (Math.max(p.z0, p.z1) < czMin || Math.min(p.z0, p.z1) > czMax || Math.max(p.r0, p.r1) < crMin
                        || Math.min(p.r0, p.r1) > crMax) {
                    continue;
                }
                double fz = p.z1 - p.z0, fr = p.r1 - p.r0;
                double den = ez * fr - er * fz;
                if (den == 0) {
                    continue; // parallel: a grazing chord touches only at its ends, found by the neighbours
                }
                double gz = p.z0 - za, gr = p.r0 - ra;
                double t = (gz * fr - gr * fz) / den;
                double s = (gz * er - gr * ez) / den;
                if (t >= 0 && t <= 1 && s >= 0 && s <= 1 && t < bestT) {
                    bestT = t;
                    best = p;
                }
            }
        }
        if (best == null) {
            return Optional.empty();
        }
        return Optional.of(new Crossing(best.electrode(), bestT, za + bestT * ez, ra + bestT * er));
    }

    /**
     * Signed side of (z, r) relative to the line through the surface piece nearest the given hit
     * point; used to refine a hit along the curved path. Positive on the side where the chord began.
     */
    double side(Crossing hit, double z_m, double r_m) {
        Piece p = nearestPiece(hit.z_m(), hit.r_m());
        double fz = p.z1 - p.z0, fr = p.r1 - p.r0;
        return (fz * (r_m - p.r0) - fr * (z_m - p.z0)) / Math.hypot(fz, fr);
    }

    private Piece nearestPiece(double z, double r) {
        Piece best = null;
        double d = Double.POSITIVE_INFINITY;
        for (Piece p : pieces) {
            double x = distance(p, z, r);
            if (x < d) {
                d = x;
                best = p;
            }
        }
        return best;
    }

    /** Human-readable description of the region, mm. */
    public String describeRegion() {
        return "z from " + Fmt.mm(regionZMin_m) + " to " + Fmt.mm(regionZMax_m) + ", r up to " + Fmt.mm(regionR_m);
    }
}
