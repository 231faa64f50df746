package org.axistack.optics;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.OptionalDouble;

import org.axistack.model.Beam;
import org.axistack.model.Particle;
import org.hipparchus.ode.ODEState;
import org.hipparchus.ode.OrdinaryDifferentialEquation;
import org.hipparchus.ode.nonstiff.DormandPrince853Integrator;
import org.junit.jupiter.api.Test;

/**
 * Non-relativistically the paths depend only on U(z): an electron and a singly charged argon ion of the same
 * kinetic energy in mirrored biases have the same cardinal elements (physics brief, "Conventions"; a fact of
 * the trade). Relativistically the electron differs; the size of that difference is predicted independently
 * by Picht's reduced equation R'' + T R = 0, R = r U*^(1/4), with the relativistic
 * T = (3/16)(g U'/U*)^2 - U'^2/(4 Vr U*) (the standard substitution that removes the first-derivative term,
 * derived here from the relativistic paraxial equation; cf. Hawkes and Kasper vol. 1, ch. 15, from memory).
 */
class MassIndependenceTest {

    private static final Particle ARGON = Particle.ion(39.962383, 1);
    private static final double W = 4e-3;
    private static final double T0 = 10_000;
    private static final double BIAS = 4000; // decelerating bump height, V

    @Test
    void electronAndArgonIonAgreeNonRelativisticallyAndDifferByTheRelativisticCorrection() {
        AnalyticAxialField forElectron = AnalyticAxialField.gaussian(-BIAS, W);
        AnalyticAxialField forIon = AnalyticAxialField.gaussian(BIAS, W);
        AccelerationPotential electron = new AccelerationPotential(forElectron, new Beam(Particle.electron(), T0));
        AccelerationPotential ion = new AccelerationPotential(forIon, new Beam(ARGON, T0));

        CardinalElements eNr = cardinal(electron.nonRelativistic());
        CardinalElements iNr = cardinal(ion.nonRelativistic());
        assertThat(eNr.relativeDifference(iNr)).as("non-relativistic electron vs argon").isLessThan(1e-10);

        CardinalElements eRel = cardinal(electron);
        CardinalElements iRel = cardinal(ion);
        double measured = eRel.focalLengthImage_m() / iRel.focalLengthImage_m() - 1;

        double pichtElectron = pichtFocalLength(electron);
        double pichtIon = pichtFocalLength(ion);
        double predicted = pichtElectron / pichtIon - 1;
        assertThat(eRel.focalLengthImage_m()).isCloseTo(pichtElectron, within(1e-9 * pichtElectron));
        assertThat(iRel.focalLengthImage_m()).isCloseTo(pichtIon, within(1e-9 * pichtIon));
        assertThat(measured).isCloseTo(predicted, within(1e-6 * Math.abs(predicted)));
        // order of magnitude: U/Vr for a 10 keV electron is about 2%
        double scale = T0 / Particle.electron().restPotential_V();
        assertThat(Math.abs(measured)).isBetween(0.1 * scale, 10 * scale);
        // argon is non-relativistic to ~U/Vr = 3e-7
        assertThat(iRel.relativeDifference(iNr)).isLessThan(1e-6);
    }

    private static CardinalElements cardinal(AccelerationPotential p) {
        return ParaxialOptics.auto(p, -0.06, 0.06, OptionalDouble.empty(), ParaxialSettings.defaults()).cardinal();
    }

    /** Image-side focal length from Picht's equation (same U*, so R and r are proportional outside the lens). */
    private static double pichtFocalLength(AccelerationPotential p) {
        double vr = p.restPotential_V();
        OrdinaryDifferentialEquation ode = new OrdinaryDifferentialEquation() {
            private final double[] d = new double[2];

            @Override
            public int getDimension() {
                return 2;
            }

            @Override
            public double[] computeDerivatives(double z, double[] y) {
                p.derivatives(z, 1, d);
                double u = d[0];
                double uStar = u * (1 + u / (2 * vr));
                double g = 1 + u / vr;
                double t = 3.0 / 16.0 * Math.pow(g * d[1] / uStar, 2) - d[1] * d[1] / (4 * vr * uStar);
                return new double[] {y[1], -t * y[0]};
            }
        };
        DormandPrince853Integrator integ = new DormandPrince853Integrator(1e-12, 1e-3,
                new double[] {1e-16, 1e-14}, new double[] {1e-13, 1e-13});
        double[] end = integ.integrate(ode, new ODEState(-0.06, new double[] {1, 0}), 0.06).getPrimaryState();
        return -1 / end[1];
    }
}
