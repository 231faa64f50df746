package org.axistack.ui;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.Optional;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

import org.axistack.io.AtomicFiles;
import org.axistack.io.StackInputException;
import org.axistack.io.StackReader;
import org.axistack.io.StackWriter;
import org.axistack.model.Stack;

/**
 * The stack file being edited: its text as last saved and as edited now, and where it lives. Biases moved
 * with the controls are written back into the text in place ({@link #textWithBiases}), so comments and
 * layout survive a save; the result is read back and checked before it is used. Immutable: edits return a
 * new document.
 *
 * @param path      where the file is (empty for the built-in demo until it is saved somewhere)
 * @param shownAs   how the file is named in messages and the title
 * @param savedText the text as on disk (or as built in)
 * @param text      the text now
 */
public record StackDocument(Optional<Path> path, String shownAs, String savedText, String text) {

    private static final Pattern TABLE = Pattern.compile("^\\s*\\[.*$");
    private static final Pattern ELECTRODE = Pattern.compile("^\\s*\\[\\[\\s*electrode\\s*]]\\s*(#.*)?$");
    private static final Pattern BIAS = Pattern.compile("^(\\s*bias_V\\s*=\\s*)([^#\\s]+)(.*)$");

    /** Reads a file (UTF-8). */
    public static StackDocument open(Path file) throws IOException {
        String t = new String(Files.readAllBytes(file), StandardCharsets.UTF_8);
        return new StackDocument(Optional.of(file), file.toString(), t, t);
    }

    /** A document for text that has no file yet (the built-in demo). */
    public static StackDocument unsaved(String name, String text) {
        return new StackDocument(Optional.empty(), name, text, text);
    }

    /** Whether the text differs from what is on disk. */
    public boolean modified() {
        return !text.equals(savedText);
    }

    /** The same document with edited text. */
    public StackDocument withText(String newText) {
        return new StackDocument(path, shownAs, savedText, newText);
    }

    /** Reads and checks the text (the same reader and messages as the command line). */
    public Stack parse() throws StackInputException {
        return StackReader.parse(text, shownAs);
    }

    /**
     * The text with each electrode's {@code bias_V} value replaced by the given bias (volts, electrode order),
     * keeping every other character. Falls back to the canonical writer ({@link StackWriter#toToml}) if the
     * text cannot be edited in place (an electrode table written in another TOML form), so the result always
     * reads back to the stack with these biases.
     */
    public String textWithBiases(Stack parsed, double[] biases_V) {
        Stack target = parsed.withBiases(biases_V);
        String edited = replaceBiases(text, biases_V);
        if (edited != null) {
            try {
                Stack back = StackReader.parse(edited, shownAs);
                if (Arrays.equals(back.biases_V(), target.biases_V())
                        && back.names().equals(target.names())) {
                    return edited;
                }
            } catch (StackInputException e) {
                // fall through to the canonical form
            }
        }
        return StackWriter.toToml(target);
    }

    /** Replaces the value of the first bias_V line in each [[electrode]] table, or null if that is not possible. */
    static String replaceBiases(String text, double[] biases_V) {
        String[] lines = text.split("\n", -1);
        int electrode = -1;
        boolean done = true;
        for (int i = 0; i < lines.length; i++) {
            String line = lines[i];
            if (ELECTRODE.matcher(line).matches()) {
                if (!done) {
                    return null;
                }
                electrode++;
                done = false;
            } else if (TABLE.matcher(line).matches()) {
                if (!done) {
                    return null;
                }
                done = true;
            } else if (!done) {
                Matcher m = BIAS.matcher(line);
                if (m.matches()) {
                    if (electrode >= biases_V.length) {
                        return null;
                    }
                    lines[i] = m.group(1) + tomlNumber(biases_V[electrode]) + m.group(3);
                    done = true;
                }
            }
        }
        if (!done || electrode != biases_V.length - 1) {
            return null;
        }
        return String.join("\n", lines);
    }

    /** A volt value as a TOML float. */
    static String tomlNumber(double v) {
        String s = UiFormat.volts(v);
        return s.contains(".") ? s : s + ".0";
    }

    /** Writes text to the file atomically (temporary file, then move) and returns the saved document. */
    public StackDocument saveAs(Path file, String newText) throws IOException {
        AtomicFiles.writeString(file, newText);
        return new StackDocument(Optional.of(file), file.toString(), newText, newText);
    }
}
