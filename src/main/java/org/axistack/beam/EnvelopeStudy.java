package org.axistack.beam;

import org.axistack.model.PhysicsMessage;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.OptionalDouble;
import java.util.function.DoublePredicate;

import org.axistack.field.AxialField;
import org.axistack.model.Electrode;
import org.axistack.model.Stack;

/**
 * Runs the envelope through a stack's solved field three ways (full, zero current, zero emittance) and
 * checks the full envelope against every electrode's bore. Default range: from the beam's start plane
 * (else three largest-bore radii ahead of the first electrode) to the screen (else three stack lengths,
 * at least six bore radii, beyond the last electrode).
 */
public final class EnvelopeStudy {

    private final EnvelopeSolver solver;

    public EnvelopeStudy(EnvelopeSolver solver) {
        this.solver = solver;
    }

    public EnvelopeStudy() {
        this(new EnvelopeSolver());
    }

    public EnvelopeSolver solver() {
        return solver;
    }

    /** Largest bore among the electrodes that leave the axis open, m (0 if none). */
    static double largestBore_m(Stack stack) {
        return stack.electrodes().stream().mapToDouble(e -> e.contour().minR_m()).max().orElse(0);
    }

    /** Start plane used for this stack and request, m. */
    public static double startZ_m(Stack stack, EnvelopeRequest req) {
        if (req.fromZ_m().isPresent()) {
            return req.fromZ_m().getAsDouble();
        }
        if (stack.beam().startZ_m().isPresent()) {
            return stack.beam().startZ_m().getAsDouble();
        }
        return stack.minZ_m() - 3 * largestBore_m(stack);
    }

    /** End plane used for this stack and request, m. */
    public static double endZ_m(Stack stack, EnvelopeRequest req) {
        if (req.toZ_m().isPresent()) {
            return req.toZ_m().getAsDouble();
        }
        if (stack.screenZ_m().isPresent()) {
            return stack.screenZ_m().getAsDouble();
        }
        double len = stack.maxZ_m() - stack.minZ_m();
        return stack.maxZ_m() + Math.max(3 * len, 6 * largestBore_m(stack));
    }

    /** The channel of this stack's beam in this field. */
    public static ElectrostaticChannel channel(Stack stack, AxialField field) {
        return new ElectrostaticChannel(field, stack.beam().particle(), stack.beam().energyPerCharge_V());
    }

    /** The low-level problem for this stack and request (normalised edge emittance at the start energy). */
    public static EnvelopeProblem problem(Stack stack, AxialField field, EnvelopeRequest req) {
        double z0 = startZ_m(stack, req);
        double z1 = endZ_m(stack, req);
        if (!(z1 > z0)) {
            throw PhysicsMessage.ENVELOPE_RANGE.exception("from", z0 * 1e3, "to", z1 * 1e3);
        }
        ElectrostaticChannel ch = channel(stack, field);
        double u0 = ch.accelerationPotential_V(z0);
        if (!(u0 > 0)) {
            throw PhysicsMessage.NOT_REACHING_START.exception("z", z0 * 1e3, "energy", u0);
        }
        double bg = BeamKinematics.betaGamma(u0, ch.restPotential_V());
        EnvelopeStart s = req.start();
        return new EnvelopeProblem(z0, z1, s.radius_m(), s.slope_rad(), req.current_A(),
                s.emittance().normalisedEdge_m_rad(bg));
    }

    public EnvelopeStudyResult run(Stack stack, AxialField field, EnvelopeRequest req) {
        return run(stack, field, req, f -> true);
    }

    /**
     * The study, with the share done (0..1 over the three integrations) told to {@code progress} after every
     * integrator step; return false to cancel ({@link java.util.concurrent.CancellationException}). The integrations
     * run through a table of a solved field over the range ({@link EnvelopeTable#through}).
     */
    public EnvelopeStudyResult run(Stack stack, AxialField field, EnvelopeRequest req, DoublePredicate progress) {
        EnvelopeProblem p = problem(stack, field, req);
        ElectrostaticChannel ch = channel(stack, EnvelopeTable.through(field, p.zStart_m(), p.zEnd_m(), stack.openBore_m()));
        boolean withCurrent = p.current_A() != 0, withEmittance = p.normalisedEmittance_m_rad() != 0;
        int runs = 1 + (withCurrent ? 1 : 0) + (withEmittance ? 1 : 0);
        int[] run = {0};
        DoublePredicate share = f -> progress.test((run[0] + f) / runs);
        EnvelopeCurve full = solver.solve(ch, p, share);
        run[0]++;
        EnvelopeCurve noCurrent = !withCurrent ? full : solver.solve(ch, p.withCurrent_A(0), share);
        run[0] += withCurrent ? 1 : 0;
        EnvelopeCurve noEmittance = !withEmittance ? full
                : solver.solve(ch, p.withNormalisedEmittance_m_rad(0), share);
        double bg = BeamKinematics.betaGamma(ch.accelerationPotential_V(p.zStart_m()), ch.restPotential_V());
        double k0 = BeamKinematics.perveance(p.current_A(), ch.restPotential_V(), bg);
        double eps0 = p.normalisedEmittance_m_rad() / bg;
        OptionalDouble ratio = eps0 > 0 ? OptionalDouble.of(k0 * p.radius_m() * p.radius_m() / (eps0 * eps0))
                : OptionalDouble.empty();
        OptionalDouble screen = stack.screenZ_m();
        OptionalDouble screenR = screen.isPresent() && full.covers(screen.getAsDouble())
                ? OptionalDouble.of(full.at(screen.getAsDouble()).radius_m()) : OptionalDouble.empty();
        List<EnvelopeWarning> warnings = new ArrayList<>();
        List<BoreClearance> clear = clearances(stack, full, warnings);
        Termination t = full.termination();
        if (t.kind() == Termination.Kind.REFLECTED) {
            warnings.add(new EnvelopeWarning(EnvelopeWarning.Kind.REFLECTED, t.z_m(), "", t.detail()));
        } else if (t.kind() == Termination.Kind.FAILED) {
            warnings.add(new EnvelopeWarning(EnvelopeWarning.Kind.INTEGRATION_FAILED, t.z_m(), "", t.detail()));
        }
        warnings.sort(Comparator.comparingDouble(EnvelopeWarning::z_m));
        return new EnvelopeStudyResult(req, p.zStart_m(), p.zEnd_m(), bg, p.normalisedEmittance_m_rad(), k0, ratio,
                full, noCurrent, noEmittance, screen, screenR, clear, warnings);
    }

