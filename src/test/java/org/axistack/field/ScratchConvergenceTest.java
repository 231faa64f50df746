package org.axistack.field;

import java.util.List;
import org.axistack.model.*;
import org.junit.jupiter.api.Test;

class ScratchConvergenceTest {
    @Test
    void disk() {
        double a = 0.01;
        for (int levels : new int[] {4, 8, 12}) {
            for (int n : new int[] {64, 128, 256, 512}) {
                Electrode d = new Electrode.Disk("d", 1.0, 0, a, 0);
                FieldSolution s = BemSolver.solve(List.of(d), new MeshSettings(n, levels), SolveProgress.NONE);
                double c = s.capacitanceMatrix_F()[0][0];
                double ref = 8 * Codata2018.EPSILON0_F_PER_M * a;
                BiasedField f = s.biased();
                double maxErr = 0;
                for (double zr = 0.1; zr <= 10; zr *= 1.3) {
                    double v = f.axialPotential_V(zr * a);
                    double exact = 2 / Math.PI * Math.atan(1 / zr);
                    maxErr = Math.max(maxErr, Math.abs(v - exact));
                }
                System.out.printf("disk L=%d N=%d cap rel err %.3e axial max err %.3e residual %.2e t=%.3fs%n", levels, s.unknowns(), (c - ref) / ref, maxErr, s.residual(), s.solveSeconds());
            }
        }
    }

    @Test
    void sphere() {
        double R = 0.02;
        for (int n : new int[] {32, 64, 128, 256}) {
            Contour c = new Contour(List.of(new Segment.Arc(new ZR(-R, 0), new ZR(0, R), new ZR(R, 0))), false);
            Electrode e = new Electrode.Outline("s", 1.0, c);
            FieldSolution s = BemSolver.solve(List.of(e), new MeshSettings(n, 4), SolveProgress.NONE);
            double cap = s.capacitanceMatrix_F()[0][0];
            double ref = 4 * Math.PI * Codata2018.EPSILON0_F_PER_M * R;
            System.out.printf("sphere N=%d cap rel err %.3e%n", s.unknowns(), (cap - ref) / ref);
        }
    }
}
