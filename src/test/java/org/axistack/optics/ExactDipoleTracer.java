package org.axistack.optics;

import org.axistack.field.AxialField;
import org.axistack.model.Particle;

/**
 * Slow, independent reference for the misalignment-aberration tests: exact relativistic skew rays (Lorentz force,
 * z as the independent variable, as {@link ExactSkewTracer}) in a round field plus eps times a dipole (m = 1) field
 * with axial function P(z). The dipole's three-dimensional potential is the solution of Laplace's equation with
 * that axial function, x sum_k (-1)^k r^(2k) P^(2k)(z) / (4^k k! (k + 1)!) (the cylindrical harmonic series of
 * order 1: the Laplacian of a(z) r^n cos(phi) is cos(phi) [a (n^2 - 1) r^(n-2) + a'' r^n], so each term cancels the
 * z part of the one before; misalignment.md), up to k = 3. Nothing here uses the paraxial equation or the aberration
 * expansion.
 */
final class ExactDipoleTracer {

    /** 1 / (4^k k! (k + 1)!), k = 0..3, with the sign (-1)^k. */
    private static final double[] COEFF = {1, -1.0 / 8, 1.0 / 192, -1.0 / 9216};

    private final ExactMeridionalTracer round;
    private final AxialField dipole;
    private final Particle particle;

    ExactDipoleTracer(AxialField round, AxialField dipole, Particle particle) {
        this.round = new ExactMeridionalTracer(round, particle);
        this.dipole = dipole;
        this.particle = particle;
    }

    /** Potential (returned) and E = -grad phi into e (x, y, z) at (x, y, z) with dipole strength eps. */
    double field(double x, double y, double z, double eps, double[] e) {
        double r = Math.hypot(x, y);
        double[] ez = new double[2];
        double phi = round.evaluate(z, r, ez);
        e[0] = r > 0 ? ez[1] * x / r : 0;
        e[1] = r > 0 ? ez[1] * y / r : 0;
        e[2] = ez[0];
        if (eps != 0) {
            double[] p = new double[8];
            dipole.axial(z, 7, p);
            double r2 = r * r;
            double f = 0;
            double df = 0; // d f / d(r^2)
            double fz = 0;
            double pow = 1;
            for (int k = 0; k <= 3; k++) {
                f += COEFF[k] * pow * p[2 * k];
                fz += COEFF[k] * pow * p[2 * k + 1];
                if (k >= 1) {
                    df += COEFF[k] * k * (pow / r2) * p[2 * k];
                }
                pow *= r2;
            }
            if (r2 == 0) {
                df = COEFF[1] * p[2];
            }
            phi += eps * x * f;
            e[0] -= eps * (f + 2 * x * x * df);
            e[1] -= eps * 2 * x * y * df;
            e[2] -= eps * x * fz;
        }
        return phi;
    }

    /** {x, y, dx/dz, dy/dz} at z1 of the ray given at z0, kinetic energy t0_eV where the potential is 0 V. */
    double[] trace(double z0, double x0, double y0, double sx0, double sy0, double t0_eV, double z1, double eps) {
        return ExactSkewTracer.trace(particle, (x, y, z, e) -> field(x, y, z, eps, e), z0, x0, y0, sx0, sy0, t0_eV, z1);
    }
}
