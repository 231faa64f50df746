package org.axistack.cli;

import java.io.PrintWriter;
import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;
import java.util.OptionalDouble;
import java.util.concurrent.Callable;

import org.axistack.model.Numbers;
import org.axistack.field.BemSolver;
import org.axistack.field.BiasedField;
import org.axistack.io.StackInputException;
import org.axistack.model.Units;
import org.axistack.model.Stack;
import org.axistack.optics.AberrationPolynomials;
import org.axistack.optics.Aberrations;
import org.axistack.optics.CardinalElements;
import org.axistack.optics.Imaging;
import org.axistack.optics.ParaxialOptics;
import org.axistack.optics.ReflectionException;
import org.axistack.optics.StartPlaneException;
import org.axistack.report.SafetyNotice;


import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/**
 * {@code optics STACK [--object-z Z] [--object-height-mm H] [--aperture-mrad A] [--json]}: solves the field, then
 * prints the paraxial cardinal elements, imaging of a finite object, the spherical and chromatic aberration
 * coefficients (keys of interface.md) and, for a finite object, the off-axis third-order aberrations.
 * Exit 1 when the beam is reflected or the lens does not focus.
 */
@Command(name = "optics", mixinStandardHelpOptions = true,
        header = "Paraxial optics: focal points, principal planes, image, Cs and Cc.",
        description = {"Paraxial optics of a stack: focal points, principal planes and focal lengths on both sides,"
            + " the image of an axial object, and the spherical (Cs) and chromatic (Cc) aberration coefficients.",
            "Relativistic throughout. Lengths in mm in the stack's z coordinates."})
