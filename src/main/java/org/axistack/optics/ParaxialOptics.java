package org.axistack.optics;

import java.util.OptionalDouble;

import org.axistack.field.AxialField;
import org.axistack.field.FarField;
import org.axistack.model.Beam;
import org.axistack.model.Stack;
import org.hipparchus.analysis.solvers.BrentSolver;
import org.hipparchus.ode.ODEState;
import org.hipparchus.ode.OrdinaryDifferentialEquation;
import org.hipparchus.ode.nonstiff.DormandPrince853Integrator;

/**
 * Paraxial optics of a round electrostatic lens: the relativistic paraxial ray equation
 * r'' + g U' r' / (2 U*) + g U'' r / (4 U*) = 0 (P. W. Hawkes and E. Kasper, Principles of Electron Optics,
 * vol. 1, ch. 15; physics brief) integrated once for two fundamental rays with the Dormand-Prince 8(5,3)
 * adaptive integrator (E. Hairer, S. P. Norsett, G. Wanner, Solving Ordinary Differential Equations I,
 * Hipparchus implementation) with dense output. Every transfer matrix, cardinal element and image between
 * the two reference planes then comes from that one integration. Immutable and thread-safe after
 * construction.
 *
 * <p>Use {@link #auto} to let the reference planes be chosen where the field has decayed, or {@link #of}
 * with planes of your own. Both throw {@link ReflectionException} if the axial acceleration potential
 * reaches zero between the planes (a mirror).
 */
/**
 * Paraxial optics of a round electrostatic lens: the relativistic paraxial ray equation
 * r'' + g U' r' / (2 U*) + g U'' r / (4 U*) = 0 (P. W. Hawkes and E. Kasper, Principles of Electron Optics,
 * vol. 1, ch. 15; physics brief) integrated once for two fundamental rays with the Dormand-Prince 8(5,3)
 * adaptive integrator (E. Hairer, S. P. Norsett, G. Wanner, Solving Ordinary Differential Equations I,
 * Hipparchus implementation) with dense output. Every transfer matrix, cardinal element and image then comes
 * from that one integration. Immutable and thread-safe after construction.
 *
 * <p>Where the field ends ({@link FieldEnd}) is decided per side. An open side (no drift tube around the axis
 * there, the field of a finite charge set decaying like 1/|z|) is traced out to the start of the far-field
 * multipole series and carried on to infinity by {@link FarTail}: the cardinal elements are then the true
 * asymptotic ones. Where the axis runs inside a drift tube whose field dies away (a tube that stands for a beam
 * pipe), the field is taken as ended at the tube plane where it is weakest, and beyond it rays drift. Fields
 * without a far-field model (closed-form test fields, explicit planes) are cut at the planes given.
 *
 * <p>Use {@link #auto} to let the ends be chosen, or {@link #of} with planes of your own. Both throw
 * {@link ReflectionException} if the axial acceleration potential reaches zero in the traced range (a mirror).
 */
public final class ParaxialOptics {

    /**
     * A drift-tube plane ends the field only where the field weight has fallen below this fraction of its peak
     * (and rises again further out, toward the tube mouth): the field left there is the lens's residual, the
     * rise beyond is the mouth of a tube that stands for a longer pipe.
     */
    static final double TUBE_DEPTH = 1e-3;

    private final AccelerationPotential potential;
    private final ParaxialSettings settings;
    private final double traceFrom;
    private final double traceTo;
    private final FieldEnd objectEnd;
    private final FieldEnd imageEnd;
    private final double lensCentreZ;
    private final StepStore dense;
    private final FarTail objectTail;
    private final FarTail imageTail;

    private ParaxialOptics(AccelerationPotential potential, ParaxialSettings settings, double traceFrom,
            double traceTo, FieldEnd objectEnd, FieldEnd imageEnd, double lensCentreZ) {
        this.potential = potential;
        this.settings = settings;
        this.traceFrom = traceFrom;
        this.traceTo = traceTo;
        this.objectEnd = objectEnd;
        this.imageEnd = imageEnd;
        this.lensCentreZ = lensCentreZ;
        this.dense = integrate();
        FarField far = potential.field().farField().orElse(null);
        this.objectTail = objectEnd.rule() == FieldEnd.Rule.FAR_FIELD
                ? new FarTail(potential, far, -1, traceFrom, settings.relativeTolerance()) : null;
        this.imageTail = imageEnd.rule() == FieldEnd.Rule.FAR_FIELD
                ? new FarTail(potential, far, +1, traceTo, settings.relativeTolerance()) : null;
        this.objectTailStartInverse = objectTail != null ? inverse(objectTail.fromAsymptote(traceFrom)) : null;
        this.imageTailStart = imageTail != null
                ? product(inverse(imageTail.fromAsymptote(traceTo)), inner(traceTo)) : null;
    }

