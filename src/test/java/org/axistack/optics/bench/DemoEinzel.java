package org.axistack.optics.bench;

import java.util.ArrayList;
import java.util.List;

import org.axistack.field.AxialField;
import org.axistack.field.BemSolver;
import org.axistack.field.FieldSolution;
import org.axistack.field.SolveProgress;
import org.axistack.model.Beam;
import org.axistack.model.Electrode;
import org.axistack.model.MeshSettings;
import org.axistack.model.Particle;
import org.axistack.model.Stack;
import org.axistack.optics.ParaxialOptics;
import org.axistack.optics.UnitAxialFields;
import org.axistack.trace.AxialTable;

/**
 * Demo data for the benchmark and its accuracy test (invented numbers): a three-tube einzel lens, bore radius
 * 5 mm, 1 mm gaps, centre tube 8 mm long, outer tubes 80 mm, 3 keV protons; solved once with the default mesh, then tabulated per
 * unit bias (Hermite tables, step R/40) so any bias set is a cheap superposition.
 */
public final class DemoEinzel {

    public static final double RADIUS = 5e-3;

    public final Stack stack;
    public final FieldSolution solution;
    public final UnitAxialFields units;
    public final double maxTableError_V;

    public DemoEinzel() {
        List<Electrode> es = List.of(new Electrode.Tube("entrance", 0, RADIUS, -0.085, -0.005, 0),
                new Electrode.Tube("focus", 1800, RADIUS, -0.004, 0.004, 0),
                new Electrode.Tube("exit", 0, RADIUS, 0.005, 0.085, 0));
        stack = new Stack("demo einzel", new Beam(Particle.proton(), 3000), es);
        solution = BemSolver.solve(es, MeshSettings.defaults(), SolveProgress.NONE);
        double[] range = ParaxialOptics.searchRange_m(stack);
        List<AxialField> tables = new ArrayList<>();
        double err = 0;
        for (int e = 0; e < es.size(); e++) {
            double[] unit = new double[es.size()];
            unit[e] = 1;
            AxialTable t = new AxialTable(solution.withBiases(unit), range[0], range[1], RADIUS / 40);
            err = Math.max(err, t.maxPotentialError_V());
            tables.add(t);
        }
        units = UnitAxialFields.of(tables);
        maxTableError_V = err;
    }
}
