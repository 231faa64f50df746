package org.axistack.optics;

import java.util.OptionalDouble;

import org.axistack.field.AxialField;
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
public final class ParaxialOptics {

    private final AccelerationPotential potential;
    private final ParaxialSettings settings;
    private final double zStart;
    private final double zEnd;
    private final double lensCentreZ;
    private final StepStore dense;

    private ParaxialOptics(AccelerationPotential potential, ParaxialSettings settings, double zStart,
            double zEnd, double lensCentreZ) {
        this.potential = potential;
        this.settings = settings;
        this.zStart = zStart;
        this.zEnd = zEnd;
        this.lensCentreZ = lensCentreZ;
        this.dense = integrate();
    }

    /** Paraxial optics between given reference planes, default settings. */
    public static ParaxialOptics of(AxialField field, Beam beam, double zStart_m, double zEnd_m) {
        return of(new AccelerationPotential(field, beam), zStart_m, zEnd_m, ParaxialSettings.defaults());
    }

    /** Paraxial optics between given reference planes (zStart &lt; zEnd, rays travel toward +z). */
    public static ParaxialOptics of(AccelerationPotential potential, double zStart_m, double zEnd_m,
            ParaxialSettings settings) {
        if (!(zStart_m < zEnd_m) || !Double.isFinite(zStart_m) || !Double.isFinite(zEnd_m)) {
            throw new IllegalArgumentException("reference planes must satisfy zStart < zEnd: " + zStart_m
                    + ", " + zEnd_m);
        }
        AxisScan scan = AxisScan.sample(potential, zStart_m, zEnd_m, settings.scanPoints());
        scan.checkNoReflection(zStart_m);
        return new ParaxialOptics(potential, settings, zStart_m, zEnd_m, scan.peakZ());
    }

    /**
     * Paraxial optics with reference planes chosen automatically inside [zMin, zMax] (normally the stack
     * extent, see {@link #searchRange_m(Stack)}): from the strongest point of the lens outward to where
     * (|U'| + L|U''|)/U first falls below {@link ParaxialSettings#fieldFreeFraction()} of its peak (L the scan
     * step), or, if it never does, to where it is smallest; so the planes stay inside drift tubes rather than
     * running on to leaky tube mouths. A beam start position, when given, is used as the
     * object-side plane ({@link StartPlaneException} if it is outside [zMin, image-side plane)). How much the result still depends on the planes is measured and reported in
     * {@link CardinalElements#planeSensitivity()}.
     */
    public static ParaxialOptics auto(AxialField field, Beam beam, double zMin_m, double zMax_m) {
        return auto(new AccelerationPotential(field, beam), zMin_m, zMax_m, beam.startZ_m(),
                ParaxialSettings.defaults());
    }

    /**
     * Paraxial optics of a stack's field for the stack's beam, planes chosen automatically within
     * {@link #searchRange_m(Stack)}.
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
     * Where the reference planes are searched for a stack: its extent widened by half its length on each side,
     * so fringe fields outside plate lenses are included (the open-boundary field is valid there); inside long
     * tubes the search stops at the first field-free point anyway.
     */
    public static double[] searchRange_m(Stack stack) {
        double span = stack.maxZ_m() - stack.minZ_m();
        return new double[] {stack.minZ_m() - 0.5 * span, stack.maxZ_m() + 0.5 * span};
    }

    /** As {@link #auto(AxialField, Beam, double, double)} with explicit potential, start and settings. */
    public static ParaxialOptics auto(AccelerationPotential potential, double zMin_m, double zMax_m,
            OptionalDouble startZ_m, ParaxialSettings settings) {
        if (!(zMin_m < zMax_m)) {
            throw new IllegalArgumentException("search range must satisfy zMin < zMax: " + zMin_m + ", " + zMax_m);
        }
        AxisScan scan = AxisScan.sample(potential, zMin_m, zMax_m, settings.scanPoints());
        double[] planes = scan.fieldFreePlanes(settings.fieldFreeFraction());
        double start = planes[0];
        if (startZ_m.isPresent()) {
            start = startZ_m.getAsDouble();
            if (!(start >= zMin_m && start < planes[1])) {
                throw new StartPlaneException(start, zMin_m, planes[1]);
            }
        }
        scan.checkNoReflection(start);
        double centre = Math.min(Math.max(scan.peakZ(), start), planes[1]);
        return new ParaxialOptics(potential, settings, start, planes[1], centre);
    }

