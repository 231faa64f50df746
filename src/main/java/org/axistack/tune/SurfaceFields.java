package org.axistack.tune;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import org.axistack.field.BiasedField;
import org.axistack.field.SurfacePeak;
import org.axistack.model.Stack;
import org.axistack.model.SurfaceFieldLimits;

/**
 * The plan's one assessment of electrode surface fields, shared by the text, the report and the CSV table: per
 * electrode the largest surface field, where it sits, and its verdict against the stack's limits. On rounded edges
 * the value converges as the mesh is refined (field design note); at a sharp corner or a free sheet edge it has
 * no finite limit, and the assessment says so instead of giving a number that only reflects the mesh.
 */
public final class SurfaceFields {

    /**
     * One electrode's surface field.
     *
     * @param name  electrode name
     * @param peak  the largest field and where it sits (sharp: at a corner without a finite limit)
     * @param check the sampled value against the limits (at a sharp corner: the field at the mesh's resolution,
     *              which the true field only exceeds)
     * @param coarser the same electrode's peak on the next coarser mesh of an accuracy-driven solve, or null
     * @param coarserUnknowns unknowns of that mesh (0 without one)
     */
    public record Row(String name, SurfacePeak peak, SurfaceFieldCheck check, SurfacePeak coarser, int coarserUnknowns) {

        /**
         * The mesh convergence of a finite peak in words, when the solve refined to an accuracy: the value on the next
         * coarser mesh and the relative change, "converged" when it is at most {@link #CONVERGED}; empty for a fixed
         * mesh (one solve) and for a sharp corner (no finite value to converge).
         */
        public java.util.Optional<String> convergence() {
            if (coarser == null || peak.sharp()) {
                return java.util.Optional.empty();
            }
            double change = relativeChange();
            return java.util.Optional.of(String.format(Locale.ROOT, "%s: %s V/mm on the next coarser mesh (%d unknowns),"
                    + " relative change %s (tolerance %s)", change <= CONVERGED ? "converged" : "NOT converged",
                    num(coarser.field_V_per_m() * 1e-3), coarserUnknowns,
                    org.axistack.model.Numbers.scientific(change, 1), org.axistack.model.Numbers.scientific(CONVERGED, 0)));
        }

        /** |peak - coarser| / peak (NaN without a coarser mesh). */
        public double relativeChange() {
            return coarser == null ? Double.NaN
                    : Math.abs(peak.field_V_per_m() - coarser.field_V_per_m()) / peak.field_V_per_m();
        }

        /** The field in words: "195.43 V/mm at z = 5.483, r = 5.84 mm", or the sharp-corner statement. */
        public String describe() {
            if (peak.sharp()) {
                return sharpStatement(peak);
            }
            return String.format(Locale.ROOT, "%s V/mm at z = %s, r = %s mm", num(peak.field_V_per_m() * 1e-3),
                    num(peak.z_m() * 1e3), num(peak.r_m() * 1e3));
        }

        /** The verdict in words ("within", "above comfort", "unbounded (sharp corner)", ...). */
        public String verdict() {
            String v = check.words();
            return peak.sharp() ? "unbounded (sharp corner); " + v + " already at the mesh's resolution" : v;
        }
    }

    /** Relative change between two meshes under which a finite peak field counts as converged. */
    public static final double CONVERGED = 1e-3;

    private SurfaceFields() {
    }

    /** Five significant digits, trailing zeros cut ("5.5", "195.43"). */
    static String num(double x) {
        return org.axistack.model.Numbers.text(x);
    }

    /** The plain statement for a sharp corner. */
    public static String sharpStatement(SurfacePeak p) {
        return String.format(Locale.ROOT, "sharp corner at z = %s, r = %s mm: the field grows without bound as the mesh "
                + "is refined; give the edge a radius (edge_radius_mm)", num(p.z_m() * 1e3),
                num(p.r_m() * 1e3));
    }

    /** The assessment of every electrode, in electrode order. */
    public static List<Row> of(Stack stack, BiasedField field) {
        SurfacePeak[] peaks = field.surfacePeaks();
        var coarse = field.solution().coarserRung();
        SurfacePeak[] before = coarse.map(c -> c.withBiases(field.biases_V()).surfacePeaks()).orElse(null);
        int beforeUnknowns = coarse.map(org.axistack.field.FieldSolution::unknowns).orElse(0);
        SurfaceFieldLimits lim = stack.limits();
        List<Row> rows = new ArrayList<>();
        for (int i = 0; i < peaks.length; i++) {
            rows.add(new Row(stack.electrodes().get(i).name(), peaks[i], SurfaceFieldCheck.of(peaks[i].field_V_per_m(), lim),
                    before == null ? null : before[i], beforeUnknowns));
        }
        return rows;
    }
}
