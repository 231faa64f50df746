package org.axistack.report;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import org.axistack.io.CsvTable;
import org.axistack.model.Units;
import org.axistack.model.Stack;
import org.axistack.optics.CardinalElements;
import org.axistack.optics.SpotSizeBudget;
import org.axistack.plan.LensPlan;
import org.axistack.tune.FocusRanking;
import org.axistack.tune.FocusSolution;
import org.axistack.verify.CheckResult;

/** The plan's CSV tables (RFC 4180, header names with units) and the axial samples behind the axial chart. */
final class PlanTables {

    /** Samples of the axial chart and table. */
    static final int AXIAL_SAMPLES = 601;

    private PlanTables() {
    }

    /** Rows: z (mm), V (V), V' (V/mm), V'' (V/mm^2), over the stack's z extent. */
    static double[][] axialSamples(LensPlan plan) {
        Stack s = plan.stack();
        double z0 = s.minZ_m(), z1 = s.maxZ_m();
        double[][] out = new double[4][AXIAL_SAMPLES];
        double[] d = new double[3];
        for (int i = 0; i < AXIAL_SAMPLES; i++) {
            double z = z0 + (z1 - z0) * i / (AXIAL_SAMPLES - 1);
            plan.field().axial(z, 2, d);
            out[0][i] = Units.mToMm(z);
            out[1][i] = d[0];
            out[2][i] = d[1] * 1e-3;
            out[3][i] = d[2] * 1e-6;
        }
        return out;
    }

