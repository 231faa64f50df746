package org.axistack.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;

import org.axistack.field.BemSolver;
import org.axistack.field.BiasedField;
import org.axistack.field.Field;
import org.axistack.io.StackInputException;
import org.axistack.io.TraceTableCsv;
import org.axistack.model.PhysicsException;
import org.axistack.model.Units;
import org.axistack.model.Beam;
import org.axistack.model.Stack;
import org.axistack.report.SafetyNotice;
import org.axistack.trace.BundleResult;
import org.axistack.trace.BundleTracer;
import org.axistack.trace.ElectrodeGeometry;
import org.axistack.trace.FieldMap;
import org.axistack.trace.PlaneStatistics;
import org.axistack.trace.RayPoint;
import org.axistack.trace.RaySet;
import org.axistack.trace.RaySets;
import org.axistack.trace.TraceProgress;
import org.axistack.trace.TraceSettings;
import org.axistack.trace.TraceStatus;
import org.axistack.trace.TraceTargets;
import org.axistack.trace.Tracer;
import org.axistack.trace.Trajectory;


import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/**
 * {@code trace [STACK] [ray-set options] [--planes Z1,Z2,...] [--table FILE.csv] [--json]}: exact rays
 * and bundles through the solved stack, a table of every ray at every plane, beam radius per plane.
 */
@Command(name = "trace", mixinStandardHelpOptions = true,
        header = "Traces exact rays to the screen: beam radius, ray tables.",
        description = {"Trace exact (relativistic Lorentz-force) rays through the stack's field: a bundle of rays"
            + " from the beam start to the screen, with the beam radius (rms and max) on chosen planes and, with"
            + " --table, every ray at every plane as CSV for bench alignment. Without STACK it uses the built-in"
            + " demo lens.", "Exit 1 if rays are lost (electrode hit, reflection, leaving the region) unless"
            + " --allow-losses."})
final class TraceCommand implements Callable<Integer> {

    /** Shapes of ray sets. */
    enum Kind { disk, gaussian, fan, ring }

    @Spec
    CommandSpec spec;

    @Mixin
    StackInput input;

    @Mixin
    QuietOption quiet;

    @Option(names = "--rays", paramLabel = "KIND", description = "Ray set: disk (parallel, uniform), gaussian (parallel),"
            + " fan (from a point), ring. Default: fan from the beam's object point if the stack has one, else disk.")
    Kind kind;

    @Option(names = "--count", paramLabel = "N", description = "Number of rays (fan: angles per azimuth). Default 100 (fan 21).")
    Integer count;

    @Option(names = "--radius", paramLabel = "MM", description = "Disk or ring radius, mm. Default 40%% of the narrowest bore.")
    Double radiusMm;

    @Option(names = "--sigma", paramLabel = "MM", description = "Gaussian beam standard deviation in x and y, mm. Default 15%% of the bore.")
    Double sigmaMm;

    @Option(names = "--cutoff", paramLabel = "MM", description = "Gaussian beam cut-off radius, mm. Default 3 sigma.")
    Double cutoffMm;

    @Option(names = "--half-angle", paramLabel = "MRAD", description = "Fan half-angle, mrad. Default 20.")
    double halfAngleMrad = 20;

    @Option(names = "--azimuths", paramLabel = "N", description = "Fan: 1 for a meridional fan, more for cones. Default 1.")
    int azimuths = 1;

    @Option(names = "--source-x", paramLabel = "MM", description = "Fan: off-axis source position x, mm. Default 0.")
    double sourceXMm;

    @Option(names = "--slope", paramLabel = "MRAD", description = "Ring: radial slope of every ray, mrad (negative converges). Default 0.")
    double slopeMrad;

    @Option(names = "--start-z", paramLabel = "MM", description = "Where rays start, mm. Default: the beam's object point for fans,"
            + " else the beam's start_z_mm, else the stack's left end.")
    Double startZMm;

    @Option(names = "--energy-offsets", split = ",", paramLabel = "EV", description = "Repeat every ray at these energy offsets, eV (e.g. -1,0,1).")
    List<Double> energyOffsets;

    @Option(names = "--energy-sigma", paramLabel = "EV", description = "Gaussian energy spread (standard deviation), eV.")
    Double energySigma;

