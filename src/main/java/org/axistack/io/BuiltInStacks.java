package org.axistack.io;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import org.axistack.model.Stack;

/** Stacks shipped inside the jar. The demo is a copy of a lens-library file (a test keeps them equal). */
public final class BuiltInStacks {

    /** File name of the demo lens, in lens-library/ and as a resource. */
    public static final String DEMO_FILE = "electron-flood-einzel.toml";
    private static final String RESOURCE = "/org/axistack/demo/" + DEMO_FILE;

    private BuiltInStacks() {
    }

    /** The demo stack's text. */
    public static String demoText() {
        try (InputStream in = BuiltInStacks.class.getResourceAsStream(RESOURCE)) {
            if (in == null) {
                throw new IllegalStateException("the jar lacks its demo resource " + RESOURCE);
            }
            return new String(in.readAllBytes(), java.nio.charset.StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /** The built-in demo lens. */
    public static Stack demo() throws StackInputException {
        return StackReader.parse(demoText(), "built-in demo (" + DEMO_FILE + ")");
    }
}
