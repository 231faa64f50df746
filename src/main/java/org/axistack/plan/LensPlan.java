package org.axistack.plan;

import java.util.List;
import java.util.Optional;

import org.axistack.beam.EnvelopeStudyResult;
import org.axistack.field.BiasedField;
import org.axistack.field.FieldSolution;
import org.axistack.model.Stack;
import org.axistack.optics.Aberrations;
import org.axistack.optics.CardinalElements;
import org.axistack.optics.Imaging;
import org.axistack.optics.SpotSizeBudget;
import org.axistack.trace.Trajectory;
import org.axistack.tune.FocusSensitivity;
import org.axistack.tune.SweepPoint;
import org.axistack.tune.TuneResult;
import org.axistack.verify.CheckResult;

/**
 * Everything a lens plan computed, for the console summary and the HTML report. Parts that could not be computed
 * are empty and the reason is in {@code notes} or {@code warnings}; nothing is filled with a stand-in.
 *
 * @param stack        the stack as planned (biases after --set)
 * @param source       how the stack was named (file or built-in demo)
 * @param solution     the field solution (one per geometry)
 * @param field        the solution at the stack's biases
 * @param reflection   the reflection message when the beam turns back on the axis
 * @param cardinal     cardinal elements (empty when reflected)
 * @param optics       reference planes, integrator and aberration convention in words
 * @param imaging      the image of the stack's object point, if it has one
 * @param aberrations  Cs and Cc (empty for an afocal lens or when reflected)
 * @param spotInputs   the spot-size budget inputs (empty without aberrations)
 * @param spotRows     the spot-size budget against aperture half-angle
 * @param rays         traced meridional rays with their paths (for the geometry picture)
 * @param rayNote      what the rays are and how they ended
 * @param envelope     the envelope study with the documented default beam
 * @param envelopeNote what beam the envelope assumes
 * @param tune         the biases of one electrode that focus on the screen, if asked for and possible
 * @param tuneNote     what was tuned, or why not
 * @param budgets      the supply-stability budget at each focusing bias, in the order of the tune's solutions
 *                     (empty when there is none)
 * @param budgetNote   what the budgets assume (depth of focus, method), or why they are missing
 * @param sweepElectrode the electrode whose bias was swept (empty: no sweep)
 * @param sweep        optical properties against that bias
 * @param checks       the built-in verification cases
 * @param warnings     things the user must look at
 * @param seconds      wall time of the whole plan, s
 * @param probe        probe size against current at the given and the focusing biases (empty: no source brightness
 *                     given, or the beam is reflected)
 * @param offAxis      the off-axis aberrations of the stack's finite object, with the object height and aperture angle
 *                     of their effects when given (empty: object at infinity, imaged to infinity, or reflected)
 * @param offAxisNote  why they are missing (empty text when present)
 * @param misalignment the decentre and tilt budget of every electrode (empty: not asked for, or the beam is
 *                     reflected)
 */
public record LensPlan(Stack stack, String source, FieldSolution solution, BiasedField field,
        Optional<String> reflection, Optional<CardinalElements> cardinal, String optics, Optional<Imaging> imaging,
        Optional<Aberrations> aberrations, Optional<SpotSizeBudget.Inputs> spotInputs, List<SpotSizeBudget.Row> spotRows,
        List<Trajectory> rays, String rayNote, Optional<EnvelopeStudyResult> envelope, String envelopeNote,
        Optional<TuneResult> tune, String tuneNote, List<FocusSensitivity> budgets, String budgetNote,
        Optional<String> sweepElectrode, List<SweepPoint> sweep,
        List<CheckResult> checks, List<String> warnings, double seconds, Optional<org.axistack.probe.ProbeStudy> probe,
        Optional<org.axistack.optics.OffAxisEffects> offAxis, String offAxisNote,
        Optional<org.axistack.optics.MisalignmentStudy> misalignment) {

    public LensPlan {
        spotRows = List.copyOf(spotRows);
        budgets = List.copyOf(budgets);
        rays = List.copyOf(rays);
        sweep = List.copyOf(sweep);
        checks = List.copyOf(checks);
        warnings = List.copyOf(warnings);
    }

    /** A plan without the misalignment section. */
    public LensPlan(Stack stack, String source, FieldSolution solution, BiasedField field,
            Optional<String> reflection, Optional<CardinalElements> cardinal, String optics, Optional<Imaging> imaging,
            Optional<Aberrations> aberrations, Optional<SpotSizeBudget.Inputs> spotInputs,
            List<SpotSizeBudget.Row> spotRows, List<Trajectory> rays, String rayNote,
            Optional<EnvelopeStudyResult> envelope, String envelopeNote, Optional<TuneResult> tune, String tuneNote,
            List<FocusSensitivity> budgets, String budgetNote, Optional<String> sweepElectrode, List<SweepPoint> sweep,
            List<CheckResult> checks, List<String> warnings, double seconds,
            Optional<org.axistack.probe.ProbeStudy> probe, Optional<org.axistack.optics.OffAxisEffects> offAxis,
            String offAxisNote) {
        this(stack, source, solution, field, reflection, cardinal, optics, imaging, aberrations, spotInputs, spotRows,
                rays, rayNote, envelope, envelopeNote, tune, tuneNote, budgets, budgetNote, sweepElectrode, sweep, checks,
                warnings, seconds, probe, offAxis, offAxisNote, Optional.empty());
    }

    /** True when the plan has an outcome the user must act on (reflection or no real focus). */
    public boolean needsAction() {
        return reflection.isPresent() || cardinal.map(c -> !c.focuses()).orElse(true);
    }
}