    @Option(names = "--seed", paramLabel = "N", description = "Seed for random ray sets and energy spreads. Default 1.")
    long seed = 1;

    @Option(names = "--screen", paramLabel = "MM", description = "End plane, mm. Default: the stack's screen, else its right end.")
    Double screenMm;

    @Option(names = "--planes", split = ",", paramLabel = "Z", description = "Observation planes, mm (e.g. --planes=-10,0,20). Default: the screen.")
    List<Double> planesMm;

    @Option(names = "--table", paramLabel = "FILE.csv", description = "Write every ray at every plane as CSV.")
    Path table;

    @Mixin
    JsonOption json;

    @Option(names = "--threads", paramLabel = "N", description = "Worker threads. Default: the number of cores.")
    Integer threads;

    @Option(names = "--exact", description = "Evaluate the boundary-element field directly at every step (slow) instead of"
            + " the near-axis series plus field map.")
    boolean exact;

    @Option(names = "--map-step", paramLabel = "MM", description = "Field map node spacing, mm. Default: bore radius / 40.")
    Double mapStepMm;

    @Option(names = "--tolerance", paramLabel = "REL", description = "Relative tolerance of the integrator. Default 1e-11.")
    double tolerance = 1e-11;

    @Option(names = "--aberrations", description = "Also fit Cs and Cc to exact traces (image side, object at infinity) and"
            + " print them beside the paraxial values and the aberration integrals, with the spot budget.")
    boolean aberrations;

    @Option(names = "--emittance", paramLabel = "MM_MRAD", description = "Spot budget: image-side edge emittance"
            + " (half-width x half-angle), mm mrad. Default 0.")
    double emittanceMmMrad;

    @Option(names = "--energy-width", paramLabel = "EV", description = "Spot budget: full energy width of the beam, eV. Default 0.")
    double energyWidthEv;

    @Option(names = "--allow-losses", description = "Exit 0 even when rays hit electrodes, turn back or leave the region.")
    boolean allowLosses;

