package org.axistack.report;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import org.axistack.field.SolveProgress;
import org.axistack.optics.ParaxialOptics;
import org.axistack.optics.ReflectionException;
import org.axistack.optics.SplitDeflection;
import org.axistack.optics.SteeringTable;
import org.axistack.plan.LensPlan;

/**
 * The report's steering section for a stack with split electrodes: the offset per volt of each steerer's x and y
 * bias at the screen and at every monitor plane, and the central ray there at the stored sector biases
 * ({@link SteeringTable}, first order). Absent for a stack without split electrodes.
 */
final class SteeringSection {

    private SteeringSection() {
    }

    static void html(StringBuilder b, LensPlan plan) {
        if (!plan.stack().hasSectors() || plan.reflection().isPresent()) {
            return;
        }
        SteeringTable t;
        try {
            ParaxialOptics optics = ParaxialOptics.of(plan.field(), plan.stack());
            t = SteeringTable.of(plan.stack(), plan.solution(), optics, SolveProgress.NONE);
        } catch (ReflectionException | IllegalArgumentException e) {
            b.append("<h2>Steering</h2>\n<p>Not computed: ").append(Html.esc(String.valueOf(e.getMessage())))
                    .append("</p>\n");
            return;
        }
        b.append("<h2>Steering</h2>\n");
        List<List<String>> rows = new ArrayList<>();
        for (int p = 0; p < t.planes_m().length; p++) {
            for (SplitDeflection.PerVolt pv : t.perVolt().get(p)) {
                int i = t.perVolt().get(p).indexOf(pv);
                rows.add(List.of(Html.esc(t.planeNames().get(p)), Html.trim(t.planes_m()[p] * 1e3),
                        Html.esc(t.names().get(i)) + " (" + t.sectors().get(i) + ")", um(pv.xPerVx_m()),
                        um(pv.yPerVx_m()), um(pv.xPerVy_m()), um(pv.yPerVy_m())));
            }
        }
        b.append(Html.table(List.of("plane", "z (mm)", "split electrode (sectors)", "x per V of x bias (um)",
                "y per V of x bias (um)", "x per V of y bias (um)", "y per V of y bias (um)"), rows));
        List<List<String>> ray = new ArrayList<>();
        for (int p = 0; p < t.planes_m().length; p++) {
            double[] r = t.ray()[p];
            ray.add(List.of(Html.esc(t.planeNames().get(p)), Html.trim(t.planes_m()[p] * 1e3), um(r[0]), um(r[1]),
                    mrad(r[2]), mrad(r[3])));
        }
        b.append("<p>Central ray at the stored sector biases and the beam's start offset and slopes:</p>\n");
        b.append(Html.table(List.of("plane", "z (mm)", "x (um)", "y (um)", "slope x (mrad)", "slope y (mrad)"), ray));
        b.append(String.format(Locale.ROOT, "<p class=\"note\">First order in the sector biases (dipole harmonic of the"
                + " split electrodes, central ray from z = %s mm through the round lens). The x bias of a split electrode"
                + " adds V cos(t_s) to sector s centred at angle t_s, the y bias V sin(t_s). The command <code>aim</code>"
                + " finds the biases that put the beam on a point and checks them by exact three-dimensional rays.</p>%n",
                Html.trim(t.zStart_m() * 1e3)));
    }

    private static String um(double m) {
        double v = m * 1e6;
        return Html.trim(Math.abs(v) < 1e-9 ? 0 : v);
    }

    private static String mrad(double rad) {
        double v = rad * 1e3;
        return Html.trim(Math.abs(v) < 1e-12 ? 0 : v);
    }
}
