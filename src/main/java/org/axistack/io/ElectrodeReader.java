package org.axistack.io;

import org.axistack.model.Units;
import static org.axistack.io.TableFields.fmt;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.axistack.model.Contour;
import org.axistack.model.Electrode;
import org.axistack.model.Sectors;
import org.axistack.model.Segment;
import org.axistack.model.ZR;
import org.tomlj.TomlArray;

/** Maps one [[electrode]] table to an {@link Electrode}, converting millimetres to metres. */
final class ElectrodeReader {

    static final List<String> COMMON = List.of("name", "shape", "bias_V", "sectors", "sector_biases_V",
            "split_rotation_deg", "slit_width_mm", "deflection_x_V", "deflection_y_V");
    /** Keys that only a split electrode (sectors = N) takes. */
    static final List<String> SECTOR_KEYS = List.of("sector_biases_V", "split_rotation_deg", "slit_width_mm",
            "deflection_x_V", "deflection_y_V");
    /** Shape keyword to its own keys (besides the common ones); order is the order of the docs. */
    static final Map<String, List<String>> SHAPE_KEYS = new LinkedHashMap<>();

    static {
        SHAPE_KEYS.put("tube", List.of("radius_mm", "z_start_mm", "z_end_mm", "wall_mm", "edge_radius_mm"));
        SHAPE_KEYS.put("aperture", List.of("z_mm", "hole_radius_mm", "outer_radius_mm", "thickness_mm", "edge_radius_mm"));
        SHAPE_KEYS.put("disk", List.of("z_mm", "radius_mm", "thickness_mm"));
        SHAPE_KEYS.put("ring", List.of("z_mm", "radius_mm", "wire_radius_mm"));
        SHAPE_KEYS.put("outline", List.of("points_mm", "closed"));
    }

    private ElectrodeReader() {
    }

    static Electrode read(TableFields t) throws StackInputException {
        String name = t.requireString("name", "\"focus\"");
        if (name.isBlank()) {
            throw t.error(StackMessage.BLANK_NAME, "name", Map.of());
        }
        t.electrode(name);
        String shape = t.requireString("shape", "\"tube\"");
        List<String> own = SHAPE_KEYS.get(shape);
        if (own == null) {
            throw t.error(StackMessage.UNKNOWN_SHAPE, "shape",
                    Map.of("shape", shape, "suggestion", TableFields.suggestion(shape, SHAPE_KEYS.keySet()),
                            "shapes", String.join(", ", Electrode.SHAPES)));
        }
        Set<String> allowed = new LinkedHashSet<>(COMMON);
        allowed.addAll(own);
        Set<String> anyShape = new LinkedHashSet<>(COMMON);
        SHAPE_KEYS.values().forEach(anyShape::addAll);
        for (String k : t.table().keySet()) {
            if (!allowed.contains(k) && anyShape.contains(k)) {
                throw t.error(StackMessage.KEY_NOT_FOR_SHAPE, k,
                        Map.of("key", k, "shape", shape, "allowed", String.join(", ", allowed)));
            }
        }
        t.rejectUnknown(allowed);
        for (String k : SECTOR_KEYS) {
            if (t.has(k) && !t.has("sectors")) {
                throw t.error(StackMessage.SECTOR_KEY_WITHOUT_SECTORS, k, Map.of("key", k));
            }
        }
        if (t.has("sector_biases_V")) {
            for (String k : List.of("bias_V", "deflection_x_V", "deflection_y_V")) {
                if (t.has(k)) {
                    throw t.error(StackMessage.CONFLICTING_SECTOR_KEYS, k, Map.of("first", "sector_biases_V", "second", k));
                }
            }
        }
        // a split electrode given by its sector biases: its round bias (their mean) is set by the Stack
        double bias = t.has("sector_biases_V") ? 0
                : t.requireNumber("bias_V", "V", -Limits.MAX_BIAS_V, Limits.MAX_BIAS_V, "-1400.0");
        try {
            return switch (shape) {
                case "tube" -> tube(t, name, bias);
                case "aperture" -> aperture(t, name, bias);
                case "disk" -> new Electrode.Disk(name, bias, Units.mmToM(t.requirePosition("z_mm", "10.0")),
                        Units.mmToM(t.requireSize("radius_mm", "8.0")), Units.mmToM(t.thickness("thickness_mm", "0.5")));
                case "ring" -> ring(t, name, bias);
                default -> new Electrode.Outline(name, bias, outline(t));
            };
        } catch (IllegalArgumentException e) {
            throw t.error(StackMessage.MODEL_REJECTED, null, Map.of("what", shape, "detail", e.getMessage()));
        }
    }

