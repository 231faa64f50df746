package org.axistack.io;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.util.List;
import java.util.regex.Pattern;

import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;

/**
 * The one place where the tool writes CSV cells: RFC 4180 (Commons CSV), a header row whose names carry units,
 * then the rows. Every CSV file goes through {@link #cell}:
 * <ul>
 * <li>numbers stay numbers; a missing value (null, NaN, infinity) is an empty cell;</li>
 * <li>text that a spreadsheet would run as a formula (a cell starting with {@code = + - @}, a tab or a carriage
 * return: an electrode name from a received stack file, say) gets a leading apostrophe, the usual neutraliser
 * (OWASP "CSV injection"; spreadsheets show the text without it). Text that is a plain decimal number, such as
 * {@code -130.08} written by a table formatter, is a number and is left as it is.</li>
 * </ul>
 * Names are not refused at input for these characters: a stack file with a name like {@code -focus} still
 * works, and its CSV cells are neutralised here.
 */
public final class CsvTable {

    private static final CSVFormat FORMAT = CSVFormat.RFC4180;
    private static final Pattern NUMBER = Pattern.compile("-?(\\d+\\.?\\d*|\\.\\d+)([eE][-+]?\\d+)?");

    private CsvTable() {
    }

    /** The cell as written: numbers as they are, missing values empty, formula-like text neutralised. */
    public static Object cell(Object v) {
        if (v == null) {
            return "";
        }
        if (v instanceof Double d) {
            return Double.isFinite(d) ? d : "";
        }
        if (v instanceof Float f) {
            return Float.isFinite(f) ? f : "";
        }
        if (v instanceof Number) {
            return v;
        }
        String s = v.toString();
        if (s.isEmpty() || NUMBER.matcher(s).matches()) {
            return s;
        }
        char c = s.charAt(0);
        return c == '=' || c == '+' || c == '-' || c == '@' || c == '\t' || c == '\r' ? "'" + s : s;
    }

    /** Writes rows one at a time (for tables too long to hold as text). */
    public static final class Writer implements AutoCloseable {
        private final CSVPrinter printer;

        private Writer(Appendable out, List<?> header) throws IOException {
            printer = new CSVPrinter(out, FORMAT);
            row(header);
        }

        /** Writes one row of cells (each through {@link CsvTable#cell}). */
        public void row(List<?> cells) throws IOException {
            for (Object c : cells) {
                printer.print(cell(c));
            }
            printer.println();
        }

        @Override
        public void close() throws IOException {
            printer.close(true);
        }
    }

    /** A row writer on out, the header written first. */
    public static Writer writer(Appendable out, List<?> header) throws IOException {
        return new Writer(out, header);
    }

    /** The whole table as CSV text. */
    public static String text(List<?> header, List<? extends List<?>> rows) {
        StringBuilder b = new StringBuilder();
        try (Writer w = writer(b, header)) {
            for (List<?> r : rows) {
                w.row(r);
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return b.toString();
    }
}
