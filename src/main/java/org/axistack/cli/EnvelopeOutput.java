package org.axistack.cli;

import java.io.IOException;
import java.io.OutputStreamWriter;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import org.axistack.beam.BoreClearance;
import org.axistack.beam.EnvelopeCurve;
import org.axistack.beam.EnvelopePoint;
import org.axistack.beam.EnvelopeStudyResult;
import org.axistack.beam.EnvelopeWarning;
import org.axistack.beam.ScanPoint;
import org.axistack.beam.ScanResult;
import org.axistack.beam.Waist;
import org.axistack.io.AtomicFiles;
import org.axistack.io.CsvTable;
import org.axistack.model.Units;
import org.axistack.model.Stack;
import org.axistack.report.SafetyNotice;

/** Text, JSON and CSV forms of an envelope study (keys and column names carry units). */
final class EnvelopeOutput {

    static final String METHOD_NOTE = "Round-beam (KV) envelope equation, paraxial: uniform-density beam, linear "
            + "external and self fields, edge radius and edge emittance (edge = 4 x rms); normalised emittance conserved; "
            + "fills near the bore are outside the paraxial model's accuracy. Integrated with Dormand-Prince 8(5,3), "
            + "tolerance 1e-12; checked against closed forms to 1e-9 (see the tests).";

    private EnvelopeOutput() {
    }

    private static double mm(double m) {
        return Units.mToMm(m);
    }

    private static String f(double x) {
        return org.axistack.model.Numbers.general(x, org.axistack.model.Numbers.MESSAGE_DIGITS);
    }

    static void text(PrintWriter w, String source, Stack stack, EnvelopeStudyResult r, ScanResult scan) {
        w.println("Beam envelope: " + (stack.title().isBlank() ? source : stack.title()));
        w.println(String.format(Locale.ROOT, "  %s, %s eV at 0 V; current %s A; normalised edge emittance %s mm mrad "
                + "(edge %s mm mrad at the start)", stack.beam().particle().label(), f(stack.beam().energy_eV()),
                f(r.request().current_A()), f(r.normalisedEmittance_m_rad() * 1e6),
                f(r.normalisedEmittance_m_rad() / r.betaGammaStart() * 1e6)));
        w.println(String.format(Locale.ROOT, "  start z = %s mm, radius %s mm, slope %s mrad; range to z = %s mm",
                f(mm(r.zStart_m())), f(mm(r.request().start().radius_m())),
                f(Units.radToMrad(r.request().start().slope_rad())), f(mm(r.zEnd_m()))));
        w.println(String.format(Locale.ROOT, "  generalised perveance at the start %s; %s", f(r.startPerveance()),
                r.dominance()));
        w.println();
        w.println(String.format(Locale.ROOT, "  %-34s %14s %16s %14s %14s", "case", "waist_z_mm", "waist_radius_mm",
                "max_radius_mm", "end_radius_mm"));
        row(w, "current and emittance", r.full());
        row(w, "zero current (emittance only)", r.emittanceOnly());
        row(w, "zero emittance (space charge only)", r.spaceChargeOnly());
        if (r.screenRadius_m().isPresent()) {
            w.println(String.format(Locale.ROOT, "  radius at the screen (z = %s mm): %s mm", f(mm(r.screenZ_m().getAsDouble())),
                    f(mm(r.screenRadius_m().getAsDouble()))));
        }
        if (!r.full().termination().reachedEnd()) {
            w.println("  " + r.full().termination().detail());
        }
        w.println();
        w.println(String.format(Locale.ROOT, "  %-14s %14s %10s %12s %8s  %s", "electrode", "bore_radius_mm", "radius_mm", "at_z_mm",
                "fill_%", "status"));
        for (BoreClearance b : r.clearances()) {
            w.println(String.format(Locale.ROOT, "  %-14s %14s %10s %12s %8s  %s", b.electrode(), f(mm(b.bore_m())),
                    f(mm(b.radius_m())), f(mm(b.zWorst_m())), String.format(Locale.ROOT, "%.1f", 100 * b.fill()),
                    b.status().name().toLowerCase(Locale.ROOT).replace('_', ' ')));
        }
        if (!r.warnings().isEmpty()) {
            w.println();
            for (EnvelopeWarning x : r.warnings()) {
                w.println("  WARNING: " + x.message());
            }
        }
        w.println();
        w.println(String.format(Locale.ROOT, "  %10s %12s %12s", "z_mm", "radius_mm", "slope_mrad"));
        List<EnvelopePoint> pts = r.full().points();
        int step = Math.max(1, pts.size() / 20);
        for (int i = 0; i < pts.size(); i += step) {
            EnvelopePoint p = pts.get(i);
            w.println(String.format(Locale.ROOT, "  %10s %12s %12s", f(mm(p.z_m())), f(mm(p.radius_m())),
                    f(Units.radToMrad(p.slope_rad()))));
        }
        if (scan != null) {
            w.println();
            w.println(String.format(Locale.ROOT, "  Current scan 0 .. %s A:", f(scan.maxCurrent_A())));
            w.println(String.format(Locale.ROOT, "  %12s %12s %16s", "current_A", "waist_z_mm", "waist_radius_mm"));
            for (ScanPoint p : scan.points()) {
                w.println(String.format(Locale.ROOT, "  %12s %12s %16s", f(p.current_A()),
                        p.waist().map(x -> f(mm(x.z_m()))).orElse("none"),
                        p.waist().map(x -> f(mm(x.radius_m()))).orElse("none")));
            }
            w.println(scan.vanishingCurrent_A().isPresent()
                    ? "  the waist leaves the range at " + f(scan.vanishingCurrent_A().getAsDouble()) + " A"
                    : "  the waist stays in the range over the whole scan");
        }
        w.println();
        w.println("  Method: " + METHOD_NOTE);
        w.println();
        w.println(SafetyNotice.text());
    }

