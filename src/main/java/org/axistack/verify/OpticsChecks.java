package org.axistack.verify;

import java.util.List;
import java.util.Locale;

import org.axistack.beam.ElectrostaticChannel;
import org.axistack.beam.EnvelopeCurve;
import org.axistack.beam.EnvelopePoint;
import org.axistack.beam.EnvelopeProblem;
import org.axistack.beam.EnvelopeSolver;
import org.axistack.field.AxialField;
import org.axistack.field.BemSolver;
import org.axistack.field.BiasedField;
import org.axistack.field.FieldSolution;
import org.axistack.field.SolveProgress;
import org.axistack.model.Beam;
import org.axistack.model.MeshSettings;
import org.axistack.model.Particle;
import org.axistack.optics.CardinalElements;
import org.axistack.optics.ParaxialOptics;

/**
 * Optics and beam verification cases: the paraxial integrator ({@link ParaxialOptics}) against the closed-form
 * relativistic ray in a uniform field and the Helmholtz-Lagrange ratio f2/f1 = sqrt(U2* / U1*) on a
 * boundary-element immersion lens; the envelope solver ({@link EnvelopeSolver}) against the universal
 * beam-spread curve of a laminar beam in a drift.
 */
final class OpticsChecks {

    private OpticsChecks() {
    }

    /**
     * Uniform field U = U0 + k z: sqrt(U*) r' is conserved, so r = r0 + r0' sqrt(U*0) Integral dz / sqrt(U*),
     * which integrates to sqrt(2 Vr)/k ln((U + Vr + S)/(U0 + Vr + S0)), S = sqrt(U^2 + 2 Vr U).
     */
    static CheckResult uniformFieldRay() {
        long t0 = System.nanoTime();
        Particle p = Particle.electron();
        double t = 2000, slope = 2e5, length = 0.5;
        double k = slope * -p.chargeSign(); // axial potential slope that accelerates the particle
        AxialField uniform = (z, order, out) -> {
            out[0] = k * z;
            for (int n = 1; n <= order; n++) {
                out[n] = n == 1 ? k : 0;
            }
        };
        Beam beam = new Beam(p, t);
        ParaxialOptics optics = ParaxialOptics.of(uniform, beam, 0.0, length);
        double r0 = 1.3e-3, s0 = -4e-3;
        double[] ray = optics.ray(0.0, r0, s0, length);
        double vr = p.restPotential_V();
        double u0 = t, u = t + slope * length;
        double uStar0 = u0 * (1 + u0 / (2 * vr));
        double sq0 = Math.sqrt(u0 * u0 + 2 * vr * u0);
        double sq = Math.sqrt(u * u + 2 * vr * u);
        double integral = Math.sqrt(2 * vr) / slope * Math.log1p((u - u0 + sq - sq0) / (u0 + vr + sq0));
        double expected = r0 + s0 * Math.sqrt(uStar0) * integral;
        return new CheckResult("uniform-field paraxial ray",
                "ray height after 0.5 m of a 200 kV/m field, 2 keV electron (relativistic)", "mm", ray[0] * 1e3,
                expected * 1e3, Math.abs(ray[0] - expected) / Math.abs(r0), 1e-10, "relative to the start height",
                "closed form: sqrt(U*) r' conserved, elementary integral (e.g. Hawkes and Kasper, Principles of "
                        + "Electron Optics, vol. 1, ch. 15, from memory)",
                "paraxial ray equation, relative tolerance " + optics.settings().relativeTolerance(), FieldChecks.seconds(t0));
    }

    /** Two tubes R 5 mm, 1 mm gap, 0 V and +2000 V; a 500 eV electron is accelerated 1:5. */
    static CheckResult helmholtzLagrange() {
        long t0 = System.nanoTime();
        double radius = 0.005, v2 = 2000, t = 500;
        FieldSolution s = BemSolver.solve(FieldChecks.twoTubes(radius, 0.1, 0.001, 0, v2), new MeshSettings(500, 8),
                SolveProgress.NONE);
        BiasedField f = s.biased();
        Particle p = Particle.electron();
        ParaxialOptics optics = ParaxialOptics.auto(f, new Beam(p, t), -0.05, 0.05);
        CardinalElements c = optics.cardinal();
        double ratio = c.focalLengthImage_m() / c.focalLengthObject_m();
        double vr = p.restPotential_V();
        double u1 = t, u2 = t + v2;
        double expected = Math.sqrt(u2 * (1 + u2 / (2 * vr)) / (u1 * (1 + u1 / (2 * vr))));
        return new CheckResult("Helmholtz-Lagrange f2/f1",
                String.format(Locale.ROOT, "f2/f1 of a 1:5 accelerating two-tube lens (f1 = %.2f mm, f2 = %.2f mm)",
                        c.focalLengthObject_m() * 1e3, c.focalLengthImage_m() * 1e3),
                "1", ratio, expected, Math.abs(ratio - expected) / expected, 1e-8, "relative",
                "f2/f1 = sqrt(U2*/U1*), Helmholtz-Lagrange (physics brief; Hawkes and Kasper, ch. 16, from memory)",
                "boundary elements (" + s.unknowns() + " unknowns), principal rays of the paraxial equation",
                FieldChecks.seconds(t0));
    }

    /**
     * Laminar round beam in a drift, R'' = K/R, parallel start at R0: z = R0 sqrt(pi/(2K)) erfi(sqrt(ln(R/R0)))
     * (R'^2 = 2K ln(R/R0); substitute R = R0 exp(t^2)). Proton, 10 keV, 1 mA, R0 = 1 mm, 0.5 m of drift.
     */
    static CheckResult universalBeamSpread() {
        long t0 = System.nanoTime();
        AxialField drift = (z, order, out) -> java.util.Arrays.fill(out, 0, order + 1, 0.0);
        EnvelopeSolver solver = new EnvelopeSolver();
        double r0 = 1e-3;
        EnvelopeCurve c = solver.solve(new ElectrostaticChannel(drift, Particle.proton(), 10_000),
                new EnvelopeProblem(0, 0.5, r0, 0, 1e-3, 0));
        double k = c.points().get(0).perveance();
        double worst = -1, worstZ = 0, worstRef = 0, worstR = 0;
        for (EnvelopePoint pt : c.points()) {
            if (pt.z_m() < 0.05) {
                continue; // ln(R/R0) ~ 0 near the start: the closed form is ill-conditioned there
            }
            double zFormula = r0 * Math.sqrt(Math.PI / (2 * k)) * Erfi.erfi(Math.sqrt(Math.log(pt.radius_m() / r0)));
            double err = Math.abs(zFormula - pt.z_m()) / pt.z_m();
            if (err > worst) {
                worst = err;
                worstZ = pt.z_m();
                worstRef = zFormula;
                worstR = pt.radius_m();
            }
        }
        return new CheckResult("universal beam-spread curve",
                String.format(Locale.ROOT, "z where the envelope reaches R = %.3f mm (10 keV protons, 1 mA, R0 1 mm, "
                        + "perveance %.3g)", worstR * 1e3, k), "mm", worstZ * 1e3, worstRef * 1e3, worst, 1e-8,
                "max over the curve beyond 50 mm, relative",
                "z = R0 sqrt(pi/(2K)) erfi(sqrt(ln(R/R0))), classical (M. Reiser, Theory and Design of Charged "
                        + "Particle Beams, 2nd ed., sec. 4.2, from memory)",
                "envelope equation, adaptive Dormand-Prince", FieldChecks.seconds(t0));
    }
}