    /** Bore fill per electrode (stack order), adding warnings for near approaches, hits and a start outside the first bore. */
    List<BoreClearance> clearances(Stack stack, EnvelopeCurve curve, List<EnvelopeWarning> warnings) {
        double near = solver.settings().nearFill();
        List<BoreClearance> out = new ArrayList<>();
        ElectrodeWall first = null;
        for (Electrode e : stack.electrodes()) {
            ElectrodeWall wall = new ElectrodeWall(e);
            if (wall.zMax_m() >= curve.problem().zStart_m()
                    && (first == null || wall.zMin_m() < first.zMin_m())) {
                first = wall;
            }
            out.add(clearance(wall, curve, near, warnings));
        }
        double r0 = curve.problem().radius_m();
        if (first != null && first.bore_m() > 0 && r0 > first.bore_m()) {
            warnings.add(new EnvelopeWarning(EnvelopeWarning.Kind.START_OUTSIDE_BORE, curve.problem().zStart_m(),
                    first.electrode().name(), BeamMessages.startOutsideBore(first.electrode().name(), r0,
                            first.bore_m())));
        }
        return out;
    }

    private static BoreClearance clearance(ElectrodeWall wall, EnvelopeCurve curve, double near,
            List<EnvelopeWarning> warnings) {
        String name = wall.electrode().name();
        List<Double> probes = new ArrayList<>(wall.probes());
        for (EnvelopePoint p : curve.points()) {
            if (p.z_m() >= wall.zMin_m() && p.z_m() <= wall.zMax_m()) {
                probes.add(p.z_m());
            }
        }
        double worstFill = -1;
        double worstZ = 0;
        double worstR = 0;
        boolean reached = false;
        for (double z : probes) {
            if (!curve.covers(z)) {
                continue;
            }
            OptionalDouble w = wall.wallAt(z);
            if (w.isEmpty()) {
                continue;
            }
            reached = true;
            double rw = w.getAsDouble();
            if (rw <= 0) {
                warnings.add(new EnvelopeWarning(EnvelopeWarning.Kind.CLOSES_AXIS, z, name, BeamMessages.fmt(
                        "electrode '%s' closes the axis at z = %.6g mm: the beam stops on it and the envelope beyond "
                        + "is not physical; end the range before it or give it a bore", name, z * 1e3)));
                return new BoreClearance(name, 0, wall.zMin_m(), wall.zMax_m(), curve.at(z).radius_m(), z, 0,
                        BoreClearance.Status.CLOSES_AXIS);
            }
            double r = curve.at(z).radius_m();
            if (r / rw > worstFill) {
                worstFill = r / rw;
                worstZ = z;
                worstR = r;
            }
        }
        if (!reached) {
            return new BoreClearance(name, wall.bore_m(), wall.zMin_m(), wall.zMax_m(), 0, wall.zMin_m(), 0,
                    BoreClearance.Status.NOT_REACHED);
        }
        BoreClearance.Status st;
        if (worstFill >= 1) {
            st = BoreClearance.Status.HIT;
            warnings.add(new EnvelopeWarning(EnvelopeWarning.Kind.HITS_ELECTRODE, worstZ, name, BeamMessages.fmt(
                    "the envelope (%.4g mm) reaches electrode '%s' at z = %.6g mm, %.0f %% of the local bore: the beam "
                    + "is clipped; reduce the start radius, slope, emittance or current, or retune the lens",
                    worstR * 1e3, name, worstZ * 1e3, 100 * worstFill)));
        } else if (worstFill >= near) {
            st = BoreClearance.Status.NEAR;
            warnings.add(new EnvelopeWarning(EnvelopeWarning.Kind.NEAR_ELECTRODE, worstZ, name, BeamMessages.fmt(
                    "the envelope (%.4g mm) fills %.0f %% of the bore of electrode '%s' at z = %.6g mm (threshold "
                    + "%.0f %%): expect aberrations and halo losses", worstR * 1e3, 100 * worstFill, name,
                    worstZ * 1e3, 100 * near)));
        } else {
            st = BoreClearance.Status.CLEAR;
        }
        return new BoreClearance(name, wall.bore_m(), wall.zMin_m(), wall.zMax_m(), worstR, worstZ, worstFill, st);
    }
}