    /**
     * The sectors of a split electrode (null when the table has no sectors key): sector_biases_V, or bias_V with
     * deflection_x_V / deflection_y_V; split_rotation_deg and slit_width_mm optional.
     */
    static Sectors sectors(TableFields t, Electrode e) throws StackInputException {
        if (!t.has("sectors")) {
            return null;
        }
        int n = (int) t.requireInteger("sectors", Sectors.MIN_COUNT, Sectors.MAX_COUNT, "4");
        double minR = e.contour().minR_m();
        if (!(minR > 0)) {
            throw t.error(StackMessage.SPLIT_ON_AXIS, "sectors", Map.of("name", e.name()));
        }
        double rot = Math.toRadians(t.has("split_rotation_deg")
                ? t.requireNumber("split_rotation_deg", "deg", -360, 360, "45.0") : 0);
        double slit = Units.mmToM(t.thickness("slit_width_mm", "0.2"));
        double arc = 2 * Math.PI * minR / n;
        if (slit >= arc) {
            throw t.error(StackMessage.SLIT_TOO_WIDE, "slit_width_mm",
                    Map.of("slit", fmt(Units.mToMm(slit)), "arc", fmt(Units.mToMm(arc))));
        }
        if (!t.has("sector_biases_V")) {
            double dx = t.has("deflection_x_V")
                    ? t.requireNumber("deflection_x_V", "V", -Limits.MAX_BIAS_V, Limits.MAX_BIAS_V, "25.0") : 0;
            double dy = t.has("deflection_y_V")
                    ? t.requireNumber("deflection_y_V", "V", -Limits.MAX_BIAS_V, Limits.MAX_BIAS_V, "-10.0") : 0;
            return Sectors.fromDifferentials(n, rot, slit, e.bias_V(), dx, dy);
        }
        String key = "sector_biases_V";
        Object v = t.table().get(List.of(key));
        if (!(v instanceof TomlArray arr)) {
            throw t.error(StackMessage.WRONG_TYPE, key, Map.of("expected", "an array of numbers", "found",
                    TableFields.typeName(v), "example", "sector_biases_V = [120.0, 80.0, 120.0, 80.0]"));
        }
        if (arr.size() != n) {
            throw t.error(StackMessage.SECTOR_BIAS_COUNT, key, Map.of("count", arr.size(), "sectors", n));
        }
        List<Double> biases = new ArrayList<>();
        for (int i = 0; i < arr.size(); i++) {
            double x = t.toNumber(arr.get(i), key, "[120.0, 80.0, 120.0, 80.0]", t.line(key));
            biases.add(t.checkRange(x, key, "V", -Limits.MAX_BIAS_V, Limits.MAX_BIAS_V, "120.0", t.line(key)));
        }
        return new Sectors(n, rot, slit, biases);
    }

    private static Electrode tube(TableFields t, String name, double bias) throws StackInputException {
        double r = t.requireSize("radius_mm", "5.0");
        double z0 = t.requirePosition("z_start_mm", "-3.0");
        double z1 = t.requirePosition("z_end_mm", "3.0");
        double wall = t.thickness("wall_mm", "0.5");
        if (!(z1 > z0)) {
            throw t.error(StackMessage.Z_ORDER, "z_end_mm", Map.of("start", fmt(z0), "end", fmt(z1)));
        }
        double edge = edgeRadius(t, "wall_mm", wall, "length (z_end_mm - z_start_mm)", z1 - z0);
        return new Electrode.Tube(name, bias, Units.mmToM(r), Units.mmToM(z0), Units.mmToM(z1), Units.mmToM(wall),
                Units.mmToM(edge));
    }

    private static Electrode aperture(TableFields t, String name, double bias) throws StackInputException {
        double z = t.requirePosition("z_mm", "10.0");
        double hole = t.requireSize("hole_radius_mm", "1.0");
        double outer = t.requireSize("outer_radius_mm", "12.0");
        double th = t.thickness("thickness_mm", "0.5");
        if (!(hole < outer)) {
            throw t.error(StackMessage.HOLE_TOO_LARGE, "hole_radius_mm", Map.of("hole", fmt(hole), "outer", fmt(outer)));
        }
        double edge = edgeRadius(t, "thickness_mm", th, "plate width (outer_radius_mm - hole_radius_mm)", outer - hole);
        return new Electrode.Aperture(name, bias, Units.mmToM(z), Units.mmToM(hole), Units.mmToM(outer), Units.mmToM(th),
                Units.mmToM(edge));
    }

