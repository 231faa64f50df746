package org.axistack.io;

import java.util.ArrayList;
import java.util.Collection;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import org.tomlj.TomlArray;
import org.tomlj.TomlPosition;
import org.tomlj.TomlTable;

/**
 * Typed, checked access to one TOML table of a stack file. Every failure becomes a
 * {@link StackInputException} naming the file, line, electrode and key.
 */
final class TableFields {
    private final String source;
    private final TomlTable table;
    private final String label;
    private final int headerLine;
    private String electrode;
    private String text;

    /**
     * @param source     file name as the user gave it
     * @param table      the table
     * @param label      how the table is named in messages ("[beam]", "[[electrode]]", "the top level")
     * @param headerLine line of the table's header, used for keys that are missing
     */
    TableFields(String source, TomlTable table, String label, int headerLine) {
        this.source = source;
        this.table = table;
        this.label = label;
        this.headerLine = headerLine;
    }

    /** The file's text, for positions tomlj does not report exactly. */
    TableFields withText(String fileText) {
        this.text = fileText;
        return this;
    }

    String text() {
        return text;
    }

    void electrode(String name) {
        this.electrode = name;
    }

    String source() {
        return source;
    }

    TomlTable table() {
        return table;
    }

    int headerLine() {
        return headerLine;
    }

    boolean has(String key) {
        return table.contains(List.of(key));
    }

    /** Line of a key, or the table header line when the key is absent. */
    int line(String key) {
        TomlPosition p = has(key) ? table.inputPositionOf(List.of(key)) : null;
        return p == null ? headerLine : p.line();
    }

    StackInputException error(StackMessage id, String key, Map<String, ?> values) {
        return new StackInputException(id, source, key == null ? headerLine : line(key), electrode, key, values);
    }

    StackInputException errorAt(StackMessage id, int lineNo, String key, Map<String, ?> values) {
        return new StackInputException(id, source, lineNo, electrode, key, values);
    }

    /** Rejects keys outside the allowed set, with a did-you-mean. */
    void rejectUnknown(Collection<String> allowed) throws StackInputException {
        for (String k : table.keySet()) {
            if (!allowed.contains(k)) {
                throw error(StackMessage.UNKNOWN_KEY, k, Map.of("key", k, "table", label,
                        "suggestion", suggestion(k, allowed), "allowed", String.join(", ", allowed)));
            }
        }
    }

    /** " (did you mean 'x'?)" for the closest candidate within a small edit distance, else "". */
    static String suggestion(String given, Collection<String> candidates) {
        String best = null;
        int bestD = Integer.MAX_VALUE;
        for (String c : candidates) {
            int d = editDistance(given.toLowerCase(Locale.ROOT), c.toLowerCase(Locale.ROOT));
            if (d < bestD) {
                bestD = d;
                best = c;
            }
        }
        int allowed = Math.max(2, given.length() / 3);
        if (best != null && bestD <= allowed) {
            return " (did you mean '" + best + "'?)";
        }
        for (String c : candidates) {
            if (c.toLowerCase(Locale.ROOT).startsWith(given.toLowerCase(Locale.ROOT) + "_")) {
                return " (did you mean '" + c + "'?)";
            }
        }
        return "";
    }

    /** Levenshtein distance (V. I. Levenshtein, 1966), two-row dynamic programme. */
    static int editDistance(String a, String b) {
        int[] prev = new int[b.length() + 1];
        int[] cur = new int[b.length() + 1];
        for (int j = 0; j <= b.length(); j++) {
            prev[j] = j;
        }
        for (int i = 1; i <= a.length(); i++) {
            cur[0] = i;
            for (int j = 1; j <= b.length(); j++) {
                int sub = prev[j - 1] + (a.charAt(i - 1) == b.charAt(j - 1) ? 0 : 1);
                cur[j] = Math.min(sub, Math.min(prev[j] + 1, cur[j - 1] + 1));
            }
            int[] t = prev;
            prev = cur;
            cur = t;
        }
        return prev[b.length()];
    }

    static String typeName(Object v) {
        if (v instanceof String) {
            return "text \"" + v + "\"";
        }
        if (v instanceof Long || v instanceof Double) {
            return "the number " + v;
        }
        if (v instanceof Boolean) {
            return "the boolean " + v;
        }
        if (v instanceof TomlArray) {
            return "an array";
        }
        if (v instanceof TomlTable) {
            return "a table";
        }
        return "a " + v.getClass().getSimpleName() + " value";
    }

    String requireString(String key, String example) throws StackInputException {
        if (!has(key)) {
            throw error(StackMessage.MISSING_KEY, key, Map.of("key", key, "example", example));
        }
        return optionalString(key, example);
    }

    String optionalString(String key, String example) throws StackInputException {
        Object v = table.get(List.of(key));
        if (v == null) {
            return null;
        }
        if (!(v instanceof String s)) {
            throw error(StackMessage.WRONG_TYPE, key, Map.of("expected", "text in double quotes", "found",
                    typeName(v), "example", key + " = " + example));
        }
        int bad = TextSafety.firstUnsafe(s);
        if (bad >= 0) {
            throw error(StackMessage.CONTROL_CHARACTER, key, Map.of("code", TextSafety.describe(s.codePointAt(bad)),
                    "index", s.codePointCount(0, bad) + 1));
        }
        return s;
    }

