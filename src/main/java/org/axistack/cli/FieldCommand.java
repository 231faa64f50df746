package org.axistack.cli;

import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;

import org.axistack.model.Numbers;
import org.axistack.field.BemSolver;
import org.axistack.field.BiasedField;
import org.axistack.field.CapacitanceCheck;
import org.axistack.field.FieldSolution;
import org.axistack.io.StackInputException;
import org.axistack.model.Units;
import org.axistack.model.Electrode;
import org.axistack.model.Stack;
import org.axistack.report.SafetyNotice;


import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/**
 * {@code field STACK [--axis FROM:TO:STEP] [--json]}: solves the surface charges and prints the axial potential
 * table, electrode charges, the capacitance matrix and the largest electrode surface fields.
 */
@Command(name = "field", mixinStandardHelpOptions = true,
        header = "Solves the field: axial potential, charges, surface field.",
        description = {"Boundary-element field solve: axial potential and field, electrode charges,"
            + " capacitance matrix and the largest electrode surface field (for breakdown checks)."})
final class FieldCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Mixin
    StackInput input;

    @Mixin
    QuietOption quiet;

    @Option(names = "--axis", paramLabel = "FROM:TO:STEP",
            description = "Axial table range and step in mm, e.g. --axis=-15:15:0.5 (default: the stack's extent, 41 points).")
    String axis;

    @Mixin
    JsonOption json;

    @Override
    public Integer call() throws StackInputException {
        Stack stack = input.loadOrDemo();
        double[] range = axisRange(stack);
        PrintWriter out = spec.commandLine().getOut();
        FieldSolution solution = BemSolver.solve(stack.electrodes(), stack.mesh(),
                SolveReporter.to(spec.commandLine().getErr(), quiet.on()));
        BiasedField field = solution.biased();
        double[] charges = field.charges_C();
        double[] maxField = field.maxSurfaceFieldPerElectrode_V_per_m();
        double[][] cap = solution.capacitanceMatrix_F();
        List<double[]> table = new ArrayList<>();
        double[] d = new double[2];
        int points = (int) Math.floor((range[1] - range[0]) / range[2] + 1e-9) + 1;
        for (int i = 0; i < points; i++) {
            double z_mm = range[0] + i * range[2];
            field.axial(Units.mmToM(z_mm), 1, d);
            table.add(new double[] {z_mm, d[0], -d[1] / 1000.0});
        }
        if (json.on()) {
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("stack", input.shownAs());
            // one word per thing: an element is a panel of the contour; the unknowns are its charge values
            m.put("elements", solution.mesh().panels().size());
            m.put("unknowns", solution.unknowns());
            m.put("solve_seconds", solution.solveSeconds());
            m.put("residual_V_per_V", solution.residual());
            m.put("solved_as_mirror_halves", solution.solvedAsMirrorHalves());
            m.put("axial_expansion_relative_error", field.axialExpansionError());
            m.put("mesh_error_estimate_relative", solution.meshAccuracy().filter(a -> !Double.isNaN(a.estimate())).map(a -> (Object) a.estimate()).orElse(null));
            m.put("mesh_error", solution.meshErrorStatement());
            List<Map<String, Object>> es = new ArrayList<>();
            for (int e = 0; e < stack.electrodes().size(); e++) {
                Electrode el = stack.electrodes().get(e);
                Map<String, Object> em = new LinkedHashMap<>();
                em.put("name", el.name());
                em.put("bias_V", el.bias_V());
                em.put("charge_C", charges[e]);
                em.put("max_surface_field_V_per_mm", maxField[e] / 1000.0);
                es.add(em);
            }
            m.put("electrodes", es);
            m.put("capacitance_matrix_F", cap);
            CapacitanceCheck check = solution.capacitanceCheck();
            Map<String, Object> cm = new LinkedHashMap<>();
            cm.put("largest_asymmetry", check.asymmetry());
            cm.put("largest_off_diagonal_relative", check.offDiagonal());
            cm.put("warning", check.warned() ? check.message(stack.electrodes()) : null);
            m.put("capacitance_check", cm);
            List<Map<String, Object>> ax = new ArrayList<>();
            for (double[] row : table) {
                Map<String, Object> am = new LinkedHashMap<>();
                am.put("z_mm", row[0]);
                am.put("potential_V", row[1]);
                am.put("field_z_V_per_mm", row[2]);
                ax.add(am);
            }
            m.put("axis", ax);
            out.println(JsonOption.text(m));
            out.flush();
            return 0;
        }
        out.printf(Locale.ROOT, "Field of %s%n", input.shownAs());
        out.printf(Locale.ROOT, "  boundary elements: %d (pieces of the electrode contours) with %d unknowns (charge values at the"
                + " collocation nodes); solved in %s s%s; collocation residual %s V/V%n",
                solution.mesh().panels().size(), solution.unknowns(), Numbers.seconds(solution.solveSeconds()),
                solution.solvedAsMirrorHalves() ? " (mirror-symmetric: two half-size systems)" : "",
                Numbers.estimate(solution.residual()));
        out.println("  " + solution.meshErrorStatement());
        out.printf(Locale.ROOT, "  method: surface-charge boundary elements, exact ring kernel (elliptic integrals);"
                + " axial values from a Chebyshev expansion within %s of the exact sum%n",
                Numbers.tolerance(Math.max(field.axialExpansionError(), 1e-16)));
        out.println();
        out.printf(Locale.ROOT, "  %-14s %10s %14s %22s%n", "electrode", "bias_V", "charge_pC", "max_surface_field_V_per_mm");
        for (int e = 0; e < stack.electrodes().size(); e++) {
            Electrode el = stack.electrodes().get(e);
            String warn = maxField[e] > stack.limits().aggressive_V_per_m() ? "  OVER aggressive limit"
                    : maxField[e] > stack.limits().comfort_V_per_m() ? "  above comfort limit" : "";
            out.printf(Locale.ROOT, "  %-14s %10.2f %14.6g %22.1f%s%n", el.name(), el.bias_V(), charges[e] * 1e12, maxField[e] / 1000.0, warn);
        }
        out.println();
        out.println("  capacitance matrix, pF (row i: charge on i per volt on j)");
        for (int i = 0; i < cap.length; i++) {
            StringBuilder sb = new StringBuilder(String.format(Locale.ROOT, "  %-14s", stack.electrodes().get(i).name()));
            for (double c : cap[i]) {
                sb.append(String.format(Locale.ROOT, " %12.6g", c * 1e12));
            }
            out.println(sb);
        }
        CapacitanceCheck check = solution.capacitanceCheck();
        if (check.warned()) {
            out.println("  WARNING: " + check.message(stack.electrodes()) + ".");
        } else if (cap.length > 1) {
            out.printf(Locale.ROOT, "  checked: symmetric to %.0e (reciprocity), off-diagonal terms negative%n",
                    Math.max(check.asymmetry(), 1e-16));
        }
        out.println();
        out.printf(Locale.ROOT, "  %10s %16s %18s%n", "z_mm", "potential_V", "field_z_V_per_mm");
        for (double[] row : table) {
            out.printf(Locale.ROOT, "  %10.4f %16.9g %18.9g%n", row[0], row[1], row[2]);
        }
        out.println();
        out.println(SafetyNotice.text());
        out.flush();
        return 0;
    }

    /** [from, to, step] in mm from --axis, or the stack's extent in 40 steps. */
    private double[] axisRange(Stack stack) {
        if (axis == null) {
            double a = Units.mToMm(stack.minZ_m());
            double b = Units.mToMm(stack.maxZ_m());
            return new double[] {a, b, (b - a) / 40};
        }
        String[] parts = axis.split(":");
        String fix = "give --axis FROM:TO:STEP in mm with FROM < TO and STEP > 0, e.g. --axis=-15:15:0.5";
        if (parts.length != 3) {
            throw new CommandLine.ParameterException(spec.commandLine(), "--axis '" + axis + "' is not FROM:TO:STEP; " + fix);
        }
        double[] v = new double[3];
        for (int i = 0; i < 3; i++) {
            try {
                v[i] = Double.parseDouble(parts[i].trim());
            } catch (NumberFormatException e) {
                throw new CommandLine.ParameterException(spec.commandLine(), "--axis: '" + parts[i] + "' is not a number; " + fix);
            }
            if (!Double.isFinite(v[i])) {
                throw new CommandLine.ParameterException(spec.commandLine(), "--axis: '" + parts[i] + "' is not finite; " + fix);
            }
        }
        if (!(v[1] > v[0]) || !(v[2] > 0)) {
            throw new CommandLine.ParameterException(spec.commandLine(), "--axis " + axis + ": " + fix);
        }
        if ((v[1] - v[0]) / v[2] > 100_000) {
            throw new CommandLine.ParameterException(spec.commandLine(),
                    "--axis " + axis + " asks for more than 100000 points; use a larger STEP");
        }
        return v;
    }
}
