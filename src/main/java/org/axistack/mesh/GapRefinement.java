package org.axistack.mesh;

import java.util.ArrayList;
import java.util.IdentityHashMap;
import java.util.List;
import java.util.Map;

import org.axistack.model.Segment;
import org.axistack.model.ZR;

/**
 * Gap-aware refinement: a panel that faces another electrode across a gap much narrower than itself is bisected
 * (repeatedly) while the gap changes along it. Across a narrow gap the surface charge density goes like the
 * bias difference over the local gap width (the parallel-plate limit), so it varies on the scale on which the gap
 * width varies: near the end of the other electrode's face, opposite its corner or edge, over the width of the
 * gap itself. A polynomial panel many gaps long cannot follow that, and the collocation solve then returns a
 * wrong charge with a tiny residual (a non-symmetric capacitance matrix, even positive off-diagonal terms).
 * Where the gap is narrow but even along the panel (two parallel faces) the density is even too, so nothing is
 * refined there and a long parallel overlap costs no extra panels.
 *
 * <p>Rule (our own, tuned on random near-touching stacks; common practice, no source): split a panel with a
 * linear map while it is longer than {@link #SPLIT_RATIO} times its smallest distance d_min to another
 * electrode (times the mesh's refinement factor, so that refining the mesh refines here too) and the distance
 * at some point of the panel exceeds {@link #VARIATION} d_min. Bisection toward the narrowest place halves the
 * panels level by level, which is the geometric grading used at edges; it costs about 2 log2(panel / gap)
 * panels per narrow place. Panels with a power map (at edges and corners) are left alone: their size is already
 * set by the feature size of the gap in {@link Mesher}.
 */
final class GapRefinement {

    /** A panel longer than this many times its distance to another electrode is a split candidate. */
    static final double SPLIT_RATIO = 2;
    /** ...when the distance along the panel varies by more than this factor. */
    static final double VARIATION = 1.5;
    /** Points per panel at which the distance is sampled. */
    private static final int SAMPLES = 9;
    /** Most bisections of one panel (2^-40 of a panel is far below any accepted gap). */
    private static final int MAX_DEPTH = 40;

    private GapRefinement() {
    }

    /** Outline segments of one electrode with their bounding box. */
    private record Outline(int electrode, List<Segment> segments, double zMin, double zMax, double rMin, double rMax) {
        double boxDistance(double z0, double z1, double r0, double r1) {
            double dz = Math.max(0, Math.max(zMin - z1, z0 - zMax));
            double dr = Math.max(0, Math.max(rMin - r1, r0 - rMax));
            return Math.hypot(dz, dr);
        }
    }

    /**
     * The panels with those that face another electrode across an uneven narrow gap bisected; order along each
     * segment kept.
     *
     * @param refine the mesh's refinement factor (1 on coarse meshes, smaller in proportion to the panel size)
     */
    static List<Panel> refine(List<Panel> panels, double refine) {
        List<Outline> outlines = outlines(panels);
        if (outlines.size() < 2) {
            return panels;
        }
        List<Panel> out = new ArrayList<>(panels.size());
        for (Panel p : panels) {
            split(p, outlines, refine, 0, out);
        }
        return out;
    }

    private static void split(Panel p, List<Outline> outlines, double refine, int depth, List<Panel> out) {
        if (depth < MAX_DEPTH && p.singularEnd() == 0 && needsSplit(p, outlines, refine)) {
            double mid = 0.5 * (p.t0() + p.t1());
            split(new Panel(p.electrode(), p.segment(), p.t0(), mid, 0, 1, p.sheet(), p.contour()), outlines, refine,
                    depth + 1, out);
            split(new Panel(p.electrode(), p.segment(), mid, p.t1(), 0, 1, p.sheet(), p.contour()), outlines, refine,
                    depth + 1, out);
        } else {
            out.add(p);
        }
    }