    boolean requireBoolean(String key) throws StackInputException {
        Object v = table.get(List.of(key));
        if (v == null) {
            throw error(StackMessage.MISSING_KEY, key, Map.of("key", key, "example", "true"));
        }
        if (!(v instanceof Boolean b)) {
            throw error(StackMessage.WRONG_TYPE, key, Map.of("expected", "true or false", "found", typeName(v),
                    "example", key + " = true"));
        }
        return b;
    }

    /** A number (integer or float), finite, within [min, max]. */
    double requireNumber(String key, String unit, double min, double max, String example) throws StackInputException {
        if (!has(key)) {
            throw error(StackMessage.MISSING_KEY, key, Map.of("key", key, "example", example));
        }
        return number(key, unit, min, max, example);
    }

    Double optionalNumber(String key, String unit, double min, double max, String example) throws StackInputException {
        return has(key) ? number(key, unit, min, max, example) : null;
    }

    private double number(String key, String unit, double min, double max, String example)
            throws StackInputException {
        Object v = table.get(List.of(key));
        double x = toNumber(v, key, example, -1);
        return checkRange(x, key, unit, min, max, example, line(key));
    }

    double toNumber(Object v, String key, String example, int lineNo) throws StackInputException {
        double x;
        if (v instanceof Long l) {
            x = l;
        } else if (v instanceof Double d) {
            x = d;
        } else {
            Map<String, Object> m = Map.of("expected", "a number", "found", typeName(v),
                    "example", key + " = " + example);
            throw lineNo < 0 ? error(StackMessage.WRONG_TYPE, key, m) : errorAt(StackMessage.WRONG_TYPE, lineNo, key, m);
        }
        if (!Double.isFinite(x)) {
            Map<String, Object> m = Map.of("value", x, "example", example);
            throw lineNo < 0 ? error(StackMessage.NOT_FINITE, key, m) : errorAt(StackMessage.NOT_FINITE, lineNo, key, m);
        }
        return x;
    }

    double checkRange(double x, String key, String unit, double min, double max, String example, int lineNo)
            throws StackInputException {
        if (x < min || x > max) {
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("value", fmt(x));
            m.put("unit", unit);
            m.put("min", fmt(min));
            m.put("max", fmt(max));
            m.put("hint", "for example " + example);
            throw errorAt(StackMessage.OUT_OF_RANGE, lineNo, key, m);
        }
        return x;
    }

    /** A positive size in mm, at least the smallest size the tool accepts. */
    double requireSize(String key, String example) throws StackInputException {
        if (!has(key)) {
            throw error(StackMessage.MISSING_KEY, key, Map.of("key", key, "example", example));
        }
        double x = toNumber(table.get(List.of(key)), key, example, -1);
        if (!(x > 0)) {
            throw error(StackMessage.NOT_POSITIVE, key, Map.of("unit", "mm", "value", fmt(x), "example", example));
        }
        return checkRange(x, key, "mm", Limits.MIN_SIZE_MM, Limits.MAX_LENGTH_MM, example, line(key));
    }

    /** A thickness in mm: 0 (sheet) or positive; absent means 0. */
    double thickness(String key, String example) throws StackInputException {
        if (!has(key)) {
            return 0;
        }
        double x = toNumber(table.get(List.of(key)), key, example, -1);
        if (x < 0) {
            throw error(StackMessage.NEGATIVE, key, Map.of("unit", "mm", "value", fmt(x), "example", example));
        }
        if (x == 0) {
            return 0;
        }
        return checkRange(x, key, "mm", Limits.MIN_SIZE_MM, Limits.MAX_LENGTH_MM, example, line(key));
    }

    /** A position in mm. */
    double requirePosition(String key, String example) throws StackInputException {
        return requireNumber(key, "mm", -Limits.MAX_LENGTH_MM, Limits.MAX_LENGTH_MM, example);
    }

    long requireInteger(String key, long min, long max, String example) throws StackInputException {
        Object v = table.get(List.of(key));
        if (v == null) {
            throw error(StackMessage.MISSING_KEY, key, Map.of("key", key, "example", example));
        }
        if (!(v instanceof Long l)) {
            throw error(StackMessage.WRONG_TYPE, key, Map.of("expected", "a whole number", "found", typeName(v),
                    "example", key + " = " + example));
        }
        checkRange(l, key, "", min, max, example, line(key));
        return l;
    }

    /** A number for a message: plain decimal notation (0.0005, not 5.0E-4), whole numbers without a point. */
    static String fmt(double x) {
        if (!Double.isFinite(x)) {
            return String.valueOf(x);
        }
        if (org.axistack.model.Numbers.whole(x, 1e15)) {
            return String.valueOf((long) x);
        }
        if (Math.abs(x) >= 1e-9 && Math.abs(x) < 1e15) {
            return org.axistack.model.Numbers.plain(x, org.axistack.model.Numbers.INPUT_DIGITS);
        }
        return java.math.BigDecimal.valueOf(x).round(new java.math.MathContext(org.axistack.model.Numbers.MESSAGE_DIGITS))
                .toString().replace("E+", " x 10^").replace("E-", " x 10^-");
    }

    static List<String> keys(Set<String> s) {
        return new ArrayList<>(s);
    }
}
