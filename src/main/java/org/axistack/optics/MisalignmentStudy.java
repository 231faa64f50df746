package org.axistack.optics;

import org.axistack.field.BiasedField;
import org.axistack.field.FieldSolution;
import org.axistack.field.HarmonicOperator;
import org.axistack.field.MisalignmentResponse;
import org.axistack.field.SolveProgress;
import org.axistack.model.Stack;

/**
 * The whole misalignment study of a solved stack: the harmonic-1 factorisation, the responses of every electrode
 * for the stack's biases and for the focus bias moved by +-{@link #FOCUS_STEP_V}, the central-ray shifts and the
 * tolerance budget at a screen plane. Immutable result.
 *
 * @param budget          sensitivities and tolerances
 * @param optics          paraxial optics of the stack as biased (planes chosen automatically)
 * @param factorSeconds   wall-clock seconds of the harmonic-1 assembly and factorisation
 * @param responseSeconds wall-clock seconds of all responses (right-hand sides, solves) and central-ray shifts
 *                        for the stack as biased, after the factorisation
 * @param totalSeconds    wall-clock seconds of the whole study after the round solve (walks included)
 * @param shift           the central-ray shifts of the stack as biased (any plane)
 * @param dipole          the harmonic-1 operator (shared with other dipole work on the same solution)
 */
public record MisalignmentStudy(MisalignmentBudget budget, ParaxialOptics optics, double factorSeconds,
        double responseSeconds, double totalSeconds, CentralRayShift shift, HarmonicOperator dipole) {

    /** Focus-bias step of the central difference for the spot walk, V (the walk is quoted per volt). */
    public static final double FOCUS_STEP_V = 1.0;

    /**
     * Runs the study.
     *
     * @param focusName electrode whose bias focuses (null: no walks)
     * @param screenZ_m plane of the allowed displacement, m
     * @param allowed_m allowed spot displacement there, m
     * @throws ReflectionException if the beam is reflected
     */
    public static MisalignmentStudy run(Stack stack, FieldSolution solution, String focusName, double screenZ_m,
            double allowed_m, SolveProgress progress) {
        long t0 = System.nanoTime();
        HarmonicOperator dipole = HarmonicOperator.factor(solution, 1, progress);
        long t1 = System.nanoTime();
        double[] biases = stack.biases_V();
        CentralRayShift shift = shifts(stack, solution, dipole, biases);
        long t2 = System.nanoTime();
        int focus = focusName == null ? -1 : stack.indexOf(focusName);
        CentralRayShift up = null;
        CentralRayShift down = null;
        if (focus >= 0) {
            double[] b = biases.clone();
            b[focus] = biases[focus] + FOCUS_STEP_V;
            up = shifts(stack, solution, dipole, b);
            b[focus] = biases[focus] - FOCUS_STEP_V;
            down = shifts(stack, solution, dipole, b);
        }
        MisalignmentBudget budget = MisalignmentBudget.of(stack.names(), shift, focus, up, down, FOCUS_STEP_V,
                screenZ_m, allowed_m);
        long t3 = System.nanoTime();
        return new MisalignmentStudy(budget, shift.optics(), (t1 - t0) * 1e-9, (t2 - t1) * 1e-9, (t3 - t0) * 1e-9,
                shift, dipole);
    }

    private static CentralRayShift shifts(Stack stack, FieldSolution solution, HarmonicOperator dipole,
            double[] biases) {
        BiasedField f = solution.withBiases(biases);
        ParaxialOptics optics = ParaxialOptics.of(f, stack.withBiases(biases));
        return CentralRayShift.of(MisalignmentResponse.solve(f, dipole), optics);
    }
}
