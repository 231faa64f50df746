package org.axistack.model;

import java.util.LinkedHashSet;
import java.util.Map;
import java.util.Set;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * The one way a catalogued message is written: a problem template and a fix template with placeholders
 * {@code {name}}, filled and joined as "problem. Fix: fix." Both catalogues (bad input files and physics failures)
 * use it, so every message the tool prints about what went wrong reads the same way.
 */
public final class MessageTemplate {

    /**
     * A catalogue entry: an enum constant with a problem and a fix template. The placeholders and the filled text
     * come from here, so both catalogues behave alike.
     */
    public interface Entry {
        /** The constant's name, for the error a missing value is. */
        String name();

        String problemTemplate();

        String fixTemplate();

        /** The placeholder names the two templates use. */
        default Set<String> placeholders() {
            return MessageTemplate.placeholders(problemTemplate(), fixTemplate());
        }

        /** "problem. Fix: fix." with the placeholders filled; a missing value is an error in the caller. */
        default String format(Map<String, ?> values) {
            return MessageTemplate.format(name(), problemTemplate(), fixTemplate(), values);
        }
    }

    private static final Pattern PLACEHOLDER = Pattern.compile("\\{([a-zA-Z]+)}");

    private MessageTemplate() {
    }

    /** The placeholder names the templates use, in order of first appearance. */
    public static Set<String> placeholders(String... templates) {
        Set<String> s = new LinkedHashSet<>();
        for (String t : templates) {
            Matcher m = PLACEHOLDER.matcher(t);
            while (m.find()) {
                s.add(m.group(1));
            }
        }
        return s;
    }

    /**
     * "problem. Fix: fix." with the placeholders filled; numbers are written by {@link Numbers#text(double)}.
     *
     * @param entry the catalogue entry's name, for the error a missing value is
     */
    public static String format(String entry, String problem, String fix, Map<String, ?> values) {
        return tidy(fill(entry, problem, values)) + ". Fix: " + tidy(fill(entry, fix, values)) + ".";
    }

    /** One space between words where an empty value (a unitless number's unit) left two or one before a stop. */
    private static String tidy(String s) {
        return s.replaceAll(" {2,}", " ").replaceAll(" +([.,;:)])", "$1").strip();
    }

    private static String fill(String entry, String template, Map<String, ?> values) {
        Matcher m = PLACEHOLDER.matcher(template);
        StringBuilder sb = new StringBuilder();
        while (m.find()) {
            String key = m.group(1);
            if (!values.containsKey(key)) {
                throw new IllegalArgumentException("message " + entry + " needs a value for {" + key + "}");
            }
            Object v = values.get(key);
            String text = v instanceof Double d ? Numbers.text(d) : String.valueOf(v);
            m.appendReplacement(sb, Matcher.quoteReplacement(text));
        }
        m.appendTail(sb);
        return sb.toString();
    }
}
