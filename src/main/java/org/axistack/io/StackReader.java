package org.axistack.io;

import org.axistack.model.Units;
import static org.axistack.io.TableFields.fmt;

import java.io.IOException;
import java.io.InputStream;
import java.nio.ByteBuffer;
import java.nio.CharBuffer;
import java.nio.charset.CharsetDecoder;
import java.nio.charset.CoderResult;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.OptionalDouble;
import org.axistack.model.Beam;
import org.axistack.model.Electrode;
import org.axistack.model.GeometryCheck;
import org.axistack.model.MeshSettings;
import org.axistack.model.Monitor;
import org.axistack.model.Particle;
import org.axistack.model.Sectors;
import org.axistack.model.Stack;
import org.axistack.model.GapRule;
import org.axistack.model.StartRay;
import org.axistack.model.SurfaceFieldLimits;
import org.tomlj.Toml;
import org.tomlj.TomlArray;
import org.tomlj.TomlParseError;
import org.tomlj.TomlParseResult;
import org.tomlj.TomlPosition;
import org.tomlj.TomlTable;

/**
 * Reads a stack file (TOML, see the README's "Stack file format") into a validated {@link Stack}.
 * The file's size is checked before it is read, its bytes must be UTF-8, its syntax TOML (parsed by
 * tomlj); then every key is checked and converted from millimetres to metres. Any problem is a
 * {@link StackInputException} with a one-paragraph message from {@link StackMessage}.
 */
public final class StackReader {

    static final List<String> TOP_KEYS = List.of("title", "beam", "electrode", "screen", "mesh", "limits",
            "monitor");
    static final List<String> BEAM_KEYS = List.of("particle", "energy_eV", "mass_u", "charge_state", "start_z_mm",
            "object_z_mm", "start_x_mm", "start_y_mm", "start_slope_x_mrad", "start_slope_y_mrad");
    /** Largest start slope accepted, mrad: the central-ray analyses are paraxial (first order in the slope). */
    static final double MAX_START_SLOPE_MRAD = 100;
    /** Most monitor planes in a stack. */
    static final int MAX_MONITORS = 50;
    static final List<String> PARTICLES = List.of("electron", "proton", "ion");

    private StackReader() {
    }

    /** Reads a stack file; messages name the file as {@code file.toString()}. */
    public static Stack read(Path file) throws StackInputException {
        return read(file, file.toString());
    }

    /** Reads a stack file; messages name it as {@code shownAs}. */
    public static Stack read(Path file, String shownAs) throws StackInputException {
        return parse(readText(file, shownAs), shownAs);
    }

    private static StackInputException tooLarge(String source, long size) {
        return new StackInputException(StackMessage.FILE_TOO_LARGE, source, 0, null, null,
                Map.of("size", size, "limit", Limits.MAX_FILE_BYTES));
    }

    /** Parses the bytes of a stack file. */
    public static Stack parse(byte[] bytes, String source) throws StackInputException {
        if (bytes.length > Limits.MAX_FILE_BYTES) {
            throw tooLarge(source, bytes.length);
        }
        return parse(decode(bytes, source), source);
    }

    private static String decode(byte[] bytes, String source) throws StackInputException {
        CharsetDecoder dec = StandardCharsets.UTF_8.newDecoder().onMalformedInput(CodingErrorAction.REPORT)
                .onUnmappableCharacter(CodingErrorAction.REPORT);
        ByteBuffer in = ByteBuffer.wrap(bytes);
        CharBuffer out = CharBuffer.allocate(bytes.length + 1);
        CoderResult r = dec.decode(in, out, true);
        if (!r.isError()) {
            r = dec.flush(out);
        }
        if (r.isError()) {
            int offset = in.position();
            int line = 1;
            for (int i = 0; i < offset; i++) {
                if (bytes[i] == '\n') {
                    line++;
                }
            }
            throw new StackInputException(StackMessage.NOT_UTF8, source, line, null, null, Map.of("offset", offset));
        }
        out.flip();
        String s = out.toString();
        return s.startsWith("\uFEFF") ? s.substring(1) : s;
    }

