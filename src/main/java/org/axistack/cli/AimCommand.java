package org.axistack.cli;

import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.concurrent.Callable;

import org.axistack.field.BemSolver;
import org.axistack.field.BiasedField;
import org.axistack.field.FieldSolution;
import org.axistack.field.SectorField;
import org.axistack.io.StackInputException;
import org.axistack.model.Units;
import org.axistack.model.Sectors;
import org.axistack.model.Stack;
import org.axistack.model.StartRay;
import org.axistack.optics.ParaxialOptics;
import org.axistack.optics.ReflectionException;
import org.axistack.optics.SteeringSolve;
import org.axistack.optics.SteeringSolve.Target;
import org.axistack.report.SafetyNotice;
import org.axistack.trace.SteeringBundle;
import org.axistack.tune.BiasRange;


import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/**
 * {@code aim [STACK] [--steerer NAME]... [--at PLANE:X:Y]... [--slopes SX:SY]}: the x and y differential biases
 * of one or two split electrodes that put the central ray on a point, or bring an off-axis or tilted beam back
 * onto the axis; the margin of every sector supply, the central ray at each monitor, and an exact
 * three-dimensional trace of the central ray and a small bundle at the setting found.
 */
@Command(name = "aim", mixinStandardHelpOptions = true,
        header = "Steering biases that put the central ray where it is wanted.",
        description = {"Finds the x and y differential biases of one or two split electrodes (steerers) so that the"
            + " central ray passes through a point: one steerer sets the position at one plane, two set the position"
            + " and the slopes at one plane (--slopes, default parallel to the axis) or the positions at two planes."
            + " Without --at the ray is brought onto the axis at the screen: the beam enters with the [beam] start"
            + " offset and slopes of the stack.",
            "First order in the biases (linear solve on the unit responses of the dipole harmonic), then checked by an"
            + " exact trace in the three-dimensional field (harmonics 1 to 3 of the split electrodes). Lengths in mm"
            + " in the stack's z coordinates, slopes in mrad."})
final class AimCommand implements Callable<Integer> {

    /** Harmonics solved for the exact trace (the dipole alone for the linear solve). */
    static final int EXACT_ORDER = 3;

    @Spec
    CommandSpec spec;

    @Mixin
    StackInput input;

    @Option(names = "--steerer", paramLabel = "NAME",
            description = "Split electrode to set (once or twice; default: the stack's split electrodes, if one or two).")
    List<String> steererNames = new ArrayList<>();

    @Option(names = "--at", paramLabel = "PLANE:X:Y",
            description = "Put the central ray at (X, Y) mm on PLANE: z in mm, 'screen' or a monitor's name (once or"
                    + " twice; default screen:0:0).")
    List<String> at = new ArrayList<>();

    @Option(names = "--slopes", paramLabel = "SX:SY",
            description = "With two steerers and one --at: the slopes there, mrad (default 0:0, parallel to the axis).")
    String slopes;

    @Option(names = "--supply-limit", paramLabel = "V",
            description = "Each sector supply reaches +-V (default: the tuning's supply range, 6 x the beam energy per"
                    + " charge within 10 V to 30 kV).")
    Double supplyLimit_V;

    @Option(names = "--bundle-radius", paramLabel = "MM",
            description = "Radius of the four-ray bundle traced around the central ray (default a quarter of the"
                    + " narrowest bore).")
    Double bundleRadius_mm;

    @Option(names = "--no-trace", description = "Skip the exact three-dimensional traces (first-order answer only).")
    boolean noTrace;

    @Mixin
    JsonOption json;

    @picocli.CommandLine.Mixin
    QuietOption quiet;

