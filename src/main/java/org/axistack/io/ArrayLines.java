package org.axistack.io;

import java.util.ArrayList;
import java.util.List;

/**
 * Finds the line on which each element of a TOML array value starts. tomlj reports element positions
 * of multi-line arrays one token early, so stack-file messages about outline points use this scan of
 * the (already validated) text instead: it follows bracket depth from the key, skipping comments and
 * quoted strings.
 */
final class ArrayLines {
    private ArrayLines() {
    }

    /**
     * @param text    the whole file
     * @param keyLine 1-based line of the key whose value is the array
     * @return the 1-based start line of each top-level element, in order (may be shorter than the
     *         array if the scan fails; callers fall back to the key line)
     */
    static List<Integer> elementLines(String text, int keyLine) {
        List<Integer> out = new ArrayList<>();
        if (text == null || keyLine < 1) {
            return out;
        }
        int i = 0, line = 1;
        while (i < text.length() && line < keyLine) {
            if (text.charAt(i++) == '\n') {
                line++;
            }
        }
        while (i < text.length() && text.charAt(i) != '=') {
            i++;
        }
        int depth = 0;
        boolean expectElement = false;
        for (; i < text.length(); i++) {
            char c = text.charAt(i);
            if (c == '\n') {
                line++;
            } else if (c == '#') {
                while (i + 1 < text.length() && text.charAt(i + 1) != '\n') {
                    i++;
                }
            } else if (c == '"' || c == '\'') {
                if (depth == 1 && expectElement) {
                    out.add(line);
                    expectElement = false;
                }
                i++;
                while (i < text.length() && text.charAt(i) != c && text.charAt(i) != '\n') {
                    if (c == '"' && text.charAt(i) == '\\') {
                        i++;
                    }
                    i++;
                }
            } else if (c == '[') {
                if (depth == 1 && expectElement) {
                    out.add(line);
                    expectElement = false;
                }
                depth++;
                if (depth == 1) {
                    expectElement = true;
                }
            } else if (c == ']') {
                depth--;
                if (depth <= 0) {
                    break;
                }
            } else if (c == ',' && depth == 1) {
                expectElement = true;
            } else if (!Character.isWhitespace(c) && depth == 1 && expectElement) {
                out.add(line);
                expectElement = false;
            }
        }
        return out;
    }
}