    /** Parses the text of a stack file. */
    public static Stack parse(String text, String source) throws StackInputException {
        TomlParseResult toml = toml(text, source);
        return map(toml, source, text);
    }

    /** Reads a file's text with the size and UTF-8 checks of stack files. */
    static String readText(Path file, String shownAs) throws StackInputException {
        byte[] bytes;
        try {
            if (!Files.exists(file)) {
                throw new StackInputException(StackMessage.FILE_NOT_FOUND, shownAs, 0, null, null, Map.of());
            }
            if (!Files.isRegularFile(file)) {
                throw new StackInputException(StackMessage.FILE_UNREADABLE, shownAs, 0, null, null,
                        Map.of("reason", "it is not a regular file"));
            }
            long size = Files.size(file);
            if (size > Limits.MAX_FILE_BYTES) {
                throw tooLarge(shownAs, size);
            }
            try (InputStream in = Files.newInputStream(file)) {
                bytes = in.readNBytes((int) Limits.MAX_FILE_BYTES + 1);
            }
        } catch (NoSuchFileException e) {
            throw new StackInputException(StackMessage.FILE_NOT_FOUND, shownAs, 0, null, null, Map.of());
        } catch (IOException e) {
            throw new StackInputException(StackMessage.FILE_UNREADABLE, shownAs, 0, null, null,
                    Map.of("reason", String.valueOf(e.getMessage())));
        }
        if (bytes.length > Limits.MAX_FILE_BYTES) {
            throw tooLarge(shownAs, bytes.length);
        }
        return decode(bytes, shownAs);
    }

    /** Checks and parses TOML text into a table, every problem a one-paragraph message. */
    static TomlParseResult toml(String text, String source) throws StackInputException {
        if (text.length() > Limits.MAX_FILE_BYTES) {
            throw tooLarge(source, text.length());
        }
        if (text.isBlank()) {
            throw new StackInputException(StackMessage.EMPTY_FILE, source, 0, null, null, Map.of());
        }
        precheck(text, source);
        TomlParseResult toml;
        try {
            toml = Toml.parse(text);
        } catch (RuntimeException | StackOverflowError e) {
            throw new StackInputException(StackMessage.NOT_TOML, source, 0, null, null,
                    Map.of("detail", "the parser gave up (" + e.getClass().getSimpleName() + ")"));
        }
        if (toml.hasErrors()) {
            TomlParseError err = toml.errors().get(0);
            String more = toml.errors().size() > 1 ? " (and " + (toml.errors().size() - 1) + " more errors)" : "";
            int line = err.position() == null ? 0 : err.position().line();
            String detail = stripPosition(err.getMessage());
            StackMessage id = detail.contains("too large") ? StackMessage.NUMBER_TOO_LARGE
                    : detail.contains("previously defined") ? StackMessage.DUPLICATE_KEY : StackMessage.NOT_TOML;
            throw new StackInputException(id, source, line, null, null, Map.of("detail", detail + more));
        }
        if (toml.isEmpty()) {
            throw new StackInputException(StackMessage.EMPTY_FILE, source, 0, null, null, Map.of());
        }
        return toml;
    }

