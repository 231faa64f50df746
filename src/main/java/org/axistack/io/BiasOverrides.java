package org.axistack.io;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.axistack.model.Stack;

/** Applies {@code --set NAME=VOLTS} overrides to a stack, then re-checks the geometry for touching electrodes. */
public final class BiasOverrides {

    private static final String SOURCE = "command line";

    private BiasOverrides() {
    }

    /**
     * @param stack the stack as read
     * @param sets  the raw --set arguments, each NAME=VOLTS
     * @return the stack with the new biases
     */
    public static Stack apply(Stack stack, List<String> sets) throws StackInputException {
        if (sets == null || sets.isEmpty()) {
            return stack;
        }
        Map<String, Double> biases = parse(stack, sets);
        Stack out = stack.withBiases(biases);
        StackReader.checkGeometry(out.electrodes(), i -> SOURCE + " (--set)", i -> 0);
        return out;
    }

    static Map<String, Double> parse(Stack stack, List<String> sets) throws StackInputException {
        Map<String, Double> biases = new LinkedHashMap<>();
        for (String arg : sets) {
            int eq = arg.indexOf('=');
            if (eq <= 0 || eq == arg.length() - 1) {
                throw new StackInputException(StackMessage.SET_SYNTAX, SOURCE, 0, null, "--set", Map.of("arg", arg));
            }
            String name = arg.substring(0, eq).trim();
            String value = arg.substring(eq + 1).trim();
            if (stack.indexOf(name) < 0) {
                throw new StackInputException(StackMessage.SET_UNKNOWN_NAME, SOURCE, 0, null, "--set",
                        Map.of("name", name, "suggestion", TableFields.suggestion(name, stack.names()),
                                "names", String.join(", ", stack.names())));
            }
            double v;
            try {
                v = Double.parseDouble(value);
            } catch (NumberFormatException e) {
                v = Double.NaN;
            }
            if (!Double.isFinite(v) || Math.abs(v) > Limits.MAX_BIAS_V || !value.matches("[-+]?(\\d+\\.?\\d*|\\.\\d+)([eE][-+]?\\d+)?")) {
                throw new StackInputException(StackMessage.SET_BAD_NUMBER, SOURCE, 0, name, "--set",
                        Map.of("name", name, "value", value));
            }
            if (biases.put(name, v) != null) {
                throw new StackInputException(StackMessage.SET_TWICE, SOURCE, 0, name, "--set", Map.of("name", name));
            }
        }
        return biases;
    }
}
