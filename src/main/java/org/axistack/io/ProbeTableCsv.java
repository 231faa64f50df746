package org.axistack.io;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

import org.axistack.probe.ProbePoint;
import org.axistack.probe.ProbeStudy;

/**
 * The probe-current curves of a probe study: RFC 4180 CSV (Commons CSV) with unit-named columns, one row per working
 * point and current. Shared by the probe command and the plan report.
 */
public final class ProbeTableCsv {

    /** Column names, with their units. */
    public static final List<String> HEADER = List.of("working_point", "current_A", "alpha_mrad", "probe_fw50_nm",
            "probe_quadrature_nm", "source_nm", "diffraction_nm", "spherical_nm", "chromatic_nm", "dominant",
            "interior_optimum");

    private ProbeTableCsv() {
    }

    /** One point's cells in {@link #HEADER} order. */
    public static Object[] row(String workingPoint, ProbePoint p) {
        return new Object[] {workingPoint, p.current_A(), p.alpha_rad() * 1e3, p.fw50_m() * 1e9, p.quadrature_m() * 1e9,
            p.source_m() * 1e9, p.diffraction_m() * 1e9, p.spherical_m() * 1e9, p.chromatic_m() * 1e9,
            p.dominant().name().toLowerCase(java.util.Locale.ROOT), p.interior()};
    }

    /** Every curve of the study as CSV text (through the one CSV cell writer, {@link CsvTable}). */
    public static String text(ProbeStudy study) {
        List<List<Object>> rows = new ArrayList<>();
        for (ProbeStudy.Curve c : study.curves()) {
            for (ProbePoint pt : c.points()) {
                rows.add(Arrays.asList(row(c.workingPoint().label(), pt)));
            }
        }
        return CsvTable.text(HEADER, rows);
    }
}