    /** Cheap checks before the TOML parser, whose time grows faster than the input in some shapes. */
    private static void precheck(String text, String source) throws StackInputException {
        int line = 1, lineStart = 0, commas = 0;
        for (int i = 0; i <= text.length(); i++) {
            char c = i < text.length() ? text.charAt(i) : '\n';
            if (c == '\r' && (i + 1 >= text.length() || text.charAt(i + 1) != '\n')) {
                boolean all = text.indexOf('\n') < 0;
                throw new StackInputException(StackMessage.CR_LINE_ENDINGS, source, line, null, null,
                        Map.of("which", all ? "every line ends" : "this line ends"));
            }
            if (c == ',') {
                commas++;
            } else if (c == '\n') {
                if (i - lineStart > Limits.MAX_LINE_CHARS) {
                    throw new StackInputException(StackMessage.LINE_TOO_LONG, source, line, null, null,
                            Map.of("count", i - lineStart, "limit", Limits.MAX_LINE_CHARS));
                }
                line++;
                lineStart = i + 1;
            }
        }
        if (commas > Limits.MAX_COMMAS) {
            throw new StackInputException(StackMessage.TOO_MANY_VALUES, source, 0, null, null,
                    Map.of("count", commas, "limit", Limits.MAX_COMMAS));
        }
    }

    private static String stripPosition(String msg) {
        return msg == null ? "syntax error" : msg.replaceAll("\\s*\\(line \\d+, column \\d+\\)\\s*$", "");
    }

    static int lineOf(TomlTable t, String key) {
        TomlPosition p = t.inputPositionOf(List.of(key));
        return p == null ? 0 : p.line();
    }

    private static Stack map(TomlParseResult toml, String source, String text) throws StackInputException {
        TableFields top = new TableFields(source, toml, "the top level", 1);
        top.rejectUnknown(TOP_KEYS);
        String title = top.optionalString("title", "\"Flood-gun lens\"");

        TomlTable beamTable = table(top, "beam", true, "[beam]");
        if (beamTable == null) {
            throw new StackInputException(StackMessage.MISSING_BEAM, source, 0, null, null, Map.of());
        }
        Beam beam = beam(new TableFields(source, beamTable, "[beam]", lineOf(toml, "beam")));
        Map<String, Sectors> sectors = new LinkedHashMap<>();
        List<Electrode> electrodes = electrodes(toml, top, text, sectors);
        double lensEnd = electrodes.stream().mapToDouble(e -> e.contour().maxZ_m()).max().orElse(Double.NaN);
        if (beam.startZ_m().isPresent() && !(beam.startZ_m().getAsDouble() < lensEnd)) {
            TableFields b = new TableFields(source, beamTable, "[beam]", lineOf(toml, "beam"));
            throw b.error(StackMessage.START_AFTER_LENS, "start_z_mm", Map.of("start",
                    fmt(Units.mToMm(beam.startZ_m().getAsDouble())), "end", fmt(Units.mToMm(lensEnd))));
        }

        startRayInsideBore(beam, electrodes, new TableFields(source, beamTable, "[beam]", lineOf(toml, "beam")));
        List<Monitor> monitors = monitors(toml, top, beam);

        OptionalDouble screen = OptionalDouble.empty();
        TomlTable screenTable = table(top, "screen", false, "[screen]");
        if (screenTable != null) {
            TableFields s = new TableFields(source, screenTable, "[screen]", lineOf(toml, "screen"));
            s.rejectUnknown(List.of("z_mm"));
            screen = OptionalDouble.of(Units.mmToM(s.requirePosition("z_mm", "60.0")));
        }
        MeshSettings mesh = MeshSettings.defaults();
        TomlTable meshTable = table(top, "mesh", false, "[mesh]");
        if (meshTable != null) {
            TableFields m = new TableFields(source, meshTable, "[mesh]", lineOf(toml, "mesh"));
            m.rejectUnknown(List.of("target_elements", "edge_levels", "accuracy"));
            Double accuracy = m.optionalNumber("accuracy", "", MeshSettings.MIN_ACCURACY, MeshSettings.MAX_ACCURACY, "1e-7");
            int n = m.has("target_elements") ? (int) m.requireInteger("target_elements", 8, MeshSettings.MAX_ELEMENTS, "1200")
                    : accuracy == null ? MeshSettings.DEFAULT_TARGET_ELEMENTS : MeshSettings.DEFAULT_ACCURACY_CAP;
            int lv = m.has("edge_levels") ? (int) m.requireInteger("edge_levels", 0, 40, "10")
                    : MeshSettings.DEFAULT_EDGE_LEVELS;
            mesh = new MeshSettings(n, lv, accuracy == null ? Double.NaN : accuracy);
        }
        SurfaceFieldLimits limits = SurfaceFieldLimits.defaults();
        TomlTable limTable = table(top, "limits", false, "[limits]");
        if (limTable != null) {
            limits = limits(new TableFields(source, limTable, "[limits]", lineOf(toml, "limits")));
        }
        return new Stack(title == null ? "" : title, beam, electrodes, screen, mesh, limits, sectors, monitors);
    }