    private static void row(PrintWriter w, String name, EnvelopeCurve c) {
        Optional<Waist> ws = c.smallestWaist();
        w.println(String.format(Locale.ROOT, "  %-34s %14s %16s %14s %14s", name,
                ws.map(x -> f(mm(x.z_m()))).orElse("none"), ws.map(x -> f(mm(x.radius_m()))).orElse("none"),
                f(mm(c.largest().radius_m())), f(mm(c.last().radius_m()))));
    }

    private static Map<String, Object> curve(EnvelopeCurve c) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("termination", c.termination().kind().name().toLowerCase(Locale.ROOT));
        m.put("stop_z_mm", mm(c.zStop_m()));
        List<Map<String, Object>> ws = new ArrayList<>();
        for (Waist x : c.waists()) {
            Map<String, Object> wm = new LinkedHashMap<>();
            wm.put("z_mm", mm(x.z_m()));
            wm.put("radius_mm", mm(x.radius_m()));
            wm.put("kind", x.kind().name().toLowerCase(Locale.ROOT));
            ws.add(wm);
        }
        m.put("waists", ws);
        m.put("smallest_waist_z_mm", c.smallestWaist().map(x -> mm(x.z_m())).orElse(null));
        m.put("smallest_waist_radius_mm", c.smallestWaist().map(x -> mm(x.radius_m())).orElse(null));
        m.put("max_radius_mm", mm(c.largest().radius_m()));
        m.put("end_radius_mm", mm(c.last().radius_m()));
        return m;
    }

    static String json(Stack stack, EnvelopeStudyResult r, ScanResult scan) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("particle", stack.beam().particle().label());
        m.put("energy_eV", stack.beam().energy_eV());
        m.put("current_A", r.request().current_A());
        m.put("emittance_normalised_edge_mm_mrad", r.normalisedEmittance_m_rad() * 1e6);
        m.put("emittance_edge_start_mm_mrad", r.normalisedEmittance_m_rad() / r.betaGammaStart() * 1e6);
        m.put("emittance_convention", "edge (full, = 4 x rms for a KV beam); normalised = beta gamma x geometric, conserved");
        m.put("start_z_mm", mm(r.zStart_m()));
        m.put("end_z_mm", mm(r.zEnd_m()));
        m.put("start_radius_mm", mm(r.request().start().radius_m()));
        m.put("start_slope_mrad", Units.radToMrad(r.request().start().slope_rad()));
        m.put("beta_gamma_start", r.betaGammaStart());
        m.put("perveance_start", r.startPerveance());
        m.put("space_charge_ratio_start", r.spaceChargeRatio().isPresent() ? r.spaceChargeRatio().getAsDouble() : null);
        m.put("dominance", r.dominance());
        Map<String, Object> cases = new LinkedHashMap<>();
        cases.put("full", curve(r.full()));
        cases.put("zero_current", curve(r.emittanceOnly()));
        cases.put("zero_emittance", curve(r.spaceChargeOnly()));
        m.put("cases", cases);
        m.put("screen_z_mm", r.screenZ_m().isPresent() ? mm(r.screenZ_m().getAsDouble()) : null);
        m.put("screen_radius_mm", r.screenRadius_m().isPresent() ? mm(r.screenRadius_m().getAsDouble()) : null);
        List<Map<String, Object>> bores = new ArrayList<>();
        for (BoreClearance b : r.clearances()) {
            Map<String, Object> bm = new LinkedHashMap<>();
            bm.put("electrode", b.electrode());
            bm.put("bore_radius_mm", mm(b.bore_m()));
            bm.put("radius_mm", mm(b.radius_m()));
            bm.put("worst_z_mm", mm(b.zWorst_m()));
            bm.put("fill", b.fill());
            bm.put("status", b.status().name().toLowerCase(Locale.ROOT));
            bores.add(bm);
        }
        m.put("bores", bores);
        List<Map<String, Object>> warns = new ArrayList<>();
        for (EnvelopeWarning x : r.warnings()) {
            Map<String, Object> wm = new LinkedHashMap<>();
            wm.put("kind", x.kind().name().toLowerCase(Locale.ROOT));
            wm.put("z_mm", mm(x.z_m()));
            wm.put("electrode", x.electrode());
            wm.put("message", x.message());
            warns.add(wm);
        }
        m.put("warnings", warns);
        List<Map<String, Object>> env = new ArrayList<>();
        for (EnvelopePoint p : r.full().points()) {
            Map<String, Object> pm = new LinkedHashMap<>();
            pm.put("z_mm", mm(p.z_m()));
            pm.put("radius_mm", mm(p.radius_m()));
            pm.put("slope_mrad", Units.radToMrad(p.slope_rad()));
            pm.put("radius_zero_current_mm", r.emittanceOnly().covers(p.z_m()) ? mm(r.emittanceOnly().at(p.z_m()).radius_m()) : null);
            pm.put("radius_zero_emittance_mm", r.spaceChargeOnly().covers(p.z_m()) ? mm(r.spaceChargeOnly().at(p.z_m()).radius_m()) : null);
            env.add(pm);
        }
        m.put("envelope", env);
        if (scan != null) {
            Map<String, Object> sm = new LinkedHashMap<>();
            sm.put("max_current_A", scan.maxCurrent_A());
            sm.put("vanishing_current_A", scan.vanishingCurrent_A().isPresent() ? scan.vanishingCurrent_A().getAsDouble() : null);
            List<Map<String, Object>> sp = new ArrayList<>();
            for (ScanPoint p : scan.points()) {
                Map<String, Object> pm = new LinkedHashMap<>();
                pm.put("current_A", p.current_A());
                pm.put("waist_z_mm", p.waist().map(x -> (Object) mm(x.z_m())).orElse(null));
                pm.put("waist_radius_mm", p.waist().map(x -> (Object) mm(x.radius_m())).orElse(null));
                pm.put("termination", p.termination().kind().name().toLowerCase(Locale.ROOT));
                sp.add(pm);
            }
            sm.put("points", sp);
            m.put("scan", sm);
        }
        m.put("method", METHOD_NOTE);
        m.put("safety", SafetyNotice.lines());
        return JsonOption.text(m);
    }

    static void writeEnvelopeCsv(Path file, EnvelopeStudyResult r) throws IOException {
        AtomicFiles.write(file, out -> {
            try (CsvTable.Writer p = CsvTable.writer(new OutputStreamWriter(out, StandardCharsets.UTF_8), List.of("z_mm",
                    "radius_mm", "slope_mrad", "radius_zero_current_mm", "radius_zero_emittance_mm", "perveance",
                    "emittance_mm_mrad"))) {
                for (EnvelopePoint e : r.full().points()) {
                    p.row(java.util.Arrays.asList(mm(e.z_m()), mm(e.radius_m()), Units.radToMrad(e.slope_rad()),
                            r.emittanceOnly().covers(e.z_m()) ? mm(r.emittanceOnly().at(e.z_m()).radius_m()) : "",
                            r.spaceChargeOnly().covers(e.z_m()) ? mm(r.spaceChargeOnly().at(e.z_m()).radius_m()) : "",
                            e.perveance(), e.emittance_m_rad() * 1e6));
                }
            }
        });
    }

    static void writeScanCsv(Path file, ScanResult s) throws IOException {
        AtomicFiles.write(file, out -> {
            try (CsvTable.Writer p = CsvTable.writer(new OutputStreamWriter(out, StandardCharsets.UTF_8),
                    List.of("current_A", "waist_z_mm", "waist_radius_mm", "end_radius_mm", "termination"))) {
                for (ScanPoint x : s.points()) {
                    p.row(java.util.Arrays.asList(x.current_A(), x.waist().map(w -> (Object) mm(w.z_m())).orElse(""),
                            x.waist().map(w -> (Object) mm(w.radius_m())).orElse(""), mm(x.endRadius_m()),
                            x.termination().kind().name().toLowerCase(Locale.ROOT)));
                }
            }
        });
    }
}
