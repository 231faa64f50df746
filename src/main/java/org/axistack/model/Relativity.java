package org.axistack.model;

/**
 * Relativistic kinematics of a particle in an electrostatic potential, written with the acceleration potential
 * U = T/|q| (volts) and the rest potential V0 = m c^2/|q| (textbook special relativity; e.g. P. W. Hawkes and
 * E. Kasper, Principles of Electron Optics, vol. 1, ch. 2). The one place for these formulas.
 */
public final class Relativity {

    private Relativity() {
    }

    /** Lorentz factor gamma = 1 + U/V0 (also g = d(U*)/dU in the paraxial equation). */
    public static double gamma(double u_V, double restPotential_V) {
        return 1 + u_V / restPotential_V;
    }

    /** Relativistically corrected acceleration potential U* = U (1 + U/(2 V0)), V. */
    public static double relativisticPotential_V(double u_V, double restPotential_V) {
        return u_V * (1 + u_V / (2 * restPotential_V));
    }
}