    static TomlTable table(TableFields top, String key, boolean required, String label)
            throws StackInputException {
        Object v = top.table().get(List.of(key));
        if (v == null) {
            return null;
        }
        if (!(v instanceof TomlTable t)) {
            throw top.error(StackMessage.WRONG_TYPE, key, Map.of("expected", "a table " + label, "found",
                    TableFields.typeName(v), "example", "a line " + label + " followed by its keys"));
        }
        return t;
    }

    private static Beam beam(TableFields b) throws StackInputException {
        return beam(b, BEAM_KEYS);
    }

    /** The [beam] table with the given allowed keys (requirements files allow fewer than stack files). */
    static Beam beam(TableFields b, List<String> allowed) throws StackInputException {
        b.rejectUnknown(allowed);
        String particle = b.requireString("particle", "\"electron\"");
        if (!PARTICLES.contains(particle)) {
            throw b.error(StackMessage.UNKNOWN_PARTICLE, "particle",
                    Map.of("particle", particle, "suggestion", TableFields.suggestion(particle, PARTICLES)));
        }
        Particle p;
        if (particle.equals("ion")) {
            if (!b.has("mass_u")) {
                throw b.error(StackMessage.ION_KEY_MISSING, "mass_u", Map.of("key", "mass_u", "example", "39.962"));
            }
            if (!b.has("charge_state")) {
                throw b.error(StackMessage.ION_KEY_MISSING, "charge_state", Map.of("key", "charge_state", "example", "1"));
            }
            double mass = b.requireNumber("mass_u", "u", Limits.MIN_MASS_U, Limits.MAX_MASS_U, "39.962");
            long q = b.requireInteger("charge_state", -Limits.MAX_CHARGE_STATE, Limits.MAX_CHARGE_STATE, "1");
            if (q == 0) {
                throw b.error(StackMessage.CHARGE_STATE_ZERO, "charge_state", Map.of());
            }
            p = Particle.ion(mass, (int) q);
        } else {
            for (String k : List.of("mass_u", "charge_state")) {
                if (b.has(k)) {
                    throw b.error(StackMessage.ION_KEY_NOT_APPLICABLE, k, Map.of("key", k, "particle", particle));
                }
            }
            p = particle.equals("electron") ? Particle.electron() : Particle.proton();
        }
        if (!b.has("energy_eV")) {
            throw b.error(StackMessage.MISSING_KEY, "energy_eV", Map.of("key", "energy_eV", "example", "500.0"));
        }
        double energy = b.toNumber(b.table().get(List.of("energy_eV")), "energy_eV", "500.0", -1);
        if (!(energy > 0)) {
            throw b.error(StackMessage.NOT_POSITIVE, "energy_eV", Map.of("unit", "eV", "value", fmt(energy), "example", "500.0"));
        }
        b.checkRange(energy, "energy_eV", "eV", 1e-6, Limits.MAX_ENERGY_EV, "500.0", b.line("energy_eV"));
        Double start = b.has("start_z_mm") ? b.requirePosition("start_z_mm", "-40.0") : null;
        Double object = b.has("object_z_mm") ? b.requirePosition("object_z_mm", "-80.0") : null;
        double x = b.has("start_x_mm") ? b.requirePosition("start_x_mm", "0.2") : 0;
        double y = b.has("start_y_mm") ? b.requirePosition("start_y_mm", "-0.1") : 0;
        double sx = b.has("start_slope_x_mrad") ? b.requireNumber("start_slope_x_mrad", "mrad", -MAX_START_SLOPE_MRAD,
                MAX_START_SLOPE_MRAD, "1.5") : 0;
        double sy = b.has("start_slope_y_mrad") ? b.requireNumber("start_slope_y_mrad", "mrad", -MAX_START_SLOPE_MRAD,
                MAX_START_SLOPE_MRAD, "-0.5") : 0;
        return new Beam(p, energy, start == null ? OptionalDouble.empty() : OptionalDouble.of(Units.mmToM(start)),
                object == null ? OptionalDouble.empty() : OptionalDouble.of(Units.mmToM(object)),
                new StartRay(Units.mmToM(x), Units.mmToM(y), Units.mradToRad(sx), Units.mradToRad(sy)));
    }