    private StepStore integrate() {
        double length = zEnd - zStart;
        double tol = settings.relativeTolerance();
        double[] absTol = {tol * 1e-3, tol * 1e-3 / length, tol * 1e-3 * length, tol * 1e-3};
        double[] relTol = {tol, tol, tol, tol};
        DormandPrince853Integrator integrator =
                new DormandPrince853Integrator(length * 1e-12, length / 50, absTol, relTol);
        StepStore store = new StepStore();
        integrator.addStepHandler(store);
        integrator.integrate(new RayEquation(potential), new ODEState(zStart, new double[] {1, 0, 0, 1}), zEnd);
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

    /** Object-side reference plane, m. */
    public double zStart_m() {
        return zStart;
    }

    /** Image-side reference plane, m. */
    public double zEnd_m() {
        return zEnd;
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

    /** The fundamental matrix from zStart to z: columns are the rays (1, 0) and (0, 1) started at zStart. */
    private double[] fundamental(double z) {
        if (z < zStart - 1e-12 * (zEnd - zStart) || z > zEnd + 1e-12 * (zEnd - zStart)) {
            throw new IllegalArgumentException(String.format(java.util.Locale.ROOT,
                    "z = %.6f mm is outside the traced range %.6f .. %.6f mm", z * 1e3, zStart * 1e3, zEnd * 1e3));
        }
        double zc = Math.min(Math.max(z, zStart), zEnd);
        double[] y = dense.state(zc);
        return new double[] {y[0], y[2], y[1], y[3]};
    }

    /**
     * Transfer matrix between any two planes in [zStart, zEnd] (z2 may lie before z1: the backward map).
     * Planes outside the traced range are reached by field-free drifts.
     */
    public TransferMatrix transfer(double z1_m, double z2_m) {
        double in1 = clamp(z1_m);
        double in2 = clamp(z2_m);
        double[] m1 = fundamental(in1);
        double[] m2 = fundamental(in2);
        double det1 = m1[0] * m1[3] - m1[1] * m1[2];
        // inverse of m1
        double ia = m1[3] / det1;
        double ib = -m1[1] / det1;
        double ic = -m1[2] / det1;
        double id = m1[0] / det1;
        TransferMatrix core = new TransferMatrix(in1, in2,
                m2[0] * ia + m2[1] * ic, m2[0] * ib + m2[1] * id,
                m2[2] * ia + m2[3] * ic, m2[2] * ib + m2[3] * id);
        return TransferMatrix.drift(z1_m, in1).then(core).then(TransferMatrix.drift(in2, z2_m));
    }

    private double clamp(double z) {
        return Math.min(Math.max(z, zStart), zEnd);
    }

    /** Height and slope at z of the ray that has height r0 and slope s0 at z0 (both in the traced range or drifts). */
    public double[] ray(double z0_m, double r0_m, double slope0, double z_m) {
        TransferMatrix t = transfer(z0_m, z_m);
        return new double[] {t.height(r0_m, slope0), t.slope(r0_m, slope0)};
    }

    /** Cardinal elements between the reference planes, with the measured sensitivity to the plane positions. */
    public CardinalElements cardinal() {
        CardinalElements full = cardinalBetween(zStart, zEnd, true);
        double f = settings.planeCheckFraction();
        double inner1 = zStart + f * Math.max(0, lensCentreZ - zStart);
        double inner2 = zEnd - f * Math.max(0, zEnd - lensCentreZ);
        CardinalElements inner = cardinalBetween(inner1, inner2, false);
        double sensitivity = full.relativeDifference(inner);
        return new CardinalElements(full.zStart_m(), full.zEnd_m(), full.uObject_V(), full.uImage_V(),
                full.relativistic(), full.kind(), full.focalPointObjectZ_m(), full.focalPointImageZ_m(),
                full.principalPlaneObjectZ_m(), full.principalPlaneImageZ_m(), full.focalLengthObject_m(),
                full.focalLengthImage_m(), full.realFocusImageZ_m(), full.realFocusObjectZ_m(), sensitivity);
    }

    private CardinalElements cardinalBetween(double z1, double z2, boolean withRealFoci) {
        TransferMatrix m = transfer(z1, z2);
        double u1 = potential.u_V(z1);
        double u2 = potential.u_V(z2);
        OptionalDouble realImage = OptionalDouble.empty();
        OptionalDouble realObject = OptionalDouble.empty();
        CardinalElements c = CardinalElements.fromMatrix(m, u1, u2, relativistic(), realImage, realObject, 0);
        if (!withRealFoci) {
            return c;
        }
        // parallel ray from the object side: first crossing after z1
        realImage = firstCrossing(z1, 1, 0, z1, z2, true);
        if (realImage.isEmpty() && c.converging() && c.focalPointImageZ_m() >= z2) {
            realImage = OptionalDouble.of(c.focalPointImageZ_m());
        }
        // ray leaving parallel on the image side: last crossing before z2
        realObject = firstCrossing(z2, 1, 0, z1, z2, false);
        if (realObject.isEmpty() && c.converging() && c.focalPointObjectZ_m() <= z1) {
            realObject = OptionalDouble.of(c.focalPointObjectZ_m());
        }
        return CardinalElements.fromMatrix(m, u1, u2, relativistic(), realImage, realObject, 0);
    }

    /**
     * First axis crossing of the ray (r0, s0) given at z0, searched from a toward b (forward) or from b toward
     * a (backward), by sampling and Brent's method on the dense output.
     */
    OptionalDouble firstCrossing(double z0, double r0, double s0, double a, double b, boolean forward) {
        TransferMatrix back = transfer(z0, zStart);
        double rs = back.height(r0, s0);
        double ss = back.slope(r0, s0);
        java.util.function.DoubleUnaryOperator height = z -> {
            double[] m = fundamental(z);
            return m[0] * rs + m[1] * ss;
        };
        int n = Math.max(50, settings.scanPoints() / 2);
        double eps = 1e-9 * (b - a);
        double prevZ = forward ? a + eps : b - eps;
        double prev = height.applyAsDouble(prevZ);
        BrentSolver solver = new BrentSolver(1e-15, 1e-14 * (zEnd - zStart));
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
     * Imaging of an axial object at objectZ (before zEnd; before zStart it is reached by a drift): asymptotic
     * image position, magnifications and the real crossing of the axial ray if it lies inside the field.
     */
    public Imaging imaging(double objectZ_m) {
        if (!(objectZ_m < zEnd) || !Double.isFinite(objectZ_m)) {
            throw new IllegalArgumentException(String.format(java.util.Locale.ROOT,
                    "object z = %.4f mm must lie before the image-side plane %.4f mm", objectZ_m * 1e3, zEnd * 1e3));
        }
        TransferMatrix t = transfer(objectZ_m, zEnd);
        double imageZ;
        double lateral;
        TransferMatrix toImage;
        if (Math.abs(t.d()) * (zEnd - zStart) < CardinalElements.AFOCAL_LIMIT * Math.abs(t.b())) {
            imageZ = Double.POSITIVE_INFINITY;
            lateral = Double.POSITIVE_INFINITY;
            toImage = t;
        } else {
            imageZ = zEnd - t.b() / t.d();
            toImage = t.then(TransferMatrix.drift(zEnd, imageZ));
            lateral = toImage.a();
        }
        OptionalDouble real = firstCrossing(objectZ_m, 0, 1, Math.max(objectZ_m, zStart), zEnd, true);
        if (real.isEmpty() && imageZ >= zEnd && Double.isFinite(imageZ)) {
            real = OptionalDouble.of(imageZ);
        }
        return new Imaging(objectZ_m, imageZ, lateral, t.d(), real, toImage);
    }

    /** Spherical and chromatic aberration coefficients for an object at infinity (image side). */
    public Aberrations aberrations() {
        return AberrationIntegrals.atInfinity(this);
    }

    /** Aberration coefficients for an axial object at objectZ: image side at infinity plus object side. */
    public Aberrations aberrations(double objectZ_m) {
        return AberrationIntegrals.forObject(this, objectZ_m);
    }
}
