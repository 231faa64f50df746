package org.axistack.beam;

import java.util.Comparator;
import java.util.List;
import java.util.Optional;

import org.hipparchus.ode.DenseOutputModel;

/**
 * The computed envelope of one {@link EnvelopeProblem}: a sampled table, the waists, why the
 * integration stopped, and dense output for the envelope at any plane in between. Immutable once
 * built (the dense-output lookup is synchronised).
 */
public final class EnvelopeCurve {

    private final EnvelopeProblem problem;
    private final EnvelopeChannel channel;
    private final List<EnvelopePoint> points;
    private final List<Waist> waists;
    private final Termination termination;
    private final DenseOutputModel dense;
    private final double betaGammaSquaredFloor;

    EnvelopeCurve(EnvelopeProblem problem, EnvelopeChannel channel, List<EnvelopePoint> points, List<Waist> waists,
            Termination termination, DenseOutputModel dense, double betaGammaSquaredFloor) {
        this.problem = problem;
        this.channel = channel;
        this.points = List.copyOf(points);
        this.waists = List.copyOf(waists);
        this.termination = termination;
        this.dense = dense;
        this.betaGammaSquaredFloor = betaGammaSquaredFloor;
    }

    public EnvelopeProblem problem() {
        return problem;
    }

    /** Table along z, ascending, including every waist. */
    public List<EnvelopePoint> points() {
        return points;
    }

    /** Interior local minima of the envelope, in z order (the start plane is never one). */
    public List<Waist> waists() {
        return waists;
    }

    public Termination termination() {
        return termination;
    }

    /** Last plane the envelope reached, m. */
    public double zStop_m() {
        return termination.z_m();
    }

    /** True when z lies in the computed range. */
    public boolean covers(double z_m) {
        return z_m >= problem.zStart_m() && z_m <= zStop_m();
    }

    /** The smallest interior waist, if the envelope has one. */
    public Optional<Waist> smallestWaist() {
        return waists.stream().min(Comparator.comparingDouble(Waist::radius_m));
    }

    /** Largest radius in the table. */
    public EnvelopePoint largest() {
        return points.stream().max(Comparator.comparingDouble(EnvelopePoint::radius_m)).orElseThrow();
    }

    /** Last point of the table (at the stop plane). */
    public EnvelopePoint last() {
        return points.get(points.size() - 1);
    }

    /**
     * The envelope at z (clamped to the computed range).
     */
    public EnvelopePoint at(double z_m) {
        double z = Math.max(problem.zStart_m(), Math.min(zStop_m(), z_m));
        double r;
        double rp;
        if (dense == null) {
            r = problem.radius_m();
            rp = problem.slope_rad();
        } else {
            double[] y;
            synchronized (dense) {
                y = dense.getInterpolatedState(z).getPrimaryState();
            }
            r = y[0];
            rp = y[1];
        }
        double[] c = new double[3];
        channel.coefficients(z, c);
        double bg = Math.sqrt(Math.max(c[EnvelopeChannel.BETA_GAMMA_SQUARED], betaGammaSquaredFloor));
        double k = BeamKinematics.perveance(problem.current_A(), channel.restPotential_V(), bg);
        double eps = problem.normalisedEmittance_m_rad() / bg;
        if (r < 0) {
            // zero current and emittance: the envelope is |ray|
            return new EnvelopePoint(z, -r, -rp, k, eps);
        }
        return new EnvelopePoint(z, r, rp, k, eps);
    }
}
