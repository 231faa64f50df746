package org.axistack.size;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import java.util.OptionalDouble;

import org.axistack.field.BemSolver;
import org.axistack.field.BiasedField;
import org.axistack.field.FieldSolution;
import org.axistack.field.SolveException;
import org.axistack.field.SolveProgress;
import org.axistack.model.Electrode;
import org.axistack.model.GeometryCheck;
import org.axistack.model.MeshSettings;
import org.axistack.model.Stack;
import org.axistack.model.SurfaceFieldLimits;
import org.axistack.optics.Aberrations;
import org.axistack.optics.CardinalElements;
import org.axistack.optics.Imaging;
import org.axistack.optics.ParaxialOptics;
import org.axistack.optics.OpticsAccuracy;
import org.axistack.optics.ReflectionException;
import org.axistack.tune.GapMargins;

/**
 * Evaluates one candidate geometry: one boundary-element solve, the focusing biases from a {@link FocusFinder}
 * (re-biasing only), then for each bias the paraxial optics, aberration integrals and surface fields, and the
 * limit checks. Thread-safe.
 */
public final class DesignEvaluator {

    private final Requirements req;
    private final FocusFinder finder;

    public DesignEvaluator(Requirements req, FocusFinder finder) {
        this.req = req;
        this.finder = finder;
    }

    /** What one geometry gave: its designs (one per focusing bias), or why it gave none. */
    public record Candidate(List<Double> parameters_m, List<Design> designs, String failure) {
        public Candidate {
            parameters_m = List.copyOf(parameters_m);
            designs = List.copyOf(designs);
        }
    }

    /** The stack for a geometry: beam with the object, screen at the image, the given mesh. */
    public Stack stack(List<Electrode> electrodes, MeshSettings mesh) {
        SurfaceFieldLimits limits = new SurfaceFieldLimits(req.maxSurfaceField_V_per_m(),
                Math.max(req.maxSurfaceField_V_per_m(), SurfaceFieldLimits.DEFAULT_AGGRESSIVE_V_PER_M));
        return new Stack(req.title(), req.beam().withObjectZ_m(req.objectZ_m()), electrodes, req.imageZ_m(), mesh,
                limits);
    }

    /** Evaluates the geometry of the given sizing parameters (m) on a mesh of the given target size. */
    public Candidate evaluate(double[] parameters_m, int meshElements, SolveProgress progress) {
        List<Double> p = Arrays.stream(parameters_m).boxed().toList();
        Map<String, Double> dims = req.family().dimensions(parameters_m);
        return evaluate(p, dims, meshElements, progress, null);
    }

    /**
     * Evaluates machining dimensions (m). With {@code nearBias} the designs are limited to the focusing bias
     * nearest to it (used when a coarse-mesh design is re-solved on a finer mesh).
     */
    public Candidate evaluate(List<Double> p, Map<String, Double> dims, int meshElements, SolveProgress progress,
            Double nearBias) {
        Family family = req.family();
        List<Electrode> electrodes = family.electrodes(dims, new double[] {1.0});
        if (!GeometryCheck.check(electrodes).isEmpty()) {
            return new Candidate(p, List.of(), "electrodes overlap or touch");
        }
        Stack stack = stack(electrodes, MeshSettings.defaults().withTargetElements(meshElements));
        FieldSolution sol;
        try {
            sol = BemSolver.solve(electrodes, stack.mesh(), progress);
        } catch (SolveException e) {
            return new Candidate(p, List.of(), "mesh: " + e.getMessage());
        }
        int biased = stack.indexOf(family.biasedElectrodes().get(0));
        double[] biases = finder.focusingBiases(sol, stack, biased, FocusCondition.of(req), req.maxBias_V());
        if (nearBias != null && biases.length > 0) {
            double best = biases[0];
            for (double b : biases) {
                if (Math.abs(b - nearBias) < Math.abs(best - nearBias)) {
                    best = b;
                }
            }
            biases = new double[] {best};
        }
        List<Design> designs = new ArrayList<>();
        for (double b : biases) {
            Design d = design(p, dims, sol, stack, biased, b);
            if (d != null) {
                designs.add(d);
            }
        }
        return new Candidate(p, designs, designs.isEmpty() ? "no bias within the supply limit focuses" : null);
    }

