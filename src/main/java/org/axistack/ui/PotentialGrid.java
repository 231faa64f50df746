package org.axistack.ui;

import java.util.concurrent.CancellationException;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.stream.IntStream;

import org.axistack.field.BiasedField;
import org.axistack.field.FieldSolution;

/**
 * The potential on a regular (z, r) grid over the lens, stored once per electrode at 1 V on that electrode
 * and 0 V on the others. By linearity of Laplace's equation the grid for any biases is the bias-weighted sum
 * ({@link #combine}), so moving a bias costs one pass over the grid and never evaluates the field again.
 * Immutable after construction.
 */
public final class PotentialGrid {

    /** Progress of the grid computation: fraction 0..1; return false to cancel. */
    @FunctionalInterface
    public interface Progress {
        boolean update(double fraction);

        Progress NONE = f -> true;
    }

    /**
     * Which electrode a node belongs to (inside its solid, or so close to its surface that the surface sums
     * are not trusted there): its index, or -1 elsewhere.
     */
    @FunctionalInterface
    public interface Inside {
        int electrodeAt(double z_m, double r_m);

        Inside NOWHERE = (z, r) -> -1;
    }

    private final double z0_m;
    private final double z1_m;
    private final double r1_m;
    private final int nz;
    private final int nr;
    /** [electrode][iz * nr + ir], volts per volt. */
    private final double[][] unit;

    private PotentialGrid(double z0_m, double z1_m, double r1_m, int nz, int nr, double[][] unit) {
        this.z0_m = z0_m;
        this.z1_m = z1_m;
        this.r1_m = r1_m;
        this.nz = nz;
        this.nr = nr;
        this.unit = unit;
    }

    /**
     * Evaluates the unit-bias potentials (boundary-element sums of {@link BiasedField#potential_V}) on nz x nr
     * nodes spanning [z0, z1] x [0, r1], in parallel over z columns. Nodes inside an electrode's solid or within
     * half a grid step of its surface take that electrode's potential exactly (1 V on its own unit grid, 0 V on
     * the others) instead of the surface sums, which lose accuracy right at the surface.
     *
     * @throws CancellationException when progress returns false
     */
    public static PotentialGrid compute(FieldSolution solution, double z0_m, double z1_m, double r1_m, int nz, int nr,
            Inside inside, Progress progress) {
        if (!(z1_m > z0_m) || !(r1_m > 0) || nz < 2 || nr < 2) {
            throw new IllegalArgumentException("grid needs z1 > z0, r1 > 0 and at least 2 x 2 nodes");
        }
        int ne = solution.electrodes().size();
        BiasedField[] fields = new BiasedField[ne];
        for (int e = 0; e < ne; e++) {
            double[] b = new double[ne];
            b[e] = 1;
            fields[e] = solution.withBiases(b);
        }
        double[][] unit = new double[ne][nz * nr];
        AtomicInteger done = new AtomicInteger();
        AtomicBoolean cancelled = new AtomicBoolean();
        double dz = (z1_m - z0_m) / (nz - 1);
        double dr = r1_m / (nr - 1);
        IntStream.range(0, nz).parallel().forEach(iz -> {
            if (cancelled.get()) {
                return;
            }
            double z = z0_m + iz * dz;
            for (int ir = 0; ir < nr; ir++) {
                double r = ir * dr;
                int in = inside.electrodeAt(z, r);
                for (int e = 0; e < ne; e++) {
                    unit[e][iz * nr + ir] = in >= 0 ? (e == in ? 1 : 0) : fields[e].potential_V(z, r);
                }
            }
            if (!progress.update((double) done.incrementAndGet() / nz)) {
                cancelled.set(true);
            }
        });
        if (cancelled.get()) {
            throw new CancellationException("potential map cancelled");
        }
        return new PotentialGrid(z0_m, z1_m, r1_m, nz, nr, unit);
    }

    /** An empty grid with these nodes (no unit potentials): for drawing values computed elsewhere. */
    static PotentialGrid geometry(double z0_m, double z1_m, double r1_m, int nz, int nr) {
        return new PotentialGrid(z0_m, z1_m, r1_m, nz, nr, new double[0][]);
    }

    /** The potential at every node for these biases (volts, electrode order): [iz][ir]. */
    public double[][] combine(double[] biases_V) {
        if (biases_V.length != unit.length) {
            throw new IllegalArgumentException("need " + unit.length + " biases, got " + biases_V.length);
        }
        double[][] v = new double[nz][nr];
        for (int e = 0; e < unit.length; e++) {
            double b = biases_V[e];
            if (b == 0) {
                continue;
            }
            double[] u = unit[e];
            for (int iz = 0; iz < nz; iz++) {
                double[] row = v[iz];
                int base = iz * nr;
                for (int ir = 0; ir < nr; ir++) {
                    row[ir] += b * u[base + ir];
                }
            }
        }
        return v;
    }

    public int nz() {
        return nz;
    }

    public int nr() {
        return nr;
    }

    /** z of column iz, m. */
    public double z_m(int iz) {
        return z0_m + iz * (z1_m - z0_m) / (nz - 1);
    }

    /** r of row ir, m. */
    public double r_m(int ir) {
        return ir * r1_m / (nr - 1);
    }
}
