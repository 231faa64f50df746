package org.axistack.cli;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.axistack.io.BiasOverrides;
import org.axistack.io.BuiltInStacks;
import org.axistack.io.StackInputException;
import org.axistack.io.StackReader;
import org.axistack.model.Stack;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/**
 * Shared options of every command that reads a stack: the STACK file and repeatable
 * {@code --set NAME=VOLTS}. Use it with {@code @Mixin StackInput input;}.
 */
public final class StackInput {

    @Parameters(index = "0", arity = "0..1", paramLabel = "STACK",
            description = "Stack file (TOML, lengths in mm); optional: when omitted, the built-in demo lens"
                    + " (lens-library/" + BuiltInStacks.DEMO_FILE + ") is used.")
    Path stack;

    @Option(names = "--set", paramLabel = "NAME=VOLTS",
            description = "Override the bias of electrode NAME, in volts (repeatable), e.g. --set focus=-1400.")
    List<String> sets = new ArrayList<>();

    /** The STACK argument, or null when omitted. */
    public Path path() {
        return stack;
    }

    /** How the stack is named in messages. */
    public String shownAs() {
        return stack == null ? "built-in demo (" + BuiltInStacks.DEMO_FILE + ")" : stack.toString();
    }

    /** Loads STACK (or the built-in demo when it is omitted) and applies --set. */
    public Stack loadOrDemo() throws StackInputException {
        Stack s = stack == null ? BuiltInStacks.demo() : StackReader.read(stack);
        return BiasOverrides.apply(s, sets);
    }
}
