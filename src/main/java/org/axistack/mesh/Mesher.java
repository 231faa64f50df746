package org.axistack.mesh;

import java.util.ArrayList;
import java.util.List;

import org.axistack.model.Contour;
import org.axistack.model.Electrode;
import org.axistack.model.MeshSettings;
import org.axistack.model.Segment;
import org.axistack.model.ZR;
import org.hipparchus.analysis.integration.gauss.GaussIntegrator;
import org.hipparchus.analysis.integration.gauss.GaussIntegratorFactory;

/**
 * Cuts electrode outlines into panels. Panel size is uniform away from singular points and halves
 * geometrically toward every free sheet edge and every corner (charge density grows there like
 * d^beta, beta = pi/theta - 1 for an exterior angle theta: -1/2 at a thin edge, -1/3 at a right-angle
 * corner; J. D. Jackson, Classical Electrodynamics, 3rd ed., sec. 2.11). The panel touching a singular
 * point gets the power map of {@link Panel}; the uniform size is chosen so that the total number of
 * nodes meets the settings' target. Panels facing another electrode across a narrow, uneven gap are then
 * bisected ({@link GapRefinement}); those few extra panels come on top of the target.
 */
public final class Mesher {

    /** Collocation nodes per panel (Gauss-Legendre order). */
    public static final int ORDER = 8;
    /** Tangent turn (radians) above which a vertex counts as a corner. */
    private static final double CORNER_TURN = 0.02;
    /** Largest angle one panel spans on a circular arc (rounded edge), radians. */
    private static final double ARC_ANGLE = Math.PI / 4;
    /**
     * Uniform panel size, as a share of the whole outline length, below which arc panels span less than
     * {@link #ARC_ANGLE}: arc panels then shrink in proportion to the uniform size, so that one refinement knob
     * refines rounded edges and the rest of the outline together.
     */
    private static final double ARC_REFERENCE_SHARE = 1.0 / 192;
    private Mesher() {
    }

