package org.axistack.properties;

import java.util.OptionalDouble;

import org.axistack.field.AxialField;
import org.axistack.field.BemSolver;
import org.axistack.field.FieldSolution;
import org.axistack.field.SolveProgress;
import org.axistack.model.Beam;
import org.axistack.model.Stack;
import org.axistack.optics.AccelerationPotential;
import org.axistack.optics.Aberrations;
import org.axistack.optics.CardinalElements;
import org.axistack.optics.ParaxialOptics;
import org.axistack.optics.ParaxialSettings;

/** The optics of one stack as the property tests compare them: cardinal elements and aberrations. */
record Lens(CardinalElements c, Aberrations a) {

    static FieldSolution solve(Stack s) {
        return BemSolver.solve(s.electrodes(), s.mesh(), SolveProgress.NONE);
    }

    /** Optics of the stack's beam in the given field, planes chosen automatically; relativistic as the code does. */
    static Lens of(AxialField field, Stack s) {
        return of(ParaxialOptics.of(field, s));
    }

    /** Optics of a beam in the given field with the relativistic correction switched off. */
    static Lens nonRelativistic(AxialField field, Stack s, Beam beam) {
        double[] range = ParaxialOptics.searchRange_m(s);
        AccelerationPotential u = new AccelerationPotential(field, beam).nonRelativistic();
        return of(ParaxialOptics.auto(u, range[0], range[1], OptionalDouble.empty(), ParaxialSettings.defaults()));
    }

    static Lens of(ParaxialOptics o) {
        CardinalElements c = o.cardinal();
        return new Lens(c, c.kind() == CardinalElements.Kind.AFOCAL ? null : o.aberrations());
    }

    double f1() {
        return c.focalLengthObject_m();
    }

    double f2() {
        return c.focalLengthImage_m();
    }

    /** Scale of the lens for tolerances: the larger |f|. */
    double size() {
        return Math.max(Math.abs(f1()), Math.abs(f2()));
    }

    /** Tolerance on positions and focal lengths: what the plane choice may move, plus a floor. */
    double tolerance(Lens other, double floor) {
        return size() * (floor + 3 * Math.max(c.planeSensitivity(), other.c.planeSensitivity()));
    }
}
