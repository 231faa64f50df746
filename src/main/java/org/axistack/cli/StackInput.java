package org.axistack.cli;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.axistack.io.BiasOverrides;
import org.axistack.io.BuiltInStacks;
import org.axistack.io.StackInputException;
import org.axistack.io.StackReader;
import org.axistack.model.MeshSettings;
import org.axistack.model.Stack;
import picocli.CommandLine;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/**
 * Shared options of every command that reads a stack: the STACK file, repeatable
 * {@code --set NAME=VOLTS} and {@code --mesh-accuracy REL}. Use it with {@code @Mixin StackInput input;}.
 */
public final class StackInput {

    @Parameters(index = "0", arity = "0..1", paramLabel = "STACK",
            description = "Stack file (TOML, lengths in mm); optional: when omitted, the built-in demo lens"
                    + " (lens-library/" + BuiltInStacks.DEMO_FILE + ") is used.")
    Path stack;

    @Option(names = "--set", paramLabel = "NAME=VOLTS",
            description = "Override the bias of electrode NAME, in volts (repeatable), e.g. --set focus=-1400.")
    List<String> sets = new ArrayList<>();

    @Option(names = "--mesh-accuracy", paramLabel = "REL", converter = AccuracyConverter.class,
            description = "Refine the mesh until the estimated error of the potential is at most REL of the largest bias"
                    + " difference (e.g. 1e-7); overrides [mesh] accuracy (optics --accuracy is the accuracy asked of the cardinal elements); the element cap is [mesh] target_elements or "
                    + MeshSettings.DEFAULT_ACCURACY_CAP + ", whichever is larger.")
    Double accuracy;

    /** --mesh-accuracy: a number within the accepted range, or a message naming the range. */
    static final class AccuracyConverter implements CommandLine.ITypeConverter<Double> {
        @Override
        public Double convert(String value) {
            double a;
            try {
                a = Double.parseDouble(value.trim());
            } catch (NumberFormatException e) {
                throw new CommandLine.TypeConversionException("'" + value + "' is not a number; give a relative accuracy"
                        + " such as 1e-7");
            }
            if (!(a >= MeshSettings.MIN_ACCURACY && a <= MeshSettings.MAX_ACCURACY)) {
                throw new CommandLine.TypeConversionException(value + " is outside " + MeshSettings.MIN_ACCURACY + " .. "
                        + MeshSettings.MAX_ACCURACY + "; give a relative accuracy such as 1e-7");
            }
            return a;
        }
    }

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
        s = BiasOverrides.apply(s, sets);
        if (accuracy != null) {
            MeshSettings m = s.mesh();
            s = s.withMesh(m.withAccuracy(accuracy)
                    .withTargetElements(Math.max(m.targetElements(), MeshSettings.DEFAULT_ACCURACY_CAP)));
        }
        return s;
    }
}