    /**
     * The central ray must start inside the narrowest bore of the electrodes around the axis (else every
     * steering answer is about a beam that cannot pass).
     */
    private static void startRayInsideBore(Beam beam, List<Electrode> electrodes, TableFields b)
            throws StackInputException {
        double off = beam.startRay().radius_m();
        if (off == 0) {
            return;
        }
        Electrode narrowest = null;
        for (Electrode e : electrodes) {
            double r = e.contour().minR_m();
            if (r > 0 && (narrowest == null || r < narrowest.contour().minR_m())) {
                narrowest = e;
            }
        }
        if (narrowest != null && !(off < narrowest.contour().minR_m())) {
            String key = b.has("start_x_mm") ? "start_x_mm" : "start_y_mm";
            throw b.error(StackMessage.START_OFFSET_OUTSIDE_BORE, key, Map.of("offset", fmt(Units.mToMm(off)),
                    "bore", fmt(Units.mToMm(narrowest.contour().minR_m())), "name", narrowest.name()));
        }
    }

    /** The [[monitor]] planes: z_mm and an optional name, unique names, not before the beam start. */
    private static List<Monitor> monitors(TomlParseResult toml, TableFields top, Beam beam)
            throws StackInputException {
        Object v = toml.get(List.of("monitor"));
        if (v == null) {
            return List.of();
        }
        if (!(v instanceof TomlArray arr) || !allTables(arr)) {
            throw top.error(StackMessage.WRONG_TYPE, "monitor", Map.of("expected", "[[monitor]] tables (double brackets)",
                    "found", TableFields.typeName(v), "example", "[[monitor]] followed by z_mm = 120.0 and an optional name"));
        }
        if (arr.size() > MAX_MONITORS) {
            throw top.error(StackMessage.TOO_MANY_MONITORS, "monitor", Map.of("count", arr.size(), "limit", MAX_MONITORS));
        }
        List<Monitor> list = new ArrayList<>();
        Map<String, Integer> seen = new HashMap<>();
        for (int i = 0; i < arr.size(); i++) {
            int line = arr.inputPositionOf(i) == null ? 0 : arr.inputPositionOf(i).line();
            TableFields t = new TableFields(top.source(), arr.getTable(i), "[[monitor]]", line);
            t.rejectUnknown(List.of("z_mm", "name"));
            double z = Units.mmToM(t.requirePosition("z_mm", "120.0"));
            String name = t.optionalString("name", "\"viewer\"");
            name = name == null ? "" : name.strip();
            if (!name.isEmpty()) {
                Integer other = seen.putIfAbsent(name, line);
                if (other != null) {
                    throw t.error(StackMessage.DUPLICATE_MONITOR, "name", Map.of("name", name, "other", other));
                }
            }
            if (beam.startZ_m().isPresent() && !(z > beam.startZ_m().getAsDouble())) {
                throw t.error(StackMessage.MONITOR_BEFORE_START, "z_mm", Map.of("z", fmt(Units.mToMm(z)),
                        "start", fmt(Units.mToMm(beam.startZ_m().getAsDouble()))));
            }
            list.add(new Monitor(name, z));
        }
        return list;
    }