    @Override
    public Integer call() throws StackInputException {
        Stack stack = input.loadOrDemo();
        OutputCheck.file(spec.commandLine(), "--table", table);
        PrintWriter out = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        Beam beam = stack.beam();
        ElectrodeGeometry geometry = ElectrodeGeometry.of(stack);
        double bore = stack.openBore_m();
        Kind k = kind != null ? kind : beam.objectZ_m().isPresent() ? Kind.fan : Kind.disk;
        double startZ = startZMm != null ? Units.mmToM(startZMm)
                : k == Kind.fan && beam.objectZ_m().isPresent() ? beam.objectZ_m().getAsDouble()
                : beam.startZ_m().orElse(stack.minZ_m());
        double screenZ = screenMm != null ? Units.mmToM(screenMm) : stack.screenZ_m().orElse(stack.maxZ_m());
        List<Double> planes = new ArrayList<>();
        if (planesMm == null || planesMm.isEmpty()) {
            planes.add(screenZ);
        } else {
            for (double z : planesMm) {
                planes.add(Units.mmToM(z));
            }
        }
        RaySet rays;
        TraceTargets targets;
        Tracer tracer;
        long wanted = (long) (count != null ? count : k == Kind.fan ? 21 : 100) * (k == Kind.fan ? Math.max(1, azimuths) : 1)
                * (energyOffsets != null && !energyOffsets.isEmpty() ? energyOffsets.size() : 1);
        int most = BundleTracer.maxRaysForHeap(planes.size());
        if (wanted > most) {
            throw usage(String.format(Locale.ROOT, "%d rays at %d plane(s) are more than this heap can hold (at most %d;"
                    + " about %d MB of heap): lower --count%s, or start Java with a larger -Xmx", wanted, planes.size(),
                    most, Runtime.getRuntime().maxMemory() >> 20, k == Kind.fan ? " or --azimuths" : ""));
        }
        try {
            rays = raySet(k, beam, startZ, bore);
            targets = new TraceTargets(planes, screenZ);
            TraceSettings.defaults().withRelativeTolerance(tolerance); // checks the tolerance's range
            Tracer.checkTargets(geometry, targets);
            for (var r : rays.rays()) {
                Tracer.checkPlacement(geometry, r, targets);
            }
        } catch (IllegalArgumentException | PhysicsException e) {
            throw usage(e.getMessage());
        }

        if (!exact) {
            double step = mapStepMm != null ? Units.mmToM(mapStepMm) : FieldMap.defaultStep_m(bore);
            if (!(step > 0) || !Double.isFinite(step)) {
                throw usage("--map-step must be a positive number of mm");
            }
            double[] zr = FieldMap.zRange_m(geometry, startZ, screenZ, step);
            double z0 = zr[0];
            double z1 = zr[1];
            try {
                FieldMap.checkStep(z0, z1, bore, step);
            } catch (PhysicsException e) {
                throw usage("--map-step: " + e.getMessage());
            }
        }
        PrintWriter progress = quiet.on() ? new PrintWriter(java.io.Writer.nullWriter()) : err;
        progress.println("solving the field (" + stack.mesh().targetElements() + " elements) ...");
        BiasedField biased = BemSolver.solve(stack.electrodes(), stack.mesh(), SolveReporter.to(err, quiet.on()))
                .withBiases(stack.biases_V());
        Field field = biased;
        String method;
        if (exact) {
            method = "boundary-element field evaluated directly at every step";
        } else {
            double step = mapStepMm != null ? Units.mmToM(mapStepMm) : FieldMap.defaultStep_m(bore);
            progress.println("mapping the field ...");
            FieldMap map = FieldMap.forRays(biased, geometry, startZ, screenZ, bore, step, TraceProgress.none());
            field = map;
            method = String.format(Locale.ROOT, "near-axis series of the axial potential's Chebyshev expansion (relative"
                    + " error %s) plus a %s mm map of the remainder (measured map error: %s V, %s V/mm); direct element"
                    + " sums near electrodes and beyond r = %s mm", sci(biased.axialExpansionError()),
                    num(Units.mToMm(step)), sci(map.maxPotentialError_V()),
                    sci(Units.vPerMToVPerMm(map.maxFieldError_V_per_m())), num(Units.mToMm(bore)));
        }
        tracer = new Tracer(field, geometry, TraceSettings.defaults().withRelativeTolerance(tolerance));
        int nThreads = threads != null ? threads : Runtime.getRuntime().availableProcessors();
        BundleResult res;
        try {
            res = new BundleTracer(tracer, Math.max(1, nThreads)).trace(rays, targets, progressRays(progress));
        } catch (IllegalArgumentException | PhysicsException e) {
            throw usage(e.getMessage());
        }
        TracedAberrationSection ab = null;
        if (aberrations) {
            progress.println("fitting aberrations to exact traces ...");
            try {
                ab = new TracedAberrationSection(stack, biased, tracer, bore, emittanceMmMrad * 1e-6, energyWidthEv);
            } catch (IllegalArgumentException | PhysicsException e) {
                throw usage("--aberrations: " + e.getMessage());
            }
        }
        if (table != null) {
            writeTable(res);
        }
        if (json.on()) {
            printJson(out, stack, res, method, ab);
        } else {
            printText(out, stack, res, method);
            if (ab != null) {
                ab.print(out);
            }
            out.println();
            out.println(SafetyNotice.text());
        }
        int lost = res.lost();
        if (lost > 0 && !allowLosses) {
            throw new OutcomeException(lossMessage(res));
        }
        return 0;
    }

    /** What went wrong with lost rays and what to do, one clause per way of ending. */
    static String lossMessage(BundleResult res) {
        List<String> why = new ArrayList<>();
        Map<TraceStatus, Integer> c = res.statusCounts();
        if (c.containsKey(TraceStatus.HIT)) {
            why.add(c.get(TraceStatus.HIT) + " hit electrodes (shrink the beam or its angles, or centre it)");
        }
        if (c.containsKey(TraceStatus.REFLECTED)) {
            why.add(c.get(TraceStatus.REFLECTED) + " turned back (a bias reaches past the beam's energy per charge:"
                    + " weaken that bias or raise the beam energy)");
        }
        if (c.containsKey(TraceStatus.LEFT_REGION)) {
            why.add(c.get(TraceStatus.LEFT_REGION) + " left the traced region (start them inside the bore, aimed forward)");
        }
        if (c.containsKey(TraceStatus.STEP_LIMIT)) {
            why.add(c.get(TraceStatus.STEP_LIMIT) + " ran out of integration steps (loosen --tolerance)");
        }
        return String.format(Locale.ROOT, "%d of %d rays did not reach the screen: %s. The outputs are complete;"
                + " pass --allow-losses if the losses are intended", res.lost(), res.trajectories().size(),
                String.join("; ", why));
    }