    @Override
    public Integer call() throws StackInputException {
        CommandLine cl = spec.commandLine();
        Stack stack = input.loadOrDemo();
        if (!stack.hasSectors()) {
            throw new CommandLine.ParameterException(cl, input.shownAs() + " has no split electrode to steer with: give"
                    + " one electrode sectors = 4 (and sector_biases_V, or bias_V with deflection_x_V/deflection_y_V)");
        }
        List<Integer> steerers = steerers(cl, stack);
        if (supplyLimit_V != null && !(supplyLimit_V > 0 && Double.isFinite(supplyLimit_V))) {
            throw new CommandLine.ParameterException(cl, "--supply-limit must be a positive number of volts, got "
                    + supplyLimit_V);
        }
        if (bundleRadius_mm != null && !(bundleRadius_mm > 0 && Double.isFinite(bundleRadius_mm))) {
            throw new CommandLine.ParameterException(cl, "--bundle-radius must be a positive number of mm, got "
                    + bundleRadius_mm);
        }
        if (at.size() > 2) {
            throw new CommandLine.ParameterException(cl, "--at is given " + at.size() + " times; give it once or twice");
        }
        List<double[]> planned = planes(cl, stack, steerers);
        PrintWriter err = cl.getErr();
        boolean silent = quiet.on();
        FieldSolution sol = BemSolver.solve(stack.electrodes(), stack.mesh(), SolveReporter.to(err, silent));
        BiasedField round = sol.withBiases(stack.biases_V());
        ParaxialOptics optics;
        try {
            optics = ParaxialOptics.of(round, stack);
        } catch (ReflectionException e) {
            throw new OutcomeException(e.getMessage() + "; lower the retarding bias or raise the beam energy");
        }
        double screen = stack.screenZ_m().orElse(optics.zEnd_m());
        double zStart = stack.beam().startZ_m().orElse(optics.zStart_m());
        List<Target> targets = targets(cl, planned, screen, zStart);
        Map<Integer, Sectors> byIndex = stack.sectorsByIndex();
        SectorField field = SectorField.solve(sol, byIndex, noTrace ? 1 : EXACT_ORDER, SolveReporter.to(err, silent));
        double[] monitors = stack.monitors().stream().mapToDouble(m -> m.z_m()).toArray();
        StartRay start = stack.beam().startRay();
        SteeringSolve solve;
        try {
            solve = SteeringSolve.solve(field, optics, zStart, start, byIndex, steerers, targets, monitors);
        } catch (SteeringSolve.Infeasible e) {
            throw new OutcomeException(e.getMessage());
        }
        BiasRange range = supplyLimit_V != null ? new BiasRange(-supplyLimit_V, supplyLimit_V)
                : BiasRange.supplyDefault(stack.beam());
        SteeringBundle bundle = null;
        if (!noTrace) {
            double a = bundleRadius_mm != null ? Units.mmToM(bundleRadius_mm) : 0.25 * stack.openBore_m();
            if (!silent) {
                err.println("tracing 9 exact rays in the three-dimensional field (element sums: tens of seconds;"
                        + " --no-trace skips this; Ctrl-C stops)");
                err.flush();
            }
            bundle = SteeringBundle.trace(round, field, solve, stack.beam(), zStart, a, stack.openBore_m());
        }
        Map<String, Object> out = AimOutput.map(input.shownAs(), stack, solve, targets, range, zStart, bundle);
        PrintWriter w = cl.getOut();
        if (json.on()) {
            w.println(JsonOption.text(out));
        } else {
            AimOutput.text(w, stack, out);
            w.println();
            w.println(SafetyNotice.text());
        }
        w.flush();
        if (Boolean.FALSE.equals(out.get("within_supply_range"))) {
            err.println("aim: the biases found exceed the supply range (" + PlanCommand.num(range.to_V())
                    + " V); steer with a stronger or a second steerer, or raise --supply-limit if the supplies reach further");
            err.flush();
            return 1;
        }
        return 0;
    }

