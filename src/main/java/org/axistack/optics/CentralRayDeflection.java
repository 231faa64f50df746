package org.axistack.optics;

import java.util.Arrays;
import java.util.List;
import java.util.TreeSet;
import java.util.function.DoubleUnaryOperator;
import java.util.stream.IntStream;

import org.hipparchus.analysis.integration.gauss.GaussIntegrator;
import org.hipparchus.analysis.integration.gauss.GaussIntegratorFactory;

/**
 * The central ray under dipole forces: the one home of the dipole-driven paraxial ray equation, used by the
 * deflection of split electrodes ({@link SplitDeflection}) and by the misalignment responses
 * ({@link CentralRayShift}). Near the axis a dipole source adds x Phi_1(z) to the potential, so on the axis
 * the transverse derivative of the acceleration potential is dU/dx = -sign(q) Phi_1, and the relativistic
 * paraxial ray equation with that transverse force (momentum p^2 = 2 m |q| U*, p v = 2 |q| U* / g; P. W.
 * Hawkes and E. Kasper, Principles of Electron Optics, vol. 1, ch. 15, cited from memory and derived in
 * src/site/markdown/harmonic-field.md and misalignment.md) reads
 *
 * <pre>
 *   x'' + (g U' / (2 U*)) x' + (g U''/(4 U*)) x = F(z) = -sign(q) g Phi_1(z) / (2 U*),   g = 1 + U/Vr,
 * </pre>
 *
 * the same for y with the sin dipole. It is the round lens's equation with a source, so (variation of
 * constants) the ray that starts at z0 with height x0 and slope x0' is
 *
 * <pre>
 *   (x, x')(z) = M(z) (x0, x0') + M(z) Int_{z0}^{z} M(z')^-1 (0, F(z')) dz',   M(z) = T(z0 -&gt; z),
 * </pre>
 *
 * T the round lens's transfer matrix ({@link ParaxialOptics#transfer}, one integration shared with the
 * cardinal elements). The integral is cumulative, so every plane costs one matrix product: composite 8-point
 * Gauss-Legendre over [z0, sourceEnd], the requested planes inside taken as break points, Phi_1 of every
 * source tabulated once at the nodes (in parallel). Beyond sourceEnd the sources are taken as absent and the
 * ray follows the round lens (a drift where the optics take the field as ended). It is linear in the sources:
 * each source k (unit strength) gives a unit response xi_k, and any combination only recombines. Immutable
 * and thread-safe.
 */
public final class CentralRayDeflection {

    /** Dipole sources: Phi_1 of each unit source at z, V/m; must be safe to call from several threads. */
    public interface Sources {
        /** Number of sources. */
        int count();

        /** Fills out[k] with Phi_1(z) of source k, V/m per unit strength. */
        void at(double z_m, double[] out);
    }

    /** Gauss points per interval. */
    static final int POINTS = 8;

    /** Default number of quadrature intervals over the source range. */
    public static final int DEFAULT_INTERVALS = 96;

    private final ParaxialOptics optics;
    private final double zStart;
    private final double sourceEnd;
    private final double[] planes;
    /** offset[p][k], slope[p][k]: xi_k and xi_k' at plane p, m and rad per unit source. */
    private final double[][] offset;
    private final double[][] slope;
    /** The source integrals up to sourceEnd: M(z')^-1 (0, F) summed, [0 or 1][k]. */
    private final double[][] total;

    private CentralRayDeflection(ParaxialOptics optics, double zStart, double sourceEnd, double[] planes,
            double[][] offset, double[][] slope, double[][] total) {
        this.optics = optics;
        this.zStart = zStart;
        this.sourceEnd = sourceEnd;
        this.planes = planes;
        this.offset = offset;
        this.slope = slope;
        this.total = total;
    }

