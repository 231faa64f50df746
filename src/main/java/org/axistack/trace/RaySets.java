package org.axistack.trace;

import org.axistack.model.PhysicsMessage;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;

import org.axistack.model.Particle;

/**
 * Ways to fill a beam with rays: fans from a point, parallel bundles (uniform disk or Gaussian),
 * rings. All rays travel towards +z; positions in metres, angles in radians, energies in eV (kinetic
 * energy where the potential is 0 V). Random sets take a seed so that runs repeat.
 */
public final class RaySets {

    private RaySets() {
    }

    private static void requireCount(int n, String what) {
        if (n < 1) {
            throw PhysicsMessage.RAY_COUNT.exception("what", what, "count", n);
        }
    }

    /** v in SI units (m, rad); the message gives it in mm or mrad. */
    private static void requireNonNegative(double v, String what, String unit) {
        if (!(v >= 0) || !Double.isFinite(v)) {
            throw PhysicsMessage.RAY_SET_NEGATIVE.exception("what", what, "value", v * 1e3, "unit", unit);
        }
    }

    /**
     * A fan from a point source at (x0, 0, z0): with azimuths = 1, a meridional fan of n rays with
     * slopes spread evenly over [-tan(maxAngle), +tan(maxAngle)] in the x-z plane; with azimuths &gt; 1,
     * the axial ray plus n cones at angles maxAngle * k / n (k = 1..n), each with that many rays
     * around the source's axis.
     */
    public static RaySet pointFan(Particle particle, double energy_eV, double z0_m, double x0_m, double maxAngle_rad,
            int n, int azimuths) {
        requireCount(n, "point fan");
        requireCount(azimuths, "point fan azimuths");
        requireNonNegative(maxAngle_rad, "fan half-angle", "mrad");
        if (!(maxAngle_rad < Math.PI / 2)) {
            throw PhysicsMessage.FAN_ANGLE.exception("angle", maxAngle_rad * 1e3);
        }
        List<RayStart> rays = new ArrayList<>();
        if (azimuths == 1) {
            for (int i = 0; i < n; i++) {
                double a = n == 1 ? 0 : -maxAngle_rad + 2 * maxAngle_rad * i / (n - 1);
                rays.add(new RayStart(i + 1, x0_m, 0, z0_m, Math.sin(a), 0, Math.cos(a), energy_eV));
            }
        } else {
            rays.add(new RayStart(1, x0_m, 0, z0_m, 0, 0, 1, energy_eV));
            for (int k = 1; k <= n; k++) {
                double a = maxAngle_rad * k / n;
                for (int j = 0; j < azimuths; j++) {
                    double ph = 2 * Math.PI * j / azimuths;
                    rays.add(new RayStart(rays.size() + 1, x0_m, 0, z0_m, Math.sin(a) * Math.cos(ph),
                            Math.sin(a) * Math.sin(ph), Math.cos(a), energy_eV));
                }
            }
        }
        return new RaySet(particle, rays, String.format(java.util.Locale.ROOT,
                "point fan from z = %s mm, x = %s mm, half-angle %s mrad", Fmt.num(z0_m * 1e3), Fmt.num(x0_m * 1e3),
                Fmt.num(maxAngle_rad * 1e3)));
    }

    /** n rays parallel to the axis, uniformly distributed over a disk of the given radius (seeded). */
    public static RaySet uniformDisk(Particle particle, double energy_eV, double z0_m, double radius_m, int n,
            long seed) {
        requireCount(n, "uniform disk");
        requireNonNegative(radius_m, "disk radius", "mm");
        Random rnd = new Random(seed);
        List<RayStart> rays = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            double r = radius_m * Math.sqrt(rnd.nextDouble());
            double ph = 2 * Math.PI * rnd.nextDouble();
            rays.add(new RayStart(i + 1, r * Math.cos(ph), r * Math.sin(ph), z0_m, 0, 0, 1, energy_eV));
        }
        return new RaySet(particle, rays, "parallel uniform disk, radius " + Fmt.num(radius_m * 1e3) + " mm");
    }

    /**
     * n rays parallel to the axis with x and y drawn from a normal distribution of standard deviation
     * sigma (seeded), cut off at radius cutoff (draws beyond it are redrawn).
     */
    public static RaySet gaussianBeam(Particle particle, double energy_eV, double z0_m, double sigma_m,
            double cutoff_m, int n, long seed) {
        requireCount(n, "Gaussian beam");
        requireNonNegative(sigma_m, "beam sigma", "mm");
        requireNonNegative(cutoff_m, "beam cutoff radius", "mm");
        if (sigma_m > 0 && cutoff_m < 0.1 * sigma_m) {
            throw PhysicsMessage.GAUSSIAN_CUTOFF.exception("cutoff", cutoff_m * 1e3, "sigma", sigma_m * 1e3);
        }
        Random rnd = new Random(seed);
        List<RayStart> rays = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            double x, y;
            do {
                x = sigma_m * rnd.nextGaussian();
                y = sigma_m * rnd.nextGaussian();
            } while (Math.hypot(x, y) > cutoff_m);
            rays.add(new RayStart(i + 1, x, y, z0_m, 0, 0, 1, energy_eV));
        }
        return new RaySet(particle, rays, "parallel Gaussian beam, sigma " + Fmt.num(sigma_m * 1e3) + " mm, cut at "
                + Fmt.num(cutoff_m * 1e3) + " mm");
    }

    /**
     * n rays on a circle of the given radius, evenly spaced in azimuth, each with radial slope
     * (negative converges towards the axis).
     */
    public static RaySet ring(Particle particle, double energy_eV, double z0_m, double radius_m, double radialSlope,
            int n) {
        requireCount(n, "ring");
        requireNonNegative(radius_m, "ring radius", "mm");
        List<RayStart> rays = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            double ph = 2 * Math.PI * i / n;
            double c = Math.cos(ph), s = Math.sin(ph);
            rays.add(RayStart.withSlopes(i + 1, radius_m * c, radius_m * s, z0_m, radialSlope * c, radialSlope * s,
                    energy_eV));
        }
        return new RaySet(particle, rays, "ring, radius " + Fmt.num(radius_m * 1e3) + " mm, radial slope "
                + Fmt.num(radialSlope * 1e3) + " mrad");
    }

    /** Any rays of one particle, renumbered 1..N in the given order. */
    public static RaySet of(Particle particle, List<RayStart> rays, String description) {
        List<RayStart> out = new ArrayList<>();
        for (RayStart r : rays) {
            out.add(r.withId(out.size() + 1));
        }
        return new RaySet(particle, out, description);
    }
}