    private List<Integer> steerers(CommandLine cl, Stack stack) {
        List<Integer> list = new ArrayList<>();
        if (steererNames.isEmpty()) {
            if (stack.sectors().size() > 2) {
                throw new CommandLine.ParameterException(cl, input.shownAs() + " has " + stack.sectors().size()
                        + " split electrodes; name one or two with --steerer (" + String.join(", ",
                                stack.sectors().keySet()) + ")");
            }
            for (String n : stack.names()) {
                if (stack.sectors().containsKey(n)) {
                    list.add(stack.indexOf(n));
                }
            }
            return list;
        }
        if (steererNames.size() > 2) {
            throw new CommandLine.ParameterException(cl, "--steerer is given " + steererNames.size()
                    + " times; give one or two split electrodes");
        }
        for (String n : steererNames) {
            if (!stack.sectors().containsKey(n)) {
                throw new CommandLine.ParameterException(cl, "--steerer " + n + ": " + (stack.indexOf(n) < 0
                        ? "no such electrode" : "that electrode is not split into sectors") + " in " + input.shownAs()
                        + "; split electrodes: " + String.join(", ", stack.sectors().keySet()));
            }
            if (list.contains(stack.indexOf(n))) {
                throw new CommandLine.ParameterException(cl, "--steerer " + n + " is given twice");
            }
            list.add(stack.indexOf(n));
        }
        return list;
    }

    /**
     * The --at planes read and checked before any solve: {z (NaN for a screen the stack does not place), x, y,
     * slope x, slope y, with slopes (1 or 0)} in SI, each after the steerers that must act on it.
     */
    private List<double[]> planes(CommandLine cl, Stack stack, List<Integer> steerers) {
        List<String> specs = at.isEmpty() ? List.of("screen:0:0") : at;
        double[] sl = null;
        if (slopes != null) {
            sl = numbers(cl, "--slopes", slopes, 2, "SX:SY (mrad), for example 0:0");
        }
        boolean withSlopes = steerers.size() == 2 && specs.size() == 1;
        if (sl != null && !withSlopes) {
            throw new CommandLine.ParameterException(cl, "--slopes needs two steerers and one --at plane");
        }
        if (steerers.size() == 1 && specs.size() != 1) {
            throw new CommandLine.ParameterException(cl, "one steerer sets the position at one plane: give --at once,"
                    + " or name a second steerer with --steerer");
        }
        List<double[]> list = new ArrayList<>();
        List<String> shown = new ArrayList<>();
        for (String s : specs) {
            String[] parts = s.split(":", -1);
            if (parts.length != 3) {
                throw new CommandLine.ParameterException(cl, "--at " + s + " is not PLANE:X:Y; write for example"
                        + " --at screen:0.5:0 or --at 120:0:0 (z, x and y in mm)");
            }
            double z = plane(cl, stack, parts[0].strip(), s);
            double[] xy = numbers(cl, "--at", parts[1] + ":" + parts[2], 2, "PLANE:X:Y with X and Y in mm");
            double limit = stack.openBore_m();
            if (Math.hypot(Units.mmToM(xy[0]), Units.mmToM(xy[1])) >= limit && limit > 0) {
                throw new CommandLine.ParameterException(cl, "--at " + s + ": the point lies outside the narrowest bore ("
                        + PlanCommand.num(Units.mToMm(limit)) + " mm); the steering solve is first order, for small"
                        + " offsets");
            }
            double sx = withSlopes ? Units.mradToRad(sl == null ? 0 : sl[0]) : 0;
            double sy = withSlopes ? Units.mradToRad(sl == null ? 0 : sl[1]) : 0;
            list.add(new double[] {z, Units.mmToM(xy[0]), Units.mmToM(xy[1]), sx, sy, withSlopes ? 1 : 0});
            shown.add(s);
        }
        if (list.size() == 2 && list.get(0)[0] == list.get(1)[0]) {
            throw new CommandLine.ParameterException(cl, "the two --at planes are the same; give two different planes");
        }
        // a steerer moves the beam only downstream of where it begins: every plane after the first steerer's start,
        // and the last plane after every steerer's start (one plane with two steerers: after both)
        int first = steerers.get(0);
        int last = steerers.get(0);
        for (int e : steerers) {
            if (start(stack, e) < start(stack, first)) {
                first = e;
            }
            if (start(stack, e) > start(stack, last)) {
                last = e;
            }
        }
        double latest = Double.NEGATIVE_INFINITY;
        int latestAt = 0;
        for (int i = 0; i < list.size(); i++) {
            double z = list.get(i)[0];
            double zz = Double.isNaN(z) ? Double.POSITIVE_INFINITY : z;
            upstream(cl, stack, shown.get(i), z, first);
            if (zz > latest) {
                latest = zz;
                latestAt = i;
            }
        }
        upstream(cl, stack, shown.get(latestAt), list.get(latestAt)[0], last);
        return list;
    }

