package org.axistack.optics;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.function.DoubleUnaryOperator;

import org.axistack.field.SectorField;
import org.axistack.model.Sectors;
import org.axistack.model.StartRay;

/**
 * Deflection of the central ray by the split electrodes of a stack, to first order in the sector biases: the
 * unit responses of {@link CentralRayDeflection} to each split electrode's dipole function, recombined for any
 * sector biases through their harmonic-1 coefficients (so re-biasing costs a few multiplications per sector).
 * Only the dipole harmonic enters at first order; the quadrupole and higher harmonics act on rays off the axis
 * (second and higher order in the offset). Immutable.
 */
public final class SplitDeflection {

    /**
     * Offset and slope at a plane per volt of an electrode's x and y differential bias (the patterns cos(theta_s)
     * and sin(theta_s) of {@link Sectors#fromDifferentials}), m/V and rad/V.
     */
    public record PerVolt(int electrode, double xPerVx_m, double yPerVx_m, double xPerVy_m, double yPerVy_m,
            double slopeXPerVx_rad, double slopeYPerVx_rad, double slopeXPerVy_rad, double slopeYPerVy_rad) {

        /** {x, y, x', y'} per volt of the x differential bias. */
        public double[] perVx() {
            return new double[] {xPerVx_m, yPerVx_m, slopeXPerVx_rad, slopeYPerVx_rad};
        }

        /** {x, y, x', y'} per volt of the y differential bias. */
        public double[] perVy() {
            return new double[] {xPerVy_m, yPerVy_m, slopeXPerVy_rad, slopeYPerVy_rad};
        }
    }

    private final List<Integer> electrodes;
    private final Map<Integer, Sectors> layout;
    private final CentralRayDeflection response;

    private SplitDeflection(List<Integer> electrodes, Map<Integer, Sectors> layout, CentralRayDeflection response) {
        this.electrodes = electrodes;
        this.layout = layout;
        this.response = response;
    }

    /**
     * The unit responses from zStart (central ray on the axis and parallel to it) to the planes, the round lens
     * traced between zStart and the last plane and taken as ended there ({@link CentralRayDeflection#of(
     * AccelerationPotential, double, double[], List)}).
     *
     * @param field  the solved harmonics of the split electrodes (at least m = 1)
     * @param u      acceleration potential of the round field at the stack's biases
     * @param planes planes after zStart, m
     */
    public static SplitDeflection of(SectorField field, AccelerationPotential u, double zStart, double[] planes) {
        List<Integer> es = new ArrayList<>(field.split().keySet());
        return new SplitDeflection(List.copyOf(es), field.split(),
                CentralRayDeflection.of(u, zStart, planes, dipoles(field, es)));
    }

    /**
     * The unit responses in a stack's round optics: the ray starts at zStart, the split electrodes' dipoles act
     * up to the last plane (or the optics' image-side plane if that is farther).
     */
    public static SplitDeflection of(SectorField field, ParaxialOptics optics, double zStart, double[] planes) {
        List<Integer> es = new ArrayList<>(field.split().keySet());
        double end = optics.zEnd_m();
        for (double p : planes) {
            end = Math.max(end, p);
        }
        return new SplitDeflection(List.copyOf(es), field.split(), CentralRayDeflection.of(optics, zStart, end,
                planes, CentralRayDeflection.functions(dipoles(field, es)), CentralRayDeflection.DEFAULT_INTERVALS));
    }

    private static List<DoubleUnaryOperator> dipoles(SectorField field, List<Integer> es) {
        List<DoubleUnaryOperator> dip = new ArrayList<>();
        for (int e : es) {
            // tabulated (built here, before the parallel quadrature): a common-mode change reuses the table
            dip.add(field.unitFunction(e, 1));
        }
        return dip;
    }

    /** The unit responses (per unit harmonic-1 coefficient of each split electrode, in {@link #electrodes()} order). */
    public CentralRayDeflection responses() {
        return response;
    }

    /** Split electrode indices, in the order of the responses. */
    public List<Integer> electrodes() {
        return electrodes;
    }

    public double[] planes_m() {
        return response.planes_m();
    }

    /** {x, y, x', y'} of the central ray at plane p for the given sector biases (by electrode index), m and rad. */
    public double[] ray(int plane, Map<Integer, List<Double>> sectorBiases_V) {
        int k = electrodes.size();
        double[] a = new double[k];
        double[] b = new double[k];
        for (int i = 0; i < k; i++) {
            int e = electrodes.get(i);
            List<Double> v = sectorBiases_V.get(e);
            if (v != null) {
                double[] ab = layout.get(e).harmonic(1, v);
                a[i] = ab[0];
                b[i] = ab[1];
            }
        }
        return new double[] {response.offset_m(plane, a), response.offset_m(plane, b), response.slope_rad(plane, a),
            response.slope_rad(plane, b)};
    }

    /**
     * {x, y, x', y'} of the central ray at plane p for the given sector biases when it starts with the given offset
     * and slopes at the start plane (carried by the round lens), m and rad.
     */
    public double[] ray(int plane, Map<Integer, List<Double>> sectorBiases_V, StartRay start) {
        double[] r = ray(plane, sectorBiases_V);
        TransferMatrix t = response.entry(plane);
        r[0] += t.height(start.x_m(), start.slopeX_rad());
        r[1] += t.height(start.y_m(), start.slopeY_rad());
        r[2] += t.slope(start.x_m(), start.slopeX_rad());
        r[3] += t.slope(start.y_m(), start.slopeY_rad());
        return r;
    }

    /** Offset per volt of each differential bias of split electrode e at plane p. */
    public PerVolt perVolt(int plane, int electrode) {
        int i = electrodes.indexOf(electrode);
        if (i < 0) {
            throw new IllegalArgumentException("electrode " + electrode + " is not split");
        }
        Sectors s = layout.get(electrode);
        double[] hx = s.harmonic(1, boxed(s.xPattern()));
        double[] hy = s.harmonic(1, boxed(s.yPattern()));
        double xi = response.unitOffset_m(plane, i);
        double si = response.unitSlope_rad(plane, i);
        return new PerVolt(electrode, hx[0] * xi, hx[1] * xi, hy[0] * xi, hy[1] * xi, hx[0] * si, hx[1] * si,
                hy[0] * si, hy[1] * si);
    }

    private static List<Double> boxed(double[] v) {
        List<Double> l = new ArrayList<>();
        for (double x : v) {
            l.add(x);
        }
        return l;
    }
}
