package org.axistack.cli;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import picocli.CommandLine.Option;

/**
 * The shared {@code --json} option: the command prints one JSON document (snake_case keys with units in their names)
 * on standard output instead of text. Use with {@code @Mixin JsonOption json;} and ask {@link #on()}.
 */
public final class JsonOption {

    @Option(names = "--json", description = "Print JSON (snake_case keys with units in their names) instead of text.")
    boolean json;

    private static final ObjectMapper MAPPER = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);

    /** Whether JSON was asked for. */
    public boolean on() {
        return json;
    }

    /**
     * The one way a command writes its JSON document: indented, keys in the order the command put them.
     *
     * @param document maps, lists, strings, numbers and booleans (nulls for values that are not finite)
     */
    static String text(Object document) {
        try {
            return MAPPER.writeValueAsString(document);
        } catch (JsonProcessingException e) {
            throw new IllegalStateException("a command built a JSON document that cannot be written", e);
        }
    }
}
