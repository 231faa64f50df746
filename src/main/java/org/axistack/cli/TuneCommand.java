package org.axistack.cli;

import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.List;
import java.util.OptionalDouble;
import java.util.concurrent.Callable;

import org.axistack.model.PhysicsException;
import org.axistack.field.BemSolver;
import org.axistack.field.FieldSolution;
import org.axistack.io.StackInputException;
import org.axistack.model.Units;
import org.axistack.model.Stack;
import org.axistack.model.SurfaceFieldLimits;
import org.axistack.tune.BiasRange;
import org.axistack.tune.BiasTuner;
import org.axistack.tune.FocusRanking;
import org.axistack.tune.FocusSensitivity;
import org.axistack.tune.FocusSolution;
import org.axistack.tune.FocusTarget;
import org.axistack.tune.PairTuner;
import org.axistack.tune.SecondCondition;
import org.axistack.tune.TuneResult;

import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/**
 * {@code tune STACK --vary NAME --image-z Z}: every bias of one electrode in a range that images the object onto
 * a plane, with magnification, surface-field check and the supply-stability budget; with {@code --also-vary}
 * two electrodes meet two conditions together. One field solve, then re-biasing only. Exit 1 when nothing in
 * the range focuses there (or, with {@code --strict}, when a solution's surface field is over the limit).
 */
@Command(name = "tune", mixinStandardHelpOptions = true,
        header = "Finds the biases of one electrode that focus on a plane.",
        description = {"Finds every bias of electrode NAME that images the object (a parallel beam unless the stack"
            + " or --object-z gives one) onto the plane z = Z, with magnification, largest surface field, and how"
            + " far the image moves per volt and per relative energy change (the supply stability the focus needs).",
            "With --also-vary NAME2 and --magnification or --focal-length-mm, two biases meet two conditions."})
