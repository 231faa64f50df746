package org.axistack.probe;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Random;

import org.axistack.model.Particle;
import org.axistack.trace.RaySet;
import org.axistack.trace.RaySets;
import org.axistack.trace.RayStart;

/**
 * A source-filled bundle for checking the probe model by tracing, for a source at infinity (a parallel beam into
 * the lens): ray positions fill the entrance aperture disc uniformly (a Fibonacci-spiral pattern, so the filling
 * is even without random clumps), each ray's slopes are drawn from a normal distribution (the finite source seen
 * from the lens: a Gaussian source image of rms radius f2 sigma per axis) and its energy from a normal
 * distribution of given FWHM; seeded, so runs repeat. And the spot measures of a set of crossing points.
 */
public final class SourceBundle {

    /** FWHM of a normal distribution over its standard deviation, 2 sqrt(2 ln 2). */
    public static final double FWHM_PER_SIGMA = 2 * Math.sqrt(2 * Math.log(2));

    private SourceBundle() {
    }

    /**
     * @param entranceRadius_m  radius of the filled entrance disc (the aperture), m
     * @param slopeSigma        standard deviation of each slope dx/dz, dy/dz
     * @param energyFwhm_eV     FWHM of the kinetic-energy distribution, eV
     */
    public static RaySet rays(Particle particle, double energy_eV, double z0_m, double entranceRadius_m,
            double slopeSigma, double energyFwhm_eV, int n, long seed) {
        if (n < 1 || !(entranceRadius_m > 0) || !(slopeSigma >= 0) || !(energyFwhm_eV >= 0)) {
            throw new IllegalArgumentException("a bundle needs n >= 1, a positive radius and non-negative spreads");
        }
        Random rnd = new Random(seed);
        double golden = Math.PI * (3 - Math.sqrt(5));
        double sigmaE = energyFwhm_eV / FWHM_PER_SIGMA;
        List<RayStart> rays = new ArrayList<>(n);
        for (int i = 0; i < n; i++) {
            double r = entranceRadius_m * Math.sqrt((i + 0.5) / n);
            double phi = i * golden;
            double e;
            do {
                e = energy_eV + sigmaE * rnd.nextGaussian();
            } while (!(e > 0));
            rays.add(RayStart.withSlopes(i + 1, r * Math.cos(phi), r * Math.sin(phi), z0_m, slopeSigma * rnd.nextGaussian(),
                    slopeSigma * rnd.nextGaussian(), e));
        }
        return RaySets.of(particle, rays, String.format(java.util.Locale.ROOT,
                "source-filled bundle: %d rays over a %.4g mm disc, slope sigma %.3g, energy FWHM %.3g eV", n,
                entranceRadius_m * 1e3, slopeSigma, energyFwhm_eV));
    }

    /** FW50 diameter about the centroid of the points (x, y pairs), m: twice the median distance. */
    public static double fw50_m(double[] x, double[] y) {
        double[] r = distances(x, y);
        Arrays.sort(r);
        int n = r.length;
        return n % 2 == 1 ? 2 * r[n / 2] : r[n / 2 - 1] + r[n / 2];
    }

    /** Rms radius about the centroid, m. */
    public static double rmsRadius_m(double[] x, double[] y) {
        double s = 0;
        for (double d : distances(x, y)) {
            s += d * d;
        }
        return Math.sqrt(s / x.length);
    }

    private static double[] distances(double[] x, double[] y) {
        if (x.length != y.length || x.length == 0) {
            throw new IllegalArgumentException("need the same, non-zero number of x and y values");
        }
        double cx = Arrays.stream(x).average().orElse(0);
        double cy = Arrays.stream(y).average().orElse(0);
        double[] r = new double[x.length];
        for (int i = 0; i < x.length; i++) {
            r[i] = Math.hypot(x[i] - cx, y[i] - cy);
        }
        return r;
    }
}