    /** Optics and checks of one geometry at one bias (null when the optics fail there). */
    Design design(List<Double> p, Map<String, Double> dims, FieldSolution sol, Stack stack, int biased, double bias) {
        double[] b = stack.biases_V();
        b[biased] = bias;
        Stack s = stack.withBiases(b);
        BiasedField field = sol.withBiases(b);
        try {
            ParaxialOptics optics = ParaxialOptics.of(field, s);
            CardinalElements card = optics.cardinal();
            double imageZ, mag, cs, cc;
            if (req.objectZ_m().isPresent()) {
                double zo = req.objectZ_m().getAsDouble();
                Imaging im = optics.imaging(zo);
                Aberrations ab = optics.aberrations(zo);
                // the image plane is a real plane: where the real ray crosses the axis
                imageZ = im.realImageZ_m().orElse(im.imageZ_m());
                mag = im.realImageZ_m().isPresent() ? im.realLateralMagnification() : im.lateralMagnification();
                cs = ab.sphericalObject_m().getAsDouble();
                cc = ab.chromaticObject_m().getAsDouble();
            } else {
                Aberrations ab = optics.aberrations();
                imageZ = card.realFocusImageZ_m().orElse(card.focalPointImageZ_m());
                mag = Double.NaN;
                cs = ab.sphericalImage_m();
                cc = ab.chromaticImage_m();
            }
            if (!meetsCondition(imageZ, card.focalLengthImage_m())) {
                return null;
            }
            double maxField = Arrays.stream(field.maxSurfaceFieldPerElectrode_V_per_m()).max().orElse(0);
            return new Design(req.family(), p, dims, s.electrodes(), bias, imageZ, card.focalLengthImage_m(), mag, cs,
                    cc, maxField, s.maxZ_m() - s.minZ_m(), checks(s, bias, maxField), sol.unknowns(), card.errorEstimate(),
                    planWarnings(s, card));
        } catch (ReflectionException | IllegalArgumentException | ArithmeticException e) {
            return null;
        }
    }

    /**
     * What plan will warn of on this design, in plan's own words (one place for each: OpticsAccuracy and
     * GapMargins): the optics' error estimate above the default accuracy, an open lens whose far field matters, and
     * gaps above the stack's gap rule.
     */
    static List<String> planWarnings(Stack s, CardinalElements card) {
        List<String> w = new ArrayList<>();
        OpticsAccuracy.shortfall(card, OpticsAccuracy.DEFAULT_REQUESTED).ifPresent(w::add);
        OpticsAccuracy.closeTheLens(card).ifPresent(w::add);
        for (GapMargins.Row r : GapMargins.of(s)) {
            String g = GapMargins.warning(r);
            if (g != null) {
                w.add(g);
            }
        }
        return w;
    }

    /** Relative accuracy a focusing bias must reach (of the object-image distance, or of the focal length). */
    static final double FOCUS_TOLERANCE = 1e-6;

    /**
     * Whether the design really meets the focusing condition: a finder's root is re-checked on the design's own
     * optics (a root reported at the edge of a reflecting range, for example, is dropped).
     */
    private boolean meetsCondition(double imageZ, double f2) {
        if (req.focalLength_m().isPresent()) {
            double f = req.focalLength_m().getAsDouble();
            return Math.abs(f2 - f) <= FOCUS_TOLERANCE * f;
        }
        double zi = req.imageZ_m().getAsDouble();
        double scale = req.objectZ_m().isPresent() ? zi - req.objectZ_m().getAsDouble() : Math.abs(f2);
        return Math.abs(imageZ - zi) <= FOCUS_TOLERANCE * scale;
    }

    private List<Violation> checks(Stack s, double bias, double maxField) {
        List<Violation> v = new ArrayList<>();
        v.add(Violation.upper(Limit.BIAS, Math.abs(bias), req.maxBias_V()));
        v.add(Violation.upper(Limit.SURFACE_FIELD, maxField, req.maxSurfaceField_V_per_m()));
        v.add(Violation.upper(Limit.LENGTH, s.maxZ_m() - s.minZ_m(), req.maxLength_m()));
        v.add(Violation.lower(Limit.BORE, s.minBore_m(), req.minBore_m()));
        v.add(placement(s));
        v.add(gapRule(s));
        return v;
    }

    /**
     * The gap rule as a limit (issue 19: designs over it are rejected, not only flagged): the facing gap whose
     * voltage is the largest share of the rule's comfort voltage at its width (GapMargins, plan's own assessment);
     * without a facing gap under voltage nothing can break it.
     */
    private static Violation gapRule(Stack s) {
        GapMargins.Row worst = null;
        for (GapMargins.Row r : GapMargins.of(s)) {
            if (worst == null || r.voltage_V() / r.comfort_V() > worst.voltage_V() / worst.comfort_V()) {
                worst = r;
            }
        }
        return worst == null ? Violation.upper(Limit.GAP, 0, Double.POSITIVE_INFINITY)
                : Violation.upper(Limit.GAP, worst.voltage_V(), worst.comfort_V());
    }

    /**
     * How far the stack sticks out past the object or image plane, as a relative excess over the room between
     * them (a finite object before the stack, the image after it).
     */
    private Violation placement(Stack s) {
        OptionalDouble zo = req.objectZ_m(), zi = req.imageZ_m();
        double over = 0;
        double room = zi.isPresent() && zo.isPresent() ? zi.getAsDouble() - zo.getAsDouble() : s.maxZ_m() - s.minZ_m();
        if (zo.isPresent()) {
            over = Math.max(over, s.minZ_m() - zo.getAsDouble() < 0 ? zo.getAsDouble() - s.minZ_m() : 0);
        }
        if (zi.isPresent()) {
            over = Math.max(over, zi.getAsDouble() < s.maxZ_m() ? s.maxZ_m() - zi.getAsDouble() : 0);
        }
        return new Violation(Limit.PLACEMENT, over, room, over > 0 ? over / room : -1);
    }
}