    /** File name to CSV text, in the order they are listed. */
    static Map<String, String> csvTables(LensPlan plan, double[][] axial) {
        Map<String, String> t = new LinkedHashMap<>();
        List<List<Object>> rows = new ArrayList<>();
        for (int i = 0; i < axial[0].length; i++) {
            rows.add(List.of(axial[0][i], axial[1][i], axial[2][i], axial[3][i]));
        }
        t.put("axial.csv", csv(List.of("z_mm", "potential_V", "dV_dz_V_per_mm", "d2V_dz2_V_per_mm2"), rows));
        if (plan.cardinal().isPresent()) {
            CardinalElements c = plan.cardinal().get();
            List<List<Object>> cr = new ArrayList<>();
            cr.add(List.of("focal_length_mm", mm(c.focalLengthObject_m()), mm(c.focalLengthImage_m())));
            cr.add(List.of("focal_point_z_mm", mm(c.focalPointObjectZ_m()), mm(c.focalPointImageZ_m())));
            cr.add(List.of("principal_plane_z_mm", mm(c.principalPlaneObjectZ_m()), mm(c.principalPlaneImageZ_m())));
            plan.aberrations().ifPresent(a -> {
                cr.add(List.of("spherical_aberration_mm", a.sphericalObject_m().isPresent()
                        ? mm(a.sphericalObject_m().getAsDouble()) : "", mm(a.sphericalImage_m())));
                cr.add(List.of("chromatic_aberration_mm", a.chromaticObject_m().isPresent()
                        ? mm(a.chromaticObject_m().getAsDouble()) : "", mm(a.chromaticImage_m())));
            });
            t.put("cardinal.csv", csv(List.of("quantity", "object_side", "image_side"), cr));
        }
        Stack s = plan.stack();
        double[] q = plan.field().charges_C();
        List<List<Object>> sf = new ArrayList<>();
        List<org.axistack.tune.SurfaceFields.Row> assessed = org.axistack.tune.SurfaceFields.of(s, plan.field());
        for (int i = 0; i < assessed.size(); i++) {
            org.axistack.field.SurfacePeak p = assessed.get(i).peak();
            sf.add(List.of(s.electrodes().get(i).name(), s.electrodes().get(i).bias_V(),
                    Units.vPerMToVPerMm(p.field_V_per_m()), Units.mToMm(p.z_m()), Units.mToMm(p.r_m()),
                    p.sharp() ? "yes" : "no",
                    Units.vPerMToVPerMm(s.limits().comfort_V_per_m()), Units.vPerMToVPerMm(s.limits().aggressive_V_per_m()),
                    q[i] * 1e12));
        }
        t.put("surface_fields.csv", csv(List.of("electrode", "bias_V", "max_surface_field_V_per_mm", "at_z_mm", "at_r_mm",
                "sharp_corner_unbounded", "comfort_limit_V_per_mm", "aggressive_limit_V_per_mm", "charge_pC"), sf));
        List<List<Object>> gr = new ArrayList<>();
        for (org.axistack.tune.GapMargins.Row r : org.axistack.tune.GapMargins.of(s)) {
            gr.add(List.of(r.first(), r.second(), Units.mToMm(r.gap().gap_m()), r.voltage_V(),
                    Units.vPerMToVPerMm(r.averageField_V_per_m()), r.comfort_V(), r.aggressive_V(), r.percentOfComfort(),
                    r.check().name().toLowerCase(java.util.Locale.ROOT), Units.mToMm(r.gap().from().z_m()),
                    Units.mToMm(r.gap().from().r_m()), Units.mToMm(r.gap().to().z_m()), Units.mToMm(r.gap().to().r_m())));
        }
        t.put("gaps.csv", csv(List.of("first_electrode", "second_electrode", "gap_mm", "voltage_across_V",
                "average_field_V_per_mm", "comfort_voltage_V", "aggressive_voltage_V", "percent_of_comfort_voltage",
                "verdict", "first_end_z_mm", "first_end_r_mm", "second_end_z_mm", "second_end_r_mm"), gr));
        double[][] cap = plan.solution().capacitanceMatrix_F();
        List<String> head = new ArrayList<>();
        head.add("electrode");
        for (var e : s.electrodes()) {
            head.add(e.name() + "_pF");
        }
        List<List<Object>> cm = new ArrayList<>();
        for (int i = 0; i < cap.length; i++) {
            List<Object> r = new ArrayList<>();
            r.add(s.electrodes().get(i).name());
            for (double x : cap[i]) {
                r.add(x * 1e12);
            }
            cm.add(r);
        }
        t.put("capacitance.csv", csv(head, cm));
        if (!plan.spotRows().isEmpty()) {
            List<List<Object>> sp = new ArrayList<>();
            for (SpotSizeBudget.Row r : plan.spotRows()) {
                sp.add(List.of(Units.radToMrad(r.alpha_rad()), r.spherical_m() * 1e6, r.chromatic_m() * 1e6, r.total_m() * 1e6));
            }
            t.put("spot_budget.csv", csv(List.of("half_angle_mrad", "spherical_disc_um", "chromatic_disc_um", "total_um"), sp));
        }
        plan.tune().ifPresent(tr -> {
            List<List<Object>> tu = new ArrayList<>();
            for (FocusSolution f : tr.solutions()) {
                tu.add(List.of(f.electrode(), f.bias_V(), mm(f.imageZ_m()), blankIfMissing(f.magnification()),
                        Units.vPerMToVPerMm(f.maxSurfaceField_V_per_m()), f.worstElectrode(), f.axisCrossings(),
                        FocusRanking.nearMirror(f) ? "yes" : "no"));
            }
            // most useful first (the plan ranks them): direct images, then near-mirror ones
            t.put("focus_biases.csv", csv(List.of("electrode", "bias_V", "image_z_mm", "magnification",
                    "max_surface_field_V_per_mm", "worst_electrode", "axis_crossings", "near_mirror"), tu));
        });
        if (!plan.budgets().isEmpty()) {
            t.put("supply_budget.csv", csv(BudgetSection.CSV_HEADER, BudgetSection.csvRows(plan)));
        }
        if (!plan.checks().isEmpty()) {
            List<List<Object>> ch = new ArrayList<>();
            for (CheckResult r : plan.checks()) {
                ch.add(List.of(r.name(), r.quantity(), r.unit(), r.computed(), r.reference(), r.error(), r.tolerance(),
                        r.errorMeasure(), r.passed() ? "pass" : "FAIL", r.source()));
            }
            t.put("verification.csv", csv(List.of("case", "compared", "unit", "computed", "reference", "error", "tolerance",
                    "error_measure", "result", "source"), ch));
        }
        return t;
    }

    private static Object mm(double m) {
        return blankIfMissing(Units.mToMm(m));
    }

    /** A number, or a blank cell for a missing one (NaN, infinite): the convention of every CSV file. */
    private static Object blankIfMissing(double x) {
        return Double.isFinite(x) ? (Object) x : "";
    }

    private static String csv(List<String> header, List<List<Object>> rows) {
        return CsvTable.text(header, rows);
    }
}
