package org.axistack.io;

import org.axistack.model.Units;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

import org.axistack.optics.MisalignmentBudget;

/**
 * The bench alignment table: RFC 4180 CSV (Commons CSV), one row per electrode and motion, units in the column
 * names: the central ray's displacement and slope at the screen per unit misalignment (0.01 mm of decentre,
 * 1 mrad of tilt), the spot walk per volt of the focus bias, the budget and single-error tolerances (each the
 * smaller of the displacement and spot-growth limits), the spot growth (length of the axial-coma figure at the
 * beam's aperture) per unit misalignment and the growth share of the tolerance. Empty cells where there is no
 * value (no focus electrode, no growth computed, or an unlimited tolerance).
 */
public final class AlignmentTableCsv {

    /** Column names, with their units. */
    public static final List<String> HEADER = List.of("electrode", "motion", "unit", "screen_z_mm",
            "screen_shift_um_per_unit", "screen_slope_urad_per_unit", "walk_um_per_unit_per_focus_V",
            "tolerance_budget", "tolerance_alone", "tolerance_unit", "spot_growth_um_per_unit", "growth_tolerance");

    /** 0.01 mm of decentre, m. */
    public static final double DECENTRE_UNIT_M = 1e-5;
    /** 1 mrad of tilt. */
    public static final double TILT_UNIT_RAD = 1e-3;

    private AlignmentTableCsv() {
    }

    /** The rows in {@link #HEADER} order; null where there is no value. */
    public static List<Object[]> rows(MisalignmentBudget b) {
        List<Object[]> out = new ArrayList<>();
        double z = Units.mToMm(b.screenZ_m());
        for (MisalignmentBudget.Row r : b.rows()) {
            out.add(new Object[] {r.name(), "decentre", "0.01 mm", z, finite(r.decentreShift() * DECENTRE_UNIT_M * 1e6),
                finite(r.decentreSlope() * DECENTRE_UNIT_M * 1e6), finite(r.decentreWalk_per_V() * DECENTRE_UNIT_M * 1e6),
                finite(Units.mToMm(r.decentreTolerance_m())), finite(Units.mToMm(r.decentreAlone_m())), "mm",
                finite(r.coma().decentreGrowth() * DECENTRE_UNIT_M * 1e6),
                finite(Units.mToMm(r.coma().decentreGrowthTolerance_m()))});
            out.add(new Object[] {r.name(), "tilt", "1 mrad", z, finite(r.tiltShift() * TILT_UNIT_RAD * 1e6),
                finite(r.tiltSlope() * TILT_UNIT_RAD * 1e6), finite(r.tiltWalk_per_V() * TILT_UNIT_RAD * 1e6),
                finite(r.tiltTolerance_rad() * 1e3), finite(r.tiltAlone_rad() * 1e3), "mrad",
                finite(r.coma().tiltGrowth() * TILT_UNIT_RAD * 1e6), finite(r.coma().tiltGrowthTolerance_rad() * 1e3)});
        }
        return out;
    }

    /** The whole table as CSV text (through the one CSV cell writer, {@link CsvTable}). */
    public static String text(MisalignmentBudget b) {
        List<List<Object>> rows = new ArrayList<>();
        for (Object[] r : rows(b)) {
            rows.add(Arrays.asList(r));
        }
        return CsvTable.text(HEADER, rows);
    }

    /**
     * The table with the bench columns of the monitors and steerers: per monitor plane, the central ray's x shift
     * there per unit misalignment ({@code monitor_<name>_shift_um_per_unit}); per split electrode, the x bias that
     * cancels the screen displacement per unit misalignment ({@code steerer_<name>_x_bias_V_per_unit}). Rows are
     * in the order of {@link #rows}: per electrode, decentre then tilt.
     */
    public static String text(MisalignmentBudget b, org.axistack.optics.MonitorAlignment bench) {
        List<String> header = new ArrayList<>(HEADER);
        for (String m : bench.monitorNames()) {
            header.add("monitor_" + m + "_shift_um_per_unit");
        }
        for (String s : bench.steerers()) {
            header.add("steerer_" + s + "_x_bias_V_per_unit");
        }
        List<List<Object>> rows = new ArrayList<>();
        List<Object[]> base = rows(b);
        for (int i = 0; i < base.size(); i++) {
            int k = i / 2;
            int motion = i % 2;
            double unit = motion == 0 ? DECENTRE_UNIT_M : TILT_UNIT_RAD;
            List<Object> row = new ArrayList<>(Arrays.asList(base.get(i)));
            for (int m = 0; m < bench.monitorNames().size(); m++) {
                row.add(finite(bench.shift()[k][motion][m] * unit * 1e6));
            }
            for (int s = 0; s < bench.steerers().size(); s++) {
                row.add(finite(bench.cancelBias_V()[s][k][motion] * unit));
            }
            rows.add(row);
        }
        return CsvTable.text(header, rows);
    }

    private static Double finite(double v) {
        return Double.isFinite(v) ? v : null;
    }
}
