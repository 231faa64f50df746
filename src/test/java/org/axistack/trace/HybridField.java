package org.axistack.trace;

import java.util.concurrent.atomic.LongAdder;
import java.util.function.DoubleUnaryOperator;

import org.axistack.field.AxialField;
import org.axistack.field.Field;

/**
 * The field a ray sees: the near-axis series ({@link NearAxisField}) where it is accurate, the
 * direct field elsewhere. At each point the series is used only if (a) r is within the series
 * reach supplied for that z (the convergence region: by default half the distance from the axis
 * point to the nearest electrode surface) and (b) the first omitted term of the series is at most
 * {@code tolerance_V}. So wherever the series is used its potential differs from the full series
 * by about the tolerance (first omitted term as the estimate; the remaining terms decrease faster
 * inside half the convergence radius). At the switch the potential may step by that much, which
 * bounds the energy bookkeeping error of a ray to a few times the tolerance. Thread-safe.
 */
public final class HybridField implements Field {

    private final Field direct;
    private final AxialField axial;
    private final DoubleUnaryOperator seriesReach_m;
    private final double tolerance_V;
    private final LongAdder seriesCount = new LongAdder();
    private final LongAdder directCount = new LongAdder();

    /**
     * @param direct        the full field, valid everywhere outside the conductors
     * @param axial         axial potential and derivatives to order 8 (the same field on the axis)
     * @param seriesReach_m largest radius (m) at which the series may be tried, as a function of z (m)
     * @param tolerance_V   largest accepted series truncation estimate, V (&gt; 0)
     */
    public HybridField(Field direct, AxialField axial, DoubleUnaryOperator seriesReach_m, double tolerance_V) {
        if (direct == null || axial == null || seriesReach_m == null) {
            throw new IllegalArgumentException("the hybrid field needs a direct field, an axial field and a reach");
        }
        if (!(tolerance_V > 0) || !Double.isFinite(tolerance_V)) {
            throw new IllegalArgumentException("series tolerance must be positive and finite, V: " + tolerance_V);
        }
        this.direct = direct;
        this.axial = axial;
        this.seriesReach_m = seriesReach_m;
        this.tolerance_V = tolerance_V;
    }

    /**
     * A hybrid field whose series reach is half the distance from the axis point (z, 0) to the
     * nearest electrode surface, tabulated on a grid over the traced region.
     */
    public static HybridField forGeometry(Field direct, AxialField axial, ElectrodeGeometry geometry,
            double tolerance_V) {
        int n = 4000;
        double z0 = geometry.regionZMin_m(), z1 = geometry.regionZMax_m();
        double h = (z1 - z0) / n;
        double[] d = new double[n + 1];
        for (int i = 0; i <= n; i++) {
            d[i] = 0.5 * geometry.distanceToSurface_m(z0 + i * h, 0);
        }
        // conservative between nodes: the distance is 1-Lipschitz in z, so subtract half a cell
        DoubleUnaryOperator reach = z -> {
            if (z <= z0 || z >= z1) {
                return 0.5 * geometry.distanceToSurface_m(z, 0);
            }
            int i = (int) ((z - z0) / h);
            i = Math.min(i, n - 1);
            return Math.max(0, Math.min(d[i], d[i + 1]) - 0.5 * h);
        };
        return new HybridField(direct, axial, reach, tolerance_V);
    }

    public double tolerance_V() {
        return tolerance_V;
    }

    @Override
    public double potential_V(double z_m, double r_m) {
        return evaluate(z_m, r_m, null);
    }

    @Override
    public double evaluate(double z_m, double r_m, double[] fieldOut) {
        if (r_m <= seriesReach_m.applyAsDouble(z_m)) {
            double[] v = new double[NearAxisField.ORDER + 1];
            axial.axial(z_m, NearAxisField.ORDER, v);
            if (NearAxisField.truncationEstimate_V(v, r_m) <= tolerance_V) {
                seriesCount.increment();
                return NearAxisField.series(v, r_m, fieldOut);
            }
        }
        directCount.increment();
        return fieldOut == null ? direct.potential_V(z_m, r_m) : direct.evaluate(z_m, r_m, fieldOut);
    }

    /** Fraction of evaluations so far that used the series (for benchmarks and reports). */
    public double seriesFraction() {
        double s = seriesCount.sum(), d = directCount.sum();
        return s + d == 0 ? 0 : s / (s + d);
    }
}
