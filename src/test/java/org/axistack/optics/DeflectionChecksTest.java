package org.axistack.optics;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;
import java.util.Map;

import org.axistack.field.BemSolver;
import org.axistack.field.BiasedField;
import org.axistack.field.FieldSolution;
import org.axistack.field.SectorField;
import org.axistack.field.SolveProgress;
import org.axistack.model.Beam;
import org.axistack.model.Electrode;
import org.axistack.model.MeshSettings;
import org.axistack.model.Particle;
import org.axistack.model.Sectors;
import org.hipparchus.ode.ODEState;
import org.hipparchus.ode.ODEStateAndDerivative;
import org.hipparchus.ode.OrdinaryDifferentialEquation;
import org.hipparchus.ode.nonstiff.DormandPrince853Integrator;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * First-order deflection of the central ray by a four-sector steerer between two grounded tubes, against an
 * exact three-dimensional trace (Newton's equations in the full potential: round part plus every solved
 * harmonic by direct element sums, gradient by central differences), and its symmetry properties.
 */
class DeflectionChecksTest {

    static final double R = 0.005;
    static FieldSolution round;
    static SectorField sectors;
    static final Beam BEAM = new Beam(Particle.proton(), 1000);

    @BeforeAll
    static void solve() {
        List<Electrode> es = List.of(new Electrode.Tube("in", 0, R, -0.04, -0.0055, 0),
                new Electrode.Tube("steer", 250, R, -0.005, 0.005, 0),
                new Electrode.Tube("out", 0, R, 0.0055, 0.04, 0));
        round = BemSolver.solve(es, new MeshSettings(360, 6), SolveProgress.NONE);
        Sectors s = Sectors.fromDifferentials(4, 0, 0, 250, 0, 0);
        sectors = SectorField.solve(round, Map.of(1, s), 3, SolveProgress.NONE);
    }

    private static double[] paraxial(Sectors s, double zEnd) {
        AccelerationPotential u = new AccelerationPotential(round.withBiases(new double[] {0, s.common_V(), 0}), BEAM);
        CentralRayDeflection d = CentralRayDeflection.of(u, -0.03, new double[] {zEnd},
                List.of(z -> sectors.unitDipole_V_per_m(1, z)));
        double[] ab = s.harmonic(1);
        return new double[] {d.offset_m(0, new double[] {ab[0]}), d.offset_m(0, new double[] {ab[1]}),
            d.slope_rad(0, new double[] {ab[0]}), d.slope_rad(0, new double[] {ab[1]})};
    }

    /**
     * Exact trace from (0, 0, -30 mm), parallel to the axis, to z = zEnd (non-relativistic Newton equations with
     * z as the independent variable); returns x, y, x', y' and the largest relative change of the total energy.
     */
    private static double[] exact(Sectors s, double zEnd) {
        BiasedField f = round.withBiases(new double[] {0, s.common_V(), 0});
        Map<Integer, List<Double>> b = Map.of(1, s.biases_V());
        double q = BEAM.particle().charge_C();
        double mass = BEAM.particle().mass_kg();
        double t0 = BEAM.energy_eV() * q;
        java.util.function.ToDoubleFunction<double[]> pot = p ->
                f.potential_V(p[2], Math.hypot(p[0], p[1])) + sectors.potential_V(p[0], p[1], p[2], b);
        double h = 2e-7;
        OrdinaryDifferentialEquation ode = new OrdinaryDifferentialEquation() {
            @Override
            public int getDimension() {
                return 5;
            }

            @Override
            public double[] computeDerivatives(double z, double[] y) {
                double[] g = new double[3];
                for (int k = 0; k < 3; k++) {
                    double[] p = {y[0], y[1], z};
                    double[] m = {y[0], y[1], z};
                    p[k] += h;
                    m[k] -= h;
                    g[k] = (pot.applyAsDouble(p) - pot.applyAsDouble(m)) / (2 * h);
                }
                double vz = y[4];
                return new double[] {y[2] / vz, y[3] / vz, -q * g[0] / mass / vz, -q * g[1] / mass / vz,
                    -q * g[2] / mass / vz};
            }
        };
        double z0 = -0.03;
        double phi0 = pot.applyAsDouble(new double[] {0, 0, z0});
        double v0 = Math.sqrt(2 * (t0 - q * phi0) / mass);
        DormandPrince853Integrator integ = new DormandPrince853Integrator(1e-12, 2e-3,
                new double[] {1e-12, 1e-12, 1e-6, 1e-6, 1e-3}, new double[] {1e-8, 1e-8, 1e-8, 1e-8, 1e-10});
        double[] worst = {0};
        integ.addStepHandler((interp) -> {
            ODEStateAndDerivative st = interp.getCurrentState();
            double[] y = st.getPrimaryState();
            double v2 = y[2] * y[2] + y[3] * y[3] + y[4] * y[4];
            double e = 0.5 * mass * v2 + q * pot.applyAsDouble(new double[] {y[0], y[1], st.getTime()});
            worst[0] = Math.max(worst[0], Math.abs(e - t0) / t0);
        });
        ODEStateAndDerivative end = integ.integrate(ode, new ODEState(z0, new double[] {0, 0, 0, 0, v0}), zEnd);
        double[] y = end.getPrimaryState();
        return new double[] {y[0], y[1], y[2] / y[4], y[3] / y[4], worst[0]};
    }

