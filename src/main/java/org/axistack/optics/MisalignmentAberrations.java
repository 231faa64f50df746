package org.axistack.optics;

import java.util.Arrays;
import java.util.Locale;
import java.util.OptionalDouble;

import org.axistack.field.MisalignmentResponse;
import org.hipparchus.ode.ODEState;
import org.hipparchus.ode.ODEStateAndDerivative;
import org.hipparchus.ode.OrdinaryDifferentialEquation;
import org.hipparchus.ode.nonstiff.DormandPrince853Integrator;

/**
 * The aberrations a misalignment adds to the spot, to first order in the misalignment: axial coma. Derived in
 * misalignment.md from the exact trajectory equation (the form of {@link OffAxisAberrations}) with the dipole term
 * of the potential to third order in the transverse coordinates, x (Phi_1 - r^2 Phi_1''/8); summary: a ray of the
 * beam is the central ray c(z) (first order in the misalignment) plus xi = b s(z) + ..., s the aperture ray; the
 * third-order round terms expanded about the central ray and the dipole's own quadratic terms drive xi with terms
 * of order (misalignment) x b^2, which the round paraxial operator carries to the image. Per unit misalignment along
 * x, with the image-side aperture slope alpha = alpha_x + i alpha_y, a ray lands at
 *
 * <pre>
 *   dw = eps [ A alpha conj(alpha) + B alpha^2 ]   (x + i y, relative to the central ray)
 * </pre>
 *
 * (for a misalignment along another direction e^{i psi}: A eps alpha conj(alpha) + B conj(eps) alpha^2). A cone of
 * half-angle beta draws circles of radius |B| eps beta^2 centred at A eps beta^2: the comet of axial coma. No term
 * linear in alpha survives at first order (a dipole perturbation has no rotation-covariant term linear in both
 * eps and alpha), so axial astigmatism is of second order in the misalignment and not given here.
 *
 * <p>Method: one ODE (Hipparchus Dormand-Prince 8(5,3), tolerance halved until stable) for the aperture ray s, the
 * central ray of every source, and the two coefficient functions of every source, each obeying the round paraxial
 * equation with its source; over the optics' traced range (the range where the central-ray shifts act too),
 * beyond it a drift. The plane is the beam's Gaussian image (of the object point, or the image-side focal point of
 * a parallel beam). Immutable.
 *
 * @param imageZ_m        the Gaussian image plane the coefficients hold at, m
 * @param parallel        whether the beam enters parallel (aperture variable an entrance height) rather than from an
 *                        object point (aperture variable an object-side slope)
 * @param imageSlopeRatio image-side slope per unit aperture variable (1/m for a parallel beam)
 * @param spherical_m     image-side spherical coefficient of the same rays: dw = C alpha^2 conj(alpha), m (a check)
 * @param comaRound       A of every source (m per unit misalignment, per rad^2 of image-side aperture)
 * @param comaCircle      B of every source
 * @param apertureRayPeak largest |s| of the aperture ray over the traced range (m per unit aperture variable: per
 *                        rad of object-side slope, or per metre of entrance height), to scale a beam to the bore
 */