    /** Inverse of the object tail's map at traceFrom (null without that tail). */
    private final double[] objectTailStartInverse;
    /** The image tail's inverse map at traceTo times the fundamental matrix there (null without that tail). */
    private final double[] imageTailStart;

    /** Paraxial optics between given reference planes, default settings. */
    public static ParaxialOptics of(AxialField field, Beam beam, double zStart_m, double zEnd_m) {
        return of(new AccelerationPotential(field, beam), zStart_m, zEnd_m, ParaxialSettings.defaults());
    }

    /**
     * Paraxial optics between given reference planes (zStart &lt; zEnd, rays travel toward +z), the field taken as
     * ended there ({@link FieldEnd.Rule#GIVEN_PLANE}).
     */
    public static ParaxialOptics of(AccelerationPotential potential, double zStart_m, double zEnd_m,
            ParaxialSettings settings) {
        if (!(zStart_m < zEnd_m) || !Double.isFinite(zStart_m) || !Double.isFinite(zEnd_m)) {
            throw new IllegalArgumentException("reference planes must satisfy zStart < zEnd: " + zStart_m
                    + ", " + zEnd_m);
        }
        AxisScan scan = AxisScan.sample(potential, zStart_m, zEnd_m, settings.scanPoints());
        scan.checkNoReflection(zStart_m);
        return new ParaxialOptics(potential, settings, zStart_m, zEnd_m,
                new FieldEnd(FieldEnd.Rule.GIVEN_PLANE, zStart_m), new FieldEnd(FieldEnd.Rule.GIVEN_PLANE, zEnd_m),
                scan.peakZ());
    }

    /**
     * Paraxial optics with the field's ends chosen automatically from a scan of [zMin, zMax] (normally
     * {@link #searchRange_m(Stack)}), see {@link #auto(AccelerationPotential, double, double, OptionalDouble,
     * ParaxialSettings)}.
     */
    public static ParaxialOptics auto(AxialField field, Beam beam, double zMin_m, double zMax_m) {
        return auto(new AccelerationPotential(field, beam), zMin_m, zMax_m, beam.startZ_m(),
                ParaxialSettings.defaults());
    }

    /**
     * Paraxial optics of a stack's field for the stack's beam, ends chosen automatically from
     * {@link #searchRange_m(Stack)}; the beam start, object and screen are traced in the full field.
     *
     * @throws BlockedAxisException if an electrode crosses the axis in the beam's path (anywhere in the search
     *                              range not behind a given beam start)
     */
    public static ParaxialOptics of(AxialField field, Stack stack) {
        double[] range = searchRange_m(stack);
        double from = stack.beam().startZ_m().orElse(range[0]);
        for (org.axistack.model.Electrode e : stack.electrodes()) {
            org.axistack.model.Contour c = e.contour();
            if (c.minR_m() <= 0 && c.maxZ_m() > from && c.minZ_m() < range[1]) {
                throw new BlockedAxisException(e.name(), c.minZ_m(), c.maxZ_m());
            }
        }
        return auto(field, stack.beam(), range[0], range[1]);
    }

    /**
     * Where the field is scanned for a stack: its extent widened by half its length on each side, so fringe
     * fields outside plate lenses are seen; inside long tubes the tube plane is found anyway.
     */
    public static double[] searchRange_m(Stack stack) {
        return stack.fringeRange_m();
    }