    private static boolean needsSplit(Panel p, List<Outline> outlines, double refine) {
        double length = p.length_m();
        double reach = length / (SPLIT_RATIO * refine);
        ZR[] pts = new ZR[SAMPLES];
        double z0 = Double.POSITIVE_INFINITY, z1 = Double.NEGATIVE_INFINITY;
        double r0 = Double.POSITIVE_INFINITY, r1 = Double.NEGATIVE_INFINITY;
        for (int k = 0; k < SAMPLES; k++) {
            pts[k] = p.at((double) k / (SAMPLES - 1));
            z0 = Math.min(z0, pts[k].z_m());
            z1 = Math.max(z1, pts[k].z_m());
            r0 = Math.min(r0, pts[k].r_m());
            r1 = Math.max(r1, pts[k].r_m());
        }
        for (Outline o : outlines) {
            if (o.electrode != p.electrode() && o.boxDistance(z0, z1, r0, r1) < reach && uneven(p, pts, o, reach)) {
                return true;
            }
        }
        return false;
    }

    /** Whether another electrode's outline comes within reach of the panel with a distance that varies along it. */
    private static boolean uneven(Panel p, ZR[] pts, Outline o, double reach) {
        double[] sampled = new double[SAMPLES];
        java.util.Arrays.fill(sampled, Double.POSITIVE_INFINITY);
        double dMin = Double.POSITIVE_INFINITY;
        for (Segment s : o.segments) {
            for (int k = 0; k < SAMPLES; k++) {
                sampled[k] = Math.min(sampled[k], distance(s, pts[k]));
            }
            // the other candidates for the nearest pair: the other segment's ends (nearest pair of two straight
            // pieces that do not cross) and, on arcs, the point nearest the other curve's centre
            dMin = Math.min(dMin, panelDistance(p, s.start()));
            dMin = Math.min(dMin, panelDistance(p, s.end()));
            if (s instanceof Segment.Arc arc) {
                ZR c = arc.centre();
                dMin = Math.min(dMin, distance(s, p.segment().at(clamp(p, p.segment().closestParameter(c.z_m(),
                        c.r_m())))));
            }
            if (p.segment() instanceof Segment.Arc arc) {
                ZR c = arc.centre();
                dMin = Math.min(dMin, panelDistance(p, s.at(s.closestParameter(c.z_m(), c.r_m()))));
            }
        }
        double dMax = 0;
        for (double d : sampled) {
            dMin = Math.min(dMin, d);
            dMax = Math.max(dMax, d);
        }
        return dMin > 0 && dMin < reach && dMax > VARIATION * dMin;
    }

    private static double clamp(Panel p, double t) {
        return Math.max(p.t0(), Math.min(p.t1(), t));
    }

    /** Distance from a point to a segment. */
    private static double distance(Segment s, ZR q) {
        return s.at(s.closestParameter(q.z_m(), q.r_m())).distanceTo(q);
    }

    /** Distance from a point to the piece of its segment a panel covers. */
    private static double panelDistance(Panel p, ZR q) {
        return p.segment().at(clamp(p, p.segment().closestParameter(q.z_m(), q.r_m()))).distanceTo(q);
    }

    /** Each electrode's segments (in panel order) and bounding box. */
    private static List<Outline> outlines(List<Panel> panels) {
        Map<Integer, List<Segment>> segs = new java.util.LinkedHashMap<>();
        Map<Segment, Boolean> seen = new IdentityHashMap<>();
        for (Panel p : panels) {
            if (seen.put(p.segment(), Boolean.TRUE) == null) {
                segs.computeIfAbsent(p.electrode(), e -> new ArrayList<>()).add(p.segment());
            }
        }
        List<Outline> out = new ArrayList<>();
        for (Map.Entry<Integer, List<Segment>> e : segs.entrySet()) {
            double z0 = Double.POSITIVE_INFINITY, z1 = Double.NEGATIVE_INFINITY;
            double r0 = Double.POSITIVE_INFINITY, r1 = Double.NEGATIVE_INFINITY;
            for (Segment s : e.getValue()) {
                for (int k = 0; k <= 16; k++) {
                    ZR q = s.at(k / 16.0);
                    z0 = Math.min(z0, q.z_m());
                    z1 = Math.max(z1, q.z_m());
                    r0 = Math.min(r0, q.r_m());
                    r1 = Math.max(r1, q.r_m());
                }
            }
            // arcs bulge between the sampled points by at most their sagitta: widen the box by 2 % of its size
            double pad = 0.02 * Math.max(z1 - z0, r1 - r0);
            out.add(new Outline(e.getKey(), e.getValue(), z0 - pad, z1 + pad, r0 - pad, r1 + pad));
        }
        return out;
    }
}