    private RaySet raySet(Kind k, Beam beam, double startZ, double bore) {
        double e = beam.energy_eV();
        RaySet set = switch (k) {
            case disk -> RaySets.uniformDisk(beam.particle(), e, startZ,
                    radiusMm != null ? Units.mmToM(radiusMm) : 0.4 * bore, count != null ? count : 100, seed);
            case gaussian -> {
                double sigma = sigmaMm != null ? Units.mmToM(sigmaMm) : 0.15 * bore;
                yield RaySets.gaussianBeam(beam.particle(), e, startZ, sigma,
                        cutoffMm != null ? Units.mmToM(cutoffMm) : 3 * sigma, count != null ? count : 100, seed);
            }
            case fan -> RaySets.pointFan(beam.particle(), e, startZ, Units.mmToM(sourceXMm),
                    Units.mradToRad(halfAngleMrad), count != null ? count : 21, azimuths);
            case ring -> RaySets.ring(beam.particle(), e, startZ, radiusMm != null ? Units.mmToM(radiusMm) : 0.4 * bore,
                    Units.mradToRad(slopeMrad), count != null ? count : 100);
        };
        if (energyOffsets != null && !energyOffsets.isEmpty()) {
            set = set.withEnergyOffsets(energyOffsets);
        }
        if (energySigma != null) {
            set = set.withGaussianEnergy(energySigma, seed);
        }
        return set;
    }

    private CommandLine.ParameterException usage(String message) {
        return new CommandLine.ParameterException(spec.commandLine(), message);
    }

    private static TraceProgress progressRays(PrintWriter err) {
        int[] last = {-1};
        return (done, total) -> {
            int pct = done * 10 / total * 10;
            synchronized (last) {
                if (pct != last[0]) {
                    last[0] = pct;
                    err.println("  rays: " + done + " of " + total);
                }
            }
        };
    }

    private void writeTable(BundleResult res) {
        try {
            TraceTableCsv.write(table, res);
        } catch (IOException e) {
            throw usage("--table " + table + ": cannot write there (" + e.getMessage() + "); choose a file you can write to");
        }
    }

    private void printText(PrintWriter w, Stack stack, BundleResult res, String method) {
        w.println("Stack: " + (stack.title().isBlank() ? "(untitled)" : stack.title()) + "  [" + input.shownAs() + "]");
        w.println("Rays: " + res.trajectories().size() + " " + res.rays().particle().label() + "s, "
                + res.rays().description());
        w.println("Screen: z = " + num(Units.mToMm(res.targets().screenZ_m())) + " mm");
        w.println("Field: " + method);
        w.println("Tracing: relativistic Lorentz force, Dormand-Prince 8(5,3), relative tolerance " + sci(tolerance)
                + "; worst energy conservation error " + sci(res.maxEnergyError()) + " (relative)");
        w.println("Ended: " + statusText(res));
        w.println();
        w.println(String.format(Locale.ROOT, "  %10s %6s %14s %14s %14s %14s %16s", "z_mm", "rays", "rms_radius_mm",
                "max_radius_mm", "centroid_x_mm", "centroid_y_mm", "mean_energy_eV"));
        for (PlaneStatistics p : res.planeStatistics()) {
            w.println(String.format(Locale.ROOT, "  %10s %6d %14s %14s %14s %14s %16s", num(Units.mToMm(p.z_m())),
                    p.rays(), num(Units.mToMm(p.rmsRadius_m())), num(Units.mToMm(p.maxRadius_m())),
                    num(Units.mToMm(p.centroidX_m())), num(Units.mToMm(p.centroidY_m())), num(p.meanEnergy_eV())));
        }
        List<Trajectory> lostRays = res.trajectories().stream().filter(t -> t.status() != TraceStatus.SCREEN).toList();
        for (Trajectory t : lostRays.subList(0, Math.min(5, lostRays.size()))) {
            RayPoint e = t.end();
            String where = String.format(Locale.ROOT, "at z = %s mm, r = %s mm", num(Units.mToMm(e.z_m())),
                    num(Units.mToMm(e.r_m())));
            String what = switch (t.status()) {
                case HIT -> "hit '" + t.hit().orElseThrow().electrode() + "'";
                case REFLECTED -> "turned back";
                case LEFT_REGION -> "left the region";
                default -> "stopped (step limit)";
            };
            w.println("  ray " + t.id() + " " + what + " " + where);
        }
        if (lostRays.size() > 5) {
            w.println("  ... and " + (lostRays.size() - 5) + " more rays that did not reach the screen");
        }
        if (table != null) {
            w.println();
            w.println("Trajectory table: " + table + " (" + res.tableRows().size() + " rows)");
        }
    }