    /**
     * Paraxial optics with the ends chosen from a scan of [zMin, zMax]. On each side of the strongest point of
     * the lens the scan looks outward for the weakest field (the weight (|U'| + L|U''|)/U, L the scan step). If
     * it falls below {@link ParaxialSettings#fieldFreeFraction()} of its peak, or below {@link #TUBE_DEPTH} of it
     * at a point beyond which it rises again (inside a drift tube, before its mouth), the field is taken as
     * ended there ({@link FieldEnd.Rule#TUBE_PLANE}). Otherwise the side is open: with a far-field model
     * ({@link AxialField#farField()}) it is traced to the model's start and carried to infinity
     * ({@link FieldEnd.Rule#FAR_FIELD}); without one it is cut at the weakest point
     * ({@link FieldEnd.Rule#NO_MODEL}). A beam start, when given, is traced from in the full field.
     */
    public static ParaxialOptics auto(AccelerationPotential potential, double zMin_m, double zMax_m,
            OptionalDouble startZ_m, ParaxialSettings settings) {
        if (!(zMin_m < zMax_m)) {
            throw new IllegalArgumentException("search range must satisfy zMin < zMax: " + zMin_m + ", " + zMax_m);
        }
        AxisScan scan = AxisScan.sample(potential, zMin_m, zMax_m, settings.scanPoints());
        FarField far = potential.field().farField().orElse(null);
        FieldEnd[] ends = scan.ends(settings.fieldFreeFraction(), TUBE_DEPTH, far != null);
        double from = ends[0].z_m();
        double to = ends[1].z_m();
        FieldEnd.Rule open = settings.farFieldModel() ? FieldEnd.Rule.FAR_FIELD : FieldEnd.Rule.GIVEN_PLANE;
        if (ends[0].rule() == FieldEnd.Rule.FAR_FIELD) {
            from = Math.min(from, far.centreZ_m() - settings.farFieldReach() * far.startDistance_m());
        }
        if (ends[1].rule() == FieldEnd.Rule.FAR_FIELD) {
            to = Math.max(to, far.centreZ_m() + settings.farFieldReach() * far.startDistance_m());
        }
        FieldEnd objectEnd = ends[0].rule() == FieldEnd.Rule.FAR_FIELD ? new FieldEnd(open, from) : ends[0];
        FieldEnd imageEnd = ends[1].rule() == FieldEnd.Rule.FAR_FIELD ? new FieldEnd(open, to) : ends[1];
        if (startZ_m.isPresent() && Double.isFinite(startZ_m.getAsDouble())
                && potential.field().axisBlocked(Double.NEGATIVE_INFINITY, startZ_m.getAsDouble())) {
            from = startZ_m.getAsDouble();
            objectEnd = new FieldEnd(FieldEnd.Rule.BEAM_START, from);
        }
        double check = from;
        if (startZ_m.isPresent()) {
            double start = startZ_m.getAsDouble();
            if (!Double.isFinite(start)) {
                throw new StartPlaneException(start, from, to);
            }
            // a start inside the ended field region (e.g. deeper in the entrance tube) is traced from
            if (start < from && start >= zMin_m && objectEnd.rule() != FieldEnd.Rule.FAR_FIELD) {
                from = start;
            }
            check = Math.max(start, from);
        }
        if (from < zMin_m || to > zMax_m) {
            AxisScan.sample(potential, from, to, settings.scanPoints()).checkNoReflection(check);
        } else {
            scan.checkNoReflection(check);
        }
        double centre = Math.min(Math.max(scan.peakZ(), objectEnd.z_m()), imageEnd.z_m());
        return new ParaxialOptics(potential, settings, from, to, objectEnd, imageEnd, centre);
    }

    private StepStore integrate() {
        double length = traceTo - traceFrom;
        double tol = settings.relativeTolerance();
        double[] absTol = {tol * 1e-3, tol * 1e-3 / length, tol * 1e-3 * length, tol * 1e-3};
        double[] relTol = {tol, tol, tol, tol};
        DormandPrince853Integrator integrator =
                new DormandPrince853Integrator(length * 1e-12, length / 50, absTol, relTol);
        StepStore store = new StepStore();
        integrator.addStepHandler(store);
        integrator.integrate(new RayEquation(potential), new ODEState(traceFrom, new double[] {1, 0, 0, 1}), traceTo);
        return store.freeze();
    }

    /** The paraxial equation for two rays at once (shares the field evaluations). */
    private static final class RayEquation implements OrdinaryDifferentialEquation {
        private final AccelerationPotential p;
        private final double[] u = new double[3];

        RayEquation(AccelerationPotential p) {
            this.p = p;
        }

        @Override
        public int getDimension() {
            return 4;
        }

        @Override
        public double[] computeDerivatives(double z, double[] y) {
            p.derivatives(z, 2, u);
            if (!(u[0] > 0)) {
                throw new ReflectionException(new Reflection(z, Double.NaN));
            }
            double g = p.g(u[0]);
            double uStar = p.uStar(u[0]);
            double pp = g * u[1] / (2 * uStar);
            double qq = g * u[2] / (4 * uStar);
            return new double[] {y[1], -pp * y[1] - qq * y[0], y[3], -pp * y[3] - qq * y[2]};
        }
    }

