package org.axistack.io;

import org.axistack.model.Units;
import java.io.IOException;
import java.io.OutputStreamWriter;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

import org.axistack.trace.BundleResult;
import org.axistack.trace.RayPoint;
import org.axistack.trace.TableRow;

/**
 * The trajectory table of {@code trace --table}: every ray at every plane, RFC 4180 CSV ({@link CsvTable})
 * with a header whose names carry units, written atomically (temporary file, then move). Shared by the
 * trace command and the desktop window.
 */
public final class TraceTableCsv {

    public static final String[] HEADER = {"ray_id", "z_mm", "x_mm", "y_mm", "r_mm", "slope_mrad", "kinetic_energy_eV",
        "time_ns", "status", "slope_x_mrad", "slope_y_mrad"};

    private TraceTableCsv() {
    }

    public static void write(Path file, BundleResult res) throws IOException {
        AtomicFiles.write(file, os -> {
            Writer w = new OutputStreamWriter(os, StandardCharsets.UTF_8);
            try (CsvTable.Writer csv = CsvTable.writer(w, List.of(HEADER))) {
                for (TableRow row : res.tableRows()) {
                    csv.row(cells(row));
                }
            }
        });
    }

    private static List<String> cells(TableRow row) {
        List<String> cells = new ArrayList<>();
        cells.add(Integer.toString(row.rayId()));
        cells.add(num(Units.mToMm(row.z_m())));
        if (row.point().isPresent()) {
            RayPoint p = row.point().get();
            cells.add(num(Units.mToMm(p.x_m())));
            cells.add(num(Units.mToMm(p.y_m())));
            cells.add(num(Units.mToMm(p.r_m())));
            cells.add(num(Units.radToMrad(p.radialSlope())));
            cells.add(num(p.kineticEnergy_eV()));
            cells.add(num(p.time_s() * 1e9));
            cells.add(row.status());
            cells.add(num(Units.radToMrad(p.slopeX())));
            cells.add(num(Units.radToMrad(p.slopeY())));
        } else {
            for (int i = 0; i < 6; i++) {
                cells.add("");
            }
            cells.add(row.status());
            cells.add("");
            cells.add("");
        }
        return cells;
    }

    /** A table number: ten significant digits, plain notation, empty for a non-finite value. */
    public static String num(double x) {
        if (!Double.isFinite(x)) {
            return "";
        }
        return org.axistack.model.Numbers.plain(x, org.axistack.model.Numbers.TABLE_DIGITS);
    }
}
