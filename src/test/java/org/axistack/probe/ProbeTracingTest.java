package org.axistack.probe;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.List;
import java.util.OptionalDouble;

import org.axistack.field.BemSolver;
import org.axistack.field.BiasedField;
import org.axistack.io.BuiltInStacks;
import org.axistack.model.Stack;
import org.axistack.optics.ParaxialOptics;
import org.axistack.trace.BundleResult;
import org.axistack.trace.BundleTracer;
import org.axistack.trace.ElectrodeGeometry;
import org.axistack.trace.FieldMap;
import org.axistack.trace.NearAxisField;
import org.axistack.trace.RayPoint;
import org.axistack.trace.RaySet;
import org.axistack.trace.TraceProgress;
import org.axistack.trace.TraceSettings;
import org.axistack.trace.TraceTargets;
import org.axistack.trace.Tracer;
import org.axistack.trace.Trajectory;
import org.junit.jupiter.api.Test;

/**
 * The probe model against exact tracing (issue 18, point 4): a source-filled bundle (filled aperture, Gaussian
 * source image, Gaussian energies) through the demo lens with its biases as given, traced with the Lorentz force
 * to planes around the focus; the smallest FW50 over the planes against the model's root-power-sum for the same
 * partial diameters. Required: within the model's stated error, about 10 % (Barth and Kruit, from memory).
 */
class ProbeTracingTest {

    @Test
    void tracedFw50AgreesWithTheRootPowerSum() throws Exception {
        Stack stack = BuiltInStacks.demo();
        BiasedField field = BemSolver.solve(stack.electrodes(), stack.mesh(), org.axistack.field.SolveProgress.NONE).biased();
        ParaxialOptics optics = ParaxialOptics.of(field, stack);
        ProbeWorkingPoint wp = ProbeWorkingPoint.of("as given", stack.biases_V(), optics, OptionalDouble.empty(),
                stack.beam().particle());
        double f2 = optics.cardinal().focalLengthImage_m();
        double fp2 = wp.probeZ_m();
        double energy = stack.beam().energy_eV();
        double alpha = 12e-3;
        double fwhm = 0.4;
        double slopeSigma = 1.2e-5;
        double dI = SourceBundle.FWHM_PER_SIGMA * Math.abs(f2) * slopeSigma; // FW50 of a 2-D Gaussian = its FWHM
        int n = 2000;
        double z0 = stack.beam().startZ_m().getAsDouble();
        RaySet rays = SourceBundle.rays(stack.beam().particle(), energy, z0, alpha * f2, slopeSigma, fwhm, n, 18);

        // the model at the same partial diameters: brightness chosen so that its d_I is the Gaussian's FW50
        double current = 1e-9;
        ProbeLens lens = wp.lens();
        double b = current / (Math.PI * dI * dI / 4 * Math.PI * alpha * alpha) / lens.imageRelativisticPotential_V();
        ProbeModel model = new ProbeModel(lens, new ProbeSource(b, fwhm, OptionalDouble.empty()), 1e-4, 0.05);
        ProbePoint p = model.at(current, alpha);
        assertThat(p.source_m()).isCloseTo(dI, org.assertj.core.api.Assertions.within(1e-6 * dI));
        assertThat(p.share(ProbeTerm.DIFFRACTION)).as("diffraction (absent from classical tracing) negligible").isLessThan(1e-3);

        // planes from 0.5 Cs a^2 before F2 to 0.1 Cs a^2 after (the FW50 focus lies near -0.375 Cs a^2)
        double span = lens.sphericalImage_m() * alpha * alpha;
        List<Double> planes = new ArrayList<>();
        for (int k = 0; k <= 20; k++) {
            planes.add(fp2 - 0.5 * span + 0.6 * span * k / 20);
        }
        double screen = planes.get(planes.size() - 1) + 1e-3;
        double bore = stack.minBore_m();
        ElectrodeGeometry geometry = ElectrodeGeometry.of(stack);
        FieldMap map = new FieldMap(field, new NearAxisField(field), geometry, z0 - 1e-3, screen + 1e-3, bore, bore / 40,
                TraceProgress.none());
        Tracer tracer = new Tracer(map, geometry, TraceSettings.defaults());
        BundleResult result = BundleTracer.perCore(tracer).trace(rays, new TraceTargets(planes, screen), TraceProgress.none());
        assertThat(result.lost()).isZero();
        double best = Double.POSITIVE_INFINITY;
        double bestRms = Double.NaN;
        for (int k = 0; k < planes.size(); k++) {
            double[] x = new double[n];
            double[] y = new double[n];
            int i = 0;
            for (Trajectory t : result.trajectories()) {
                RayPoint q = t.at(k).orElseThrow();
                x[i] = q.x_m();
                y[i++] = q.y_m();
            }
            double fw50 = SourceBundle.fw50_m(x, y);
            if (fw50 < best) {
                best = fw50;
                bestRms = SourceBundle.rmsRadius_m(x, y);
            }
        }
        // measured on the demo (2000 rays, 21 planes): traced FW50 2234 nm (rms radius 1637 nm), root-power-sum
        // 2184 nm (2.3 %), quadrature 1915 nm (14 %); partials I 1271, S 962, C 1061, A 3.9 nm
        String what = String.format(java.util.Locale.ROOT, "traced FW50 %.4g nm (rms %.4g nm) vs model %.4g nm"
                + " (quadrature %.4g nm)", best * 1e9, bestRms * 1e9, p.fw50_m() * 1e9, p.quadrature_m() * 1e9);
        assertThat(Math.abs(best - p.fw50_m())).as(what).isLessThan(Math.abs(best - p.quadrature_m()));
        assertThat(best).as(what).isCloseTo(p.fw50_m(), org.assertj.core.api.Assertions.within(0.10 * p.fw50_m()));
    }
}
