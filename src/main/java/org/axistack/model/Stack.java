package org.axistack.model;

import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.OptionalDouble;
import java.util.Set;

/**
 * A validated electrode stack and the beam planned through it. SI units throughout.
 *
 * @param title      free text
 * @param beam       the beam
 * @param electrodes at least one electrode, unique names
 * @param screenZ_m  optional observation plane
 * @param mesh       boundary-element mesh settings
 * @param limits     surface-field limits for breakdown warnings
 * @param sectors    split electrodes by name (empty: every electrode round); a split electrode's bias_V is the
 *                   mean of its sector biases (set here), its round part
 * @param monitors   planes where the beam position is watched (bench monitors), in the order given
 */
public record Stack(String title, Beam beam, List<Electrode> electrodes, OptionalDouble screenZ_m,
        MeshSettings mesh, SurfaceFieldLimits limits, Map<String, Sectors> sectors, List<Monitor> monitors) {

    public Stack {
        title = title == null ? "" : title;
        if (beam == null) {
            throw new IllegalArgumentException("a stack needs a beam");
        }
        electrodes = List.copyOf(electrodes);
        if (electrodes.isEmpty()) {
            throw new IllegalArgumentException("a stack needs at least one electrode");
        }
        Set<String> names = new HashSet<>();
        for (Electrode e : electrodes) {
            if (!names.add(e.name())) {
                throw new IllegalArgumentException("duplicate electrode name '" + e.name() + "'");
            }
        }
        screenZ_m = screenZ_m == null ? OptionalDouble.empty() : screenZ_m;
        mesh = mesh == null ? MeshSettings.defaults() : mesh;
        limits = limits == null ? SurfaceFieldLimits.defaults() : limits;
        sectors = sectors == null ? Map.of() : java.util.Collections.unmodifiableMap(new java.util.LinkedHashMap<>(sectors));
        if (!sectors.isEmpty()) {
            List<Electrode> list = new ArrayList<>();
            for (Electrode e : electrodes) {
                Sectors sec = sectors.get(e.name());
                if (sec != null && e.contour().minR_m() <= 0) {
                    throw new IllegalArgumentException("split electrode '" + e.name() + "' reaches the axis");
                }
                list.add(sec == null ? e : e.withBias_V(sec.common_V()));
            }
            for (String n : sectors.keySet()) {
                if (!names.contains(n)) {
                    throw new IllegalArgumentException("sectors for unknown electrode '" + n + "'");
                }
            }
            electrodes = List.copyOf(list);
        }
        monitors = monitors == null ? List.of() : List.copyOf(monitors);
    }

    public Stack(String title, Beam beam, List<Electrode> electrodes, OptionalDouble screenZ_m, MeshSettings mesh,
            SurfaceFieldLimits limits, Map<String, Sectors> sectors) {
        this(title, beam, electrodes, screenZ_m, mesh, limits, sectors, List.of());
    }

    public Stack(String title, Beam beam, List<Electrode> electrodes, OptionalDouble screenZ_m, MeshSettings mesh,
            SurfaceFieldLimits limits) {
        this(title, beam, electrodes, screenZ_m, mesh, limits, Map.of(), List.of());
    }

    public Stack(String title, Beam beam, List<Electrode> electrodes) {
        this(title, beam, electrodes, OptionalDouble.empty(), MeshSettings.defaults(), SurfaceFieldLimits.defaults());
    }

    /** The stack with electrode {@code name} split (or its sectors replaced). */
    public Stack withSectors(String name, Sectors s) {
        electrode(name);
        Map<String, Sectors> m = new java.util.LinkedHashMap<>(sectors);
        m.put(name, s);
        return new Stack(title, beam, electrodes, screenZ_m, mesh, limits, m, monitors);
    }

    /** The stack with another title (everything else kept). */
    public Stack withTitle(String newTitle) {
        return new Stack(newTitle, beam, electrodes, screenZ_m, mesh, limits, sectors, monitors);
    }

    /** The stack with other monitor planes. */
    public Stack withMonitors(List<Monitor> newMonitors) {
        return new Stack(title, beam, electrodes, screenZ_m, mesh, limits, sectors, newMonitors);
    }

    /** Label of monitor i: its name, or "monitor i+1" when it has none. */
    public String monitorLabel(int i) {
        String n = monitors.get(i).name();
        return n.isEmpty() ? "monitor " + (i + 1) : n;
    }

    public int indexOf(String electrodeName) {
        for (int i = 0; i < electrodes.size(); i++) {
            if (electrodes.get(i).name().equals(electrodeName)) {
                return i;
            }
        }
        return -1;
    }

    public Electrode electrode(String electrodeName) {
        int i = indexOf(electrodeName);
        if (i < 0) {
            throw new IllegalArgumentException("no electrode named '" + electrodeName + "'");
        }
        return electrodes.get(i);
    }

    /** Biases in electrode order, volts. */
    public double[] biases_V() {
        return electrodes.stream().mapToDouble(Electrode::bias_V).toArray();
    }

    public List<String> names() {
        return electrodes.stream().map(Electrode::name).toList();
    }

    public Stack withBias(String electrodeName, double bias_V) {
        return withBiases(Map.of(electrodeName, bias_V));
    }

    public Stack withBiases(Map<String, Double> biases_V) {
        List<Electrode> list = new ArrayList<>();
        for (Electrode e : electrodes) {
            Double b = biases_V.get(e.name());
            list.add(b == null ? e : e.withBias_V(b));
        }
        for (String n : biases_V.keySet()) {
            electrode(n);
        }
        return new Stack(title, beam, list, screenZ_m, mesh, limits, shiftedSectors(list), monitors);
    }

    public Stack withBiases(double[] biases_V) {
        if (biases_V.length != electrodes.size()) {
            throw new IllegalArgumentException("need " + electrodes.size() + " biases, got " + biases_V.length);
        }
        List<Electrode> list = new ArrayList<>();
        for (int i = 0; i < biases_V.length; i++) {
            list.add(electrodes.get(i).withBias_V(biases_V[i]));
        }
        return new Stack(title, beam, list, screenZ_m, mesh, limits, shiftedSectors(list), monitors);
    }

    /** The stack's biases as a value (electrodes and sectors). */
    public Biases biases() {
        return Biases.of(this);
    }

    /** The stack at other biases (same electrode names in the same order; sector biases for split electrodes). */
    public Stack withBiases(Biases b) {
        if (!b.names().equals(names())) {
            throw new IllegalArgumentException("the biases name other electrodes than the stack's: " + b.names());
        }
        for (String n : b.sectors_V().keySet()) {
            if (!sectors.containsKey(n)) {
                throw new IllegalArgumentException("sector biases for electrode '" + n + "', which is not split");
            }
        }
        List<Electrode> list = new ArrayList<>();
        for (int i = 0; i < electrodes.size(); i++) {
            list.add(electrodes.get(i).withBias_V(b.volts_V().get(i)));
        }
        Map<String, Sectors> m = new java.util.LinkedHashMap<>(shiftedSectors(list));
        b.sectors_V().forEach((n, v) -> m.put(n, sectors.get(n).withBiases_V(v)));
        return new Stack(title, beam, list, screenZ_m, mesh, limits, m);
    }

    /** What a field solution of this stack depends on besides the mesh (its electrodes at 0 V). */
    public GeometryKey geometryKey() {
        return GeometryKey.of(this);
    }

    public Stack withBeam(Beam newBeam) {
        return new Stack(title, newBeam, electrodes, screenZ_m, mesh, limits, sectors, monitors);
    }

    public Stack withMesh(MeshSettings newMesh) {
        return new Stack(title, beam, electrodes, screenZ_m, newMesh, limits, sectors, monitors);
    }

    public Stack withLimits(SurfaceFieldLimits newLimits) {
        return new Stack(title, beam, electrodes, screenZ_m, mesh, newLimits, sectors, monitors);
    }

    /**
     * The stack with every length multiplied by k (&gt; 0): electrodes, beam start and object points, screen.
     * Mesh settings (element counts and edge levels) are kept, so the mesh scales with the geometry.
     */
    public Stack scaled(double k) {
        if (!(k > 0) || !Double.isFinite(k)) {
            throw new IllegalArgumentException("scale factor must be positive and finite: " + k);
        }
        return transformed(e -> e.scaled(k), z -> z * k);
    }

    /** The stack with every z (electrodes, beam start and object points, screen) shifted by dz_m. */
    public Stack shifted(double dz_m) {
        if (!Double.isFinite(dz_m)) {
            throw new IllegalArgumentException("shift must be finite: " + dz_m);
        }
        return transformed(e -> e.shifted(dz_m), z -> z + dz_m);
    }

    /**
     * The stack reflected z -&gt; -z, electrode order kept. The beam's start and object points are reflected
     * too (a beam still travels toward +z, so a stack with either set usually needs them chosen anew).
     */
    public Stack mirrored() {
        return transformed(Electrode::mirrored, z -> -z);
    }

    private Stack transformed(java.util.function.UnaryOperator<Electrode> e, java.util.function.DoubleUnaryOperator z) {
        List<Electrode> list = electrodes.stream().map(e).toList();
        double k = Math.abs(z.applyAsDouble(1) - z.applyAsDouble(0));
        // offsets scale with the lengths; a reflection z -> -z turns the slopes over
        double turn = Math.signum(z.applyAsDouble(1) - z.applyAsDouble(0));
        StartRay r = beam.startRay();
        Beam b = new Beam(beam.particle(), beam.energy_eV(), map(beam.startZ_m(), z), map(beam.objectZ_m(), z),
                new StartRay(r.x_m() * k, r.y_m() * k, turn * r.slopeX_rad(), turn * r.slopeY_rad()));
        Map<String, Sectors> m = new java.util.LinkedHashMap<>();
        sectors.forEach((n, s) -> m.put(n, s.scaled(k)));
        List<Monitor> mon = monitors.stream().map(x -> new Monitor(x.name(), z.applyAsDouble(x.z_m()))).toList();
        return new Stack(title, b, list, map(screenZ_m, z), mesh, limits, m, mon);
    }

    /**
     * Sectors following new electrode biases: a split electrode whose bias changed has every sector moved by the
     * change (differentials kept).
     */
    private Map<String, Sectors> shiftedSectors(List<Electrode> newElectrodes) {
        if (sectors.isEmpty()) {
            return sectors;
        }
        Map<String, Sectors> m = new java.util.LinkedHashMap<>();
        for (Electrode e : newElectrodes) {
            Sectors s = sectors.get(e.name());
            if (s != null) {
                double dv = e.bias_V() - s.common_V();
                m.put(e.name(), dv == 0 ? s : s.shifted_V(dv));
            }
        }
        return m;
    }

    /** The split electrodes' sectors by electrode index (stack order), as the harmonic solvers take them. */
    public Map<Integer, Sectors> sectorsByIndex() {
        Map<Integer, Sectors> m = new java.util.LinkedHashMap<>();
        sectors.forEach((n, s) -> m.put(indexOf(n), s));
        return m;
    }

    /** Whether any electrode is split into sectors. */
    public boolean hasSectors() {
        return !sectors.isEmpty();
    }

    private static OptionalDouble map(OptionalDouble v, java.util.function.DoubleUnaryOperator f) {
        return v.isPresent() ? OptionalDouble.of(f.applyAsDouble(v.getAsDouble())) : v;
    }

    /** Leftmost z of any electrode, m. */
    public double minZ_m() {
        return electrodes.stream().mapToDouble(e -> e.contour().minZ_m()).min().orElseThrow();
    }

    /** Rightmost z of any electrode, m. */
    public double maxZ_m() {
        return electrodes.stream().mapToDouble(e -> e.contour().maxZ_m()).max().orElseThrow();
    }

    /**
     * Smallest radius any electrode reaches, m; 0 if an electrode crosses the axis (a closed electrode counts:
     * the sizing's least-bore limit). For the bore a beam passes through, see {@link #openBore_m()}.
     */
    public double minBore_m() {
        return electrodes.stream().mapToDouble(e -> e.contour().minR_m()).min().orElseThrow();
    }

    /** The stack's z extent widened by half its length on each side, m: see {@link #fringeRange_m(List)}. */
    public double[] fringeRange_m() {
        return fringeRange_m(electrodes);
    }

    /**
     * The z extent of some electrodes widened by half its length on each side, m ({lo, hi}): where fringe fields
     * outside plate lenses are looked for (the optics' scan for field-free planes, the axial expansion's table).
     * One place for the widening, so the optics never scans beyond the tabulated axis.
     */
    public static double[] fringeRange_m(List<Electrode> electrodes) {
        double lo = electrodes.stream().mapToDouble(e -> e.contour().minZ_m()).min().orElseThrow();
        double hi = electrodes.stream().mapToDouble(e -> e.contour().maxZ_m()).max().orElseThrow();
        double span = Math.max(hi - lo, 1e-6);
        return new double[] {lo - 0.5 * span, hi + 0.5 * span};
    }

    /**
     * The narrowest open bore, m: the smallest radius reached by an electrode that leaves the axis open. Default
     * beams, ray fans, envelope radii and field-map extents scale with it (the one place for that scale). A
     * stack in which every electrode closes the axis has no open bore; half its largest radius stands in.
     */
    public double openBore_m() {
        double b = electrodes.stream().mapToDouble(e -> e.contour().minR_m()).filter(r -> r > 0).min().orElse(0);
        return b > 0 ? b : electrodes.stream().mapToDouble(e -> e.contour().maxR_m()).max().orElseThrow() / 2;
    }
}