    /**
     * Unit responses at the planes.
     *
     * @param optics    the round lens (its acceleration potential and transfer matrices)
     * @param zStart_m  where the ray starts (the sources act from here on), m
     * @param sourceEnd_m where the sources are taken to end, m (&gt; zStart)
     * @param planes_m  planes where the ray is wanted (any order; planes before zStart get zero responses)
     * @param sources   the unit dipole sources
     * @param intervals number of quadrature intervals over [zStart, sourceEnd] (shared out over the pieces
     *                  between planes, at least one each)
     */
    public static CentralRayDeflection of(ParaxialOptics optics, double zStart_m, double sourceEnd_m,
            double[] planes_m, Sources sources, int intervals) {
        if (intervals < 1) {
            throw new IllegalArgumentException("need at least one quadrature interval, got " + intervals);
        }
        if (!(sourceEnd_m > zStart_m) || !Double.isFinite(zStart_m) || !Double.isFinite(sourceEnd_m)) {
            throw new IllegalArgumentException("source range must satisfy start < end: " + zStart_m + ", "
                    + sourceEnd_m);
        }
        double[] pl = planes_m.clone();
        for (double p : pl) {
            if (!Double.isFinite(p)) {
                throw new IllegalArgumentException("planes must be finite: " + p);
            }
        }
        TreeSet<Double> cuts = new TreeSet<>();
        cuts.add(zStart_m);
        cuts.add(sourceEnd_m);
        for (double p : pl) {
            if (p > zStart_m && p < sourceEnd_m) {
                cuts.add(p);
            }
        }
        double[] bp = cuts.stream().mapToDouble(Double::doubleValue).toArray();
        GaussIntegrator g = new GaussIntegratorFactory().legendre(POINTS, 0, 1);
        double span = sourceEnd_m - zStart_m;
        int[] per = new int[bp.length - 1];
        int n = 0;
        for (int s = 0; s < per.length; s++) {
            per[s] = Math.max(1, (int) Math.round(intervals * (bp[s + 1] - bp[s]) / span));
            n += per[s] * POINTS;
        }
        double[] z = new double[n];
        double[] w = new double[n];
        int[] pieceEnd = new int[per.length];
        int j = 0;
        for (int s = 0; s < per.length; s++) {
            double h = (bp[s + 1] - bp[s]) / per[s];
            for (int i = 0; i < per[s]; i++) {
                for (int q = 0; q < POINTS; q++) {
                    z[j] = bp[s] + h * (i + g.getPoint(q));
                    w[j] = h * g.getWeight(q);
                    j++;
                }
            }
            pieceEnd[s] = j;
        }
        int k = sources.count();
        AccelerationPotential u = optics.potential();
        double sign = u.chargeSign();
        // per node: F w times the second column of M(z')^-1, i.e. (-b, a)/det
        double[][] colH = new double[n][k];
        double[][] colS = new double[n][k];
        IntStream.range(0, n).parallel().forEach(i -> {
            double[] phi = new double[k];
            sources.at(z[i], phi);
            double uu = u.u_V(z[i]);
            if (!(uu > 0)) {
                throw new ReflectionException(new Reflection(z[i], zStart_m));
            }
            TransferMatrix m = optics.transfer(zStart_m, z[i]);
            double det = m.determinant();
            double f = -sign * u.g(uu) / (2 * u.uStar(uu)) * w[i];
            for (int c = 0; c < k; c++) {
                colH[i][c] = -m.b() / det * f * phi[c];
                colS[i][c] = m.a() / det * f * phi[c];
            }
        });
        // cumulative integrals at each break point
        double[][] cumH = new double[bp.length][k];
        double[][] cumS = new double[bp.length][k];
        double[] accH = new double[k];
        double[] accS = new double[k];
        int from = 0;
        for (int s = 0; s < per.length; s++) {
            for (int i = from; i < pieceEnd[s]; i++) {
                for (int c = 0; c < k; c++) {
                    accH[c] += colH[i][c];
                    accS[c] += colS[i][c];
                }
            }
            from = pieceEnd[s];
            cumH[s + 1] = accH.clone();
            cumS[s + 1] = accS.clone();
        }
        double[][] off = new double[pl.length][k];
        double[][] sl = new double[pl.length][k];
        for (int p = 0; p < pl.length; p++) {
            if (!(pl[p] > zStart_m)) {
                continue;
            }
            int b = pl[p] >= sourceEnd_m ? bp.length - 1 : Arrays.binarySearch(bp, pl[p]);
            TransferMatrix m = optics.transfer(zStart_m, pl[p]);
            for (int c = 0; c < k; c++) {
                off[p][c] = m.a() * cumH[b][c] + m.b() * cumS[b][c];
                sl[p][c] = m.c() * cumH[b][c] + m.d() * cumS[b][c];
            }
        }
        return new CentralRayDeflection(optics, zStart_m, sourceEnd_m, pl, off, sl,
                new double[][] {accH.clone(), accS.clone()});
    }

