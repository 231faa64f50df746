package org.axistack.trace;

import org.axistack.model.PhysicsMessage;
import java.util.OptionalDouble;

import org.axistack.model.Particle;
import org.hipparchus.linear.Array2DRowRealMatrix;
import org.hipparchus.linear.ArrayRealVector;
import org.hipparchus.linear.QRDecomposition;
import org.hipparchus.linear.RealVector;

/**
 * Image-side focal properties and aberration coefficients measured by exact tracing, independently
 * of the aberration integrals: rays enter parallel to the axis at heights h_k = h_max k / K between
 * two reference planes; the asymptote of each leaving ray gives its axis crossing z_c(h) and its
 * slope. Least-squares polynomial fits in h^2 extrapolate to h -&gt; 0: the paraxial focal point F2
 * and focal length f2 (their small-angle limit). The miss of each asymptote on the focal plane is
 * fitted as -Cs alpha^3 - C5 alpha^5 - C7 alpha^7 with alpha = h / f2 (the convention of
 * interface.md: image side, object at infinity). Cc is the derivative of F2 with respect to the
 * relative energy change dT/T (T the image-side kinetic energy), by a fourth-order central
 * difference over dT/T = +-1e-3, +-2e-3. This is the classical "trace and fit" measurement of
 * aberration coefficients (e.g. Hawkes and Kasper, "Principles of Electron Optics", vol. 1, ch. 24,
 * on determining aberrations from computed trajectories).
 */
public final class TracedAberrations {

    /** Relative energy step of the chromatic difference. */
    public static final double ENERGY_STEP = 1e-3;
    /** Number of ray heights in the fits. */
    public static final int HEIGHTS = 8;

    private TracedAberrations() {
    }

    /**
     * The measurement.
     *
     * @param zStart_m              object-side reference plane (rays start there, parallel), m
     * @param zEnd_m                image-side reference plane (asymptotes taken there), m
     * @param energy_eV             beam energy (kinetic where phi = 0), eV
     * @param maxHeight_m           largest ray height, m
     * @param focalPointImageZ_m    F2 used for the spherical fit, m: the small-angle limit of the
     *                              traces, or the paraxial value when one was supplied
     * @param tracedFocalPointZ_m   small-angle limit of the traced axis crossings, m
     * @param focalLengthImage_m    f2, small-angle limit of -h / slope, m
     * @param principalPlaneImageZ_m H2 = F2 - f2, m
     * @param spherical_m           Cs, m
     * @param fifthOrder_m          C5, m (next term of the fit; indicative)
     * @param sphericalHalfHeight_m Cs from the fit over half the heights, m: the difference to Cs
     *                              shows the convergence of the fit
     * @param chromatic_m           Cc, m
     * @param imageEnergy_eV        kinetic energy on the axis at zEnd, eV
     * @param maxAngle_rad          largest alpha = h_max / f2, rad
     * @param fitResidual_m         root-mean-square residual of the spherical fit, m
     */
    public record Result(double zStart_m, double zEnd_m, double energy_eV, double maxHeight_m,
            double focalPointImageZ_m, double tracedFocalPointZ_m, double focalLengthImage_m,
            double principalPlaneImageZ_m, double spherical_m, double fifthOrder_m, double sphericalHalfHeight_m,
            double chromatic_m, double imageEnergy_eV, double maxAngle_rad, double fitResidual_m) {

        /** The convention in words. */
        public String convention() {
            return "traced, image side, object at infinity: rays enter parallel at height h (alpha = h/f2); the"
                    + " asymptote meets the paraxial focal plane at -Cs alpha^3 - C5 alpha^5; an energy change dT moves"
                    + " the focal point by +Cc dT/T (T the image-side kinetic energy)";
        }
    }

    /** Focal points of parallel rays at the given heights, and their slopes and misses. */
    private record Fan(double[] h, double[] x, double[] s) {
    }

