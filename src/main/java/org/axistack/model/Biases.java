package org.axistack.model;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * The volts a solved geometry is at: one bias per electrode, by name in stack order, and for each split electrode
 * its sector biases (whose mean is that electrode's bias, its round part). A value: "copy the biases, set one"
 * is {@link #with(String, double)}, and a field at these biases is the solution's superposition.
 *
 * @param names     electrode names, stack order
 * @param volts_V   one bias per name, volts
 * @param sectors_V sector biases of split electrodes by name, volts (empty: every electrode round)
 */
public record Biases(List<String> names, List<Double> volts_V, Map<String, List<Double>> sectors_V) {

    public Biases {
        names = List.copyOf(names);
        volts_V = List.copyOf(volts_V);
        if (names.size() != volts_V.size()) {
            throw new IllegalArgumentException("need one bias per electrode: " + names.size() + " names, "
                    + volts_V.size() + " biases");
        }
        for (double v : volts_V) {
            if (!Double.isFinite(v)) {
                throw new IllegalArgumentException("non-finite bias " + v);
            }
        }
        Map<String, List<Double>> copy = new LinkedHashMap<>();
        for (Map.Entry<String, List<Double>> e : (sectors_V == null ? Map.<String, List<Double>>of() : sectors_V)
                .entrySet()) {
            if (!names.contains(e.getKey())) {
                throw new IllegalArgumentException("sector biases for unknown electrode '" + e.getKey() + "'");
            }
            List<Double> s = List.copyOf(e.getValue());
            double mean = s.stream().mapToDouble(Double::doubleValue).average().orElse(Double.NaN);
            double own = volts_V.get(names.indexOf(e.getKey()));
            if (!(Math.abs(mean - own) <= 1e-9 * Math.max(1, Math.abs(own)))) {
                throw new IllegalArgumentException("electrode '" + e.getKey() + "': its bias " + own
                        + " V is not the mean of its sector biases (" + mean + " V)");
            }
            copy.put(e.getKey(), s);
        }
        sectors_V = java.util.Collections.unmodifiableMap(copy);
    }

    /** The biases a stack holds (electrodes and sectors). */
    public static Biases of(Stack stack) {
        Map<String, List<Double>> sec = new LinkedHashMap<>();
        stack.sectors().forEach((n, s) -> sec.put(n, s.biases_V()));
        return new Biases(stack.names(), stack.electrodes().stream().map(Electrode::bias_V).toList(), sec);
    }

    /** Round biases in this electrode order. */
    public static Biases of(List<String> names, double[] volts_V) {
        List<Double> v = new ArrayList<>();
        for (double x : volts_V) {
            v.add(x);
        }
        return new Biases(names, v, Map.of());
    }

    /** Index of an electrode by name. */
    public int indexOf(String name) {
        int i = names.indexOf(name);
        if (i < 0) {
            throw new IllegalArgumentException("no electrode named '" + name + "'");
        }
        return i;
    }

    /** The bias of one electrode, V. */
    public double get_V(String name) {
        return volts_V.get(indexOf(name));
    }

    /**
     * The same biases with one electrode at a new bias. A split electrode's sectors all move by the change (a
     * common-mode change: its steering and stigmation differentials stay).
     */
    public Biases with(String name, double bias_V) {
        int i = indexOf(name);
        List<Double> v = new ArrayList<>(volts_V);
        double change = bias_V - v.get(i);
        v.set(i, bias_V);
        Map<String, List<Double>> sec = new LinkedHashMap<>(sectors_V);
        List<Double> s = sec.get(name);
        if (s != null) {
            sec.put(name, s.stream().map(x -> x + change).toList());
        }
        return new Biases(names, v, sec);
    }

    /** The electrode biases as an array in stack order, V (a fresh copy). */
    public double[] toArray_V() {
        return volts_V.stream().mapToDouble(Double::doubleValue).toArray();
    }
}
