package org.axistack.trace;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.List;

import org.axistack.model.Codata2018;
import org.axistack.model.Electrode;
import org.axistack.model.Particle;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class TracerTest {

    private static final double E = Codata2018.ELEMENTARY_CHARGE_C;

    /** A wide grounded can that rays do not reach: only there to define the region. */
    private static ElectrodeGeometry can() {
        return new ElectrodeGeometry(List.of(new Electrode.Tube("can", 0, 0.05, -0.01, 0.11, 0)), -0.02, 0.12, 0.1);
    }

    @ParameterizedTest
    @CsvSource({"10000, -1e6", "1000000, -2e7", "50000, 2e5"})
    void uniformFieldMatchesTheRelativisticClosedForm(double energy_eV, double e0) {
        // Source: motion in a constant electric field, Landau and Lifshitz, "The Classical Theory of
        // Fields", section 20 (closed form with asinh for the transverse coordinate). Electrons of
        // 10 keV and 1 MeV (gamma ~ 3) accelerated, and of 50 keV decelerated, over 100 mm, launched
        // at 1 mm off axis with slope 0.05. E_z < 0 pushes electrons towards +z.
        Particle el = Particle.electron();
        double startEnergy_eV = energy_eV;
        UniformField f = new UniformField(0, e0);
        Tracer tracer = new Tracer(f, can(), TraceSettings.defaults().withRelativeTolerance(1e-12));
        RayStart ray = RayStart.withSlopes(1, 1e-3, 0, 0, 0.05, 0, startEnergy_eV);
        double zs = 0.1;
        Trajectory t = tracer.trace(el, ray, TraceTargets.screenOnly(zs));
        assertThat(t.status()).isEqualTo(TraceStatus.SCREEN);

        double vRest = el.restPotential_V();
        double kappa = el.chargeSign() * e0 / vRest; // q E / (m c^2), 1/m
        double g0 = 1 + startEnergy_eV / vRest;
        double u = Math.sqrt(g0 * g0 - 1);
        double ux = u * ray.dirX(), uz0 = u * ray.dirZ();
        double gs = g0 + kappa * (zs - 0);
        double uzs = Math.sqrt(gs * gs - 1 - ux * ux);
        double perp = Math.sqrt(1 + ux * ux);
        double tauS = (uzs - uz0) / kappa;
        double xs = 1e-3 + ux / kappa * (asinh(uzs / perp) - asinh(uz0 / perp));
        double tS = tauS / Codata2018.SPEED_OF_LIGHT_M_PER_S;

        assertEquals(xs, t.end().x_m(), 1e-9 * Math.abs(xs));
        assertEquals(tS, t.end().time_s(), 1e-9 * tS);
        assertEquals(uzs, t.end().uZ(), 1e-9 * uzs);
        assertEquals((gs - 1) * vRest, t.end().kineticEnergy_eV(), 1e-9 * (gs - 1) * vRest);
        assertEquals(zs, t.end().z_m(), 1e-12);
        assertThat(t.maxEnergyError()).isLessThan(1e-9);
    }

    private static double asinh(double x) {
        return Math.log(x + Math.sqrt(x * x + 1));
    }

    @Test
    void reflectionInARetardingFieldStopsAtTheClassicalTurningPoint() {
        // An axial 1 keV proton against a retarding 100 kV/m field turns where q E d = T0, d = 10 mm
        // (energy conservation; textbook).
        Particle p = Particle.proton();
        UniformField f = new UniformField(0, -1e5);
        Tracer tracer = new Tracer(f, can(), TraceSettings.defaults());
        Trajectory t = tracer.trace(p, new RayStart(1, 0, 0, 0, 0, 0, 1, 1000), TraceTargets.screenOnly(0.1));
        assertThat(t.status()).isEqualTo(TraceStatus.REFLECTED);
        assertEquals(0.01, t.end().z_m(), 1e-12);
        assertThat(t.end().kineticEnergy_eV()).isLessThan(1e-6);
    }

    @Test
    void coulombFieldConservesEnergyAndAngularMomentum() {
        // Central force: r x p is conserved exactly, relativistically too (Goldstein, "Classical
        // Mechanics", 3rd ed., section 7.9), and T + q phi (energy). A 2 keV proton passes a
        // repelling charge on the axis at 3 mm impact parameter.
        Particle p = Particle.proton();
        double zc = 0.05;
        double q = 4 * Math.PI * Codata2018.EPSILON0_F_PER_M * 1e-3 * 200; // 200 V at 1 mm
        PointChargeField f = new PointChargeField(q, zc);
        Tracer tracer = new Tracer(f, can(), TraceSettings.defaults());
        RayStart ray = new RayStart(1, 3e-3, 0, 0, 0, 0, 1, 2000);
        Trajectory t = tracer.trace(p, ray, TraceTargets.screenOnly(0.1));
        assertThat(t.status()).isEqualTo(TraceStatus.SCREEN);
        double u0 = Math.sqrt(Math.pow(1 + 2000 / p.restPotential_V() + 0, 2) - 1);
        // the start is not at phi = 0: use the start kinetic energy
        double phi0 = f.potential_V(0, 3e-3);
        double g0 = 1 + (2000 - phi0) / p.restPotential_V();
        u0 = Math.sqrt(g0 * g0 - 1);
        double l0 = (0 - zc) * 0 - 3e-3 * u0; // (z - zc) u_x - x u_z
        RayPoint e = t.end();
        double l1 = (e.z_m() - zc) * e.uX() - e.x_m() * e.uZ();
        assertEquals(l0, l1, 1e-9 * Math.abs(l0));
        assertThat(e.x_m()).isGreaterThan(3e-3); // repelled
        assertThat(t.maxEnergyError()).isLessThan(1e-9);
    }

    @Test
    void energyIsConservedAlongEveryRayOfAFanThroughARingLens() {
        // Source: energy conservation T + q phi = const in a static field. Tolerance 1e-9 relative, as
        // the issue demands; the integrator runs at 1e-11.
        RingLens lens = RingLens.standard();
        Tracer tracer = new Tracer(lens.field(), lens.geometry(), TraceSettings.defaults());
        for (int i = -4; i <= 4; i++) {
            double slope = i * 0.01;
            RayStart ray = RayStart.withSlopes(i + 5, 0.2e-3, 0.1e-3, -0.04, slope, 0.3 * slope, 1000);
            Trajectory t = tracer.trace(Particle.electron(), ray, TraceTargets.screenOnly(0.06));
            assertThat(t.status()).isEqualTo(TraceStatus.SCREEN);
            assertThat(t.maxEnergyError()).as("ray %d", i).isLessThan(1e-9);
            double phi = lens.field().potential_V(t.end().z_m(), t.end().r_m());
            double w = t.end().kineticEnergy_eV() - phi; // electron: T - e phi, in eV
            assertEquals(1000, w, 1e-9 * 1000);
        }
    }

    @Test
    void hitsOnSheetsAndSolidsNameTheElectrodeAndThePlace() {
        Electrode tube = new Electrode.Tube("bore", 0, 2e-3, 0.0, 0.02, 0);
        Electrode plate = new Electrode.Aperture("stop", 0, 0.03, 1e-3, 6e-3, 1e-3);
        Electrode disk = new Electrode.Disk("target", 0, 0.05, 6e-3, 0);
        Electrode wire = new Electrode.Ring("loop", 0, 0.04, 4e-3, 0.5e-3);
        ElectrodeGeometry g = new ElectrodeGeometry(List.of(tube, plate, disk, wire), -0.01, 0.07, 0.02);
        Tracer tracer = new Tracer(new UniformField(0, 0), g, TraceSettings.defaults());
        TraceTargets tt = TraceTargets.screenOnly(0.06);
        Particle el = Particle.electron();

        // thin tube: a ray with slope 0.2 from the axis at z = 0.005 meets r = 2 mm at z = 0.015
        Trajectory t1 = tracer.trace(el, RayStart.withSlopes(1, 0, 0, 0.005, 0.2, 0, 500), tt);
        assertThat(t1.status()).isEqualTo(TraceStatus.HIT);
        assertThat(t1.hit().orElseThrow().electrode()).isEqualTo("bore");
        assertEquals(0.015, t1.hit().orElseThrow().z_m(), 1e-9);
        assertEquals(2e-3, t1.hit().orElseThrow().r_m(), 1e-10);

        // thick aperture: a parallel ray at r = 1.5 mm hits its front face at z = 29.5 mm
        Trajectory t2 = tracer.trace(el, RayStart.withSlopes(2, 0, 1.5e-3, 0.025, 0, 0, 500), tt);
        assertThat(t2.hit().orElseThrow().electrode()).isEqualTo("stop");
        assertEquals(0.0295, t2.hit().orElseThrow().z_m(), 1e-10);
        assertThat(t2.statusLabel()).isEqualTo("hit:stop");

        // wire loop: a parallel ray at r = 4 mm hits the torus at z = 40 - 0.5 mm (arc polyline error 1e-5 * 0.5 mm)
        Trajectory t3 = tracer.trace(el, RayStart.withSlopes(3, 4e-3, 0, 0.035, 0, 0, 500), tt);
        assertThat(t3.hit().orElseThrow().electrode()).isEqualTo("loop");
        assertEquals(0.0395, t3.hit().orElseThrow().z_m(), 1e-8);

        // disk across the axis: the axial ray stops on it
        Trajectory t4 = tracer.trace(el, RayStart.withSlopes(4, 0, 0, 0.045, 0, 0, 500), tt);
        assertThat(t4.hit().orElseThrow().electrode()).isEqualTo("target");
        assertEquals(0.05, t4.end().z_m(), 1e-10);
    }

    @Test
    void aRayThatLeavesTheRegionSaysSo() {
        ElectrodeGeometry g = new ElectrodeGeometry(List.of(new Electrode.Disk("d", 0, 0.05, 1e-3, 0)), -0.01, 0.06,
                0.01);
        Tracer tracer = new Tracer(new UniformField(0, 0), g, TraceSettings.defaults());
        Trajectory t = tracer.trace(Particle.electron(), RayStart.withSlopes(1, 2e-3, 0, 0, 0.5, 0, 100),
                TraceTargets.screenOnly(0.055));
        assertThat(t.status()).isEqualTo(TraceStatus.LEFT_REGION);
        assertEquals(0.01, t.end().r_m(), 1e-12);
    }

    @Test
    void planesRecordEveryCrossingWithStraightLineValuesInAFieldFreeRegion() {
        Tracer tracer = new Tracer(new UniformField(0, 0), can(), TraceSettings.defaults());
        Trajectory t = tracer.trace(Particle.electron(), RayStart.withSlopes(7, 1e-3, -2e-3, 0, 0.01, 0.02, 100),
                new TraceTargets(List.of(0.05, 0.02, 0.08), 0.08));
        assertThat(t.crossings()).hasSize(3);
        RayPoint p = t.at(1).orElseThrow(); // planes are sorted: 0.02, 0.05, 0.08
        assertEquals(0.05, p.z_m(), 1e-13);
        assertEquals(1e-3 + 0.01 * 0.05, p.x_m(), 1e-13);
        assertEquals(-2e-3 + 0.02 * 0.05, p.y_m(), 1e-13);
        assertEquals(0.01, p.slopeX(), 1e-13);
        assertThat(t.at(2)).isPresent();
    }

    @Test
    void badStartsAndTargetsGiveClearMessages() {
        Electrode thick = new Electrode.Aperture("stop", 0, 0.03, 1e-3, 6e-3, 1e-3);
        ElectrodeGeometry g = new ElectrodeGeometry(List.of(thick), -0.01, 0.07, 0.02);
        Tracer tracer = new Tracer(new UniformField(0, 0), g, TraceSettings.defaults());
        Particle el = Particle.electron();
        assertThatThrownBy(() -> tracer.trace(el, RayStart.withSlopes(3, 2e-3, 0, 0.03, 0, 0, 100),
                TraceTargets.screenOnly(0.06))).isInstanceOf(org.axistack.model.PhysicsException.class)
                .hasMessageContaining("ray 3 starts inside electrode 'stop'").hasMessageContaining("open bore");
        assertThatThrownBy(() -> tracer.trace(el, RayStart.withSlopes(1, 0, 0, 0, 0, 0, 100),
                TraceTargets.screenOnly(0.5))).isInstanceOf(org.axistack.model.PhysicsException.class)
                .hasMessageContaining("screen at z = 500 mm lies outside the traced region");
        assertThatThrownBy(() -> tracer.trace(el, RayStart.withSlopes(1, 0, 0, 0.02, 0, 0, 100),
                new TraceTargets(List.of(0.01), 0.06))).hasMessageContaining("before the start of ray 1");
        Tracer retarding = new Tracer(new UniformField(-200, 0), g, TraceSettings.defaults());
        assertThatThrownBy(() -> retarding.trace(el, RayStart.withSlopes(1, 0, 0, 0, 0, 0, 100),
                TraceTargets.screenOnly(0.06))).hasMessageContaining("leaves it no kinetic energy");
        assertThatThrownBy(() -> new RayStart(1, 0, 0, 0, 1, 0, -1, 100)).hasMessageContaining("towards +z");
    }

    @Test
    void nonRelativisticallyAnElectronAndAProtonInMirroredBiasesFollowTheSamePath() {
        // Fact of the trade (physics brief): non-relativistic trajectories depend only on U(z). With
        // relativity the electron at 1 keV deviates by ~T/(m c^2) ~ 2e-3 relative in the deflection;
        // the proton (5e-7) is practically classical. So compare slopes to 1e-2 relative.
        RingLens lens = RingLens.standard();
        RingLens mirrored = lens.withSign(-1);
        Tracer te = new Tracer(lens.field(), lens.geometry(), TraceSettings.defaults());
        Tracer tp = new Tracer(mirrored.field(), mirrored.geometry(), TraceSettings.defaults());
        RayStart ray = RayStart.withSlopes(1, 1e-3, 0, -0.04, 0, 0, 1000);
        Trajectory a = te.trace(Particle.electron(), ray, TraceTargets.screenOnly(0.06));
        Trajectory b = tp.trace(Particle.proton(), ray, TraceTargets.screenOnly(0.06));
        assertEquals(a.end().slopeX(), b.end().slopeX(), 1e-2 * Math.abs(b.end().slopeX()));
        assertThat(Math.abs(a.end().slopeX())).isGreaterThan(1e-3); // the lens really deflects
    }
}