    /**
     * Measures the image-side properties.
     *
     * @param paraxialFocus_m the paraxial focal point from the paraxial optics if available (empty:
     *                        use the small-angle limit of the traces)
     */
    public static Result measure(Tracer tracer, Particle particle, double energy_eV, double zStart_m, double zEnd_m,
            double maxHeight_m, OptionalDouble paraxialFocus_m) {
        if (!(maxHeight_m > 0) || !Double.isFinite(maxHeight_m)) {
            throw PhysicsMessage.ABERRATION_HEIGHT.exception("height", maxHeight_m * 1e3);
        }
        if (!(zEnd_m > zStart_m)) {
            throw new IllegalArgumentException("reference planes need z_end > z_start");
        }
        Fan nominal = fan(tracer, particle, energy_eV, zStart_m, zEnd_m, maxHeight_m);
        double[] zc = crossings(nominal, zEnd_m);
        double tracedF = fitEven(nominal.h, zc, maxHeight_m)[0];
        double[] g = new double[HEIGHTS];
        for (int k = 0; k < HEIGHTS; k++) {
            g[k] = -nominal.h[k] / nominal.s[k];
        }
        double f2 = fitEven(nominal.h, g, maxHeight_m)[0];
        double fUsed = paraxialFocus_m.orElse(tracedF);

        double[] alpha = new double[HEIGHTS], miss = new double[HEIGHTS];
        for (int k = 0; k < HEIGHTS; k++) {
            alpha[k] = nominal.h[k] / f2;
            miss[k] = nominal.x[k] + nominal.s[k] * (fUsed - zEnd_m);
        }
        double amax = maxHeight_m / f2;
        double[] c = fitOdd(alpha, miss, amax, HEIGHTS);
        double[] cHalf = fitOdd(alpha, miss, amax / 2, HEIGHTS / 2);
        double res = 0;
        for (int k = 0; k < HEIGHTS; k++) {
            double a = alpha[k];
            double model = c[0] * a * a * a + c[1] * Math.pow(a, 5) + c[2] * Math.pow(a, 7);
            res += (miss[k] - model) * (miss[k] - model);
        }
        res = Math.sqrt(res / HEIGHTS);

        double phiEnd = tracer.field().potential_V(zEnd_m, 0);
        double tImage = particle.energy_eV(particle.energyPerCharge_V(energy_eV) - particle.chargeSign() * phiEnd);
        double[] fd = new double[4];
        double[] steps = {ENERGY_STEP, -ENERGY_STEP, 2 * ENERGY_STEP, -2 * ENERGY_STEP};
        for (int i = 0; i < 4; i++) {
            Fan f = fan(tracer, particle, energy_eV + steps[i] * tImage, zStart_m, zEnd_m, maxHeight_m);
            fd[i] = fitEven(f.h, crossings(f, zEnd_m), maxHeight_m)[0];
        }
        double cc = (8 * (fd[0] - fd[1]) - (fd[2] - fd[3])) / (12 * ENERGY_STEP);
        return new Result(zStart_m, zEnd_m, energy_eV, maxHeight_m, fUsed, tracedF, f2, fUsed - f2, -c[0], -c[1],
                -cHalf[0], cc, tImage, amax, res);
    }

    private static Fan fan(Tracer tracer, Particle particle, double energy_eV, double z0, double z1, double hMax) {
        double[] h = new double[HEIGHTS], x = new double[HEIGHTS], s = new double[HEIGHTS];
        TraceTargets tt = TraceTargets.screenOnly(z1);
        for (int k = 0; k < HEIGHTS; k++) {
            h[k] = hMax * (k + 1) / HEIGHTS;
            Trajectory t = tracer.trace(particle, new RayStart(k + 1, h[k], 0, z0, 0, 0, 1, energy_eV), tt);
            if (t.status() != TraceStatus.SCREEN) {
                throw PhysicsMessage.ABERRATION_RAY_LOST.exception("height", h[k] * 1e3, "z", z1 * 1e3, "status", t.statusLabel());
            }
            x[k] = t.end().x_m();
            s[k] = t.end().slopeX();
            if (!(s[k] < 0)) {
                throw PhysicsMessage.ABERRATION_NOT_CONVERGING.exception("height", h[k] * 1e3);
            }
        }
        return new Fan(h, x, s);
    }

    private static double[] crossings(Fan f, double zEnd) {
        double[] zc = new double[f.h.length];
        for (int k = 0; k < zc.length; k++) {
            zc[k] = zEnd - f.x[k] / f.s[k];
        }
        return zc;
    }

    /** Least squares y = c0 + c1 u^2 + c2 u^4 + c3 u^6, u = h / scale; returns c (c0 is the h -&gt; 0 limit). */
    static double[] fitEven(double[] h, double[] y, double scale) {
        int n = h.length;
        double[][] a = new double[n][4];
        for (int k = 0; k < n; k++) {
            double u2 = (h[k] / scale) * (h[k] / scale);
            a[k][0] = 1;
            a[k][1] = u2;
            a[k][2] = u2 * u2;
            a[k][3] = u2 * u2 * u2;
        }
        return solve(a, y);
    }

    /** Least squares y = c3 a^3 + c5 a^5 + c7 a^7 over the first m points; returns {c3, c5, c7}. */
    static double[] fitOdd(double[] alpha, double[] y, double scale, int m) {
        double[][] a = new double[m][3];
        double[] yy = new double[m];
        for (int k = 0; k < m; k++) {
            double u = alpha[k] / scale;
            a[k][0] = u * u * u;
            a[k][1] = a[k][0] * u * u;
            a[k][2] = a[k][1] * u * u;
            yy[k] = y[k];
        }
        double[] c = solve(a, yy);
        return new double[] {c[0] / Math.pow(scale, 3), c[1] / Math.pow(scale, 5), c[2] / Math.pow(scale, 7)};
    }

    private static double[] solve(double[][] a, double[] y) {
        RealVector sol = new QRDecomposition(new Array2DRowRealMatrix(a, false)).getSolver()
                .solve(new ArrayRealVector(y, false));
        return sol.toArray();
    }
}