    /** Object-side reference plane (where the field is taken as ended, or where its far-field tail starts), m. */
    public double zStart_m() {
        return objectEnd.z_m();
    }

    /** Image-side reference plane (where the field is taken as ended, or where its far-field tail starts), m. */
    public double zEnd_m() {
        return imageEnd.z_m();
    }

    /** How the field ends on the object side. */
    public FieldEnd objectEnd() {
        return objectEnd;
    }

    /** How the field ends on the image side. */
    public FieldEnd imageEnd() {
        return imageEnd;
    }

    /**
     * Where the lens ends for a beam that must pass through it: the image-side plane where the field is taken as
     * ended, or, on an open image side, the given end of the electrodes (the field there decays to infinity, so
     * the lens has no sharper end). A beam start or object at or beyond it lies after the lens.
     */
    public double lensExitZ_m(double electrodesEndZ_m) {
        return imageEnd.rule() == FieldEnd.Rule.FAR_FIELD ? electrodesEndZ_m : zEnd_m();
    }

    /** The range integrated in z (the tails beyond it, if any, in the compactified variable), m. */
    public double[] tracedRange_m() {
        return new double[] {traceFrom, traceTo};
    }

    /** The far-field tail of the object side (null when that side is ended). */
    FarTail objectTail() {
        return objectTail;
    }

    /** The far-field tail of the image side (null when that side is ended). */
    FarTail imageTail() {
        return imageTail;
    }

    /** Where the lens is strongest (largest |U'|/U found by the axis scan), m. */
    public double lensCentreZ_m() {
        return lensCentreZ;
    }

    public AccelerationPotential potential() {
        return potential;
    }

    public ParaxialSettings settings() {
        return settings;
    }

    public boolean relativistic() {
        return Double.isFinite(potential.restPotential_V());
    }

    /**
     * The fundamental matrix G(z) (row-major a, b, c, d) from the state at traceFrom to the state at any z:
     * the dense output inside the traced range, the far-field tails beyond open ends, drifts beyond ended ones.
     */
    private double[] fundamental(double z) {
        if (z < traceFrom) {
            if (objectTail != null) {
                return product(objectTail.fromAsymptote(z), objectTailStartInverse);
            }
            return new double[] {1, z - traceFrom, 0, 1};
        }
        if (z > traceTo) {
            if (imageTail != null) {
                return product(imageTail.fromAsymptote(z), imageTailStart);
            }
            return product(new double[] {1, z - traceTo, 0, 1}, inner(traceTo));
        }
        return inner(z);
    }

    private double[] inner(double z) {
        double[] y = dense.state(Math.min(Math.max(z, traceFrom), traceTo));
        return new double[] {y[0], y[2], y[1], y[3]};
    }

    private static double[] product(double[] m, double[] n) {
        return new double[] {m[0] * n[0] + m[1] * n[2], m[0] * n[1] + m[1] * n[3],
            m[2] * n[0] + m[3] * n[2], m[2] * n[1] + m[3] * n[3]};
    }

    private static double[] inverse(double[] m) {
        double det = m[0] * m[3] - m[1] * m[2];
        return new double[] {m[3] / det, -m[1] / det, -m[2] / det, m[0] / det};
    }

    private static TransferMatrix matrix(double z1, double z2, double[] m) {
        return new TransferMatrix(z1, z2, m[0], m[1], m[2], m[3]);
    }

    /**
     * Transfer matrix of the real ray between any two planes (z2 may lie before z1: the backward map): through
     * the traced field, the far-field tails of open ends, and drifts beyond ended ones.
     */
    public TransferMatrix transfer(double z1_m, double z2_m) {
        if (!Double.isFinite(z1_m) || !Double.isFinite(z2_m)) {
            throw new IllegalArgumentException("planes must be finite: " + z1_m + ", " + z2_m);
        }
        return matrix(z1_m, z2_m, product(fundamental(z2_m), inverse(fundamental(z1_m))));
    }

    /**
     * The map from the object-side asymptote (its height at {@link #zStart_m()}, its slope) to the real ray at z:
     * for an open object side the ray that comes from infinity along that asymptote, else the ray given at the
     * ended plane.
     */
    public TransferMatrix fromObjectAsymptote(double z_m) {
        return entryFromAsymptote().then(transfer(zStart_m(), z_m));
    }

