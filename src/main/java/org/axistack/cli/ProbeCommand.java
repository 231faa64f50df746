package org.axistack.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.OptionalDouble;
import java.util.concurrent.Callable;

import org.axistack.model.PhysicsException;
import org.axistack.field.BemSolver;
import org.axistack.field.FieldSolution;
import org.axistack.io.AtomicFiles;
import org.axistack.io.ProbeTableCsv;
import org.axistack.io.StackInputException;
import org.axistack.model.Stack;
import org.axistack.plan.PlanAnalysis;
import org.axistack.probe.ProbeLens;
import org.axistack.probe.ProbePoint;
import org.axistack.probe.ProbeSource;
import org.axistack.probe.ProbeStudy;
import org.axistack.report.ChartFiles;
import org.axistack.report.ProbeChart;
import org.axistack.report.SafetyNotice;


import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/**
 * {@code probe [STACK] --brightness B [...]}: the focused-probe plan of org.axistack.probe (probe diameter FW50
 * against current at the optimum aperture angle, with the dominant contribution) for the biases as given and for
 * each bias that focuses on the screen; optional CSV, PNG and SVG in a folder.
 */
@Command(name = "probe", mixinStandardHelpOptions = true,
        header = "Smallest probe and its aperture angle at each beam current.",
        description = {"The smallest probe (FW50 diameter, root-power-sum of Barth and Kruit) at each current and the"
            + " aperture angle that gives it, from the source brightness and energy spread, diffraction, and the lens's"
            + " spherical and chromatic aberration, with the quadrature sum for comparison.",
            "Computed for the biases as given and for every bias of the tuned electrode that focuses on the screen."})