    private static double start(Stack stack, int electrode) {
        return stack.electrodes().get(electrode).contour().minZ_m();
    }

    private static void upstream(CommandLine cl, Stack stack, String spec, double z, int steerer) {
        double from = start(stack, steerer);
        if (!Double.isNaN(z) && !(z > from)) {
            String name = stack.names().get(steerer);
            throw new CommandLine.ParameterException(cl, "--at " + spec + ": the plane z = "
                    + PlanCommand.num(Units.mToMm(z)) + " mm lies before the steerer " + name + ", which begins at z = "
                    + PlanCommand.num(Units.mToMm(from)) + " mm; a steerer moves the beam only downstream of itself:"
                    + " give a plane after z = " + PlanCommand.num(Units.mToMm(from)) + " mm (or 'screen')");
        }
    }

    /** The checked planes as targets once the screen's default and the ray's start are known. */
    private static List<Target> targets(CommandLine cl, List<double[]> planned, double screen, double zStart) {
        List<Target> list = new ArrayList<>();
        for (double[] p : planned) {
            double z = Double.isNaN(p[0]) ? screen : p[0];
            if (!(z > zStart)) {
                throw new CommandLine.ParameterException(cl, "--at: the plane z = "
                        + PlanCommand.num(Units.mToMm(z)) + " mm is not after the central ray's start at z = "
                        + PlanCommand.num(Units.mToMm(zStart)) + " mm");
            }
            list.add(new Target(z, p[1], p[2], p[5] == 1, p[3], p[4]));
        }
        if (list.size() == 2 && list.get(0).z_m() == list.get(1).z_m()) {
            throw new CommandLine.ParameterException(cl, "the two --at planes are the same; give two different planes");
        }
        return list;
    }

    /** z of a named plane, m; NaN for 'screen' when the stack places no screen (the optics' image side then). */
    private double plane(CommandLine cl, Stack stack, String p, String spec) {
        if (p.equals("screen")) {
            return stack.screenZ_m().orElse(Double.NaN);
        }
        for (int i = 0; i < stack.monitors().size(); i++) {
            if (stack.monitorLabel(i).equals(p)) {
                return stack.monitors().get(i).z_m();
            }
        }
        try {
            double z = Double.parseDouble(p);
            if (Double.isFinite(z) && Math.abs(z) <= 10000) {
                return Units.mmToM(z);
            }
        } catch (NumberFormatException e) {
            // falls through to the message
        }
        List<String> names = new ArrayList<>();
        for (int i = 0; i < stack.monitors().size(); i++) {
            names.add(stack.monitorLabel(i));
        }
        throw new CommandLine.ParameterException(cl, "--at " + spec + ": '" + p + "' is neither a z in mm (within"
                + " +-10000), 'screen', nor a monitor of the stack" + (names.isEmpty() ? "" : " (" + String.join(", ",
                        names) + ")"));
    }

    private static double[] numbers(CommandLine cl, String option, String text, int count, String form) {
        String[] parts = text.split(":", -1);
        double[] v = new double[count];
        try {
            if (parts.length != count) {
                throw new NumberFormatException();
            }
            for (int i = 0; i < count; i++) {
                v[i] = Double.parseDouble(parts[i].strip());
                if (!Double.isFinite(v[i]) || Math.abs(v[i]) > 10000) {
                    throw new NumberFormatException();
                }
            }
        } catch (NumberFormatException e) {
            throw new CommandLine.ParameterException(cl, option + " " + text + ": expected " + form);
        }
        return v;
    }

    static String fmt(double x) {
        return org.axistack.model.Numbers.general(x, org.axistack.model.Numbers.WINDOW_DIGITS);
    }
}
