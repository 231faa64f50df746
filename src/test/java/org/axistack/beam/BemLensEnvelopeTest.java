package org.axistack.beam;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.List;

import org.axistack.field.BemSolver;
import org.axistack.field.BiasedField;
import org.axistack.field.SolveProgress;
import org.axistack.model.Beam;
import org.axistack.model.Electrode;
import org.axistack.model.MeshSettings;
import org.axistack.model.Particle;
import org.axistack.optics.ParaxialOptics;
import org.axistack.optics.TransferMatrix;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * Through a real boundary-element lens (two coaxial tubes, accelerating immersion lens), the envelope's
 * linear limits against the project's independent paraxial-optics package (its own integrator and
 * transfer matrices): zero current and emittance gives the paraxial ray; zero current gives the linear
 * image of the start ellipse, R = sqrt((M11 R0)^2 + (M12 eps0/R0)^2) (Liouville, linear optics).
 */
class BemLensEnvelopeTest {

    static BiasedField field;
    static final Beam BEAM = new Beam(Particle.proton(), 3000);

    @BeforeAll
    static void solve() {
        List<Electrode> tubes = List.of(new Electrode.Tube("low", 0, 5e-3, -0.06, -0.0005, 0),
                new Electrode.Tube("high", -9000, 5e-3, 0.0005, 0.06, 0));
        field = BemSolver.solve(tubes, new MeshSettings(400, 10), SolveProgress.NONE).biased();
    }

    @Test
    void zeroCurrentZeroEmittanceIsTheParaxialRay() {
        double z0 = -0.04;
        double z1 = 0.05;
        ElectrostaticChannel ch = new ElectrostaticChannel(field, BEAM.particle(), BEAM.energyPerCharge_V());
        double r0 = 1e-3;
        double s0 = 2e-3;
        EnvelopeCurve c = new EnvelopeSolver().solve(ch, new EnvelopeProblem(z0, z1, r0, s0, 0, 0));
        ParaxialOptics po = ParaxialOptics.of(field, BEAM, z0, z1);
        assertThat(c.waists()).as("the immersion lens focuses the diverging ray").isNotEmpty();
        for (double z : new double[] {-0.02, -0.005, 0.0, 0.005, 0.01, 0.02, 0.035, 0.05}) {
            double[] ray = po.ray(z0, r0, s0, z);
            assertThat(c.at(z).radius_m()).as("z = %s", z).isCloseTo(Math.abs(ray[0]), within(1e-8 * r0));
        }
    }

    @Test
    void zeroCurrentEnvelopeIsTheLinearImageOfTheStartEllipse() {
        double z0 = -0.04;
        double z1 = 0.05;
        ElectrostaticChannel ch = new ElectrostaticChannel(field, BEAM.particle(), BEAM.energyPerCharge_V());
        double u0 = ch.accelerationPotential_V(z0);
        double bg0 = BeamKinematics.betaGamma(u0, BEAM.particle().restPotential_V());
        double r0 = 0.8e-3;
        double eps0 = 4e-6; // geometric edge emittance at the start, upright ellipse (waist)
        EnvelopeCurve c = new EnvelopeSolver().solve(ch, new EnvelopeProblem(z0, z1, r0, 0, 0, eps0 * bg0));
        ParaxialOptics po = ParaxialOptics.of(field, BEAM, z0, z1);
        for (double z : new double[] {-0.01, 0.0, 0.01, 0.03, 0.05}) {
            TransferMatrix m = po.transfer(z0, z);
            double mx = m.height(1, 0);
            double ma = m.height(0, 1);
            double ref = Math.hypot(mx * r0, ma * eps0 / r0);
            assertThat(c.at(z).radius_m()).as("z = %s", z).isCloseTo(ref, within(1e-8 * ref));
        }
    }
}