    /**
     * The optional edge_radius_mm of a tube or aperture (absent: 0, sharp corners): not negative, only on a solid
     * section, at most half its thickness and half its other side (so that the rounded corners do not overlap).
     */
    private static double edgeRadius(TableFields t, String thicknessKey, double thickness, String otherName,
            double other) throws StackInputException {
        String key = "edge_radius_mm";
        if (!t.has(key)) {
            return 0;
        }
        double rho = t.toNumber(t.table().get(List.of(key)), key, "0.25", -1);
        if (rho < 0) {
            throw t.error(StackMessage.EDGE_RADIUS_NEGATIVE, key, Map.of("value", fmt(rho)));
        }
        if (rho == 0) {
            return 0;
        }
        if (thickness == 0) {
            throw t.error(StackMessage.EDGE_RADIUS_ON_SHEET, key, Map.of("radius", fmt(rho), "key", thicknessKey));
        }
        String what = rho > thickness / 2 ? thicknessKey : rho > other / 2 ? otherName : null;
        if (what != null) {
            double size = what.equals(thicknessKey) ? thickness : other;
            throw t.error(StackMessage.EDGE_RADIUS_TOO_LARGE, key, Map.of("radius", fmt(rho), "what", what,
                    "size", fmt(size), "max", fmt(Math.min(thickness, other) / 2)));
        }
        return t.checkRange(rho, key, "mm", Limits.MIN_SIZE_MM, Limits.MAX_LENGTH_MM, "0.25", t.line(key));
    }

    private static Electrode ring(TableFields t, String name, double bias) throws StackInputException {
        double z = t.requirePosition("z_mm", "10.0");
        double r = t.requireSize("radius_mm", "8.0");
        double w = t.requireSize("wire_radius_mm", "0.25");
        if (!(w < r)) {
            throw t.error(StackMessage.WIRE_TOO_THICK, "wire_radius_mm", Map.of("wire", fmt(w), "radius", fmt(r)));
        }
        return new Electrode.Ring(name, bias, Units.mmToM(z), Units.mmToM(r), Units.mmToM(w));
    }

    /** One parsed point of points_mm: (z, r) and, for an arc, the via point. */
    private record Pt(double z, double r, double[] via, int line) {
    }

