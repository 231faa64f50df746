package org.axistack.model;

import java.util.ArrayList;
import java.util.List;

/**
 * An electrode cut along its length into {@code count} equal sectors, each at its own bias (a steerer or
 * stigmator). Sector s (0-based; the stack file numbers them from 1) is centred on the angle
 * rotation + 2 pi s / count from +x, counter-clockwise toward +y; neighbouring sectors are separated by slits of
 * width {@code slitWidth_m} (0: slits of zero width), across which the potential is taken to vary linearly along
 * the arc (the linear-gap model, as for round gaps). Immutable: the biases are a per-electrode value that a
 * bias set can hold ({@link #withBiases_V}).
 *
 * @param count        number of sectors, 2..16
 * @param rotation_rad angle of the middle of sector 1 from +x
 * @param slitWidth_m  slit width (arc length), 0 or positive
 * @param biases_V     one bias per sector, volts
 */
public record Sectors(int count, double rotation_rad, double slitWidth_m, List<Double> biases_V) {

    /** Fewest and most sectors accepted. */
    public static final int MIN_COUNT = 2;
    public static final int MAX_COUNT = 16;

    public Sectors {
        if (count < MIN_COUNT || count > MAX_COUNT) {
            throw new IllegalArgumentException("sectors must be " + MIN_COUNT + ".." + MAX_COUNT + ", got " + count);
        }
        if (!Double.isFinite(rotation_rad) || !(slitWidth_m >= 0) || !Double.isFinite(slitWidth_m)) {
            throw new IllegalArgumentException("bad split rotation or slit width");
        }
        biases_V = List.copyOf(biases_V);
        if (biases_V.size() != count) {
            throw new IllegalArgumentException("need " + count + " sector biases, got " + biases_V.size());
        }
        for (double b : biases_V) {
            if (!Double.isFinite(b)) {
                throw new IllegalArgumentException("non-finite sector bias " + b);
            }
        }
    }

    /**
     * Sectors from a common bias and x/y differential biases: sector s at angle theta_s gets
     * common + dx cos(theta_s) + dy sin(theta_s), so dx and dy are the amplitudes of the pure dipole patterns
     * (for four sectors at 0, 90, 180, 270 degrees: common +- dx on the x pair, common +- dy on the y pair).
     */
    public static Sectors fromDifferentials(int count, double rotation_rad, double slitWidth_m, double common_V,
            double dx_V, double dy_V) {
        List<Double> b = new ArrayList<>();
        for (int s = 0; s < count; s++) {
            double th = rotation_rad + 2 * Math.PI * s / count;
            b.add(common_V + dx_V * Math.cos(th) + dy_V * Math.sin(th));
        }
        return new Sectors(count, rotation_rad, slitWidth_m, b);
    }

    /** Angle of the middle of sector s (0-based) from +x, radians. */
    public double centre_rad(int s) {
        return rotation_rad + 2 * Math.PI * s / count;
    }

    /** The mean of the sector biases: the round (m = 0) part of the electrode's potential. */
    public double common_V() {
        double sum = 0;
        for (double b : biases_V) {
            sum += b;
        }
        return sum / count;
    }

    /** Unit x differential pattern: cos(theta_s) per sector (volts per volt of x differential bias). */
    public double[] xPattern() {
        double[] p = new double[count];
        for (int s = 0; s < count; s++) {
            p[s] = Math.cos(centre_rad(s));
        }
        return p;
    }

    /** Unit y differential pattern: sin(theta_s) per sector. */
    public double[] yPattern() {
        double[] p = new double[count];
        for (int s = 0; s < count; s++) {
            p[s] = Math.sin(centre_rad(s));
        }
        return p;
    }

    /** The x differential bias of these sectors: (2/N) sum V_s cos(theta_s) (N &gt;= 3; for two sectors the projection). */
    public double xDifferential_V() {
        return projection(xPattern());
    }

    /** The y differential bias: (2/N) sum V_s sin(theta_s). */
    public double yDifferential_V() {
        return projection(yPattern());
    }

    private double projection(double[] p) {
        double num = 0;
        double den = 0;
        for (int s = 0; s < count; s++) {
            num += biases_V.get(s) * p[s];
            den += p[s] * p[s];
        }
        return den == 0 ? 0 : num / den;
    }

    /** Whether harmonic m (&gt;= 1) is present in a general sector pattern: sin(m pi / N) != 0. */
    public boolean carries(int m) {
        return m % count != 0;
    }

    /**
     * Coefficients {a_m, b_m} of cos(m phi) and sin(m phi) in the wall potential with zero-width slits, volts:
     * a_m = (2/(m pi)) sin(m pi/N) sum_s V_s cos(m theta_s), b_m likewise with sin (the Fourier coefficients
     * of a piecewise-constant function). A slit of width w at radius r multiplies both by
     * sinc(m w/(2 r)) ({@link #slitFactor}).
     */
    public double[] harmonic(int m, List<Double> sectorBiases_V) {
        double f = 2 / (m * Math.PI) * Math.sin(m * Math.PI / count);
        double a = 0;
        double b = 0;
        for (int s = 0; s < count; s++) {
            double th = m * centre_rad(s);
            a += sectorBiases_V.get(s) * Math.cos(th);
            b += sectorBiases_V.get(s) * Math.sin(th);
        }
        return new double[] {f * a, f * b};
    }

    /** {@link #harmonic(int, List)} for these sectors' own biases. */
    public double[] harmonic(int m) {
        return harmonic(m, biases_V);
    }

    /**
     * Factor of harmonic m at radius r for the linear-gap slit model: the sector pattern convolved with a
     * box of angular width w/r (a linear ramp across the slit) multiplies its coefficients by
     * sin(m w/(2r)) / (m w/(2r)).
     */
    public double slitFactor(int m, double r_m) {
        if (slitWidth_m == 0 || !(r_m > 0)) {
            return 1;
        }
        double x = m * slitWidth_m / (2 * r_m);
        return Math.sin(x) / x;
    }

    public Sectors withBiases_V(List<Double> newBiases_V) {
        return new Sectors(count, rotation_rad, slitWidth_m, newBiases_V);
    }

    /** Every sector bias moved by dv (the common bias changes, the differentials stay). */
    public Sectors shifted_V(double dv) {
        List<Double> b = new ArrayList<>();
        for (double v : biases_V) {
            b.add(v + dv);
        }
        return withBiases_V(b);
    }

    public Sectors scaled(double k) {
        return new Sectors(count, rotation_rad, slitWidth_m * k, biases_V);
    }
}