    private static String statusText(BundleResult res) {
        List<String> parts = new ArrayList<>();
        for (Map.Entry<TraceStatus, Integer> e : res.statusCounts().entrySet()) {
            parts.add(e.getValue() + " " + e.getKey().label());
        }
        return String.join(", ", parts);
    }

    private void printJson(PrintWriter w, Stack stack, BundleResult res, String method, TracedAberrationSection ab) {
        Map<String, Object> root = new LinkedHashMap<>();
        root.put("title", stack.title());
        root.put("particle", res.rays().particle().label());
        root.put("ray_set", res.rays().description());
        root.put("rays", res.trajectories().size());
        root.put("screen_z_mm", Units.mToMm(res.targets().screenZ_m()));
        root.put("field_method", method);
        root.put("relative_tolerance", tolerance);
        root.put("max_energy_error", res.maxEnergyError());
        Map<String, Integer> counts = new LinkedHashMap<>();
        res.statusCounts().forEach((s, n) -> counts.put(s.label(), n));
        root.put("status_counts", counts);
        List<Map<String, Object>> planes = new ArrayList<>();
        for (PlaneStatistics p : res.planeStatistics()) {
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("z_mm", Units.mToMm(p.z_m()));
            m.put("rays", p.rays());
            m.put("rms_radius_mm", finiteOrNull(Units.mToMm(p.rmsRadius_m())));
            m.put("max_radius_mm", finiteOrNull(Units.mToMm(p.maxRadius_m())));
            m.put("centroid_x_mm", finiteOrNull(Units.mToMm(p.centroidX_m())));
            m.put("centroid_y_mm", finiteOrNull(Units.mToMm(p.centroidY_m())));
            m.put("mean_kinetic_energy_eV", finiteOrNull(p.meanEnergy_eV()));
            planes.add(m);
        }
        root.put("planes", planes);
        List<Map<String, Object>> ends = new ArrayList<>();
        for (Trajectory t : res.trajectories()) {
            Map<String, Object> m = new LinkedHashMap<>();
            RayPoint p = t.end();
            m.put("ray_id", t.id());
            m.put("status", t.statusLabel());
            m.put("z_mm", Units.mToMm(p.z_m()));
            m.put("x_mm", Units.mToMm(p.x_m()));
            m.put("y_mm", Units.mToMm(p.y_m()));
            m.put("r_mm", Units.mToMm(p.r_m()));
            m.put("slope_mrad", Units.radToMrad(p.radialSlope()));
            m.put("kinetic_energy_eV", p.kineticEnergy_eV());
            m.put("time_ns", p.time_s() * 1e9);
            ends.add(m);
        }
        root.put("ray_ends", ends);
        if (ab != null) {
            root.put("aberrations", ab.json());
        }
        root.put("safety_notice", SafetyNotice.text());
        w.println(JsonOption.text(root));
    }

    private static Double finiteOrNull(double v) {
        return Double.isFinite(v) ? v : null;
    }

    static String num(double x) {
        return TraceTableCsv.num(x);
    }

    private static String sci(double x) {
        return org.axistack.model.Numbers.general(x, 2);
    }
}
