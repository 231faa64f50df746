package org.axistack.probe;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;

import org.axistack.field.FieldSolution;
import org.axistack.model.Stack;
import org.axistack.optics.ParaxialOptics;
import org.axistack.optics.ReflectionException;
import org.axistack.tune.BiasTuner;
import org.axistack.tune.FocusSolution;
import org.axistack.tune.TuneResult;

/**
 * The probe plan of a stack on one field solution: the probe-current curve (optimum angle and FW50 at each current)
 * for the biases as given and, when the stack has a screen and an electrode to tune, for every bias of that electrode
 * that {@link BiasTuner} finds to focus on the screen.
 *
 * @param settings the source, angle range and currents
 * @param curves   one curve per working point (the given biases first)
 * @param notes    what was skipped and why (a lens that does not focus, no focusing bias, ...)
 */
public record ProbeStudy(Settings settings, List<Curve> curves, List<String> notes) {

    public ProbeStudy {
        curves = List.copyOf(curves);
        notes = List.copyOf(notes);
    }

    /**
     * @param source        the source
     * @param alphaMin_rad  smallest image-side aperture half-angle
     * @param alphaMax_rad  largest
     * @param currentMin_A  smallest probe current
     * @param currentMax_A  largest probe current
     * @param points        currents on the curve (log-spaced)
     */
    public record Settings(ProbeSource source, double alphaMin_rad, double alphaMax_rad, double currentMin_A,
            double currentMax_A, int points) {
        public Settings {
            if (!(alphaMin_rad > 0) || !(alphaMax_rad > alphaMin_rad) || !Double.isFinite(alphaMax_rad)) {
                throw new IllegalArgumentException("the aperture angle range must satisfy 0 < min < max");
            }
            if (!(currentMin_A > 0) || !(currentMax_A > currentMin_A) || !Double.isFinite(currentMax_A)) {
                throw new IllegalArgumentException("the current range must satisfy 0 < min < max");
            }
            if (points < 2 || points > 10_000) {
                throw new IllegalArgumentException("the curve needs 2..10000 points: " + points);
            }
        }
    }

    /** A working point and its probe curve. */
    public record Curve(ProbeWorkingPoint workingPoint, ProbeModel model, List<ProbePoint> points) {
        public Curve {
            points = List.copyOf(points);
        }

        /** The curve point with the largest current whose FW50 does not exceed the given diameter. */
        public Optional<ProbePoint> largestCurrentWithin(double fw50_m) {
            return points.stream().filter(p -> p.fw50_m() <= fw50_m).reduce((a, b) -> b);
        }
    }

    /**
     * Runs the study.
     *
     * @param tuneElectrode the electrode to tune for focus on the screen (null: no tuning)
     */
    public static ProbeStudy run(FieldSolution solution, Stack stack, Settings settings, String tuneElectrode) {
        List<Curve> curves = new ArrayList<>();
        List<String> notes = new ArrayList<>();
        add(curves, notes, solution, stack, stack.biases_V(), "biases as given", settings);
        if (tuneElectrode != null && stack.screenZ_m().isPresent()) {
            TuneResult t = new BiasTuner(solution, stack).focus(tuneElectrode, stack.screenZ_m().getAsDouble());
            if (!t.found()) {
                notes.add(String.format(Locale.ROOT, "no bias of %s in %.6g .. %.6g V focuses on the screen", tuneElectrode,
                        t.range().from_V(), t.range().to_V()));
            }
            for (FocusSolution f : t.solutions()) {
                add(curves, notes, solution, stack, f.biases_V(), String.format(Locale.ROOT,
                        "focus on the screen, %s = %.6g V", tuneElectrode, f.bias_V()), settings);
            }
        }
        return new ProbeStudy(settings, curves, notes);
    }

    private static void add(List<Curve> curves, List<String> notes, FieldSolution solution, Stack stack, double[] biases,
            String label, Settings s) {
        try {
            ParaxialOptics optics = ParaxialOptics.of(solution.withBiases(biases), stack);
            ProbeWorkingPoint wp = ProbeWorkingPoint.of(label, biases, optics, stack.beam().objectZ_m(),
                    stack.beam().particle());
            ProbeModel model = new ProbeModel(wp.lens(), s.source(), s.alphaMin_rad(), s.alphaMax_rad());
            if (model.fixedMagnification() && !Double.isFinite(wp.lens().magnification())) {
                notes.add(label + ": a virtual source size needs an object position ([beam] object_z_mm); the "
                        + "magnification is taken as free instead");
                model = new ProbeModel(wp.lens(), new ProbeSource(s.source().reducedBrightness_A_per_m2_sr_V(),
                        s.source().energySpread_eV(), java.util.OptionalDouble.empty()), s.alphaMin_rad(), s.alphaMax_rad());
            }
            List<ProbePoint> points = model.curve(s.currentMin_A(), s.currentMax_A(), s.points());
            if (points.isEmpty()) {
                notes.add(label + ": no current in the range can pass the aperture angles at this magnification");
            }
            curves.add(new Curve(wp, model, points));
        } catch (ReflectionException e) {
            notes.add(label + ": the beam is reflected (" + e.getMessage() + ")");
        } catch (IllegalArgumentException | IllegalStateException e) {
            notes.add(label + ": " + e.getMessage());
        }
    }
}