    /**
     * Unit responses from zStart (the optics' round lens traced between zStart and the last plane, taken as
     * ended there, default settings), the sources acting up to the last plane.
     *
     * @param u       acceleration potential of the round field
     * @param zStart  start plane (the ray is on the axis and parallel to it there), m
     * @param planes  planes after zStart where the response is wanted, m
     * @param dipoles unit dipole functions d_k(z), V/m per unit coefficient
     * @throws ReflectionException if the beam is reflected before the last plane
     */
    public static CentralRayDeflection of(AccelerationPotential u, double zStart, double[] planes,
            List<DoubleUnaryOperator> dipoles) {
        double end = Arrays.stream(planes).max().orElse(zStart);
        if (!(end > zStart)) {
            throw new IllegalArgumentException("need a plane after the start plane " + zStart);
        }
        ParaxialOptics optics = ParaxialOptics.of(u, zStart, end, ParaxialSettings.defaults());
        return of(optics, zStart, end, planes, functions(dipoles), DEFAULT_INTERVALS);
    }

    /** Sources from separate functions of z. */
    public static Sources functions(List<DoubleUnaryOperator> dipoles) {
        List<DoubleUnaryOperator> d = List.copyOf(dipoles);
        return new Sources() {
            @Override
            public int count() {
                return d.size();
            }

            @Override
            public void at(double z_m, double[] out) {
                for (int i = 0; i < d.size(); i++) {
                    out[i] = d.get(i).applyAsDouble(z_m);
                }
            }
        };
    }

    /** The round lens. */
    public ParaxialOptics optics() {
        return optics;
    }

    public double zStart_m() {
        return zStart;
    }

    /** Where the sources are taken to end, m. */
    public double sourceEnd_m() {
        return sourceEnd;
    }

    public double[] planes_m() {
        return planes.clone();
    }

    /** Number of sources. */
    public int sources() {
        return total[0].length;
    }

    /** Offset at plane p per unit coefficient of source k, m. */
    public double unitOffset_m(int plane, int source) {
        return offset[plane][source];
    }

    /** Slope at plane p per unit coefficient of source k, rad. */
    public double unitSlope_rad(int plane, int source) {
        return slope[plane][source];
    }

    /**
     * Height and slope at any plane z at or beyond the end of the sources per unit source k (the sources'
     * whole effect carried on by the round lens), {m, rad}.
     */
    public double[] beyondSources(int source, double z_m) {
        if (z_m < sourceEnd) {
            throw new IllegalArgumentException("plane " + z_m + " lies before the end of the sources " + sourceEnd);
        }
        TransferMatrix m = optics.transfer(zStart, z_m);
        return new double[] {m.a() * total[0][source] + m.b() * total[1][source],
            m.c() * total[0][source] + m.d() * total[1][source]};
    }

    /** The round lens's map of a start ray (height and slope at zStart) to plane p. */
    public TransferMatrix entry(int plane) {
        return optics.transfer(zStart, planes[plane]);
    }

    /** Offset at plane p for coefficients c_k (x: the cos coefficients a_1, y: the sin coefficients b_1), m. */
    public double offset_m(int plane, double[] coefficients) {
        double s = 0;
        for (int i = 0; i < coefficients.length; i++) {
            s += coefficients[i] * offset[plane][i];
        }
        return s;
    }

    /** Slope at plane p for coefficients c_k, rad. */
    public double slope_rad(int plane, double[] coefficients) {
        double s = 0;
        for (int i = 0; i < coefficients.length; i++) {
            s += coefficients[i] * slope[plane][i];
        }
        return s;
    }
}