    /** Asymptote at zStart (height, slope) to real ray at zStart (identity unless the object side is open). */
    private TransferMatrix entryFromAsymptote() {
        if (objectTail == null) {
            return TransferMatrix.drift(zStart_m(), zStart_m());
        }
        double shift = zStart_m() - objectTail.centreZ_m();
        // (h, B) at zStart -> (A, B) about z0: A = h - B shift
        double[] m = product(objectTail.fromAsymptote(zStart_m()), new double[] {1, -shift, 0, 1});
        return matrix(zStart_m(), zStart_m(), m);
    }

    /** Real ray at zEnd to the image-side asymptote (height at zEnd, slope) (identity unless the side is open). */
    private TransferMatrix exitToAsymptote() {
        if (imageTail == null) {
            return TransferMatrix.drift(zEnd_m(), zEnd_m());
        }
        double shift = zEnd_m() - imageTail.centreZ_m();
        double[] m = product(new double[] {1, shift, 0, 1}, inverse(imageTail.fromAsymptote(zEnd_m())));
        return matrix(zEnd_m(), zEnd_m(), m);
    }

    /**
     * The map from the real ray at the image-side plane {@link #zEnd_m()} (height, slope) to its image-side
     * asymptote (height at zEnd, slope): the identity unless the image side is open.
     */
    public TransferMatrix toImageAsymptote() {
        return exitToAsymptote();
    }

    /** The map between the asymptotes: object-side (height at zStart, slope) to image-side (height at zEnd, slope). */
    public TransferMatrix asymptoticTransfer() {
        return entryFromAsymptote().then(transfer(zStart_m(), zEnd_m())).then(exitToAsymptote())
                .withPlanes(zStart_m(), zEnd_m());
    }

    /** Height and slope at z of the ray that has height r0 and slope s0 at z0. */
    public double[] ray(double z0_m, double r0_m, double slope0, double z_m) {
        TransferMatrix t = transfer(z0_m, z_m);
        return new double[] {t.height(r0_m, slope0), t.slope(r0_m, slope0)};
    }

    /**
     * Asymptotic cardinal elements (through the far-field tails of open ends, between the planes of ended
     * ones), the real axis crossings of the rays that enter and leave parallel, and the error estimate.
     */
    public CardinalElements cardinal() {
        TransferMatrix m = asymptoticTransfer();
        double u1 = objectTail != null ? potential.u0_V() : potential.u_V(zStart_m());
        double u2 = imageTail != null ? potential.u0_V() : potential.u_V(zEnd_m());
        CardinalElements full = CardinalElements.fromMatrix(m, u1, u2, relativistic(), OptionalDouble.empty(),
                OptionalDouble.empty(), 0);
        double sensitivity = 0;
        if (objectTail == null || imageTail == null) {
            // move the ended planes toward the lens (open ends keep their tails)
            double f = settings.planeCheckFraction();
            double inner1 = objectTail != null ? zStart_m() : zStart_m() + f * Math.max(0, lensCentreZ - zStart_m());
            double inner2 = imageTail != null ? zEnd_m() : zEnd_m() - f * Math.max(0, zEnd_m() - lensCentreZ);
            TransferMatrix moved = transfer(inner1, inner2);
            if (objectTail != null) {
                moved = entryFromAsymptote().then(moved);
            }
            if (imageTail != null) {
                moved = moved.then(exitToAsymptote());
            }
            moved = moved.withPlanes(inner1, inner2);
            CardinalElements inner = CardinalElements.fromMatrix(moved, objectTail != null ? u1 : potential.u_V(inner1),
                    imageTail != null ? u2 : potential.u_V(inner2), relativistic(), OptionalDouble.empty(),
                    OptionalDouble.empty(), 0);
            sensitivity = full.relativeDifference(inner);
        }
        // real crossings: the ray entering parallel (asymptotically), forward; the ray leaving parallel, backward
        TransferMatrix in = entryFromAsymptote();
        OptionalDouble realImage = crossing(zStart_m(), in.height(1, 0), in.slope(1, 0), true);
        TransferMatrix outInv = exitToAsymptote();
        double det = outInv.determinant();
        // real state at zEnd of the ray whose outgoing asymptote is (1, 0)
        double rEnd = outInv.d() / det;
        double sEnd = -outInv.c() / det;
        OptionalDouble realObject = crossing(zEnd_m(), rEnd, sEnd, false);
        CardinalElements c = CardinalElements.fromMatrix(m, u1, u2, relativistic(), realImage, realObject, sensitivity);
        double share = 0;
        if (objectTail != null || imageTail != null) {
            TransferMatrix cut = transfer(zStart_m(), zEnd_m());
            share = c.relativeDifference(CardinalElements.fromMatrix(cut, potential.u_V(zStart_m()),
                    potential.u_V(zEnd_m()), relativistic(), OptionalDouble.empty(), OptionalDouble.empty(), 0));
        }
        return c.withEnds(objectEnd, imageEnd, Math.max(sensitivity, integrationError(m, u1, u2, c)), share);
    }

