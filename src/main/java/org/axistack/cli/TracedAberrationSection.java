package org.axistack.cli;

import java.io.PrintWriter;
import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;
import java.util.OptionalDouble;

import org.axistack.field.AxialField;
import org.axistack.model.Units;
import org.axistack.model.Stack;
import org.axistack.optics.Aberrations;
import org.axistack.optics.CardinalElements;
import org.axistack.optics.ParaxialOptics;
import org.axistack.trace.SpotBudget;
import org.axistack.trace.TracedAberrations;
import org.axistack.trace.Tracer;

/**
 * The {@code trace --aberrations} section: image-side focal point, focal length, Cs and Cc fitted to
 * exact traces, printed beside the paraxial values and the aberration integrals, and the spot budget.
 */
final class TracedAberrationSection {

    final TracedAberrations.Result traced;
    final CardinalElements paraxial;
    final Aberrations integrals;
    final SpotBudget budget;
    final OptionalDouble optimum;
    final boolean openSides;

    TracedAberrationSection(Stack stack, AxialField axial, Tracer tracer, double bore_m, double emittance_m_rad,
            double energyWidth_eV) {
        ParaxialOptics full = ParaxialOptics.of(axial, stack);
        // like with like: the traced rays run between the reference planes, so the integrals here do too (an open
        // lens's far field beyond them is in the optics command's asymptotic values, not in this comparison)
        openSides = full.objectEnd().rule() == org.axistack.optics.FieldEnd.Rule.FAR_FIELD
                || full.imageEnd().rule() == org.axistack.optics.FieldEnd.Rule.FAR_FIELD;
        ParaxialOptics optics = ParaxialOptics.of(new org.axistack.optics.AccelerationPotential(axial, stack.beam()),
                full.zStart_m(), full.zEnd_m(), full.settings());
        paraxial = optics.cardinal();
        integrals = optics.aberrations();
        traced = TracedAberrations.measure(tracer, stack.beam().particle(), stack.beam().energy_eV(), optics.zStart_m(),
                optics.zEnd_m(), 0.15 * bore_m, OptionalDouble.empty());
        budget = new SpotBudget(traced.spherical_m(), traced.chromatic_m(), energyWidth_eV / traced.imageEnergy_eV(),
                emittance_m_rad);
        optimum = budget.optimumAngle_rad(1e-5, 0.5);
    }

    void print(PrintWriter w) {
        w.println();
        w.println("Aberrations (" + traced.convention() + "):");
        w.println(String.format(Locale.ROOT, "  %-34s %16s %16s %12s", "", "traced", "paraxial/integral", "rel_diff"));
        row(w, "image focal point F2 (mm)", traced.tracedFocalPointZ_m(), paraxial.focalPointImageZ_m(), true);
        row(w, "image focal length f2 (mm)", traced.focalLengthImage_m(), paraxial.focalLengthImage_m(), true);
        row(w, "spherical aberration Cs (mm)", traced.spherical_m(), integrals.sphericalImage_m(), false);
        row(w, "chromatic aberration Cc (mm)", traced.chromatic_m(), integrals.chromaticImage_m(), false);
        w.println(String.format(Locale.ROOT, "  fit over rays up to %.4g mm (alpha up to %.4g mrad); Cs from half the heights"
                + " %.7g mm; reference planes z = %.6g .. %.6g mm", Units.mToMm(traced.maxHeight_m()),
                Units.radToMrad(traced.maxAngle_rad()), Units.mToMm(traced.sphericalHalfHeight_m()),
                Units.mToMm(traced.zStart_m()), Units.mToMm(traced.zEnd_m())));
        if (openSides) {
            w.println("  (both columns between these planes; the lens is open and its far field beyond them is left out"
                    + " here: the optics command gives the asymptotic values)");
        }
        if (budget.emittance_m_rad() > 0 || budget.relativeEnergySpread() > 0) {
            w.println("Spot budget (d_g = 2 eps/alpha, d_s = Cs alpha^3/2, d_c = Cc alpha dT/T, quadrature sum; an estimate):");
            w.println(String.format(Locale.ROOT, "  %10s %12s %12s %12s %12s", "alpha_mrad", "d_g_um", "d_s_um", "d_c_um",
                    "d_um"));
            for (SpotBudget.Line l : budget.sweep(1e-4, 0.1, 13)) {
                w.println(String.format(Locale.ROOT, "  %10.4g %12.4g %12.4g %12.4g %12.4g", l.alpha_rad() * 1e3,
                        l.geometric_m() * 1e6, l.spherical_m() * 1e6, l.chromatic_m() * 1e6, l.total_m() * 1e6));
            }
            if (optimum.isPresent()) {
                SpotBudget.Line o = budget.at(optimum.getAsDouble());
                w.println(String.format(Locale.ROOT, "  optimum: alpha = %.4g mrad, d = %.4g um", o.alpha_rad() * 1e3,
                        o.total_m() * 1e6));
            } else {
                w.println("  no interior optimum: with no emittance the smallest angle gives the smallest spot");
            }
        }
    }

    private static void row(PrintWriter w, String name, double a_m, double b_m, boolean relToF) {
        double rel = Math.abs(a_m - b_m) / Math.abs(b_m);
        w.println(String.format(Locale.ROOT, "  %-34s %16s %16s %12.2g", name, TraceCommand.num(Units.mToMm(a_m)),
                TraceCommand.num(Units.mToMm(b_m)), rel));
    }

    Map<String, Object> json() {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("aberration_convention", traced.convention());
        m.put("traced_focal_point_image_z_mm", Units.mToMm(traced.tracedFocalPointZ_m()));
        m.put("traced_focal_length_image_mm", Units.mToMm(traced.focalLengthImage_m()));
        m.put("traced_spherical_aberration_mm", Units.mToMm(traced.spherical_m()));
        m.put("traced_chromatic_aberration_mm", Units.mToMm(traced.chromatic_m()));
        m.put("focal_point_image_z_mm", Units.mToMm(paraxial.focalPointImageZ_m()));
        m.put("focal_length_image_mm", Units.mToMm(paraxial.focalLengthImage_m()));
        m.put("spherical_aberration_mm", Units.mToMm(integrals.sphericalImage_m()));
        m.put("chromatic_aberration_mm", Units.mToMm(integrals.chromaticImage_m()));
        m.put("fit_max_height_mm", Units.mToMm(traced.maxHeight_m()));
        m.put("fit_max_angle_mrad", Units.radToMrad(traced.maxAngle_rad()));
        m.put("optimum_angle_mrad", optimum.isPresent() ? Units.radToMrad(optimum.getAsDouble()) : null);
        m.put("optimum_spot_um", optimum.isPresent() ? budget.at(optimum.getAsDouble()).total_m() * 1e6 : null);
        return m;
    }
}
