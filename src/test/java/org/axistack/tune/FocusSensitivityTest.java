package org.axistack.tune;

import static org.assertj.core.api.Assertions.assertThat;

import org.axistack.model.Beam;
import org.axistack.model.Particle;
import org.axistack.model.Stack;
import org.junit.jupiter.api.Test;

/**
 * Issue 6: the linearised image shifts (first-variation equations) against central finite differences of full
 * optics runs (within 1%, the tolerance), and the scaling law of electrostatic optics: without the
 * relativistic correction the paraxial rays depend only on the ratios of the potentials to the beam energy, so
 * sum_i V_i dZ/dV_i + T dZ/dT = 0 (Euler's theorem for functions homogeneous of degree 0; e.g. P. W. Hawkes and
 * E. Kasper, Principles of Electron Optics, vol. 1, the scaling of electrostatic lenses; from memory).
 */
class FocusSensitivityTest {

    private static final double IMAGE_Z = 0.035;

    @Test
    void linearisedShiftsMatchFiniteDifferences() {
        Stack stack = SolvedDemo.STACK;
        TuneResult r = new BiasTuner(SolvedDemo.SOLUTION, stack).focus("focus", IMAGE_Z);
        assertThat(r.solutions()).isNotEmpty();
        for (FocusSolution s : r.solutions()) {
            if (s.axisCrossings() > 0) {
                continue;
            }
            FocusTarget target = r.target();
            double[] b = s.biases_V();
            FocusSensitivity lin = FocusSensitivity.of(SolvedDemo.SOLUTION, stack, b, target, 1e-4);
            double dv = 1e-3 * Math.abs(s.bias_V());
            FocusProbe probe = new FocusProbe(SolvedDemo.SOLUTION, stack, target);
            double[] up = b.clone();
            double[] down = b.clone();
            up[1] += dv;
            down[1] -= dv;
            double fd = (probe.at(up).imageZ_m() - probe.at(down).imageZ_m()) / (2 * dv);
            double lv = lin.imageShift_m_per_V()[1];
            double e = stack.beam().energy_eV();
            double de = 1e-4 * e;
            Stack hi = stack.withBeam(stack.beam().withEnergy_eV(e + de));
            Stack lo = stack.withBeam(stack.beam().withEnergy_eV(e - de));
            double fdE = (new FocusProbe(SolvedDemo.SOLUTION, hi, target).at(b).imageZ_m()
                    - new FocusProbe(SolvedDemo.SOLUTION, lo, target).at(b).imageZ_m()) / (2 * de / e);
            System.out.printf("%s %.4f V: dZ/dV %.6e mm/V (finite differences %.6e), T dZ/dT %.6e mm (fd %.6e),"
                    + " ppm per supply %.3g, all %.3g, energy %.3g%n", s.mode(), s.bias_V(), lv * 1e3, fd * 1e3,
                    lin.imageShiftPerRelativeEnergy_m() * 1e3, fdE * 1e3, lin.stabilityPerSupply()[1] * 1e6,
                    lin.stabilityAllSupplies() * 1e6, lin.stabilityEnergy() * 1e6);
            assertThat(Math.abs(lv / fd - 1)).isLessThan(0.01);
            assertThat(Math.abs(lin.imageShiftPerRelativeEnergy_m() / fdE - 1)).isLessThan(0.01);
            // ppm from the definition: depth / |V dZ/dV|
            assertThat(lin.stabilityPerSupply()[1]).isCloseTo(1e-4 / Math.abs(s.bias_V() * lv),
                    org.assertj.core.data.Percentage.withPercentage(1e-9));
        }
    }

    @Test
    void nonRelativisticScalingLawHolds() {
        // protons at 200 eV: U/Vr ~ 2e-7, so the relativistic correction is below the check's 1e-5
        Stack stack = SolvedDemo.STACK.withBeam(new Beam(Particle.proton(), 200));
        TuneResult r = new BiasTuner(SolvedDemo.SOLUTION, stack).focus("focus", IMAGE_Z);
        assertThat(r.solutions()).isNotEmpty();
        for (FocusSolution s : r.solutions()) {
            FocusSensitivity lin = FocusSensitivity.of(SolvedDemo.SOLUTION, stack, s.biases_V(), r.target(), 1e-4);
            double sum = lin.imageShiftPerRelativeEnergy_m();
            double scale = Math.abs(lin.imageShiftPerRelativeEnergy_m());
            for (int i = 0; i < 3; i++) {
                sum += s.biases_V()[i] * lin.imageShift_m_per_V()[i];
                scale = Math.max(scale, Math.abs(s.biases_V()[i] * lin.imageShift_m_per_V()[i]));
            }
            System.out.printf("proton %.4f V: Euler sum %.3e of %.3e mm%n", s.bias_V(), sum * 1e3, scale * 1e3);
            assertThat(Math.abs(sum)).isLessThan(1e-5 * scale);
        }
    }
}
