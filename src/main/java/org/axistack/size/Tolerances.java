package org.axistack.size;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import org.axistack.field.BemSolver;
import org.axistack.field.FieldSolution;
import org.axistack.field.SolveProgress;
import org.axistack.model.Electrode;
import org.axistack.model.MeshSettings;
import org.axistack.model.Stack;
import org.axistack.optics.ParaxialOptics;

/**
 * Machining and supply tolerances of a design: the image shift per 0.01 mm of each machining dimension (each gap
 * separately, bore, lengths, wall or plate thickness) and per volt of the bias, at the design's fixed bias. Each
 * derivative is a central difference (error O(h^2)) with a step of 1% of the dimension (0.1% of the bias),
 * scaled linearly to 0.01 mm or 1 V; every perturbed geometry is solved anew on the design's mesh. The mesh
 * changes with the geometry, so differences smaller than the mesh error of the image position are not
 * resolved; the step is chosen large enough that the image shifts by much more than that.
 */
public final class Tolerances {

    /** Reporting unit for lengths: 0.01 mm. */
    public static final double LENGTH_UNIT_M = 1e-5;

    private Tolerances() {
    }

    public static List<Tolerance> of(Requirements req, Design d, MeshSettings mesh, SolveProgress progress) {
        DesignEvaluator ev = new DesignEvaluator(req, (s, st, e, t, m) -> new double[0]);
        List<Tolerance> out = new ArrayList<>();
        String biasedName = req.family().biasedElectrodes().get(0);
        List<String> names = new ArrayList<>(d.dimensions_m().keySet());
        double[] z = java.util.stream.IntStream.range(0, 2 * names.size()).parallel().mapToDouble(k -> {
            String name = names.get(k / 2);
            double h = (k % 2 == 0 ? 0.01 : -0.01) * d.dimensions_m().get(name);
            return imageZ(req, ev, perturbed(d, name, h), d.bias_V(), mesh, progress);
        }).toArray();
        for (int i = 0; i < names.size(); i++) {
            double h = 0.01 * d.dimensions_m().get(names.get(i));
            out.add(new Tolerance(names.get(i), false, (z[2 * i] - z[2 * i + 1]) / (2 * h) * LENGTH_UNIT_M));
        }
        Stack s = ev.stack(req.family().electrodes(d.dimensions_m(), new double[] {d.bias_V()}), mesh);
        FieldSolution sol = BemSolver.solve(s.electrodes(), mesh, progress);
        double hb = Math.max(1e-3 * Math.abs(d.bias_V()), 1e-3);
        double plus = imageZ(req, sol, s, d.bias_V() + hb);
        double minus = imageZ(req, sol, s, d.bias_V() - hb);
        out.add(new Tolerance("bias of " + biasedName, true, (plus - minus) / (2 * hb)));
        return out;
    }

    /** The entry with the largest image shift per 0.01 mm among the machining dimensions. */
    public static Tolerance mostCritical(List<Tolerance> ts) {
        Tolerance worst = null;
        for (Tolerance t : ts) {
            if (!t.bias() && (worst == null || Math.abs(t.imageShift_m()) > Math.abs(worst.imageShift_m()))) {
                worst = t;
            }
        }
        return worst;
    }

    private static Map<String, Double> perturbed(Design d, String name, double h) {
        Map<String, Double> m = new LinkedHashMap<>(d.dimensions_m());
        m.put(name, m.get(name) + h);
        return m;
    }

    private static double imageZ(Requirements req, DesignEvaluator ev, Map<String, Double> dims, double bias,
            MeshSettings mesh, SolveProgress progress) {
        List<Electrode> el = req.family().electrodes(dims, new double[] {bias});
        Stack s = ev.stack(el, mesh);
        FieldSolution sol = BemSolver.solve(el, mesh, progress);
        return imageZ(req, sol, s, bias);
    }

    private static double imageZ(Requirements req, FieldSolution sol, Stack s, double bias) {
        int i = s.indexOf(req.family().biasedElectrodes().get(0));
        double[] b = s.biases_V();
        b[i] = bias;
        ParaxialOptics o = ParaxialOptics.of(sol.withBiases(b), s.withBiases(b));
        if (req.objectZ_m().isPresent()) {
            var im = o.imaging(req.objectZ_m().getAsDouble());
            return im.realImageZ_m().orElse(im.imageZ_m());
        }
        var c = o.cardinal();
        return c.realFocusImageZ_m().orElse(c.focalPointImageZ_m());
    }
}
