package org.axistack.verify;

import java.util.List;

import org.axistack.field.BemSolver;
import org.axistack.field.BiasedField;
import org.axistack.field.FieldSolution;
import org.axistack.field.SolveProgress;
import org.axistack.model.Codata2018;
import org.axistack.model.Contour;
import org.axistack.model.Electrode;
import org.axistack.model.MeshSettings;
import org.axistack.model.Segment;
import org.axistack.model.ZR;

/**
 * Field verification cases: the boundary-element solver ({@link BemSolver}) against classical electrostatics:
 * the isolated thin disk (capacitance 8 eps0 a, axial potential (2 V0/pi) arctan(a/|z|)), the sphere
 * (capacitance 4 pi eps0 R) and two coaxial tubes with a small gap against the Bessel-integral solution
 * ({@link TwoTubeBesselPotential}).
 */
final class FieldChecks {

    private static final double EPS0 = Codata2018.EPSILON0_F_PER_M;
    private static final String JACKSON = "classical: J. D. Jackson, Classical Electrodynamics, 3rd ed., ch. 3 (from memory)";

    private FieldChecks() {
    }

    static List<CheckResult> thinDisk() {
        long t0 = System.nanoTime();
        double a = 0.012;
        double v = 250.0;
        double zc = 0.003;
        MeshSettings mesh = new MeshSettings(160, 8);
        FieldSolution s = BemSolver.solve(List.of(new Electrode.Disk("plate", v, zc, a, 0)), mesh, SolveProgress.NONE);
        double c = s.capacitanceMatrix_F()[0][0];
        double ref = 8 * EPS0 * a;
        String method = "boundary elements, " + s.unknowns() + " unknowns";
        double tSolve = seconds(t0);
        CheckResult cap = new CheckResult("thin disk capacitance", "C of a 12 mm radius zero-thickness disk", "pF",
                c * 1e12, ref * 1e12, Math.abs(c - ref) / ref, 1e-9, "relative",
                "C = 8 eps0 a, " + JACKSON, method, tSolve);
        long t1 = System.nanoTime();
        BiasedField f = s.biased();
        double worst = -1, worstZ = 0, worstV = 0, worstRef = 0;
        for (double x = 0.1; x <= 10.0001; x *= 1.2) {
            for (double side : new double[] {1, -1}) {
                double z = zc + side * x * a;
                double exact = 2 * v / Math.PI * Math.atan(1 / x);
                double got = f.exactAxial0(z);
                double err = Math.abs(got - exact) / v;
                if (err > worst) {
                    worst = err;
                    worstZ = z;
                    worstV = got;
                    worstRef = exact;
                }
            }
        }
        CheckResult axis = new CheckResult("thin disk axial potential",
                String.format(java.util.Locale.ROOT, "V on the axis at 250 V (exact element sum), worst at z = %.3f mm", (worstZ - zc) * 1e3),
                "V", worstV, worstRef, worst, 1e-9, "max over 0.1a..10a each side, of V0",
                "V = (2 V0/pi) arctan(a/|z|), " + JACKSON, method, seconds(t1));
        return List.of(cap, axis);
    }

    static CheckResult sphere() {
        long t0 = System.nanoTime();
        double radius = 0.02;
        Contour half = new Contour(List.of(new Segment.Arc(new ZR(-radius, 0), new ZR(0, radius), new ZR(radius, 0))), false);
        FieldSolution s = BemSolver.solve(List.of(new Electrode.Outline("ball", 1.0, half)), new MeshSettings(96, 4),
                SolveProgress.NONE);
        double c = s.capacitanceMatrix_F()[0][0];
        double ref = 4 * Math.PI * EPS0 * radius;
        return new CheckResult("sphere capacitance", "C of a 20 mm radius sphere (arc outline)", "pF", c * 1e12,
                ref * 1e12, Math.abs(c - ref) / ref, 1e-9, "relative", "C = 4 pi eps0 R, " + JACKSON,
                "boundary elements, " + s.unknowns() + " unknowns", seconds(t0));
    }

    /** Two 60 mm long tubes of radius 5 mm, 0.02 mm gap, -300 V and +700 V. */
    static CheckResult twoTubeGap() {
        long t0 = System.nanoTime();
        double radius = 0.005, gap = 0.00002, v1 = -300, v2 = 700;
        FieldSolution s = BemSolver.solve(twoTubes(radius, 0.06, gap, v1, v2), new MeshSettings(900, 12),
                SolveProgress.NONE);
        BiasedField f = s.biased();
        TwoTubeBesselPotential ref = new TwoTubeBesselPotential(radius, v1, v2, gap);
        double worst = -1, worstZ = 0, worstV = 0, worstRef = 0;
        for (double z = -2 * radius; z <= 2 * radius + 1e-12; z += radius / 8) {
            double got = f.axialPotential_V(z);
            double exact = ref.axialPotential_V(z);
            double err = Math.abs(got - exact) / (v2 - v1);
            if (err > worst) {
                worst = err;
                worstZ = z;
                worstV = got;
                worstRef = exact;
            }
        }
        return new CheckResult("two-tube lens axial potential",
                String.format(java.util.Locale.ROOT, "V on the axis, R 5 mm, gap 0.02 mm, worst at z = %.3f mm", worstZ * 1e3),
                "V", worstV, worstRef, worst, 2e-6, "max over |z| <= 2R, of V2-V1",
                "Bessel integral (V1+V2)/2 + (V2-V1)/pi Int sin(kz) sinc(kg/2)/(k I0(kR)) dk, classical: "
                        + "Harting and Read, Electrostatic Lenses, 1976 (from memory)",
                "boundary elements, " + s.unknowns() + " unknowns; the real gap differs from the linear-gap model "
                        + "by about 1e-5 (g/0.1 mm)^2 of V2-V1", seconds(t0));
    }

    static List<Electrode> twoTubes(double radius, double length, double gap, double v1, double v2) {
        return List.of(new Electrode.Tube("upstream", v1, radius, -length, -gap / 2, 0),
                new Electrode.Tube("downstream", v2, radius, gap / 2, length, 0));
    }

    static double seconds(long t0) {
        return (System.nanoTime() - t0) * 1e-9;
    }
}
