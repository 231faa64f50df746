package org.axistack.cli;

import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import org.axistack.field.FieldSolution;
import org.axistack.field.SectorField;
import org.axistack.field.SolveProgress;
import org.axistack.model.Sectors;
import org.axistack.model.Stack;
import org.axistack.optics.ParaxialOptics;
import org.axistack.optics.SplitDeflection;

/**
 * Bench rows for split electrodes: the harmonic solves of a four-sector steerer against the round solve, and
 * re-biasing with the central ray's deflection at the screen. Uses the stack's split electrodes, or splits the
 * electrode with the largest bias into four sectors (1 V x differential) when the stack has none.
 */
final class SteeringBench {

    private SteeringBench() {
    }

    interface Row {
        void add(String what, double seconds, double target);
    }

    static void rows(Stack stack, FieldSolution sol, double roundSolve_s, int repeat, PrintWriter out, Row row) {
        Map<Integer, Sectors> split = stack.sectorsByIndex();
        if (split.isEmpty()) {
            int e = 0;
            double[] b = stack.biases_V();
            for (int i = 1; i < b.length; i++) {
                if (Math.abs(b[i]) > Math.abs(b[e])) {
                    e = i;
                }
            }
            if (stack.electrodes().get(e).contour().minR_m() <= 0) {
                out.println("  (no steering rows: the electrode with the largest bias reaches the axis)");
                return;
            }
            split.put(e, Sectors.fromDifferentials(4, 0, 0, b[e], 1, 0));
        }
        double[] t = new double[repeat];
        SectorField sf = null;
        for (int i = 0; i < repeat; i++) {
            long t0 = System.nanoTime();
            sf = SectorField.solve(sol, split, 3, SolveProgress.NONE);
            t[i] = (System.nanoTime() - t0) * 1e-9;
        }
        double solve = median(t);
        row.add("4-sector steerer: harmonics " + sf.orders() + ", target 3 x round solve; ratio "
                + String.format(java.util.Locale.ROOT, "%.2f", solve / roundSolve_s), solve, Math.round(3000 * roundSolve_s) / 1000.0);
        ParaxialOptics optics = ParaxialOptics.of(sol.withBiases(stack.biases_V()), stack);
        double zScreen = stack.screenZ_m().orElse(optics.zEnd_m());
        SplitDeflection d = SplitDeflection.of(sf, optics, optics.zStart_m(), new double[] {zScreen});
        double[] rb = new double[Math.max(repeat, 200)];
        double sink = 0;
        for (int i = 0; i < rb.length; i++) {
            long t0 = System.nanoTime();
            Map<Integer, List<Double>> biases = new LinkedHashMap<>();
            for (var e : split.entrySet()) {
                List<Double> v = new ArrayList<>(e.getValue().biases_V());
                v.set(0, v.get(0) + 1e-3 * (i + 1));
                biases.put(e.getKey(), v);
            }
            sink += d.ray(0, biases)[0];
            rb[i] = (System.nanoTime() - t0) * 1e-9;
        }
        row.add("re-bias a sector + deflection at the screen (recombination)", median(rb), 0.005);
        double[] rc = new double[Math.max(repeat, 10)];
        double[] ro = new double[rc.length];
        for (int i = 0; i < rc.length; i++) {
            double[] b = stack.biases_V();
            for (int k = 0; k < b.length; k++) {
                b[k] *= 1 + 1e-3 * (i + 1);
            }
            long t0 = System.nanoTime();
            ParaxialOptics o = ParaxialOptics.of(sol.withBiases(b), stack.withBiases(b));
            long t1 = System.nanoTime();
            SplitDeflection dd = SplitDeflection.of(sf, o, o.zStart_m(), new double[] {zScreen});
            sink += dd.perVolt(0, dd.electrodes().get(0)).xPerVx_m();
            rc[i] = (System.nanoTime() - t0) * 1e-9;
            ro[i] = (t1 - t0) * 1e-9;
        }
        // the dipole functions come from the split electrodes' tables (built by the first deflection above), so
        // what is left is the new round optics and the quadrature on its transfer matrices
        row.add("common-mode change: round optics + deflection responses again", median(rc), 0.005);
        row.add("  of which the round optics (reference planes, fundamental rays)", median(ro), Double.NaN);
        if (Double.isNaN(sink)) {
            out.println("  (deflection undefined)");
        }
    }

    private static double median(double[] v) {
        double[] s = v.clone();
        Arrays.sort(s);
        return s.length % 2 == 1 ? s[s.length / 2] : 0.5 * (s[s.length / 2 - 1] + s[s.length / 2]);
    }
}
