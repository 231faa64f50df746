package org.axistack.io;

import java.util.Map;

/**
 * Bad input: a stack file or a command-line value that cannot be used. The message is one paragraph
 * naming the file, the line, the electrode and the field where known, what is wrong and how to fix it.
 * The text comes from the {@link StackMessage} catalogue. Unchecked, so that code between the reader and the
 * command line need not declare it; the command line's handler turns it into the message and exit code 2 (methods
 * that throw it still say so in their signatures, as documentation).
 */
public final class StackInputException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    private final StackMessage id;
    private final String source;
    private final int line;
    private final String electrode;
    private final String field;

    /**
     * @param id        the catalogue entry
     * @param source    the file as the user named it (or a description such as "command line")
     * @param line      1-based line, or 0 when no line applies
     * @param electrode electrode name, or null
     * @param field     key name, or null
     * @param values    the placeholder values of the catalogue entry
     */
    public StackInputException(StackMessage id, String source, int line, String electrode, String field,
            Map<String, ?> values) {
        super(compose(id, source, line, electrode, field, values));
        this.id = id;
        this.source = source;
        this.line = line;
        this.electrode = electrode;
        this.field = field;
    }

    private static String compose(StackMessage id, String source, int line, String electrode, String field,
            Map<String, ?> values) {
        StringBuilder sb = new StringBuilder(source == null ? "input" : source);
        if (line > 0) {
            sb.append(", line ").append(line);
        }
        if (electrode != null) {
            sb.append(", electrode '").append(electrode).append('\'');
        }
        if (field != null) {
            sb.append(", field ").append(field);
        }
        sb.append(": ").append(id.format(values));
        return sb.toString().replace('\n', ' ');
    }

    public StackMessage id() {
        return id;
    }

    public String source() {
        return source;
    }

    /** 1-based line, 0 when unknown. */
    public int line() {
        return line;
    }

    /** Electrode name or null. */
    public String electrode() {
        return electrode;
    }

    /** Field (key) name or null. */
    public String field() {
        return field;
    }
}
