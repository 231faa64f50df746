package org.axistack.size;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import org.axistack.model.Contour;
import org.axistack.model.Electrode;
import org.axistack.model.Segment;
import org.axistack.model.ZR;

/**
 * The lens families the sizer can search. Every family is symmetric in its sizing parameters and is built
 * around z = 0 (the middle of the stack); every electrode is a "stadium" outline (a slab whose ends are full
 * half-circles), so the surface field is finite everywhere and converges under mesh refinement, unlike at a
 * sharp corner. Lengths in metres.
 *
 * <p>Each family names its sizing parameters (what the requirements may vary) and its machining dimensions
 * (what a workshop controls independently: each gap separately, for example). {@link #dimensions} turns
 * sizing parameters into machining dimensions, {@link #electrodes} builds the electrodes from them.
 */
public enum Family {
    /** Three tubes, the outer two at 0 V, the centre one biased. */
    EINZEL_TUBES("einzel-tubes", "three-tube einzel lens",
            List.of("bore_radius", "gap", "centre_length", "outer_length", "wall"),
            List.of(4.0, 0.0, 2.0, 4.0, 0.25), List.of("centre")),
    /** Three plates with round holes, the outer two at 0 V, the centre one biased. */
    EINZEL_PLATES("einzel-plates", "three-aperture einzel lens",
            List.of("bore_radius", "gap", "thickness", "outer_radius"),
            List.of(0.0, 0.0, 0.5, 4.0), List.of("centre")),
    /** Two tubes, the first at 0 V, the second biased (an immersion lens changes the beam energy). */
    IMMERSION_TUBES("immersion-tubes", "two-tube immersion lens",
            List.of("bore_radius", "gap", "tube_length", "wall"),
            List.of(0.0, 0.0, 6.0, 0.25), List.of("second"));

    private final String keyword;
    private final String description;
    private final List<String> parameters;
    private final List<Double> defaultRatio;
    private final List<String> biased;

    Family(String keyword, String description, List<String> parameters, List<Double> defaultRatio, List<String> biased) {
        this.keyword = keyword;
        this.description = description;
        this.parameters = parameters;
        this.defaultRatio = defaultRatio;
        this.biased = biased;
    }

    /** As written in requirements files. */
    public String keyword() {
        return keyword;
    }

    public String description() {
        return description;
    }

    /** Sizing parameter names (without the _mm suffix of the file). */
    public List<String> parameters() {
        return parameters;
    }

    /**
     * Default of a parameter the requirements leave out, as a multiple of the bore radius (so the default
     * scales with the lens); 0 means the parameter is required.
     */
    public double defaultRatioToBore(String parameter) {
        return defaultRatio.get(parameters.indexOf(parameter));
    }

    /** Names of the biased electrodes (the others are at 0 V). */
    public List<String> biasedElectrodes() {
        return biased;
    }

    public static Family byKeyword(String keyword) {
        for (Family f : values()) {
            if (f.keyword.equals(keyword)) {
                return f;
            }
        }
        return null;
    }

    public static List<String> keywords() {
        List<String> k = new ArrayList<>();
        for (Family f : values()) {
            k.add(f.keyword);
        }
        return k;
    }

    /** Machining dimensions (m) from sizing parameters (m, in {@link #parameters()} order). */
    public Map<String, Double> dimensions(double[] p) {
        Map<String, Double> d = new LinkedHashMap<>();
        switch (this) {
            case EINZEL_TUBES -> {
                d.put("bore_radius", p[0]);
                d.put("gap_in", p[1]);
                d.put("gap_out", p[1]);
                d.put("centre_length", p[2]);
                d.put("outer_length", p[3]);
                d.put("wall", p[4]);
            }
            case EINZEL_PLATES -> {
                d.put("bore_radius", p[0]);
                d.put("gap_in", p[1]);
                d.put("gap_out", p[1]);
                d.put("thickness", p[2]);
                d.put("outer_radius", p[3]);
            }
            case IMMERSION_TUBES -> {
                d.put("bore_radius", p[0]);
                d.put("gap", p[1]);
                d.put("tube_length", p[2]);
                d.put("wall", p[3]);
            }
        }
        return d;
    }

    /**
     * The electrodes for machining dimensions (m) and the bias of the biased electrode(s) (V). The stack is
     * centred on z = 0 for the nominal (symmetric) dimensions.
     */
    public List<Electrode> electrodes(Map<String, Double> d, double[] bias_V) {
        double r = d.get("bore_radius");
        List<Electrode> list = new ArrayList<>();
        switch (this) {
            case EINZEL_TUBES -> {
                double lc = d.get("centre_length"), lo = d.get("outer_length"), w = d.get("wall");
                double c0 = -lc / 2, c1 = lc / 2;
                double e1 = c0 - d.get("gap_in"), x0 = c1 + d.get("gap_out");
                list.add(tube("entry", 0, e1 - lo, e1, r, w));
                list.add(tube("centre", bias_V[0], c0, c1, r, w));
                list.add(tube("exit", 0, x0, x0 + lo, r, w));
            }
            case EINZEL_PLATES -> {
                double t = d.get("thickness"), ro = d.get("outer_radius");
                list.add(plate("entry", 0, -t / 2 - d.get("gap_in") - t / 2, t, r, ro));
                list.add(plate("centre", bias_V[0], 0, t, r, ro));
                list.add(plate("exit", 0, t / 2 + d.get("gap_out") + t / 2, t, r, ro));
            }
            case IMMERSION_TUBES -> {
                double g = d.get("gap"), lt = d.get("tube_length"), w = d.get("wall");
                list.add(tube("first", 0, -g / 2 - lt, -g / 2, r, w));
                list.add(tube("second", bias_V[0], g / 2, g / 2 + lt, r, w));
            }
        }
        return list;
    }

    /** Tube of inner radius r and wall w from z0 to z1, both ends full half-circles of radius w/2. */
    static Electrode tube(String name, double bias, double z0, double z1, double r, double w) {
        double h = w / 2, rm = r + h;
        List<Segment> s = new ArrayList<>();
        s.add(new Segment.Line(new ZR(z0 + h, r), new ZR(z1 - h, r)));
        s.add(new Segment.Arc(new ZR(z1 - h, r), new ZR(z1, rm), new ZR(z1 - h, r + w)));
        s.add(new Segment.Line(new ZR(z1 - h, r + w), new ZR(z0 + h, r + w)));
        s.add(new Segment.Arc(new ZR(z0 + h, r + w), new ZR(z0, rm), new ZR(z0 + h, r)));
        return new Electrode.Outline(name, bias, new Contour(s, true));
    }

    /** Plate of thickness t centred at zc with a hole of radius r (at the rounded nose) and outer radius ro. */
    static Electrode plate(String name, double bias, double zc, double t, double r, double ro) {
        double h = t / 2;
        List<Segment> s = new ArrayList<>();
        s.add(new Segment.Line(new ZR(zc - h, ro - h), new ZR(zc - h, r + h)));
        s.add(new Segment.Arc(new ZR(zc - h, r + h), new ZR(zc, r), new ZR(zc + h, r + h)));
        s.add(new Segment.Line(new ZR(zc + h, r + h), new ZR(zc + h, ro - h)));
        s.add(new Segment.Arc(new ZR(zc + h, ro - h), new ZR(zc, ro), new ZR(zc - h, ro - h)));
        return new Electrode.Outline(name, bias, new Contour(s, true));
    }
}