    private static SurfaceFieldLimits limits(TableFields l) throws StackInputException {
        String ck = "comfort_surface_field_V_per_mm", ak = "aggressive_surface_field_V_per_mm";
        String gc = "gap_comfort_V_at_1mm", ga = "gap_aggressive_V_at_1mm", ge = "gap_exponent";
        l.rejectUnknown(List.of(ck, ak, gc, ga, ge));
        double comfort = Units.vPerMToVPerMm(SurfaceFieldLimits.DEFAULT_COMFORT_V_PER_M);
        double aggressive = Units.vPerMToVPerMm(SurfaceFieldLimits.DEFAULT_AGGRESSIVE_V_PER_M);
        if (l.has(ck)) {
            comfort = positiveField(l, ck, "5000.0");
        }
        if (l.has(ak)) {
            aggressive = positiveField(l, ak, "10000.0");
        }
        if (aggressive < comfort) {
            throw l.error(StackMessage.LIMITS_ORDER, l.has(ak) ? ak : ck,
                    Map.of("aggressive", fmt(aggressive), "comfort", fmt(comfort)));
        }
        GapRule d = GapRule.defaults();
        double gapComfort = l.has(gc) ? positiveVoltage(l, gc, "5000.0") : d.comfortAt1mm_V();
        double gapAggressive = l.has(ga) ? positiveVoltage(l, ga, "10000.0") : d.aggressiveAt1mm_V();
        if (gapAggressive < gapComfort) {
            throw l.error(StackMessage.GAP_LIMITS_ORDER, l.has(ga) ? ga : gc,
                    Map.of("aggressive", fmt(gapAggressive), "comfort", fmt(gapComfort)));
        }
        double exponent = d.exponent();
        if (l.has(ge)) {
            exponent = l.toNumber(l.table().get(List.of(ge)), ge, "0.5", -1);
            if (!(exponent > 0) || exponent > 1) {
                throw l.error(StackMessage.GAP_EXPONENT_RANGE, ge, Map.of("value", fmt(exponent)));
            }
        }
        return new SurfaceFieldLimits(Units.vPerMmToVPerM(comfort), Units.vPerMmToVPerM(aggressive),
                new GapRule(gapComfort, gapAggressive, exponent));
    }

    private static double positiveVoltage(TableFields l, String key, String example) throws StackInputException {
        double x = l.toNumber(l.table().get(List.of(key)), key, example, -1);
        if (!(x > 0)) {
            throw l.error(StackMessage.NOT_POSITIVE, key, Map.of("unit", "V", "value", fmt(x), "example", example));
        }
        return l.checkRange(x, key, "V", 0, Limits.MAX_BIAS_V, example, l.line(key));
    }

    private static double positiveField(TableFields l, String key, String example) throws StackInputException {
        double x = l.toNumber(l.table().get(List.of(key)), key, example, -1);
        if (!(x > 0)) {
            throw l.error(StackMessage.NOT_POSITIVE, key, Map.of("unit", "V/mm", "value", fmt(x), "example", example));
        }
        return l.checkRange(x, key, "V/mm", 0, Limits.MAX_FIELD_V_PER_MM, example, l.line(key));
    }

