package org.axistack.io;

import org.axistack.model.Units;
import static org.axistack.io.TableFields.fmt;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.OptionalDouble;

import org.axistack.model.Beam;
import org.axistack.size.Family;
import org.axistack.size.Objective;
import org.axistack.size.Parameter;
import org.axistack.size.Requirements;
import org.axistack.size.SearchSettings;
import org.tomlj.TomlArray;
import org.tomlj.TomlParseResult;
import org.tomlj.TomlTable;

/**
 * Reads a requirements file for the {@code size} command (TOML, our own format, see the README's "Requirements
 * file format"): [beam] as in a stack file (particle and energy), [target] (object and image planes, or a focal
 * length; the lens centre is z = 0), [limits], [family] (the lens family and, per sizing parameter, a fixed size
 * or a [min, max] range in mm) and an optional [search]. The same checks and one-paragraph messages as stack
 * files ({@link StackMessage}); millimetres converted to metres here.
 */
public final class RequirementsReader {

    static final List<String> TOP_KEYS = List.of("title", "beam", "target", "limits", "family", "search");
    static final List<String> BEAM_KEYS = List.of("particle", "energy_eV", "mass_u", "charge_state");
    static final List<String> TARGET_KEYS = List.of("object_z_mm", "image_z_mm", "focal_length_mm");
    static final List<String> LIMIT_KEYS = List.of("min_bore_radius_mm", "max_length_mm", "max_bias_V",
            "max_surface_field_V_per_mm");
    static final List<String> SEARCH_KEYS = List.of("objective", "evaluations", "mesh_elements",
            "final_mesh_elements", "bias_samples");

    private RequirementsReader() {
    }

    public static Requirements read(Path file) throws StackInputException {
        return read(file, file.toString());
    }

    public static Requirements read(Path file, String shownAs) throws StackInputException {
        return parse(StackReader.readText(file, shownAs), shownAs);
    }

    public static Requirements parse(String text, String source) throws StackInputException {
        if (text.isBlank()) {
            throw new StackInputException(StackMessage.EMPTY_FILE, source, 0, null, null, Map.of());
        }
        TomlParseResult toml = StackReader.toml(text, source);
        TableFields top = new TableFields(source, toml, "the top level", 1);
        top.rejectUnknown(TOP_KEYS);
        String title = top.optionalString("title", "\"Sputter-gun lens\"");
        Beam beam = StackReader.beam(fields(top, toml, "beam"), BEAM_KEYS);

        TableFields t = fields(top, toml, "target");
        t.rejectUnknown(TARGET_KEYS);
        OptionalDouble object = opt(t, "object_z_mm", "-80.0");
        OptionalDouble image = opt(t, "image_z_mm", "120.0");
        OptionalDouble focal = OptionalDouble.empty();
        if (t.has("focal_length_mm")) {
            focal = OptionalDouble.of(Units.mmToM(t.requireSize("focal_length_mm", "60.0")));
        }
        if (image.isPresent() && focal.isPresent()) {
            throw t.error(StackMessage.REQ_TARGET, "focal_length_mm", Map.of("detail", "both an image plane and a focal length"));
        }
        if (image.isEmpty() && focal.isEmpty()) {
            throw t.error(StackMessage.REQ_TARGET, null, Map.of("detail", "neither an image plane nor a focal length"));
        }
        if (focal.isPresent() && object.isPresent()) {
            throw t.error(StackMessage.REQ_TARGET, "object_z_mm",
                    Map.of("detail", "an object with a focal length (a focal length is asked for a parallel beam)"));
        }
        if (object.isPresent() && !(image.getAsDouble() > object.getAsDouble())) {
            throw t.error(StackMessage.REQ_IMAGE_ORDER, "image_z_mm", Map.of("image",
                    fmt(Units.mToMm(image.getAsDouble())), "object", fmt(Units.mToMm(object.getAsDouble()))));
        }

        TableFields l = fields(top, toml, "limits");
        l.rejectUnknown(LIMIT_KEYS);
        double bore = Units.mmToM(l.requireSize("min_bore_radius_mm", "3.0"));
        double length = Units.mmToM(l.requireSize("max_length_mm", "80.0"));
        double bias = l.requireNumber("max_bias_V", "V", 1, Limits.MAX_BIAS_V, "10000.0");
        double field = Units.vPerMmToVPerM(l.requireNumber("max_surface_field_V_per_mm", "V/mm", 1,
                Limits.MAX_FIELD_V_PER_MM, "5000.0"));

        TableFields f = fields(top, toml, "family");
        String kind = f.requireString("kind", "\"einzel-tubes\"");
        Family family = Family.byKeyword(kind);
        if (family == null) {
            throw f.error(StackMessage.REQ_UNKNOWN_FAMILY, "kind", Map.of("family", kind, "suggestion",
                    TableFields.suggestion(kind, Family.keywords()), "allowed", String.join(", ", Family.keywords())));
        }
        List<String> familyKeys = new ArrayList<>(List.of("kind"));
        family.parameters().forEach(p -> familyKeys.add(p + "_mm"));
        f.rejectUnknown(familyKeys);
        List<Parameter> params = parameters(f, family);

        SearchSettings search = SearchSettings.defaults();
        Objective objective = Objective.SPHERICAL;
        if (toml.get(List.of("search")) != null) {
            TableFields s = fields(top, toml, "search");
            s.rejectUnknown(SEARCH_KEYS);
            if (s.has("objective")) {
                String o = s.requireString("objective", "\"spherical\"");
                objective = Objective.byKeyword(o);
                if (objective == null) {
                    List<String> all = java.util.Arrays.stream(Objective.values()).map(Objective::keyword).toList();
                    throw s.error(StackMessage.REQ_UNKNOWN_OBJECTIVE, "objective", Map.of("objective", o,
                            "suggestion", TableFields.suggestion(o, all), "allowed", String.join(", ", all)));
                }
            }
            int evals = s.has("evaluations") ? (int) s.requireInteger("evaluations", 4, 5000, "40") : search.evaluations();
            int coarse = s.has("mesh_elements") ? (int) s.requireInteger("mesh_elements", 40, 4000, "250")
                    : search.meshElements();
            int fine = s.has("final_mesh_elements") ? (int) s.requireInteger("final_mesh_elements", 40,
                    org.axistack.model.MeshSettings.MAX_ELEMENTS, "1200") : search.finalElements();
            int samples = s.has("bias_samples") ? (int) s.requireInteger("bias_samples", 8, 400, "16")
                    : search.biasSamples();
            search = new SearchSettings(evals, coarse, fine, samples, search.threads());
        }
        return new Requirements(title == null ? "" : title, beam, object, image, focal, bore, length, bias, field,
                family, params, objective, search);
    }

