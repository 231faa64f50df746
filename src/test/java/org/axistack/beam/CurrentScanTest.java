package org.axistack.beam;

import org.axistack.verify.Erfi;
import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.ArrayList;
import java.util.List;

import org.axistack.model.Codata2018;
import org.axistack.model.Particle;
import org.junit.jupiter.api.Test;

/** Current scan of a converging laminar beam in a drift against the universal beam-spread curve. */
class CurrentScanTest {

    static final double R0 = 1e-3;
    static final double S = -5e-3;
    /**
     * End plane. The closed-form waist position rises from R0/|S| = 0.2 m at zero current to a peak of about
     * 0.24 m (near K = 5e-6), then falls back toward the start as space charge turns the beam earlier; with
     * the end at 0.22 m the waist leaves the range once on the rising branch.
     */
    static final double L = 0.22;
    static final double K_PEAK = 5e-6;
    static final double U = 10_000;

    /**
     * Waist position of a laminar beam (eps = 0) entering a drift at R0 with slope S: the waist radius is
     * Rm = R0 exp(-S^2/(2K)) (invariant R'^2 - 2K ln R) and the distance from the waist back to R0 is
     * Rm sqrt(pi/(2K)) erfi(|S|/sqrt(2K)) (universal beam-spread curve, Reiser section 4.2).
     */
    static double waistZ(double k) {
        double rm = R0 * Math.exp(-S * S / (2 * k));
        return rm * Math.sqrt(Math.PI / (2 * k)) * Erfi.erfi(Math.abs(S) / Math.sqrt(2 * k));
    }

    @Test
    void waistMovesDownstreamAndVanishesWhereTheClosedFormSays() {
        Particle proton = Particle.proton();
        ElectrostaticChannel ch = new ElectrostaticChannel(TestFields.drift(), proton, U);
        double v0 = proton.restPotential_V();
        double bg = BeamKinematics.betaGamma(U, v0);
        EnvelopeProblem base = new EnvelopeProblem(0, L, R0, S, 0, 0);
        CurrentScan scan = new CurrentScan(new EnvelopeSolver());
        // current at which the closed-form waist reaches the end plane (bisection on waistZ(K) = L)
        double lo = 1e-9;
        double hi = K_PEAK;
        for (int i = 0; i < 200; i++) {
            double mid = Math.sqrt(lo * hi);
            if (waistZ(mid) < L) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        double kVanish = Math.sqrt(lo * hi);
        double iVanish = kVanish * 2 * Math.PI * Codata2018.EPSILON0_F_PER_M * Codata2018.SPEED_OF_LIGHT_M_PER_S * v0
                * Math.pow(bg, 3);
        List<Double> progress = new ArrayList<>();
        double iPeak = iVanish * K_PEAK / kVanish;
        ScanResult r = scan.scan(ch, base, iPeak, 20, progress::add);
        assertThat(r.vanishingCurrent_A()).isPresent();
        assertThat(r.vanishingCurrent_A().getAsDouble()).isCloseTo(iVanish, within(2 * CurrentScan.BISECTION_TOLERANCE * iVanish));
        assertThat(progress).isNotEmpty().isSorted();
        assertThat(progress.get(progress.size() - 1)).isEqualTo(1.0);

        double prevZ = -1;
        for (ScanPoint p : r.points()) {
            if (p.current_A() == 0) {
                assertThat(p.waist().orElseThrow().z_m()).isCloseTo(R0 / -S, within(1e-9));
                continue;
            }
            double k = BeamKinematics.perveance(p.current_A(), v0, bg);
            if (p.current_A() < iVanish * 0.999) {
                Waist w = p.waist().orElseThrow();
                assertThat(w.z_m()).as("I = %s A", p.current_A()).isCloseTo(waistZ(k), within(1e-5 * waistZ(k)));
                assertThat(w.z_m()).isGreaterThan(prevZ);
                prevZ = w.z_m();
            } else if (p.current_A() > iVanish * 1.001) {
                assertThat(p.waist()).as("I = %s A", p.current_A()).isEmpty();
            }
        }
        assertThat(scan.findVanishingBound(ch, base, 1.0).getAsDouble()).isBetween(iVanish, 2 * iVanish);
    }

    @Test
    void strongSpaceChargeTurnsTheBeamEarlier() {
        // falling branch of the same closed form: at K = 3e-5 and 1e-4 the waist lies at 0.127 m and 0.046 m
        Particle proton = Particle.proton();
        ElectrostaticChannel ch = new ElectrostaticChannel(TestFields.drift(), proton, U);
        double v0 = proton.restPotential_V();
        double bg = BeamKinematics.betaGamma(U, v0);
        CurrentScan scan = new CurrentScan(new EnvelopeSolver());
        for (double k : new double[] {3e-5, 1e-4}) {
            double i = k * 2 * Math.PI * Codata2018.EPSILON0_F_PER_M * Codata2018.SPEED_OF_LIGHT_M_PER_S * v0
                    * Math.pow(bg, 3);
            ScanPoint p = scan.at(ch, new EnvelopeProblem(0, 0.5, R0, S, 0, 0), i);
            Waist w = p.waist().orElseThrow();
            assertThat(w.z_m()).isCloseTo(waistZ(k), within(1e-8 * waistZ(k)));
            assertThat(w.radius_m()).isCloseTo(R0 * Math.exp(-S * S / (2 * k)), within(1e-8 * w.radius_m()));
        }
    }
}