    private static List<Electrode> electrodes(TomlParseResult toml, TableFields top, String text,
            Map<String, Sectors> sectors) throws StackInputException {
        String source = top.source();
        Object v = toml.get(List.of("electrode"));
        if (v == null) {
            throw new StackInputException(StackMessage.NO_ELECTRODES, source, 0, null, null, Map.of());
        }
        if (!(v instanceof TomlArray arr) || !allTables(arr)) {
            throw top.error(StackMessage.WRONG_TYPE, "electrode", Map.of("expected", "[[electrode]] tables (double brackets)",
                    "found", TableFields.typeName(v), "example", "[[electrode]] followed by name, shape, bias_V and the sizes"));
        }
        if (arr.isEmpty()) {
            throw new StackInputException(StackMessage.NO_ELECTRODES, source, lineOf(toml, "electrode"), null, null, Map.of());
        }
        if (arr.size() > Limits.MAX_ELECTRODES) {
            throw new StackInputException(StackMessage.TOO_MANY_ELECTRODES, source, 0, null, null,
                    Map.of("count", arr.size(), "limit", Limits.MAX_ELECTRODES));
        }
        long points = 0;
        for (int i = 0; i < arr.size(); i++) {
            if (arr.getTable(i).get(List.of("points_mm")) instanceof TomlArray pts) {
                points += pts.size();
            }
        }
        if (points > Limits.MAX_TOTAL_POINTS) {
            throw new StackInputException(StackMessage.TOO_MANY_POINTS_TOTAL, source, 0, null, "points_mm",
                    Map.of("count", points, "limit", Limits.MAX_TOTAL_POINTS));
        }
        List<Electrode> list = new ArrayList<>();
        List<Integer> lines = new ArrayList<>();
        Map<String, Integer> seen = new HashMap<>();
        for (int i = 0; i < arr.size(); i++) {
            int line = arr.inputPositionOf(i) == null ? 0 : arr.inputPositionOf(i).line();
            TableFields t = new TableFields(source, arr.getTable(i), "[[electrode]]", line).withText(text);
            Electrode e = ElectrodeReader.read(t);
            Sectors sec = ElectrodeReader.sectors(t, e);
            if (sec != null) {
                e = e.withBias_V(sec.common_V());
                sectors.put(e.name(), sec);
            }
            Integer other = seen.putIfAbsent(e.name(), line);
            if (other != null) {
                throw t.error(StackMessage.DUPLICATE_NAME, "name", Map.of("name", e.name(), "other", other));
            }
            list.add(e);
            lines.add(line);
        }
        checkGeometry(list, i -> source, i -> lines.get(i));
        return list;
    }

    private static boolean allTables(TomlArray arr) {
        for (int i = 0; i < arr.size(); i++) {
            if (!(arr.get(i) instanceof TomlTable)) {
                return false;
            }
        }
        return true;
    }

    /** Supplies per-electrode provenance for geometry messages. */
    interface Where {
        Object of(int electrodeIndex);
    }

    /**
     * Runs {@link GeometryCheck} and turns the first problem into a message at the first electrode's line.
     * Also used after --set overrides (touching electrodes may then be at different biases).
     */
    static void checkGeometry(List<Electrode> list, Where source, Where line) throws StackInputException {
        List<GeometryCheck.Problem> problems = GeometryCheck.check(list);
        if (problems.isEmpty()) {
            return;
        }
        GeometryCheck.Problem p = problems.get(0);
        Electrode a = list.get(p.first());
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("z", fmt(round(Units.mToMm(p.where().z_m()))));
        m.put("r", fmt(round(Units.mToMm(p.where().r_m()))));
        StackMessage id;
        String field;
        switch (p.kind()) {
            case SELF_CROSSING -> {
                id = StackMessage.SELF_CROSSING;
                field = "points_mm";
            }
            case OVERLAP -> {
                id = StackMessage.OVERLAP;
                field = null;
            }
            default -> {
                id = StackMessage.TOUCH;
                field = "bias_V";
            }
        }
        if (p.second() >= 0) {
            Electrode b = list.get(p.second());
            m.put("first", a.name());
            m.put("second", b.name());
            m.put("firstBias", fmt(a.bias_V()));
            m.put("secondBias", fmt(b.bias_V()));
            m.put("otherLine", line.of(p.second()));
        }
        Object l = line.of(p.first());
        throw new StackInputException(id, String.valueOf(source.of(p.first())), l instanceof Integer n ? n : 0,
                a.name(), field, m);
    }

    private static double round(double mm) {
        return Math.round(mm * 1e4) / 1e4;
    }
}