    private static TableFields fields(TableFields top, TomlParseResult toml, String name) throws StackInputException {
        TomlTable table = StackReader.table(top, name, true, "[" + name + "]");
        if (table == null) {
            throw new StackInputException(StackMessage.REQ_NO_TABLE, top.source(), 0, null, null, Map.of("table", name));
        }
        return new TableFields(top.source(), table, "[" + name + "]", StackReader.lineOf(toml, name));
    }

    private static OptionalDouble opt(TableFields t, String key, String example) throws StackInputException {
        return t.has(key) ? OptionalDouble.of(Units.mmToM(t.requirePosition(key, example))) : OptionalDouble.empty();
    }

    private static List<Parameter> parameters(TableFields f, Family family) throws StackInputException {
        double[][] given = new double[family.parameters().size()][];
        for (int i = 0; i < given.length; i++) {
            String key = family.parameters().get(i) + "_mm";
            if (f.has(key)) {
                given[i] = range(f, key);
            } else if (family.defaultRatioToBore(family.parameters().get(i)) == 0) {
                throw f.error(StackMessage.MISSING_KEY, key, Map.of("key", key, "example", "[1.0, 6.0]"));
            }
        }
        double boreMid = 0.5 * (given[0][0] + given[0][1]);
        List<Parameter> list = new ArrayList<>();
        for (int i = 0; i < given.length; i++) {
            String name = family.parameters().get(i);
            double[] g = given[i] != null ? given[i] : new double[] {family.defaultRatioToBore(name) * boreMid,
                family.defaultRatioToBore(name) * boreMid};
            list.add(new Parameter(name, Units.mmToM(g[0]), Units.mmToM(g[1])));
        }
        return list;
    }

    /** A fixed size (min = max) or a [min, max] range, mm. */
    private static double[] range(TableFields f, String key) throws StackInputException {
        Object v = f.table().get(List.of(key));
        if (v instanceof TomlArray a) {
            if (a.size() != 2) {
                throw f.error(StackMessage.REQ_RANGE_SHAPE, key, Map.of("found", "an array of " + a.size() + " values",
                        "key", key));
            }
            double lo = positive(f, key, a.get(0));
            double hi = positive(f, key, a.get(1));
            if (lo > hi) {
                throw f.error(StackMessage.REQ_RANGE_ORDER, key, Map.of("min", fmt(lo), "max", fmt(hi)));
            }
            return new double[] {lo, hi};
        }
        if (v instanceof Long || v instanceof Double) {
            double x = positive(f, key, v);
            return new double[] {x, x};
        }
        throw f.error(StackMessage.REQ_RANGE_SHAPE, key, Map.of("found", TableFields.typeName(v), "key", key));
    }

    private static double positive(TableFields f, String key, Object v) throws StackInputException {
        double x = f.toNumber(v, key, "[1.0, 6.0]", -1);
        if (!(x > 0)) {
            throw f.error(StackMessage.NOT_POSITIVE, key, Map.of("unit", "mm", "value", fmt(x), "example", "[1.0, 6.0]"));
        }
        return f.checkRange(x, key, "mm", Limits.MIN_SIZE_MM, Limits.MAX_LENGTH_MM, "[1.0, 6.0]", f.line(key));
    }
}
