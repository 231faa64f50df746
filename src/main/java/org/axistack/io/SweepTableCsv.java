package org.axistack.io;

import org.axistack.model.Units;
import java.util.List;

import org.axistack.tune.SweepPoint;

/**
 * The table of a bias sweep (optics against one bias): RFC 4180 CSV ({@link CsvTable}) with unit-named columns, one row
 * per point, empty cells where a point has no value. Shared by the sweep command (its --csv file and JSON rows), the
 * plan report's sweep.csv and the desktop window's report export.
 */
public final class SweepTableCsv {

    /** Column names, with their units. */
    public static final List<String> HEADER = List.of("bias_V", "status", "focal_length_object_mm",
            "focal_length_image_mm", "focal_point_object_z_mm", "focal_point_image_z_mm", "principal_plane_object_z_mm",
            "principal_plane_image_z_mm", "image_z_mm", "magnification", "spherical_aberration_mm",
            "chromatic_aberration_mm", "real_image_z_mm", "error_estimate");

    private SweepTableCsv() {
    }

    /** One point's cells in {@link #HEADER} order (lengths in mm); null where the point has no value. */
    public static Object[] row(SweepPoint p) {
        return new Object[] {p.bias_V(), p.status(), mm(p.focalLengthObject_m()), mm(p.focalLengthImage_m()),
            mm(p.focalPointObjectZ_m()), mm(p.focalPointImageZ_m()), mm(p.principalPlaneObjectZ_m()),
            mm(p.principalPlaneImageZ_m()), mm(p.imageZ_m()), Double.isFinite(p.magnification()) ? p.magnification() : null,
            mm(p.sphericalAberration_m()), mm(p.chromaticAberration_m()), mm(p.realImageZ_m()),
            Double.isFinite(p.errorEstimate()) ? p.errorEstimate() : null};
    }

    /** The whole table as CSV text. */
    public static String text(List<SweepPoint> points) {
        List<List<Object>> rows = new java.util.ArrayList<>();
        for (SweepPoint pt : points) {
            rows.add(java.util.Arrays.asList(row(pt)));
        }
        return CsvTable.text(HEADER, rows);
    }

    private static Double mm(double m) {
        double v = Units.mToMm(m);
        return Double.isFinite(v) ? v : null;
    }
}