    /**
     * Estimated error of the integration: the same asymptotic map from a 1000 times looser tolerance differs from
     * this one by about the looser run's error, which bounds this run's (adaptive Dormand-Prince errors scale
     * with the tolerance). Cheap: the looser run takes a fraction of the steps.
     */
    private double integrationError(TransferMatrix m, double u1, double u2, CardinalElements c) {
        if (settings.relativeTolerance() * 1e3 >= 1e-3) {
            return settings.relativeTolerance();
        }
        ParaxialOptics loose = new ParaxialOptics(potential, settings.withRelativeTolerance(settings.relativeTolerance() * 1e3),
                traceFrom, traceTo, objectEnd, imageEnd, lensCentreZ);
        CardinalElements l = CardinalElements.fromMatrix(loose.asymptoticTransfer(), u1, u2, relativistic(),
                OptionalDouble.empty(), OptionalDouble.empty(), 0);
        return c.relativeDifference(l);
    }

    /**
     * First axis crossing of the ray (r0, s0) given at z0, searched forward (toward +z, to infinity through an
     * open image side) or backward. Inside the traced range by sampling and Brent's method on the dense output;
     * in a far-field tail by sampling in s = 1/|z - z0|; beyond an ended plane the drift line's crossing.
     */
    OptionalDouble crossing(double z0, double r0, double s0, boolean forward) {
        double[] g0 = inverse(fundamental(z0));
        double rs = g0[0] * r0 + g0[1] * s0;
        double ss = g0[2] * r0 + g0[3] * s0;
        java.util.function.DoubleUnaryOperator height = z -> {
            double[] g = fundamental(z);
            return g[0] * rs + g[1] * ss;
        };
        double a = forward ? Math.max(z0, traceFrom) : traceFrom;
        double b = forward ? traceTo : Math.min(z0, traceTo);
        if (a < b) {
            OptionalDouble inside = firstCrossing(height, a, b, forward);
            if (inside.isPresent()) {
                return inside;
            }
        }
        FarTail tail = forward ? imageTail : objectTail;
        double edge = forward ? traceTo : traceFrom;
        if (tail == null) {
            double[] g = fundamental(edge);
            double r = g[0] * rs + g[1] * ss;
            double sl = g[2] * rs + g[3] * ss;
            if (sl == 0) {
                return OptionalDouble.empty();
            }
            double z = edge - r / sl;
            return (forward ? z >= edge : z <= edge) ? OptionalDouble.of(z) : OptionalDouble.empty();
        }
        // the tail, sampled in s from the boundary toward infinity
        double sMax = 1 / Math.abs(edge - tail.centreZ_m());
        int n = Math.max(50, settings.scanPoints() / 2);
        double prevS = sMax;
        double prev = height.applyAsDouble(edge);
        java.util.function.DoubleUnaryOperator inS = t -> height.applyAsDouble(tail.centreZ_m() + tail.side() / t);
        for (int i = 1; i <= n; i++) {
            double sv = sMax * Math.pow(1e-9, (double) i / n);
            double h = inS.applyAsDouble(sv);
            if (Math.signum(h) != Math.signum(prev)) {
                double root = new BrentSolver(1e-15, 1e-14 * sMax).solve(200, inS::applyAsDouble, sv, prevS);
                return OptionalDouble.of(tail.centreZ_m() + tail.side() / root);
            }
            prev = h;
            prevS = sv;
        }
        return OptionalDouble.empty();
    }