    /** Meshes the outlines of the given electrodes. */
    public static BoundaryMesh mesh(List<Electrode> electrodes, MeshSettings settings) {
        List<SegPlan> plans = plans(electrodes);
        double totalLength = 0;
        for (Electrode e : electrodes) {
            totalLength += e.contour().length_m();
        }
        int levels = settings.edgeLevels();
        int targetPanels = Math.max(1, settings.targetElements() / ORDER);
        // Bisection on the uniform panel size h (panel count decreases with h).
        double lo = totalLength * 1e-7, hi = totalLength;
        for (int it = 0; it < 80; it++) {
            double mid = Math.sqrt(lo * hi);
            if (countPanels(plans, mid, levels, totalLength) > targetPanels) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return build(plans, hi, levels, totalLength);
    }

    /**
     * Meshes at a refinement scale instead of an element count (accuracy-driven meshing): every size the mesher
     * sets scales with {@code scale} together (the uniform panel size is scale / 192 of the whole outline length,
     * arc panels, the smallest panel across a gap, and above scale 1 also the cap of bore panels at their distance
     * from the axis and the graded levels toward corners, which lose one level per doubling). Scale 1 is the
     * reference mesh; 1/2 halves every panel.
     */
    public static BoundaryMesh meshAtScale(List<Electrode> electrodes, int edgeLevels, double scale) {
        if (!(scale > 0) || scale > 1024) {
            throw new IllegalArgumentException("mesh scale must be in (0, 1024], got " + scale);
        }
        List<SegPlan> plans = plans(electrodes);
        double totalLength = 0;
        for (Electrode e : electrodes) {
            totalLength += e.contour().length_m();
        }
        int levels = scale > 1 ? Math.max(1, edgeLevels - (int) Math.round(Math.log(scale) / Math.log(2))) : edgeLevels;
        return build(plans, scale * ARC_REFERENCE_SHARE * totalLength, levels, totalLength, scale);
    }

    private static BoundaryMesh build(List<SegPlan> plans, double h, int levels, double totalLength) {
        return build(plans, h, levels, totalLength, Double.NaN);
    }

    /** Builds the mesh; {@code scale} NaN: sizes set by h alone (element-count mode), else the scale mode. */
    private static BoundaryMesh build(List<SegPlan> plans, double h, int levels, double totalLength, double scale) {
        List<Panel> panels = new ArrayList<>();
        for (SegPlan p : plans) {
            cut(p, h, levels, totalLength, scale, panels);
        }
        panels = GapRefinement.refine(panels, Double.isNaN(scale) ? Math.min(1, h / (ARC_REFERENCE_SHARE * totalLength)) : scale);
        GaussIntegrator gauss = new GaussIntegratorFactory().legendre(ORDER, 0, 1);
        double[] tau = new double[ORDER];
        double[] w = new double[ORDER];
        for (int j = 0; j < ORDER; j++) {
            tau[j] = gauss.getPoint(j);
            w[j] = gauss.getWeight(j);
        }
        return new BoundaryMesh(panels, ORDER, tau, w);
    }

    /** The per-segment plans of all outlines: singular ends, their exponents, feature sizes and arc joints. */
    private static List<SegPlan> plans(List<Electrode> electrodes) {
        List<SegPlan> plans = new ArrayList<>();
        double totalLength = 0;
        for (int e = 0; e < electrodes.size(); e++) {
            Contour c = electrodes.get(e).contour();
            totalLength += c.length_m();
            plans.addAll(plan(c, e, electrodes.get(e).name()));
        }
        for (SegPlan p : plans) {
            if (p.segment.length_m() < 1e-9 * totalLength) {
                throw new IllegalArgumentException("electrode '" + p.name + "' has a segment of length "
                        + p.segment.length_m() + " m, too short to mesh (degenerate element); remove or merge it");
            }
        }
        // Local feature size at every graded end: the distance to the nearest other piece of outline that does
        // not meet there (another electrode across a gap, the far wall of a thin plate). Grading continues until
        // the smallest panel is a quarter of it, whatever the settings say.
        for (int i = 0; i < plans.size(); i++) {
            SegPlan p = plans.get(i);
            double fs = p.gradeStart ? feature(p.segment.start(), plans, i) : Double.POSITIVE_INFINITY;
            double fe = p.gradeEnd ? feature(p.segment.end(), plans, i) : Double.POSITIVE_INFINITY;
            plans.set(i, p.withFeatures(fs, fe));
        }
        return plans;
    }

    /** Per-segment plan: where the singular ends are and their exponents. */
    private record SegPlan(Segment segment, int electrode, int contour, String name, boolean sheet, boolean gradeStart,
            boolean gradeEnd, double betaStart, double betaEnd, double featureStart, double featureEnd,
            double arcStart, double arcEnd) {
        SegPlan withFeatures(double fs, double fe) {
            return new SegPlan(segment, electrode, contour, name, sheet, gradeStart, gradeEnd, betaStart, betaEnd, fs, fe,
                    arcStart, arcEnd);
        }
    }

    private static List<SegPlan> plan(Contour c, int electrode, String name) {
        List<Segment> segs = c.segments();
        int n = segs.size();
        boolean sheet = c.isSheet();
        double orientation = Math.signum(signedArea(c));
        boolean[] gradeS = new boolean[n], gradeE = new boolean[n];
        double[] betaS = new double[n], betaE = new double[n];
        // Interior vertices (and the closing vertex of closed contours).
        int vertices = c.closed() ? n : n - 1;
        for (int v = 0; v < vertices; v++) {
            Segment in = segs.get(v);
            Segment out = segs.get((v + 1) % n);
            double turn = turn(in, out);
            if (Math.abs(turn) < CORNER_TURN) {
                continue;
            }
            double theta = sheet ? Math.PI + Math.abs(turn) : Math.PI + orientation * turn;
            double beta = Math.PI / theta - 1;
            gradeE[v] = true;
            betaE[v] = beta;
            gradeS[(v + 1) % n] = true;
            betaS[(v + 1) % n] = beta;
        }
        if (!c.closed()) {
            ZR first = segs.get(0).start();
            ZR last = segs.get(n - 1).end();
            if (!c.onAxis(first)) {
                gradeS[0] = true;
                betaS[0] = -0.5;
            }
            if (!c.onAxis(last)) {
                gradeE[n - 1] = true;
                betaE[n - 1] = -0.5;
            }
        }
        // Smooth joints onto an arc (a rounded edge): the straight side is graded toward the arc, so that its
        // panels shrink to the arc's panel size where the charge varies on the scale of the arc's radius.
        double[] arcS = new double[n], arcE = new double[n];
        java.util.Arrays.fill(arcS, Double.POSITIVE_INFINITY);
        java.util.Arrays.fill(arcE, Double.POSITIVE_INFINITY);
        for (int v = 0; v < vertices; v++) {
            Segment in = segs.get(v);
            Segment out = segs.get((v + 1) % n);
            if (gradeE[v] || in instanceof Segment.Arc == out instanceof Segment.Arc) {
                continue;
            }
            if (out instanceof Segment.Arc a) {
                arcE[v] = a.radius_m();
            } else if (in instanceof Segment.Arc a) {
                arcS[(v + 1) % n] = a.radius_m();
            }
        }
        int contourId = electrode;
        List<SegPlan> out = new ArrayList<>();
        for (int k = 0; k < n; k++) {
            out.add(new SegPlan(segs.get(k), electrode, contourId, name, sheet, gradeS[k], gradeE[k], betaS[k], betaE[k],
                    Double.POSITIVE_INFINITY, Double.POSITIVE_INFINITY, arcS[k], arcE[k]));
        }
        return out;
    }

    /** Signed turn angle (radians) from the end tangent of one segment to the start tangent of the next. */
    private static double turn(Segment in, Segment out) {
        double[] a = in.derivative(1);
        double[] b = out.derivative(0);
        double cross = a[0] * b[1] - a[1] * b[0];
        double dot = a[0] * b[0] + a[1] * b[1];
        return Math.atan2(cross, dot);
    }

    /** Signed area in the (z, r) plane of the contour closed along the axis if open (positive: counter-clockwise). */
    private static double signedArea(Contour c) {
        List<ZR> pts = new ArrayList<>();
        for (Segment s : c.segments()) {
            for (int k = 0; k < 64; k++) {
                pts.add(s.at(k / 64.0));
            }
        }
        pts.add(c.segments().get(c.segments().size() - 1).end());
        double a = 0;
        for (int i = 0; i < pts.size(); i++) {
            ZR p = pts.get(i);
            ZR q = pts.get((i + 1) % pts.size());
            a += p.z_m() * q.r_m() - q.z_m() * p.r_m();
        }
        return a / 2;
    }

    /** Distance from point q to the nearest segment that neither is segment i nor touches q. */
    private static double feature(ZR q, List<SegPlan> plans, int i) {
        double best = Double.POSITIVE_INFINITY;
        for (int k = 0; k < plans.size(); k++) {
            Segment s = plans.get(k).segment;
            if (k == i || s.start().distanceTo(q) < 1e-12 || s.end().distanceTo(q) < 1e-12) {
                continue;
            }
            best = Math.min(best, s.at(s.closestParameter(q.z_m(), q.r_m())).distanceTo(q));
        }
        return best;
    }

    /**
     * Levels needed at an end: the settings' levels, more if the feature there is smaller than the panels (the
     * smallest panel a quarter of the feature, smaller in proportion to h below the reference size).
     */
    private static int levelsFor(double graded, double feature, int levels, double refine) {
        if (!(feature < Double.POSITIVE_INFINITY) || feature <= 0) {
            return levels;
        }
        double smallest = 0.25 * feature * refine;
        int need = (int) Math.ceil(Math.log(graded / smallest) / Math.log(2));
        return Math.max(levels, Math.min(need, 40));
    }

    private static int countPanels(List<SegPlan> plans, double h, int levels, double totalLength) {
        List<Panel> sink = new ArrayList<>();
        int count = 0;
        for (SegPlan p : plans) {
            sink.clear();
            cut(p, h, levels, totalLength, Double.NaN, sink);
            count += sink.size();
        }
        return count;
    }

    /**
     * Panel length on a circular arc of the given radius: the arc angle per panel is {@link #ARC_ANGLE} at most and
     * shrinks with the uniform size h below the reference size.
     */
    private static double arcPanel(double radius, double refine) {
        return radius * ARC_ANGLE * refine;
    }

    /** Graded levels from zone size g down to a smallest panel of about size (none if g is already that small). */
    private static int levelsDownTo(double g, double size) {
        return g > size ? Math.min(40, (int) Math.ceil(Math.log(g / size) / Math.log(2))) : 0;
    }

    /** Cuts one segment into panels (appends to out). */
    private static void cut(SegPlan p, double h, int levels, double totalLength, double scale, List<Panel> out) {
        // below the reference size every locally set size (arc panels, the smallest panel across a narrow gap)
        // shrinks in proportion to h, so that refining h refines them too; in the scale mode they also grow with it
        boolean scaled = !Double.isNaN(scale);
        double refine = scaled ? scale : Math.min(1, h / (ARC_REFERENCE_SHARE * totalLength));
        double coarse = scaled ? Math.max(1, scale) : 1;
        double len = p.segment.length_m();
        boolean arcS = p.arcStart < Double.POSITIVE_INFINITY;
        boolean arcE = p.arcEnd < Double.POSITIVE_INFINITY;
        boolean gradeS = p.gradeStart || arcS;
        boolean gradeE = p.gradeEnd || arcE;
        int ends = (gradeS ? 1 : 0) + (gradeE ? 1 : 0);
        double g = ends == 0 ? 0 : Math.min(h, len / (ends == 2 ? 3 : 2));
        List<double[]> pieces = new ArrayList<>(); // [s0, s1, singularEnd, power]
        double s = 0;
        if (gradeS) {
            int lv = arcS ? levelsDownTo(g, arcPanel(p.arcStart, refine)) : levelsFor(g, p.featureStart, levels, refine);
            s = graded(pieces, 0, g, lv, true, arcS ? 0 : p.betaStart);
        }
        double midEnd = gradeE ? len - g : len;
        double mid = midEnd - s;
        if (mid > 1e-14 * len) {
            // No panel longer than its distance from the axis (a quarter of the segment at least): the charge on a
            // bore varies on the scale of the bore radius, and long panels would make every interaction "near".
            double rMin = Math.min(p.segment.at(s / len).r_m(), p.segment.at(midEnd / len).r_m());
            double cap = Math.max(rMin * coarse, 0.25 * len);
            if (p.segment instanceof Segment.Arc arc) {
                cap = Math.min(cap, arcPanel(arc.radius_m(), refine));
            }
            int k = Math.max(1, (int) Math.ceil(mid / Math.min(h, cap) - 1e-9));
            for (int i = 0; i < k; i++) {
                pieces.add(new double[] {s + mid * i / k, s + mid * (i + 1) / k, 0, 1});
            }
        }
        if (gradeE) {
            int lv = arcE ? levelsDownTo(g, arcPanel(p.arcEnd, refine)) : levelsFor(g, p.featureEnd, levels, refine);
            graded(pieces, len - g, len, lv, false, arcE ? 0 : p.betaEnd);
        }
        for (double[] q : pieces) {
            int singular = (int) q[2];
            out.add(new Panel(p.electrode, p.segment, q[0] / len, q[1] / len, singular, q[3], p.sheet, p.contour));
        }
    }

    /**
     * Geometric panels over [a, b] toward the singular end (a if atStart). Returns the end of the graded
     * zone away from the singular point.
     */
    private static double graded(List<double[]> pieces, double a, double b, int levels, boolean atStart, double beta) {
        double g = b - a;
        double[] sizes = new double[levels + 1];
        // Sizes from the singular point outward: g/2^L, g/2^L, g/2^(L-1), ..., g/2.
        sizes[0] = g / Math.pow(2, levels);
        for (int k = 1; k <= levels; k++) {
            sizes[k] = g / Math.pow(2, levels - k + 1);
        }
        if (levels == 0) {
            sizes[0] = g;
        }
        double power = beta < -0.01 ? 1 / (1 + beta) : 1;
        if (atStart) {
            double s = a;
            for (int k = 0; k < sizes.length; k++) {
                boolean singular = k == 0 && power > 1;
                pieces.add(new double[] {s, s + sizes[k], singular ? -1 : 0, singular ? power : 1});
                s += sizes[k];
            }
            return b;
        }
        double s = b;
        List<double[]> rev = new ArrayList<>();
        for (int k = 0; k < sizes.length; k++) {
            boolean singular = k == 0 && power > 1;
            rev.add(0, new double[] {s - sizes[k], s, singular ? 1 : 0, singular ? power : 1});
            s -= sizes[k];
        }
        pieces.addAll(rev);
        return a;
    }
}