final class ProbeCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Mixin
    StackInput input;

    @Mixin
    QuietOption quiet;

    @Option(names = "--brightness", paramLabel = "B", required = true,
            description = "Reduced source brightness, A/(m^2 sr V) (e.g. a thermionic cathode is of order 1e5, a cold field emitter 1e8 or more).")
    double brightness;

    @Option(names = "--energy-spread", paramLabel = "EV", defaultValue = "1",
            description = "FWHM energy spread of the source, eV (default ${DEFAULT-VALUE}).")
    double energySpread_eV;

    @Option(names = "--source-size-nm", paramLabel = "D",
            description = "FW50 virtual source diameter, nm: the magnification is then the lens's own (needs [beam] object_z_mm)"
                    + " and the current sets the angle; without it the magnification is taken as free.")
    Double sourceSize_nm;

    @Option(names = "--current-from", paramLabel = "A", defaultValue = ProbeStudy.DEFAULT_CURRENT_FROM_A, description = "Smallest current, A (default ${DEFAULT-VALUE}).")
    double currentFrom;

    @Option(names = "--current-to", paramLabel = "A", defaultValue = ProbeStudy.DEFAULT_CURRENT_TO_A, description = "Largest current, A (default ${DEFAULT-VALUE}).")
    double currentTo;

    @Option(names = "--points", paramLabel = "N", defaultValue = ProbeStudy.DEFAULT_POINTS, description = "Currents on the curve (default ${DEFAULT-VALUE}).")
    int points;

    @Option(names = "--alpha-from-mrad", paramLabel = "MRAD", defaultValue = ProbeStudy.DEFAULT_ALPHA_FROM_MRAD,
            description = "Smallest image-side aperture half-angle, mrad (default ${DEFAULT-VALUE}).")
    double alphaFrom_mrad;

    @Option(names = "--alpha-to-mrad", paramLabel = "MRAD", defaultValue = ProbeStudy.DEFAULT_ALPHA_TO_MRAD,
            description = "Largest image-side aperture half-angle, mrad (default ${DEFAULT-VALUE}; third-order aberrations hold to tens of mrad).")
    double alphaTo_mrad;

    @Option(names = "--tune", paramLabel = "NAME",
            description = "Electrode tuned to focus on the screen (default: the one with the largest bias; none without a [screen]).")
    String tune;

    @Option(names = "--out", paramLabel = "DIR", description = "Write probe.csv, probe.png and probe.svg into this folder.")
    Path out;

    @Mixin
    JsonOption json;

    @Override
    public Integer call() throws StackInputException, IOException {
        CommandLine cl = spec.commandLine();
        Stack stack = input.loadOrDemo();
        ProbeStudy.Settings settings;
        try {
            if (!(brightness > 0) || !Double.isFinite(brightness)) {
                throw new IllegalArgumentException("--brightness must be a positive number of A/(m^2 sr V)");
            }
            if (!(energySpread_eV >= 0) || !Double.isFinite(energySpread_eV)) {
                throw new IllegalArgumentException("--energy-spread must be a number of eV >= 0");
            }
            if (sourceSize_nm != null && !(sourceSize_nm > 0 && Double.isFinite(sourceSize_nm))) {
                throw new IllegalArgumentException("--source-size-nm must be a positive number of nm");
            }
            ProbeSource source = new ProbeSource(brightness, energySpread_eV,
                    sourceSize_nm == null ? OptionalDouble.empty() : OptionalDouble.of(sourceSize_nm * 1e-9));
            if (!(currentFrom > 0) || !(currentTo > currentFrom) || !Double.isFinite(currentTo)) {
                throw new IllegalArgumentException("--current-from and --current-to must satisfy 0 < from < to (amperes)");
            }
            if (!(alphaFrom_mrad > 0) || !(alphaTo_mrad > alphaFrom_mrad) || !(alphaTo_mrad <= 500)) {
                throw new IllegalArgumentException("--alpha-from-mrad and --alpha-to-mrad must satisfy 0 < from < to <= 500");
            }
            if (points < 2 || points > 10_000) {
                throw new IllegalArgumentException("--points must be 2..10000");
            }
            settings = new ProbeStudy.Settings(source, alphaFrom_mrad * 1e-3, alphaTo_mrad * 1e-3, currentFrom, currentTo, points);
        } catch (IllegalArgumentException | PhysicsException e) {
            throw new CommandLine.ParameterException(cl, e.getMessage());
        }
        String name = tune != null ? tune : PlanAnalysis.strongest(stack);
        if (tune != null && stack.indexOf(tune) < 0) {
            throw new CommandLine.ParameterException(cl, "--tune " + tune + ": no such electrode in " + input.shownAs()
                    + "; choose one of " + String.join(", ", stack.names()));
        }
        if (out != null) {
            OutputCheck.folder(cl, "--out", out, "probe.csv");
        }
        FieldSolution solution = BemSolver.solve(stack.electrodes(), stack.mesh(), SolveReporter.to(cl.getErr(), quiet.on()));
        ProbeStudy study = ProbeStudy.run(solution, stack, settings, stack.screenZ_m().isPresent() ? name : null);
        if (out != null) {
            String title = "Probe current against size: " + stack.title();
            AtomicFiles.writeFolder(out, "probe.csv", n -> n.startsWith("probe."), dir -> {
                AtomicFiles.writeString(AtomicFiles.inside(dir, "probe.csv"), ProbeTableCsv.text(study));
                ChartFiles.writePng(ProbeChart.of(study, title), 1000, 700, AtomicFiles.inside(dir, "probe.png"));
                ChartFiles.writeSvg(ProbeChart.of(study, title), 1000, 700, AtomicFiles.inside(dir, "probe.svg"));
            });
        }
        PrintWriter w = cl.getOut();
        if (json.on()) {
            json(w, study);
        } else {
            text(w, stack, study);
        }
        w.flush();
        if (study.curves().stream().allMatch(c -> c.points().isEmpty())) {
            throw new OutcomeException("no probe could be planned: " + String.join("; ", study.notes()));
        }
        return 0;
    }

    private void json(PrintWriter w, ProbeStudy study) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("stack", input.shownAs());
        m.put("measure", "FW50 diameter (half the current inside); root-power-sum of Barth and Kruit, quadrature for comparison");
        m.put("reduced_brightness_A_per_m2_sr_V", brightness);
        m.put("energy_spread_fwhm_eV", energySpread_eV);
        List<Map<String, Object>> curves = new ArrayList<>();
        for (ProbeStudy.Curve c : study.curves()) {
            Map<String, Object> cm = new LinkedHashMap<>();
            ProbeLens lens = c.workingPoint().lens();
            cm.put("working_point", c.workingPoint().label());
            cm.put("biases_V", c.workingPoint().biases_V());
            cm.put("probe_z_mm", c.workingPoint().probeZ_m() * 1e3);
            cm.put("magnification", Double.isFinite(lens.magnification()) ? lens.magnification() : null);
            cm.put("spherical_aberration_image_mm", lens.sphericalImage_m() * 1e3);
            cm.put("chromatic_aberration_image_mm", lens.chromaticImage_m() * 1e3);
            cm.put("image_energy_eV", lens.imageEnergy_eV());
            cm.put("wavelength_pm", lens.wavelength_m() * 1e12);
            cm.put("fixed_magnification", c.model().fixedMagnification());
            if (c.offAxis().isPresent()) {
                cm.put("off_axis_blur_share_max", c.offAxisShare());
            }
            cm.put("off_axis", c.offAxisInWords());
            List<Map<String, Object>> rows = new ArrayList<>();
            for (ProbePoint p : c.points()) {
                Object[] r = ProbeTableCsv.row(c.workingPoint().label(), p);
                Map<String, Object> row = new LinkedHashMap<>();
                for (int i = 1; i < ProbeTableCsv.HEADER.size(); i++) {
                    row.put(ProbeTableCsv.HEADER.get(i), r[i]);
                }
                rows.add(row);
            }
            cm.put("points", rows);
            curves.add(cm);
        }
        m.put("curves", curves);
        m.put("notes", study.notes());
        w.println(JsonOption.text(m));
    }

    private void text(PrintWriter w, Stack stack, ProbeStudy study) {
        w.printf(Locale.ROOT, "Probe plan of %s: %s, %s eV%n", input.shownAs(), stack.beam().particle().label(),
                PlanCommand.num(stack.beam().energy_eV()));
        w.printf(Locale.ROOT, "  source: reduced brightness %.3g A/(m^2 sr V), energy spread %s eV FWHM%s%n", brightness,
                PlanCommand.num(energySpread_eV), sourceSize_nm == null ? "; magnification free (chosen per current)"
                        : String.format(Locale.ROOT, "; virtual source %s nm FW50 at the lens's magnification",
                                PlanCommand.num(sourceSize_nm)));
        w.println("  probe diameter: FW50 (half the current inside), root-power-sum of Barth and Kruit (Optik 101 (1996)"
                + " 101), stated by its authors to be within about 10 % of wave-optical results; quadrature for comparison");
        for (ProbeStudy.Curve c : study.curves()) {
            ProbeLens lens = c.workingPoint().lens();
            w.println();
            w.printf(Locale.ROOT, "  %s: probe at z = %.4g mm%s; image side Cs = %.5g mm, Cc = %.5g mm; %s eV, wavelength %.4g pm%n",
                    c.workingPoint().label(), c.workingPoint().probeZ_m() * 1e3,
                    Double.isFinite(lens.magnification()) ? String.format(Locale.ROOT, ", magnification %.4g", lens.magnification())
                            : " (object at infinity)",
                    lens.sphericalImage_m() * 1e3, lens.chromaticImage_m() * 1e3, PlanCommand.num(lens.imageEnergy_eV()),
                    lens.wavelength_m() * 1e12);
            if (c.points().isEmpty()) {
                w.println("    no point");
                continue;
            }
            w.printf(Locale.ROOT, "    %10s %10s %11s %11s %10s %10s %10s %10s  %s%n", "current_A", "alpha_mrad", "FW50_nm",
                    "quadr_nm", "source_nm", "diffr_nm", "spher_nm", "chrom_nm", "dominant");
            int every = Math.max(1, (c.points().size() + 9) / 10);
            for (int i = 0; i < c.points().size(); i++) {
                if (i % every != 0 && i != c.points().size() - 1) {
                    continue;
                }
                ProbePoint p = c.points().get(i);
                w.printf(Locale.ROOT, "    %10.3g %10.4g %11.4g %11.4g %10.3g %10.3g %10.3g %10.3g  %s%s%n", p.current_A(),
                        p.alpha_rad() * 1e3, p.fw50_m() * 1e9, p.quadrature_m() * 1e9, p.source_m() * 1e9,
                        p.diffraction_m() * 1e9, p.spherical_m() * 1e9, p.chromatic_m() * 1e9, p.dominant().words(),
                        p.interior() || c.model().fixedMagnification() ? "" : " (angle at the range end)");
            }
            w.println("    " + c.dominanceInWords());
            double diffr = c.diffractionShare();
            w.println(c.diffractionNegligible() ? String.format(Locale.ROOT,
                    "    diffraction negligible: below %.2g %% of the squared size everywhere on the curve", Math.max(100 * diffr, 1e-6))
                    : String.format(Locale.ROOT, "    diffraction matters: up to %.0f %% of the squared size", 100 * diffr));
            w.println("    " + c.offAxisInWords());
        }
        for (String n : study.notes()) {
            w.println("  note: " + n);
        }
        if (out != null) {
            w.println("  written: " + out.resolve("probe.csv") + ", probe.png, probe.svg");
        }
        w.println();
        w.println(SafetyNotice.text());
    }
}