    private OptionalDouble firstCrossing(java.util.function.DoubleUnaryOperator height, double a, double b,
            boolean forward) {
        int n = Math.max(50, settings.scanPoints() / 2);
        double eps = 1e-9 * (b - a);
        double prevZ = forward ? a + eps : b - eps;
        double prev = height.applyAsDouble(prevZ);
        BrentSolver solver = new BrentSolver(1e-15, 1e-14 * (traceTo - traceFrom));
        for (int i = 1; i <= n; i++) {
            double z = forward ? a + eps + (b - a - eps) * i / n : b - eps - (b - a - eps) * i / n;
            double h = height.applyAsDouble(z);
            if (prev == 0) {
                return OptionalDouble.of(prevZ);
            }
            if (Math.signum(h) != Math.signum(prev)) {
                double lo = Math.min(prevZ, z);
                double hi = Math.max(prevZ, z);
                return OptionalDouble.of(solver.solve(200, height::applyAsDouble, lo, hi));
            }
            prev = h;
            prevZ = z;
        }
        return OptionalDouble.empty();
    }

    /**
     * Imaging of an axial object at objectZ (any finite z): the asymptotic image (where the outgoing asymptote of
     * the axial ray crosses the axis) and its magnifications, and the real image: the first real crossing of the
     * axial ray after the object, traced in the full field, with the real lateral magnification there.
     */
    public Imaging imaging(double objectZ_m) {
        if (!Double.isFinite(objectZ_m)) {
            throw new IllegalArgumentException("object z must be finite: " + objectZ_m);
        }
        double ref = zEnd_m();
        TransferMatrix t = transfer(objectZ_m, ref).then(exitToAsymptote());
        double imageZ;
        double lateral;
        TransferMatrix toImage;
        if (Math.abs(t.d()) * (traceTo - traceFrom) < CardinalElements.AFOCAL_LIMIT * Math.abs(t.b())) {
            imageZ = Double.POSITIVE_INFINITY;
            lateral = Double.POSITIVE_INFINITY;
            toImage = t;
        } else {
            imageZ = ref - t.b() / t.d();
            toImage = t.then(TransferMatrix.drift(ref, imageZ));
            lateral = toImage.a();
        }
        OptionalDouble real = crossing(objectZ_m, 0, 1, true);
        // the axial ray leaves the object itself at height 0: search just after it
        if (real.isPresent() && Math.abs(real.getAsDouble() - objectZ_m) <= 1e-9 * (traceTo - traceFrom)) {
            double step = 1e-6 * (traceTo - traceFrom);
            double[] r = ray(objectZ_m, 0, 1, objectZ_m + step);
            real = crossing(objectZ_m + step, r[0], r[1], true);
        }
        double realLateral = real.isPresent() ? transfer(objectZ_m, real.getAsDouble()).a() : Double.NaN;
        return new Imaging(objectZ_m, imageZ, lateral, t.d(), real, toImage, realLateral);
    }

    /** Spherical and chromatic aberration coefficients for an object at infinity (image side). */
    public Aberrations aberrations() {
        return AberrationIntegrals.atInfinity(this);
    }

    /** Aberration coefficients for an axial object at objectZ: image side at infinity plus object side. */
    public Aberrations aberrations(double objectZ_m) {
        return AberrationIntegrals.forObject(this, objectZ_m);
    }

    /**
     * The aberrations every output quotes (plan, optics, sweep, window): for the stack's axial object when it lies
     * before the image-side reference plane and has a finite image, else for an object at infinity; empty for an
     * afocal lens. One rule, so no two outputs quote Cs and Cc for different object positions.
     *
     * @param imaging the image of the stack's object point, if it has one (computed once by the caller)
     */
    public java.util.Optional<Aberrations> quotedAberrations(java.util.Optional<Imaging> imaging) {
        if (cardinal().kind() == CardinalElements.Kind.AFOCAL) {
            return java.util.Optional.empty();
        }
        return java.util.Optional.of(imaging.filter(im -> im.objectZ_m() < zEnd_m() && Double.isFinite(im.imageZ_m()))
                .map(im -> aberrations(im.objectZ_m())).orElseGet(this::aberrations));
    }

    /**
     * Third-order off-axis aberrations (coma, astigmatism, field curvature, distortion, Petzval) for a finite object
     * at objectZ, see {@link OffAxisAberrations}.
     *
     * @throws IllegalArgumentException if the object is imaged to infinity
     */
    public OffAxisAberrations offAxisAberrations(double objectZ_m) {
        return OffAxisAberrations.of(this, objectZ_m);
    }
}