final class TuneCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Mixin
    StackInput input;

    @Mixin
    QuietOption quiet;

    @Option(names = "--vary", paramLabel = "NAME", required = true, description = "Electrode whose bias is tuned.")
    String vary;

    @Option(names = "--image-z", paramLabel = "Z", description = "Image plane, mm (default: the stack's [screen] z_mm).")
    Double imageZ_mm;

    @Option(names = "--object-z", paramLabel = "Z",
            description = "Axial object position, mm (default: the stack's [beam] object, else at infinity).")
    Double objectZ_mm;

    @Option(names = "--from", paramLabel = "V", description = "Lower end of the bias range, V. Default range: see --to.")
    Double from_V;

    @Option(names = "--to", paramLabel = "V", description = "Upper end of the bias range, V. Default range: +/- "
            + "6 x the beam energy per charge, at most +/- 30 kV (what a bench supply for the lens would allow).")
    Double to_V;

    @Option(names = "--depth-mm", paramLabel = "D", defaultValue = "0.1",
            description = "Keep the focus within +/- D mm when stating the supply stability (default 0.1).")
    double depth_mm;

    @Option(names = "--comfort-V-per-mm", paramLabel = "E", description = "Surface-field comfort limit, V/mm (default: the stack's).")
    Double comfort_V_per_mm;

    @Option(names = "--aggressive-V-per-mm", paramLabel = "E", description = "Surface-field aggressive limit, V/mm (default: the stack's).")
    Double aggressive_V_per_mm;

    @Option(names = "--strict", description = "Exit 1 if a solution's surface field is above the aggressive limit.")
    boolean strict;

    @Option(names = "--also-vary", paramLabel = "NAME2", description = "Second electrode, for two conditions at once.")
    String alsoVary;

    @Option(names = "--also-from", paramLabel = "V", description = "Lower end of NAME2's range, V (default as for NAME).")
    Double alsoFrom_V;

    @Option(names = "--also-to", paramLabel = "V", description = "Upper end of NAME2's range, V.")
    Double alsoTo_V;

    @Option(names = "--magnification", paramLabel = "M", description = "Second condition: lateral magnification (needs an object).")
    Double magnification;

    @Option(names = "--focal-length-mm", paramLabel = "F", description = "Second condition: image-side focal length, mm.")
    Double focalLength_mm;

    @Mixin
    JsonOption json;

    @Override
    public Integer call() throws StackInputException {
        CommandLine cl = spec.commandLine();
        Stack stack = withLimits(input.loadOrDemo(), cl);
        if (stack.indexOf(vary) < 0) {
            throw new CommandLine.ParameterException(cl, "--vary " + vary + ": no such electrode in " + input.shownAs()
                    + "; choose one of " + String.join(", ", stack.names()));
        }
        double imageZ = imagePlane(stack, cl);
        OptionalDouble objectZ = objectZ_mm != null ? OptionalDouble.of(Units.mmToM(objectZ_mm)) : stack.beam().objectZ_m();
        if (objectZ.isPresent() && !(objectZ.getAsDouble() < imageZ)) {
            throw new CommandLine.ParameterException(cl, "the object (z = " + PlanCommand.num(Units.mToMm(objectZ.getAsDouble()))
                    + " mm) must lie before the image plane (z = " + PlanCommand.num(Units.mToMm(imageZ)) + " mm)");
        }
        if (!(depth_mm > 0) || !Double.isFinite(depth_mm)) {
            throw new CommandLine.ParameterException(cl, "--depth-mm must be a positive number of mm");
        }
        FocusTarget target = new FocusTarget(imageZ, objectZ);
        BiasRange range = range(stack, from_V, to_V, "--from/--to", cl);
        TuneReport report = new TuneReport(input.shownAs(), stack, target, Units.mmToM(depth_mm),
                from_V == null && to_V == null);
        if (alsoVary != null || magnification != null || focalLength_mm != null) {
            return pair(stack, target, range, report, cl);
        }
        FieldSolution sol = BemSolver.solve(stack.electrodes(), stack.mesh(), SolveReporter.to(cl.getErr(), quiet.on()));
        long t0 = System.nanoTime();
        TuneResult result = new BiasTuner(sol, stack).focus(vary, target, range);
        List<FocusSensitivity> budgets = new ArrayList<>();
        for (FocusSolution s : result.solutions()) {
            budgets.add(FocusSensitivity.of(sol, stack, s.biases_V(), target, Units.mmToM(depth_mm)));
        }
        double seconds = (System.nanoTime() - t0) * 1e-9;
        FocusRanking.Ranked ranked = FocusRanking.rank(result, budgets); // most useful first
        result = ranked.result();
        PrintWriter out = cl.getOut();
        report.single(out, result, ranked.budgets(), seconds, json.on());
        out.flush();
        if (!result.found()) {
            throw new OutcomeException("no bias of '" + vary + "' in " + PlanCommand.num(range.from_V()) + " .. "
                    + PlanCommand.num(range.to_V()) + " V focuses at z = " + PlanCommand.num(Units.mToMm(imageZ))
                    + " mm; widen the range with --from/--to, move the image plane, or vary another electrode");
        }
        strictCheck(result.solutions());
        return 0;
    }

    private Integer pair(Stack stack, FocusTarget target, BiasRange range, TuneReport report, CommandLine cl) {
        if (alsoVary == null || (magnification == null) == (focalLength_mm == null)) {
            throw new CommandLine.ParameterException(cl, "two conditions need --also-vary NAME2 and exactly one of"
                    + " --magnification M or --focal-length-mm F");
        }
        if (stack.indexOf(alsoVary) < 0 || alsoVary.equals(vary)) {
            throw new CommandLine.ParameterException(cl, "--also-vary " + alsoVary + ": give another electrode of "
                    + input.shownAs() + " (" + String.join(", ", stack.names()) + ")");
        }
        if (magnification != null && target.objectAtInfinity()) {
            throw new CommandLine.ParameterException(cl, "--magnification needs a finite object: give --object-z"
                    + " or object_z_mm in the stack's [beam]");
        }
        SecondCondition condition;
        try {
            condition = magnification != null ? new SecondCondition.Magnification(magnification)
                    : new SecondCondition.FocalLength(Units.mmToM(focalLength_mm));
        } catch (IllegalArgumentException | PhysicsException e) {
            throw new CommandLine.ParameterException(cl, e.getMessage());
        }
        BiasRange second = range(stack, alsoFrom_V, alsoTo_V, "--also-from/--also-to", cl);
        FieldSolution sol = BemSolver.solve(stack.electrodes(), stack.mesh(), SolveReporter.to(cl.getErr(), quiet.on()));
        long t0 = System.nanoTime();
        PairTuner.PairResult result = new PairTuner(sol, stack).solve(vary, alsoVary, target, condition, range, second);
        List<FocusSensitivity> budgets = new ArrayList<>();
        for (PairTuner.PairSolution s : result.solutions()) {
            budgets.add(FocusSensitivity.of(sol, stack, s.focus().biases_V(), target, Units.mmToM(depth_mm)));
        }
        double seconds = (System.nanoTime() - t0) * 1e-9;
        PrintWriter out = cl.getOut();
        report.pair(out, result, budgets, seconds, json.on());
        out.flush();
        if (!result.found()) {
            throw new OutcomeException("no pair of biases in the ranges meets both conditions (nearest approach above);"
                    + " widen the ranges, relax the second condition or move the image plane");
        }
        strictCheck(result.solutions().stream().map(PairTuner.PairSolution::focus).toList());
        return 0;
    }

    private void strictCheck(List<FocusSolution> solutions) {
        if (strict && solutions.stream().anyMatch(s -> s.surfaceFieldCheck() == org.axistack.tune.SurfaceFieldCheck.ABOVE_AGGRESSIVE)) {
            throw new OutcomeException("--strict: a solution's surface field is above the aggressive limit");
        }
    }

    private Stack withLimits(Stack stack, CommandLine cl) {
        if (comfort_V_per_mm == null && aggressive_V_per_mm == null) {
            return stack;
        }
        double c = comfort_V_per_mm != null ? Units.vPerMmToVPerM(comfort_V_per_mm) : stack.limits().comfort_V_per_m();
        double a = aggressive_V_per_mm != null ? Units.vPerMmToVPerM(aggressive_V_per_mm) : stack.limits().aggressive_V_per_m();
        try {
            return stack.withLimits(new SurfaceFieldLimits(c, a, stack.limits().gapRule()));
        } catch (IllegalArgumentException e) {
            throw new CommandLine.ParameterException(cl, "surface-field limits: need 0 < comfort <= aggressive (V/mm)");
        }
    }

    private double imagePlane(Stack stack, CommandLine cl) {
        if (imageZ_mm != null) {
            if (!Double.isFinite(imageZ_mm)) {
                throw new CommandLine.ParameterException(cl, "--image-z must be a number of mm");
            }
            return Units.mmToM(imageZ_mm);
        }
        if (stack.screenZ_m().isPresent()) {
            return stack.screenZ_m().getAsDouble();
        }
        throw new CommandLine.ParameterException(cl, "give the image plane with --image-z Z (mm); " + input.shownAs()
                + " has no [screen] z_mm to default to");
    }

    private static BiasRange range(Stack stack, Double from, Double to, String names, CommandLine cl) {
        BiasRange def = BiasRange.supplyDefault(stack.beam());
        double a = from != null ? from : def.from_V();
        double b = to != null ? to : def.to_V();
        if (!Double.isFinite(a) || !Double.isFinite(b) || !(a < b)) {
            throw new CommandLine.ParameterException(cl, names + ": need a finite range with from < to (volts), got "
                    + PlanCommand.num(a) + " .. " + PlanCommand.num(b));
        }
        return new BiasRange(a, b);
    }
}
