package org.axistack.report;

import java.util.List;
import org.axistack.model.Numbers;

/** Small helpers for the report's hand-written HTML: escaping, tables and number formats. */
final class Html {
    private Html() {
    }

    static String esc(String s) {
        StringBuilder b = new StringBuilder(s.length() + 16);
        for (char c : s.toCharArray()) {
            switch (c) {
                case '<' -> b.append("&lt;");
                case '>' -> b.append("&gt;");
                case '&' -> b.append("&amp;");
                case '"' -> b.append("&quot;");
                case '\'' -> b.append("&#39;");
                default -> b.append(c);
            }
        }
        return b.toString();
    }

    /**
     * A table with a header row; cells are escaped; a cell starting with "!!" is shown as over a hard limit (the
     * aggressive surface-field limit, a near-mirror focus: dark red), one starting with "!" as a caution (above the
     * comfort limit: amber), the same two levels as the window's property table.
     */
    static String table(List<String> header, List<List<String>> rows) {
        StringBuilder b = new StringBuilder("<table>\n<tr>");
        for (String h : header) {
            b.append("<th>").append(esc(h)).append("</th>");
        }
        b.append("</tr>\n");
        for (List<String> r : rows) {
            b.append("<tr>");
            for (String c : r) {
                if (c.startsWith("!!")) {
                    b.append("<td class=\"over\">").append(esc(c.substring(2))).append("</td>");
                } else if (c.startsWith("!")) {
                    b.append("<td class=\"caution\">").append(esc(c.substring(1))).append("</td>");
                } else {
                    b.append("<td>").append(esc(c)).append("</td>");
                }
            }
            b.append("</tr>\n");
        }
        return b.append("</table>\n").toString();
    }

    /** Six significant digits, "-" for NaN or infinite. */
    static String g(double x) {
        if (!Double.isFinite(x)) {
            return "-";
        }
        return Numbers.general(x, Numbers.REPORT_DIGITS);
    }

    /** Six significant digits without trailing zeros ("0.1", "2500"), "-" for NaN or infinite. */
    static String trim(double x) {
        if (!Double.isFinite(x)) {
            return "-";
        }
        if (x == 0) {
            return "0";
        }
        return Numbers.trimZeros(Numbers.general(x, Numbers.REPORT_DIGITS));
    }

    static String sci(double x) {
        if (!Double.isFinite(x)) {
            return "-";
        }
        return Numbers.scientific(x, 2);
    }
}
