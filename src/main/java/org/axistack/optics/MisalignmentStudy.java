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
 * @param coma            the axial coma of every misalignment at the beam's image (null: not computed, see
 *                        {@code comaNote})
 * @param comaNote        how the aperture angle was chosen, or why there is no coma
 * @param comaSeconds     wall-clock seconds of the coma (dipole table and integration)
 */
public record MisalignmentStudy(MisalignmentBudget budget, ParaxialOptics optics, double factorSeconds,
        double responseSeconds, double totalSeconds, CentralRayShift shift, HarmonicOperator dipole,
        MisalignmentAberrations coma, String comaNote, double comaSeconds) {

    /** Focus-bias step of the central difference for the spot walk, V (the walk is quoted per volt). */
    public static final double FOCUS_STEP_V = 1.0;

    /** Default allowed spot displacement at the screen, m: our default, no source. */
    public static final double DEFAULT_ALLOWED_SHIFT_M = 5e-5;

    /** Default allowed spot growth (length of the coma figure), m: our default, no source. */
    public static final double DEFAULT_ALLOWED_GROWTH_M = 1e-5;

    /**
     * Share of the narrowest open bore the beam fills by default: the aperture ray's largest height in the traced
     * range is this share of the bore radius (keeping the beam in the inner half of the bore is common practice,
     * no source).
     */
    public static final double DEFAULT_BORE_FILL = 0.5;

    /** Runs the study with the default aperture (half the bore) and growth allowance. */
    public static MisalignmentStudy run(Stack stack, FieldSolution solution, String focusName, double screenZ_m,
            double allowed_m, SolveProgress progress) {
        return run(stack, solution, focusName, screenZ_m, allowed_m, Double.NaN, DEFAULT_ALLOWED_GROWTH_M, progress);
    }

    /**
     * Runs the study.
     *
     * @param focusName electrode whose bias focuses (null: no walks)
     * @param screenZ_m plane of the allowed displacement, m
     * @param allowed_m allowed spot displacement there, m
     * @param aperture_rad the beam's image-side half-angle for the spot growth (NaN: the beam filling
     *                     {@link #DEFAULT_BORE_FILL} of the narrowest open bore)
     * @param allowedGrowth_m allowed spot growth (length of the coma figure), m
     * @throws ReflectionException if the beam is reflected
     */
    public static MisalignmentStudy run(Stack stack, FieldSolution solution, String focusName, double screenZ_m,
            double allowed_m, double aperture_rad, double allowedGrowth_m, SolveProgress progress) {
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
        long tc = System.nanoTime();
        MisalignmentAberrations coma = null;
        String note;
        double aperture = aperture_rad;
        try {
            coma = MisalignmentAberrations.of(shift.response(), shift.optics(), stack.beam().objectZ_m());
            if (Double.isNaN(aperture)) {
                aperture = DEFAULT_BORE_FILL * stack.openBore_m() / coma.apertureRayPeak()
                        * Math.abs(coma.imageSlopeRatio());
                note = "image-side half-angle " + org.axistack.model.Numbers.text(aperture * 1e3) + " mrad: the beam"
                        + " filling " + org.axistack.model.Numbers.text(DEFAULT_BORE_FILL * 100) + " % of the narrowest"
                        + " open bore (default)";
            } else {
                note = "image-side half-angle " + org.axistack.model.Numbers.text(aperture * 1e3) + " mrad (given)";
            }
        } catch (IllegalArgumentException e) {
            note = "no spot growth: " + e.getMessage();
        }
        double comaSeconds = (System.nanoTime() - tc) * 1e-9;
        MisalignmentBudget budget = MisalignmentBudget.of(stack.names(), shift, focus, up, down, FOCUS_STEP_V,
                screenZ_m, allowed_m, coma, aperture, allowedGrowth_m);
        long t3 = System.nanoTime();
        return new MisalignmentStudy(budget, shift.optics(), (t1 - t0) * 1e-9, (t2 - t1) * 1e-9, (t3 - t0) * 1e-9,
                shift, dipole, coma, note, comaSeconds);
    }

    private static CentralRayShift shifts(Stack stack, FieldSolution solution, HarmonicOperator dipole,
            double[] biases) {
        BiasedField f = solution.withBiases(biases);
        ParaxialOptics optics = ParaxialOptics.of(f, stack.withBiases(biases));
        return CentralRayShift.of(MisalignmentResponse.solve(f, dipole), optics);
    }
}