    private static Contour outline(TableFields t) throws StackInputException {
        String key = "points_mm";
        boolean closed = t.requireBoolean("closed");
        Object v = t.table().get(List.of(key));
        if (v == null) {
            throw t.error(StackMessage.MISSING_KEY, key, Map.of("key", key, "example", "[[0.0, 5.0], [4.0, 5.0], [4.0, 8.0]]"));
        }
        if (!(v instanceof TomlArray arr)) {
            throw t.error(StackMessage.WRONG_TYPE, key, Map.of("expected", "an array of points", "found",
                    TableFields.typeName(v), "example", "points_mm = [[0.0, 5.0], [4.0, 5.0]]"));
        }
        if (arr.size() > Limits.MAX_OUTLINE_POINTS) {
            throw t.error(StackMessage.TOO_MANY_POINTS, key, Map.of("count", arr.size(), "limit", Limits.MAX_OUTLINE_POINTS));
        }
        List<Pt> pts = new ArrayList<>();
        List<Integer> lines = ArrayLines.elementLines(t.text(), t.line(key));
        for (int i = 0; i < arr.size(); i++) {
            pts.add(point(t, arr, i, i == 0, i < lines.size() ? lines.get(i) : t.line(key)));
        }
        int min = closed ? 3 : 2;
        boolean closesOnItself = pts.size() >= 3 && samePoint(pts.get(0), pts.get(pts.size() - 1));
        boolean closingArc = closed && pts.size() == 2 && pts.get(1).via() != null;
        if (pts.size() < min && !closingArc) {
            throw t.error(StackMessage.TOO_FEW_POINTS, key, Map.of("count", pts.size(), "min", min));
        }
        List<Segment> segs = new ArrayList<>();
        for (int i = 1; i < pts.size(); i++) {
            Pt a = pts.get(i - 1), b = pts.get(i);
            if (samePoint(a, b)) {
                double gap = Math.hypot(a.z() - b.z(), a.r() - b.r());
                String relation = gap == 0 ? "repeats" : "is only " + fmt(gap) + " mm, less than the smallest size of "
                        + fmt(Limits.MIN_SIZE_MM) + " mm, from";
                throw t.errorAt(StackMessage.REPEATED_POINT, b.line(), key, Map.of("index", i + 1, "z", fmt(b.z()),
                        "r", fmt(b.r()), "relation", relation, "pz", fmt(a.z()), "pr", fmt(a.r()), "min",
                        fmt(Limits.MIN_SIZE_MM)));
            }
            ZR za = zr(a), zb = zr(b);
            if (b.via() == null) {
                segs.add(new Segment.Line(za, zb));
            } else {
                ZR via = new ZR(Units.mmToM(b.via()[0]), Units.mmToM(b.via()[1]));
                if (collinear(za, via, zb)) {
                    throw t.errorAt(StackMessage.ARC_COLLINEAR, b.line(), key, Map.of("index", i + 1));
                }
                segs.add(new Segment.Arc(za, via, zb));
            }
        }
        if (closed && !closesOnItself) {
            segs.add(new Segment.Line(zr(pts.get(pts.size() - 1)), zr(pts.get(0))));
        }
        if (closed) {
            // an edge along the axis has no area of revolution: its surface charge rings shrink to nothing and the
            // collocation matrix becomes singular; the same solid is an open outline from the axis to the axis
            for (int i = 0; i < pts.size(); i++) {
                Pt a = pts.get(i), b = pts.get((i + 1) % pts.size());
                boolean straight = i + 1 == pts.size() || b.via() == null;
                if (a.r() == 0 && b.r() == 0 && straight && a.z() != b.z()) {
                    throw t.errorAt(StackMessage.AXIS_EDGE, a.line(), key, Map.of("from", fmt(Math.min(a.z(), b.z())),
                            "to", fmt(Math.max(a.z(), b.z()))));
                }
            }
        }
        return new Contour(segs, closed);
    }

    private static Pt point(TableFields t, TomlArray arr, int i, boolean first, int line) throws StackInputException {
        String key = "points_mm";
        Object o = arr.get(i);
        if (!(o instanceof TomlArray p) || !(p.size() == 2 || (p.size() == 4 && !first))) {
            throw t.errorAt(StackMessage.BAD_POINT, line, key, Map.of("index", i + 1));
        }
        double[] x = new double[p.size()];
        for (int k = 0; k < p.size(); k++) {
            Object c = p.get(k);
            if (!(c instanceof Long) && !(c instanceof Double)) {
                throw t.errorAt(StackMessage.BAD_POINT, line, key, Map.of("index", i + 1));
            }
            x[k] = t.toNumber(c, key, "[4.0, 5.0]", line);
            t.checkRange(x[k], key, "mm", -Limits.MAX_LENGTH_MM, Limits.MAX_LENGTH_MM, "[4.0, 5.0]", line);
        }
        for (int k = 1; k < x.length; k += 2) {
            if (x[k] < 0) {
                throw t.errorAt(StackMessage.NEGATIVE_RADIUS, line, key, Map.of("index", i + 1, "r", fmt(x[k])));
            }
        }
        return new Pt(x[0], x[1], x.length == 4 ? new double[] {x[2], x[3]} : null, line);
    }

    private static boolean samePoint(Pt a, Pt b) {
        return Math.hypot(a.z() - b.z(), a.r() - b.r()) < Limits.MIN_SIZE_MM;
    }

    private static ZR zr(Pt p) {
        return new ZR(Units.mmToM(p.z()), Units.mmToM(p.r()));
    }

    private static boolean collinear(ZR a, ZR via, ZR b) {
        double cross = (via.z_m() - a.z_m()) * (b.r_m() - a.r_m()) - (via.r_m() - a.r_m()) * (b.z_m() - a.z_m());
        double scale = Math.max(a.distanceTo(via), via.distanceTo(b));
        return !(Math.abs(cross) > 1e-9 * scale * scale) || a.distanceTo(via) < 1e-6 || via.distanceTo(b) < 1e-6;
    }
}