final class OpticsCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Mixin
    StackInput input;

    @Mixin
    QuietOption quiet;

    @Option(names = "--object-z", paramLabel = "Z",
            description = "Axial object position in mm (default: the stack's [beam] object, else at infinity).")
    Double objectZ_mm;

    @Mixin
    JsonOption json;

    @Mixin
    OffAxisOptions offAxis;

    @Option(names = "--astigmatism", paramLabel = "DZ:DEG",
            description = "An astigmatism to cancel with the stack's stigmators (split electrodes with a quadrupole"
                    + " harmonic): the rays in the plane at DEG degrees from x focus DZ mm downstream of those in the"
                    + " perpendicular plane; prints the stigmator biases that cancel it.")
    String astigmatism;

    @Option(names = "--stop-z-mm", paramLabel = "Z",
            description = "Aperture stop position in mm (stack z): the off-axis aberrations are given about the chief ray"
                    + " through its centre (stop-shift formulas; default: the aperture at the object).")
    Double stopZ_mm;

    @Option(names = "--accuracy", paramLabel = "REL", defaultValue = "1e-5",
            description = "Relative accuracy asked of the cardinal elements (default ${DEFAULT-VALUE} of f); exit 1 when"
                    + " the estimated error is larger.")
    double accuracy;

    @Override
    public Integer call() throws StackInputException {
        if (!(accuracy > 0 && accuracy < 1)) {
            throw new CommandLine.ParameterException(spec.commandLine(),
                    "--accuracy must lie between 0 and 1 (a relative error, e.g. 1e-5), got " + accuracy);
        }
        if (stopZ_mm != null && !Double.isFinite(stopZ_mm)) {
            throw new CommandLine.ParameterException(spec.commandLine(), "--stop-z-mm must be a position in mm, got " + stopZ_mm);
        }
        offAxis.check(spec.commandLine());
        Stack stack = input.loadOrDemo();
        PrintWriter err = spec.commandLine().getErr();
        OptionalDouble objectZ = objectZ_mm != null ? OptionalDouble.of(Units.mmToM(objectZ_mm)) : stack.beam().objectZ_m();
        // checked before the solve: a usage error never waits for the work
        if (offAxis.given() && objectZ.isEmpty()) {
            throw new CommandLine.ParameterException(spec.commandLine(),
                    "--object-height-mm needs a finite object: give --object-z or object_z_mm in the stack's [beam]");
        }
        double[] givenAstigmatism = astigmatism == null ? null : astigmatism(stack);
        org.axistack.field.SolveProgress progress = SolveReporter.to(err, quiet.on());
        BiasedField field = BemSolver.solve(stack.electrodes(), stack.mesh(), progress).biased();
        Map<String, Object> out = new LinkedHashMap<>();
        out.put("stack", input.shownAs());
        out.put("particle", stack.beam().particle().label());
        out.put("kinetic_energy_eV", stack.beam().energy_eV());
        ParaxialOptics optics;
        try {
            optics = ParaxialOptics.of(field, stack);
        } catch (StartPlaneException e) {
            throw new CommandLine.ParameterException(spec.commandLine(), String.format(Locale.ROOT,
                    "%s: [beam] start_z_mm = %s mm cannot be used (traced range %s .. %s mm); give a finite start"
                            + " before the screen, or remove it",
                    input.shownAs(), PlanCommand.num(Units.mToMm(e.startZ_m())),
                    PlanCommand.num(Units.mToMm(e.usableFromZ_m())), PlanCommand.num(Units.mToMm(e.usableToZ_m()))));
        } catch (ReflectionException e) {
            out.put("reflected", true);
            out.put("turning_point_z_mm", Units.mToMm(e.reflection().turningZ_m()));
            print(out);
            throw new OutcomeException(e.getMessage() + "; lower the retarding bias or raise the beam energy");
        }
        double exit = optics.lensExitZ_m(stack.maxZ_m());
        String exitIs = optics.imageEnd().rule() == org.axistack.optics.FieldEnd.Rule.FAR_FIELD
                ? "the end of the last electrode" : "where the lens field is taken as ended inside the exit tube";
        if (stack.beam().startZ_m().isPresent() && !(stack.beam().startZ_m().getAsDouble() < exit)) {
            throw new CommandLine.ParameterException(spec.commandLine(), String.format(Locale.ROOT,
                    "%s: [beam] start_z_mm = %s mm lies after the lens (z = %s mm is %s); set start_z_mm before"
                            + " the lens or remove it", input.shownAs(),
                    PlanCommand.num(Units.mToMm(stack.beam().startZ_m().getAsDouble())), PlanCommand.num(Units.mToMm(exit)),
                    exitIs));
        }
        if (objectZ.isPresent() && !(objectZ.getAsDouble() < exit)) {
            throw new CommandLine.ParameterException(spec.commandLine(), String.format(Locale.ROOT,
                    "--object-z %s mm lies at or after the lens (z = %s mm is %s); give an object before it",
                    PlanCommand.num(Units.mToMm(objectZ.getAsDouble())), PlanCommand.num(Units.mToMm(exit)), exitIs));
        }
        CardinalElements c = optics.cardinal();
        out.put("reflected", false);
        out.put("relativistic", optics.relativistic());
        out.put("lens_kind", c.kind().name().toLowerCase(Locale.ROOT));
        out.put("reference_plane_object_z_mm", mm(c.zStart_m()));
        out.put("reference_plane_image_z_mm", mm(c.zEnd_m()));
        out.put("field_end_object", c.objectEnd().rule().key());
        out.put("field_end_image", c.imageEnd().rule().key());
        out.put("field_ends", org.axistack.optics.OpticsAccuracy.ends(c));
        out.put("plane_sensitivity", c.planeSensitivity());
        out.put("far_field_share", c.farFieldShare());
        out.put("error_estimate", c.errorEstimate());
        out.put("mesh_error", field.solution().meshErrorStatement());
        out.put("accuracy_requested", accuracy);
        out.put("object_z_mm", objectZ.isPresent() ? mm(objectZ.getAsDouble()) : null);
        out.put("focal_length_object_mm", mm(c.focalLengthObject_m()));
        out.put("focal_length_image_mm", mm(c.focalLengthImage_m()));
        out.put("focal_point_object_z_mm", mm(c.focalPointObjectZ_m()));
        out.put("focal_point_image_z_mm", mm(c.focalPointImageZ_m()));
        out.put("principal_plane_object_z_mm", mm(c.principalPlaneObjectZ_m()));
        out.put("principal_plane_image_z_mm", mm(c.principalPlaneImageZ_m()));
        out.put("real_focus_image_z_mm", c.realFocusImageZ_m().isPresent() ? mm(c.realFocusImageZ_m().getAsDouble()) : null);
        out.put("real_focus_object_z_mm", c.realFocusObjectZ_m().isPresent() ? mm(c.realFocusObjectZ_m().getAsDouble()) : null);
        java.util.Optional<Imaging> imaging = objectZ.isPresent() ? java.util.Optional.of(optics.imaging(objectZ.getAsDouble()))
                : java.util.Optional.empty();
        if (imaging.isPresent()) {
            Imaging im = imaging.get();
            out.put("image_z_mm", mm(im.imageZ_m()));
            out.put("magnification", finite(im.lateralMagnification()));
            out.put("angular_magnification", finite(im.angularMagnification()));
            out.put("real_image_z_mm", im.realImageZ_m().isPresent() ? mm(im.realImageZ_m().getAsDouble()) : null);
            out.put("real_magnification", finite(im.realLateralMagnification()));
        }
        java.util.Optional<Aberrations> quoted = optics.quotedAberrations(imaging);
        if (quoted.isPresent()) {
            Aberrations ab = quoted.get();
            out.put("spherical_aberration_mm", mm(ab.sphericalImage_m()));
            out.put("chromatic_aberration_mm", mm(ab.chromaticImage_m()));
            if (ab.objectZ_m().isPresent()) {
                out.put("spherical_aberration_object_side_mm", mm(ab.sphericalObject_m().getAsDouble()));
                out.put("chromatic_aberration_object_side_mm", mm(ab.chromaticObject_m().getAsDouble()));
            }
            out.put("aberration_convention", ab.convention());
            AberrationPolynomials poly = AberrationPolynomials.of(optics);
            out.put("spherical_aberration_poly_mm", mmArray(poly.spherical_m()));
            out.put("chromatic_aberration_poly_mm", mmArray(poly.chromatic_m()));
            out.put("aberration_poly_convention", poly.convention());
            if (ab.objectZ_m().isPresent()) {
                org.axistack.optics.OffAxisAberrations oa = optics.offAxisAberrations(ab.objectZ_m().getAsDouble());
                if (stopZ_mm != null) {
                    try {
                        oa = oa.aboutStop(optics, Units.mmToM(stopZ_mm));
                    } catch (IllegalArgumentException e) {
                        throw new CommandLine.ParameterException(spec.commandLine(), "--stop-z-mm: " + e.getMessage()
                                + "; put the stop elsewhere");
                    }
                    out.put("stop_z_mm", stopZ_mm);
                }
                out.put("off_axis_aberrations", OffAxisOutput.map(oa, offAxis.objectHeight_mm, offAxis.aperture_mrad));
            }
        } else {
            out.put("spherical_aberration_mm", null);
            out.put("chromatic_aberration_mm", null);
            out.put("aberration_convention", "undefined for an afocal lens");
        }
        org.axistack.field.SectorField sectors = DeflectionOutput.put(out, stack, field, optics, progress);
        StigmationOutput.put(out, stack, sectors, optics, objectZ, givenAstigmatism);
        java.util.List<String> warnings = new java.util.ArrayList<>();
        org.axistack.optics.OpticsAccuracy.shortfall(c, accuracy).ifPresent(warnings::add);
        org.axistack.optics.OpticsAccuracy.closeTheLens(c).ifPresent(warnings::add);
        out.put("warnings", warnings);
        print(out);
        org.axistack.optics.OpticsAccuracy.shortfall(c, accuracy).ifPresent(w -> {
            throw new OutcomeException(w);
        });
        if (!c.focuses()) {
            throw new OutcomeException(c.notFocusingStatement() + "; change the biases (e.g. with --set) to get a real focus");
        }
        return 0;
    }

    /** --astigmatism DZ:DEG read and checked before the solve: {difference m, axis rad}. */
    private double[] astigmatism(Stack stack) {
        CommandLine cl = spec.commandLine();
        if (!StigmationOutput.hasStigmators(stack)) {
            throw new CommandLine.ParameterException(cl, "--astigmatism needs a stigmator: " + input.shownAs()
                    + " has no split electrode with a quadrupole harmonic (give one electrode sectors = 4 or 8 and"
                    + " sector_biases_V)");
        }
        String[] parts = astigmatism.split(":", -1);
        try {
            if (parts.length != 2) {
                throw new NumberFormatException();
            }
            double dz = Double.parseDouble(parts[0].strip());
            double deg = Double.parseDouble(parts[1].strip());
            if (!Double.isFinite(dz) || !Double.isFinite(deg) || Math.abs(dz) > 10000 || Math.abs(deg) > 360) {
                throw new NumberFormatException();
            }
            return new double[] {Units.mmToM(dz), Math.toRadians(deg)};
        } catch (NumberFormatException e) {
            throw new CommandLine.ParameterException(cl, "--astigmatism " + astigmatism + ": expected DZ:DEG, the"
                    + " distance in mm (within +-10000) between the line foci and the angle in degrees (within +-360)"
                    + " of the plane whose rays focus farther, for example 0.2:30");
        }
    }

    private static double[] mmArray(double[] m) {
        double[] out = new double[m.length];
        for (int i = 0; i < m.length; i++) {
            out[i] = Units.mToMm(m[i]);
        }
        return out;
    }

    private static Double mm(double z_m) {
        return finite(Units.mToMm(z_m));
    }

    private static Double finite(double x) {
        return Double.isFinite(x) ? x : null;
    }

    private void print(Map<String, Object> out) {
        PrintWriter w = spec.commandLine().getOut();
        if (json.on()) {
            w.println(JsonOption.text(out));
            return;
        }
        w.println("Paraxial optics of " + out.get("stack"));
        w.println("  " + out.get("particle") + ", " + PlanCommand.num((Double) out.get("kinetic_energy_eV"))
                + " eV where the potential is 0 V");
        if (Boolean.TRUE.equals(out.get("reflected"))) {
            w.println(String.format(Locale.ROOT, "  REFLECTED: the axial kinetic energy reaches zero at z = %.4f mm (a mirror)",
                    (Double) out.get("turning_point_z_mm")));
            return;
        }
        w.println("  relativistic paraxial ray equation; lens " + out.get("lens_kind")
                + ("converging".equals(out.get("lens_kind")) || out.get("real_focus_image_z_mm") == null ? ""
                        : " asymptotically, but the real ray crosses the axis inside the field (a strong lens)"));
        w.println("  asymptotic cardinal elements (where the rays' straight asymptotes meet); the field ends:");
        for (Object line : (java.util.List<?>) out.get("field_ends")) {
            w.println("    " + line);
        }
        w.println("  estimated error " + Numbers.estimate((Double) out.get("error_estimate")) + " of f (asked: "
                + Numbers.tolerance((Double) out.get("accuracy_requested")) + "; " + org.axistack.optics.OpticsAccuracy.SCOPE + ")"
                + ((Double) out.get("far_field_share") > 0
                        ? org.axistack.optics.OpticsAccuracy.FAR_FIELD_WORDS + Numbers.estimate((Double) out.get("far_field_share"))
                        : org.axistack.optics.OpticsAccuracy.PLANE_WORDS + Numbers.estimate((Double) out.get("plane_sensitivity"))));
        w.println("  " + out.get("mesh_error"));
        w.println("                      object side       image side");
        row(w, "focal length f1, f2", out.get("focal_length_object_mm"), out.get("focal_length_image_mm"));
        row(w, "focal point F1, F2", out.get("focal_point_object_z_mm"), out.get("focal_point_image_z_mm"));
        row(w, "principal plane H1, H2", out.get("principal_plane_object_z_mm"), out.get("principal_plane_image_z_mm"));
        row(w, "real axis crossing", out.get("real_focus_object_z_mm"), out.get("real_focus_image_z_mm"));
        w.println("  (mm; focal lengths positive when converging; F, H are z positions; the real axis crossing is where");
        w.println("   the ray that enters (leaves) parallel, traced in the full field, crosses the axis)");
        if (out.get("object_z_mm") != null) {
            w.println("  object at z = " + f(out.get("object_z_mm")) + " mm: real image at z = " + f(out.get("real_image_z_mm"))
                    + " mm (traced in the full field), magnification there " + f(out.get("real_magnification")));
            w.println("    asymptotic image at z = " + f(out.get("image_z_mm")) + " mm, lateral magnification "
                    + f(out.get("magnification")) + ", angular magnification " + f(out.get("angular_magnification")));
        }
        w.println("  spherical aberration Cs = " + f(out.get("spherical_aberration_mm")) + " mm, chromatic aberration Cc = "
                + f(out.get("chromatic_aberration_mm")) + " mm");
        if (out.containsKey("spherical_aberration_object_side_mm")) {
            w.println("  object side: Cs_o = " + f(out.get("spherical_aberration_object_side_mm")) + " mm, Cc_o = "
                    + f(out.get("chromatic_aberration_object_side_mm")) + " mm");
        }
        w.println("  convention: " + out.get("aberration_convention"));
        if (out.get("spherical_aberration_poly_mm") instanceof double[] cs
                && out.get("chromatic_aberration_poly_mm") instanceof double[] cc) {
            w.println("  for any object before the lens: Cs_o = " + polynomial(cs) + " mm; Cc_o = " + polynomial(cc) + " mm");
            w.println("  (" + out.get("aberration_poly_convention") + ")");
        }
        if (out.get("off_axis_aberrations") instanceof Map<?, ?> offAxis) {
            @SuppressWarnings("unchecked") // built by OffAxisOutput.map as Map<String, Object>
            Map<String, Object> typed = (Map<String, Object>) offAxis;
            OffAxisOutput.print(w, typed);
        }
        DeflectionOutput.print(w, out);
        StigmationOutput.print(w, out);
        for (Object warning : (java.util.List<?>) out.get("warnings")) {
            w.println("  WARNING: " + warning);
        }
        w.println();
        w.println(SafetyNotice.text());
    }

    /** c0 + c1/M + ... with the signs written out. */
    private static String polynomial(double[] c) {
        StringBuilder b = new StringBuilder(f(c[0]));
        for (int k = 1; k < c.length; k++) {
            b.append(c[k] < 0 ? " - " : " + ").append(f(Math.abs(c[k]))).append(k == 1 ? "/M" : "/M^" + k);
        }
        return b.toString();
    }

    private static void row(PrintWriter w, String label, Object a, Object b) {
        w.println(String.format(Locale.ROOT, "  %-22s %14s %16s", label, f(a), f(b)));
    }

    private static String f(Object x) {
        if (x == null) {
            return "-";
        }
        return org.axistack.model.Numbers.general(((Number) x).doubleValue(), org.axistack.model.Numbers.MESSAGE_DIGITS);
    }
}