public record MisalignmentAberrations(double imageZ_m, boolean parallel, double imageSlopeRatio, double spherical_m,
        double[] comaRound, double[] comaCircle, double apertureRayPeak) {

    /** Dipole sources with their first two z derivatives; must be safe to call from several threads. */
    public interface DipoleSources {
        /** Number of sources. */
        int count();

        /** out[k][n] = d^n Phi_1/dz^n of source k at z, n = 0..2, V/m^(1+n) per unit strength. */
        void at(double z_m, double[][] out);
    }

    public MisalignmentAberrations {
        comaRound = comaRound.clone();
        comaCircle = comaCircle.clone();
    }

    @Override
    public double[] comaRound() {
        return comaRound.clone();
    }

    @Override
    public double[] comaCircle() {
        return comaCircle.clone();
    }

    /** Default relative tolerance of the integration. */
    public static final double TOLERANCE = 1e-10;

    /** Every response of every electrode, source index 2 k + motion (as {@link CentralRayShift}). */
    public static DipoleSources sources(MisalignmentResponse response) {
        int ne = response.electrodes();
        return new DipoleSources() {
            @Override
            public int count() {
                return 2 * ne;
            }

            @Override
            public void at(double z_m, double[][] out) {
                double[][][] d = new double[ne][2][3];
                response.dipoleDerivatives(z_m, d);
                for (int k = 0; k < ne; k++) {
                    out[2 * k] = d[k][0];
                    out[2 * k + 1] = d[k][1];
                }
            }
        };
    }

    /** Intervals of the table of the boundary-element dipoles over the traced range. */
    public static final int TABLE_INTERVALS = 400;

    /**
     * The coma of every electrode's decentre and tilt for the beam's object (empty: a parallel beam), the dipoles
     * tabulated once ({@link #table}, {@link #TABLE_INTERVALS} intervals) so that the integration's many field
     * values cost no element sums.
     */
    public static MisalignmentAberrations of(MisalignmentResponse response, ParaxialOptics optics,
            OptionalDouble objectZ_m) {
        return of(optics, objectZ_m, table(sources(response), optics.zStart_m(), optics.zEnd_m(), TABLE_INTERVALS),
                TOLERANCE);
    }

    /**
     * The sources tabulated at equal intervals over [z0, z1] (values and first two derivatives at the nodes, in
     * parallel) and read back by quintic Hermite interpolation on each interval (exact for quintics; error of order
     * h^6 in the value, h^4 in the second derivative), clamped to the range.
     */
    public static DipoleSources table(DipoleSources sources, double z0_m, double z1_m, int intervals) {
        int n = sources.count();
        double h = (z1_m - z0_m) / intervals;
        double[][][] node = new double[intervals + 1][][];
        java.util.stream.IntStream.rangeClosed(0, intervals).parallel().forEach(i -> {
            double[][] v = new double[n][3];
            sources.at(z0_m + i * h, v);
            node[i] = v;
        });
        return new DipoleSources() {
            @Override
            public int count() {
                return n;
            }

            @Override
            public void at(double z_m, double[][] out) {
                double u = (z_m - z0_m) / h;
                int i = (int) Math.floor(u);
                i = Math.max(0, Math.min(intervals - 1, i));
                double t = Math.max(0, Math.min(1, u - i));
                double t2 = t * t;
                double t3 = t2 * t;
                double t4 = t3 * t;
                double t5 = t4 * t;
                // quintic Hermite basis on [0, 1] and its first two derivatives
                double[][] b = {
                    {1 - 10 * t3 + 15 * t4 - 6 * t5, -30 * t2 + 60 * t3 - 30 * t4, -60 * t + 180 * t2 - 120 * t3},
                    {t - 6 * t3 + 8 * t4 - 3 * t5, 1 - 18 * t2 + 32 * t3 - 15 * t4, -36 * t + 96 * t2 - 60 * t3},
                    {0.5 * (t2 - 3 * t3 + 3 * t4 - t5), 0.5 * (2 * t - 9 * t2 + 12 * t3 - 5 * t4),
                        0.5 * (2 - 18 * t + 36 * t2 - 20 * t3)},
                    {10 * t3 - 15 * t4 + 6 * t5, 30 * t2 - 60 * t3 + 30 * t4, 60 * t - 180 * t2 + 120 * t3},
                    {-4 * t3 + 7 * t4 - 3 * t5, -12 * t2 + 28 * t3 - 15 * t4, -24 * t + 84 * t2 - 60 * t3},
                    {0.5 * (t3 - 2 * t4 + t5), 0.5 * (3 * t2 - 8 * t3 + 5 * t4), 0.5 * (6 * t - 24 * t2 + 20 * t3)}};
                double[] scale = {1, 1 / h, 1 / (h * h)};
                double[][] lo = node[i];
                double[][] hi = node[i + 1];
                for (int k = 0; k < n; k++) {
                    for (int d = 0; d < 3; d++) {
                        out[k][d] = scale[d] * (b[0][d] * lo[k][0] + h * b[1][d] * lo[k][1] + h * h * b[2][d] * lo[k][2]
                                + b[3][d] * hi[k][0] + h * b[4][d] * hi[k][1] + h * h * b[5][d] * hi[k][2]);
                    }
                }
            }
        };
    }

    /**
     * The coma of every source.
     *
     * @param objectZ_m the beam's object point (empty: parallel beam entering at the optics' start plane)
     * @param relTol    relative tolerance of the integration
     * @throws IllegalArgumentException if the beam has no real image after the start plane
     */
    public static MisalignmentAberrations of(ParaxialOptics optics, OptionalDouble objectZ_m, DipoleSources sources,
            double relTol) {
        boolean parallel = objectZ_m.isEmpty();
        double start = optics.zStart_m();
        double image;
        if (parallel) {
            image = optics.cardinal().focalPointImageZ_m();
        } else {
            if (objectZ_m.getAsDouble() >= start) {
                throw new IllegalArgumentException(String.format(Locale.ROOT, "the object at z = %.4f mm lies after the"
                        + " start plane z = %.4f mm: the central ray is taken to enter there", objectZ_m.getAsDouble() * 1e3,
                        start * 1e3));
            }
            image = optics.imaging(objectZ_m.getAsDouble()).imageZ_m();
        }
        if (!Double.isFinite(image) || !(image > start)) {
            throw new IllegalArgumentException("the beam has no real image after the start plane: axial coma of a"
                    + " misalignment is quoted at the beam's image");
        }
        int n = sources.count();
        // state: s, s', then per source c, c', A, A', B, B', then S, S'
        int dim = 2 + 6 * n + 2;
        double[] y0 = new double[dim];
        if (parallel) {
            y0[0] = 1;
        } else {
            y0[0] = start - objectZ_m.getAsDouble();
            y0[1] = 1;
        }
        double end = Math.min(image, optics.zEnd_m());
        Equations eq = new Equations(optics.potential(), sources, dim);
        double[] peak = new double[1];
        double[] state = integrate(eq, start, end, y0, relTol, peak);
        // beyond the traced range: a drift to the image
        double gap = image - end;
        double[] at = new double[dim];
        for (int i = 0; i < dim; i += 2) {
            at[i] = state[i] + gap * state[i + 1];
            at[i + 1] = state[i + 1];
        }
        double slope = at[1];
        double[] a = new double[n];
        double[] b = new double[n];
        for (int k = 0; k < n; k++) {
            a[k] = at[2 + 6 * k + 2] / (slope * slope);
            b[k] = at[2 + 6 * k + 4] / (slope * slope);
        }
        double c = at[dim - 2] / (slope * slope * slope);
        return new MisalignmentAberrations(image, parallel, slope, c, a, b, peak[0]);
    }

    /** Two passes: a first one sets the absolute tolerances from the sizes the components reach. */
    private static double[] integrate(Equations eq, double start, double end, double[] y0, double relTol,
            double[] peak) {
        int dim = y0.length;
        double span = end - start;
        double[] abs = new double[dim];
        Arrays.fill(abs, 1e-30);
        double[] size = new double[dim];
        double[] out = null;
        for (int pass = 0; pass < 2; pass++) {
            double[] rel = new double[dim];
            Arrays.fill(rel, pass == 0 ? Math.max(relTol, 1e-8) : relTol);
            if (pass == 0) {
                for (int i = 0; i < dim; i++) {
                    abs[i] = 1e-20;
                }
            } else {
                for (int i = 0; i < dim; i++) {
                    // a component and its slope share a scale: the larger of |y| and |y'| span
                    int base = i - (i % 2);
                    double scale = Math.max(size[base], size[base + 1] * span);
                    abs[i] = relTol * (i % 2 == 0 ? scale : scale / span) + Double.MIN_NORMAL;
                }
            }
            DormandPrince853Integrator integ = new DormandPrince853Integrator(span * 1e-12, span / 20, abs, rel);
            integ.addStepHandler(interp -> {
                double[] s = interp.getCurrentState().getPrimaryState();
                for (int i = 0; i < dim; i++) {
                    size[i] = Math.max(size[i], Math.abs(s[i]));
                }
            });
            ODEStateAndDerivative fin = integ.integrate(eq, new ODEState(start, y0.clone()), end);
            out = fin.getPrimaryState();
        }
        peak[0] = Math.max(size[0], Math.abs(y0[0]));
        return out;
    }

    /** The round paraxial operator on every component, with the sources derived in misalignment.md. */
    private static final class Equations implements OrdinaryDifferentialEquation {
        private final AccelerationPotential p;
        private final DipoleSources sources;
        private final int dim;
        private final double inverseRest;
        private final double sign;

        Equations(AccelerationPotential p, DipoleSources sources, int dim) {
            this.p = p;
            this.sources = sources;
            this.dim = dim;
            this.inverseRest = 1 / p.restPotential_V();
            this.sign = p.chargeSign();
        }

        @Override
        public int getDimension() {
            return dim;
        }

        @Override
        public double[] computeDerivatives(double z, double[] y) {
            double[] d = new double[5];
            p.derivatives(z, 4, d);
            ThirdOrderTerms f = ThirdOrderTerms.of(d, inverseRest, z);
            double g = f.g();
            double gp = f.gp();
            double uStar = f.uStar();
            double aa = f.aa();
            double uStarP = f.uStarP();
            double pp = uStarP / (2 * uStar);
            double qq = -aa / uStar;
            double s = y[0];
            double sp = y[1];
            double[] dy = new double[dim];
            dy[0] = sp;
            dy[1] = -pp * sp - qq * s;
            int n = sources.count();
            double[][] phi = new double[n][3];
            sources.at(z, phi);
            double[] mono = new double[6];
            double half = 1 / (2 * uStar);
            double lin = s * (2 * aa * s - uStarP * sp) / (2 * uStar);
            for (int k = 0; k < n; k++) {
                int i = 2 + 6 * k;
                double c = y[i];
                double cp = y[i + 1];
                double d1 = -sign * g * phi[k][0];
                double d1p = -sign * (gp * phi[k][0] + g * phi[k][1]);
                double d3 = sign * (g * phi[k][2] / 8 + d[2] * phi[k][0] * inverseRest / 4);
                dy[i] = cp;
                dy[i + 1] = -pp * cp - qq * c + d1 * half;
                Arrays.fill(mono, 0);
                f.addMonomials(c, cp, s, sp, mono);
                double x2 = d3 * s * s - d1p * s * sp / 2 - d1 * lin;
                double x0 = 2 * d3 * s * s - d1p * s * sp / 2 - d1 * aa * s * s / uStar + d1 * sp * sp - d1 * lin;
                dy[i + 2] = y[i + 3];
                dy[i + 3] = -pp * y[i + 3] - qq * y[i + 2] + mono[4] + x0 * half;
                dy[i + 4] = y[i + 5];
                dy[i + 5] = -pp * y[i + 5] - qq * y[i + 4] + mono[3] + x2 * half;
            }
            Arrays.fill(mono, 0);
            f.addMonomials(0, 0, s, sp, mono);
            dy[dim - 2] = y[dim - 1];
            dy[dim - 1] = -pp * y[dim - 1] - qq * y[dim - 2] + mono[5];
            return dy;
        }
    }

    /** Number of sources. */
    public int count() {
        return comaRound.length;
    }

    /**
     * Length of the coma figure (the largest extent of the spot's growth, along the misalignment) of a cone of
     * image-side half-angle beta per unit misalignment of source k, m: beta^2 (max(0, A + |B|) - min(0, A - |B|)).
     * For the round lens's 2:1 ratio this is the classical tangential coma 3 |B| beta^2.
     */
    public double comaLength(int source, double beta_rad) {
        double a = comaRound[source];
        double b = Math.abs(comaCircle[source]);
        return beta_rad * beta_rad * (Math.max(0, a + b) - Math.min(0, a - b));
    }
}
