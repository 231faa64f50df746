package org.axistack.optics.bench;

import java.util.List;

import org.axistack.field.BemSolver;
import org.axistack.field.FieldSolution;
import org.axistack.field.SolveProgress;
import org.axistack.model.Beam;
import org.axistack.model.Electrode;
import org.axistack.model.MeshSettings;
import org.axistack.model.Particle;
import org.axistack.model.Stack;

/**
 * Demo data for the benchmark and its accuracy test (invented numbers): a three-tube einzel lens, bore radius
 * 5 mm, 1 mm gaps, centre tube 8 mm long, outer tubes 80 mm, 3 keV protons; solved once with the default mesh. Any
 * bias set is then a cheap superposition of the unit solutions ({@link FieldSolution#withBiases}).
 */
public final class DemoEinzel {

    public static final double RADIUS = 5e-3;

    public final Stack stack;
    public final FieldSolution solution;
    public DemoEinzel() {
        List<Electrode> es = List.of(new Electrode.Tube("entrance", 0, RADIUS, -0.085, -0.005, 0),
                new Electrode.Tube("focus", 1800, RADIUS, -0.004, 0.004, 0),
                new Electrode.Tube("exit", 0, RADIUS, 0.005, 0.085, 0));
        stack = new Stack("demo einzel", new Beam(Particle.proton(), 3000), es);
        solution = BemSolver.solve(es, MeshSettings.defaults(), SolveProgress.NONE);
    }
}