    /** Paraxial (first-order) deflection against the exact 3-D trace at a small deflection: 1e-4 relative. */
    @Test
    void firstOrderDeflectionMatchesExactThreeDimensionalTrace() {
        Sectors s = Sectors.fromDifferentials(4, 0, 0, 250, 0.4, -0.25);
        double zEnd = 0.03;
        double[] p = paraxial(s, zEnd);
        double[] x = exact(s, zEnd);
        double scale = Math.hypot(p[0], p[1]);
        assertThat(scale).isGreaterThan(1e-6);
        assertThat(Math.abs(x[0] - p[0])).isLessThan(1e-4 * scale);
        assertThat(Math.abs(x[1] - p[1])).isLessThan(1e-4 * scale);
        double slopeScale = Math.hypot(p[2], p[3]);
        assertThat(Math.abs(x[2] - p[2])).isLessThan(1e-4 * slopeScale);
        assertThat(Math.abs(x[3] - p[3])).isLessThan(1e-4 * slopeScale);
        assertThat(x[4]).as("energy conservation").isLessThan(1e-9);
    }

    /**
     * Symmetry (common practice, no source): equal sector biases do not deflect; reversing the differential
     * reverses the deflection; rotating the split pattern by 30 degrees rotates the deflection vector by 30 degrees.
     */
    @Test
    void deflectionFollowsTheSymmetriesOfTheSectors() {
        double zEnd = 0.03;
        double[] none = paraxial(Sectors.fromDifferentials(4, 0, 0, 250, 0, 0), zEnd);
        assertThat(Math.abs(none[0]) + Math.abs(none[1])).isLessThan(1e-15);
        double[] fwd = paraxial(Sectors.fromDifferentials(4, 0, 0, 250, 3, 1), zEnd);
        double[] rev = paraxial(Sectors.fromDifferentials(4, 0, 0, 250, -3, -1), zEnd);
        assertThat(rev[0]).isCloseTo(-fwd[0], org.assertj.core.data.Offset.offset(1e-12 * Math.abs(fwd[0])));
        assertThat(rev[1]).isCloseTo(-fwd[1], org.assertj.core.data.Offset.offset(1e-12 * Math.abs(fwd[0])));
        // the same sector biases on a pattern turned by 30 degrees (computed with the unit field of the
        // unturned pattern: harmonic 1 of the turned pattern is the turned harmonic 1)
        Sectors plain = Sectors.fromDifferentials(4, 0, 0, 250, 3, 0);
        Sectors turned = new Sectors(4, Math.toRadians(30), 0, plain.biases_V());
        double[] a = paraxial(plain, zEnd);
        double[] t = paraxial(turned, zEnd);
        double c = Math.cos(Math.toRadians(30));
        double sn = Math.sin(Math.toRadians(30));
        assertThat(t[0]).isCloseTo(c * a[0] - sn * a[1], org.assertj.core.data.Offset.offset(1e-12 * Math.abs(a[0])));
        assertThat(t[1]).isCloseTo(sn * a[0] + c * a[1], org.assertj.core.data.Offset.offset(1e-12 * Math.abs(a[0])));
    }
}
