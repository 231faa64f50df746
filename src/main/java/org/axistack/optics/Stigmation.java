package org.axistack.optics;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.OptionalDouble;

import org.axistack.field.SectorField;
import org.axistack.model.Sectors;

/**
 * Astigmatism of split electrodes that carry a quadrupole (m = 2) harmonic (stigmators), to first order in their
 * sector biases. Near the axis the quadrupole harmonic adds Phi_c(z) (x^2 - y^2) + Phi_s(z) 2xy to the potential
 * (Phi_c, Phi_s the coefficients of r^2 cos 2phi and r^2 sin 2phi), so the relativistic paraxial equations of the
 * round lens gain a term each (derivation in src/site/markdown/harmonic-field.md):
 *
 * <pre>
 *   x'' + (g U'/(2U*)) x' + (g U''/(4U*)) x = -k_c x - k_s y,   k_c = sign(q) g Phi_c / U*,
 *   y'' + (g U'/(2U*)) y' + (g U''/(4U*)) y = +k_c y - k_s x,   k_s = sign(q) g Phi_s / U*.
 * </pre>
 *
 * To first order the right-hand side is a source driven by the round lens's own ray x0(z): the dipole-source
 * equation of {@link CentralRayDeflection} with Phi_1 replaced by 2 Phi_2(z) x0(z), solved there by variation of
 * constants. Two rays per stigmator: the ray entering parallel to the axis (its change of outgoing slope is the
 * change of image-side focal power, its change of axis crossing the focal point's shift) and the axial ray from the
 * stack's object (the image plane's shift). Per unit cos(2phi) coefficient a_2 of stigmator e this gives, for rays
 * in the x-z plane, the power change D_e, the focal-point shift F_e and the image shift T_e; rays in the y-z plane
 * get the opposite, and a ray plane at angle psi gets c cos 2psi + s sin 2psi with (c, s) = sum_e (a_2, b_2) (D_e,
 * F_e or T_e): a {@link Split}. Its magnitude is half the spread between the two principal planes, its axis (half
 * the angle of (c, s)) the principal plane that gains. Linear in the sector biases by construction; the
 * neglected terms are second order in the bias for each focus, and the astigmatic difference (odd in the bias) errs
 * at relative order bias^2 (measured against exact rays in harmonic-field.md). Immutable.
 */
public final class Stigmation {

    /**
     * A first-order quadrupole effect as a vector in twice the azimuth: rays in the plane at angle psi from the
     * x-z plane get {@code c cos 2psi + s sin 2psi}.
     *
     * @param c the value for rays in the x-z plane (minus that for the y-z plane)
     * @param s the value for rays in the plane at +45 degrees
     */
    public record Split(double c, double s) {

        /** Value for rays in the plane at angle psi (rad) from the x-z plane. */
        public double along(double psi_rad) {
            return c * Math.cos(2 * psi_rad) + s * Math.sin(2 * psi_rad);
        }

        /** Half the difference between the two principal planes (the value along {@link #axis_rad()}). */
        public double magnitude() {
            return Math.hypot(c, s);
        }

        /** The principal plane whose value is +magnitude, rad from the x-z plane, in (-pi/2, pi/2]. */
        public double axis_rad() {
            return 0.5 * Math.atan2(s, c);
        }

        Split plus(Split o) {
            return new Split(c + o.c, s + o.s);
        }

        Split times(double k) {
            return new Split(c * k, s * k);
        }
    }

    /**
     * Effect per volt of one sector pattern of a stigmator: 0 degrees (sector s at cos 2 theta_s, principal planes
     * along x and y) or 45 degrees (sin 2 theta_s).
     *
     * @param electrode    electrode index
     * @param patternDeg   0 or 45
     * @param power_per_m  change of image-side focal power per volt, 1/m per V
     * @param focus_m      shift of the image-side focal point per volt, m per V (NaN for an afocal lens)
     * @param image_m      shift of the image of the stack's object per volt, m per V (NaN without one)
     */
    public record PerVolt(int electrode, int patternDeg, Split power_per_m, Split focus_m, Split image_m) {

        /** Whether the pattern has a quadrupole component at all (a four-sector electrode makes only one). */
        public boolean present() {
            return power_per_m.magnitude() > 0 || focus_m.magnitude() > 0;
        }
    }

    /**
     * Stigmator pattern biases that cancel an astigmatism, and what is left.
     *
     * @param settings   per stigmator electrode {0-degree, 45-degree} pattern biases to add, V
     * @param residual   the image (or focus) split left after adding them, m
     */
    public record Cancel(Map<Integer, double[]> settings, Split residual) {
    }

    private final ParaxialOptics optics;
    private final Map<Integer, Sectors> stigmators;
    private final List<Integer> order;
    private final double[] power;
    private final double[] focus;
    private final double[] image;
    private final double f2;
    private final double focalPointZ;
    private final double imageZ;

    private Stigmation(ParaxialOptics optics, Map<Integer, Sectors> stigmators, List<Integer> order, double[] power,
            double[] focus, double[] image, double f2, double focalPointZ, double imageZ) {
        this.optics = optics;
        this.stigmators = stigmators;
        this.order = order;
        this.power = power;
        this.focus = focus;
        this.image = image;
        this.f2 = f2;
        this.focalPointZ = focalPointZ;
        this.imageZ = imageZ;
    }

    /**
     * The unit effects of every split electrode that carries the quadrupole harmonic.
     *
     * @param field    the solved harmonics (must include m = 2 for the stigmators)
     * @param optics   the round lens at the electrodes' common biases
     * @param objectZ  the stack's axial object, if any (empty: object at infinity, the image is the focal point)
     */
    public static Stigmation of(SectorField field, ParaxialOptics optics, OptionalDouble objectZ) {
        Map<Integer, Sectors> st = new LinkedHashMap<>();
        field.split().forEach((e, s) -> {
            if (s.carries(2)) {
                st.put(e, s);
            }
        });
        if (!st.isEmpty() && field.operator(2) == null) {
            throw new IllegalArgumentException("the quadrupole harmonic (m = 2) was not solved");
        }
        List<Integer> es = List.copyOf(st.keySet());
        int n = es.size();
        double zS = optics.zStart_m();
        double zE = optics.zEnd_m();
        TransferMatrix asym = optics.asymptoticTransfer();
        TransferMatrix exit = optics.toImageAsymptote();
        double a = asym.a();
        double c = asym.c();
        double length = zE - zS;
        boolean afocal = Math.abs(c) * length < CardinalElements.AFOCAL_LIMIT;
        double f2 = afocal ? Double.POSITIVE_INFINITY : -1 / c;
        double fz = afocal ? Double.NaN : zE - a / c;
        boolean withObject = objectZ.isPresent() && objectZ.getAsDouble() < zE;
        double zo = withObject ? objectZ.getAsDouble() : Double.NaN;
        TransferMatrix axial = withObject ? optics.transfer(zo, zE).then(exit) : null;
        double h = withObject ? axial.b() : Double.NaN;
        double sl = withObject ? axial.d() : Double.NaN;
        boolean imaged = withObject && Math.abs(sl) * length >= CardinalElements.AFOCAL_LIMIT * Math.abs(h);
        double iz = imaged ? zE - h / sl : Double.NaN;
        int k = imaged ? 2 * n : n;
        List<java.util.function.DoubleUnaryOperator> quad = new ArrayList<>();
        for (int e : es) {
            quad.add(field.unitFunction(e, 2));
        }
        CentralRayDeflection.Sources sources = new CentralRayDeflection.Sources() {
            @Override
            public int count() {
                return k;
            }

            @Override
            public void at(double z, double[] out) {
                double parallel = optics.fromObjectAsymptote(z).height(1, 0);
                double fromObject = imaged && z > zo ? optics.transfer(zo, z).height(0, 1) : 0;
                for (int i = 0; i < n; i++) {
                    double q = quad.get(i).applyAsDouble(z);
                    out[i] = 2 * q * parallel;
                    if (imaged) {
                        out[n + i] = 2 * q * fromObject;
                    }
                }
            }
        };
        double[] pw = new double[n];
        double[] fc = new double[n];
        double[] im = new double[n];
        java.util.Arrays.fill(im, Double.NaN);
        if (n > 0) {
            CentralRayDeflection d = CentralRayDeflection.of(optics, zS, zE, new double[] {zE}, sources,
                    CentralRayDeflection.DEFAULT_INTERVALS);
            for (int i = 0; i < n; i++) {
                double dx = d.unitOffset_m(0, i);
                double ds = d.unitSlope_rad(0, i);
                double da = exit.height(dx, ds);
                double dc = exit.slope(dx, ds);
                pw[i] = -dc;
                fc[i] = afocal ? Double.NaN : -da / c + a * dc / (c * c);
                if (imaged) {
                    double dh = exit.height(d.unitOffset_m(0, n + i), d.unitSlope_rad(0, n + i));
                    double dsl = exit.slope(d.unitOffset_m(0, n + i), d.unitSlope_rad(0, n + i));
                    im[i] = -dh / sl + h * dsl / (sl * sl);
                }
            }
        }
        return new Stigmation(optics, st, es, pw, fc, im, f2, fz, iz);
    }

    /** The stigmators (split electrodes carrying m = 2), by electrode index. */
    public List<Integer> electrodes() {
        return order;
    }

    /** The round lens. */
    public ParaxialOptics optics() {
        return optics;
    }

    /** Image-side focal length of the round lens, m (infinite when afocal). */
    public double focalLength_m() {
        return f2;
    }

    /** Image-side focal point of the round lens, m (NaN when afocal). */
    public double focalPointZ_m() {
        return focalPointZ;
    }

    /** Image of the stack's object through the round lens, m (NaN without an object or a finite image). */
    public double imageZ_m() {
        return imageZ;
    }

    /** Whether image shifts refer to an image of the object (else to the focal point). */
    public boolean hasImage() {
        return Double.isFinite(imageZ);
    }

    /** Per unit a_2 (V) of stigmator e, rays in the x-z plane: {power 1/m, focal-point shift m, image shift m}. */
    public double[] unit(int electrode) {
        int i = index(electrode);
        return new double[] {power[i], focus[i], image[i]};
    }

    private int index(int electrode) {
        int i = order.indexOf(electrode);
        if (i < 0) {
            throw new IllegalArgumentException("electrode " + electrode + " carries no quadrupole harmonic");
        }
        return i;
    }

    /** The power, focus and image splits for the given sector biases (by electrode index; absent: none). */
    public Split[] at(Map<Integer, List<Double>> sectorBiases_V) {
        Split p = new Split(0, 0);
        Split f = new Split(0, 0);
        Split m = new Split(0, 0);
        for (int i = 0; i < order.size(); i++) {
            List<Double> b = sectorBiases_V.get(order.get(i));
            if (b == null) {
                continue;
            }
            double[] ab = stigmators.get(order.get(i)).harmonic(2, b);
            p = p.plus(new Split(ab[0], ab[1]).times(power[i]));
            f = f.plus(new Split(ab[0], ab[1]).times(focus[i]));
            m = m.plus(new Split(ab[0], ab[1]).times(image[i]));
        }
        return new Split[] {p, f, m};
    }

    /** The image split when the object has an image, else the focal-point split. */
    public Split astigmatism(Map<Integer, List<Double>> sectorBiases_V) {
        Split[] s = at(sectorBiases_V);
        return hasImage() ? s[2] : s[1];
    }

    /**
     * Sector pattern of the 0- or 45-degree quadrupole: cos 2 theta_s or sin 2 theta_s per sector, V per V (for
     * four sectors at 0, 90, 180, 270 degrees the 45-degree pattern is all zeros: such a stigmator makes only the
     * 0-degree one).
     */
    public static List<Double> pattern(Sectors s, int patternDeg) {
        List<Double> p = new ArrayList<>();
        for (int i = 0; i < s.count(); i++) {
            double t = 2 * s.centre_rad(i);
            double v = patternDeg == 0 ? Math.cos(t) : Math.sin(t);
            // sectors on the pattern's nodes get exactly 0 (not the 1e-16 of a rounded angle), so a pattern that
            // the sectors cannot make is exactly absent
            p.add(Math.abs(v) < 1e-12 ? 0.0 : v);
        }
        return p;
    }

    /** Effect per volt of the 0- or 45-degree pattern of stigmator e. */
    public PerVolt perVolt(int electrode, int patternDeg) {
        int i = index(electrode);
        double[] ab = stigmators.get(electrode).harmonic(2, pattern(stigmators.get(electrode), patternDeg));
        Split u = new Split(ab[0], ab[1]);
        return new PerVolt(electrode, patternDeg, u.times(power[i]), u.times(focus[i]), u.times(image[i]));
    }

    /**
     * The pattern biases of the stigmators that cancel an astigmatism of the image (or the focal point): rays in
     * the plane at angle axis focus {@code difference} downstream of those in the perpendicular plane. Least
     * squares with the least total bias (the pseudo-inverse of the 2 x 2n map from pattern biases to the split):
     * a four-sector stigmator acts along one pair of planes only, so an astigmatism along others is cancelled only
     * in part (the residual says how much is left).
     */
    public Cancel cancel(double difference_m, double axis_rad) {
        Split given = new Split(0.5 * difference_m * Math.cos(2 * axis_rad), 0.5 * difference_m * Math.sin(2 * axis_rad));
        int n = order.size();
        double[][] j = new double[2][2 * n];
        for (int i = 0; i < n; i++) {
            for (int p = 0; p < 2; p++) {
                Split s = hasImage() ? perVolt(order.get(i), 45 * p).image_m() : perVolt(order.get(i), 45 * p).focus_m();
                j[0][2 * i + p] = Double.isFinite(s.c()) ? s.c() : 0;
                j[1][2 * i + p] = Double.isFinite(s.s()) ? s.s() : 0;
            }
        }
        // pseudo-inverse through the 2 x 2 Gram matrix G = J J^T (symmetric): eigen-decomposition in closed form
        double g00 = 0;
        double g01 = 0;
        double g11 = 0;
        for (int i = 0; i < 2 * n; i++) {
            g00 += j[0][i] * j[0][i];
            g01 += j[0][i] * j[1][i];
            g11 += j[1][i] * j[1][i];
        }
        double mean = 0.5 * (g00 + g11);
        double rad = Math.hypot(0.5 * (g00 - g11), g01);
        double l1 = mean + rad;
        double l2 = mean - rad;
        double th = 0.5 * Math.atan2(2 * g01, g00 - g11);
        double[] e1 = {Math.cos(th), Math.sin(th)};
        double[] e2 = {-Math.sin(th), Math.cos(th)};
        double[] want = {-given.c(), -given.s()};
        double[] y = new double[2];
        double cut = 1e-12 * l1;
        if (l1 > 0) {
            double p1 = (e1[0] * want[0] + e1[1] * want[1]) / l1;
            y[0] += p1 * e1[0];
            y[1] += p1 * e1[1];
        }
        if (l2 > cut && l2 > 0) {
            double p2 = (e2[0] * want[0] + e2[1] * want[1]) / l2;
            y[0] += p2 * e2[0];
            y[1] += p2 * e2[1];
        }
        Map<Integer, double[]> settings = new LinkedHashMap<>();
        double rc = given.c();
        double rs = given.s();
        for (int i = 0; i < n; i++) {
            double v0 = j[0][2 * i] * y[0] + j[1][2 * i] * y[1];
            double v45 = j[0][2 * i + 1] * y[0] + j[1][2 * i + 1] * y[1];
            settings.put(order.get(i), new double[] {v0, v45});
            rc += j[0][2 * i] * v0 + j[0][2 * i + 1] * v45;
            rs += j[1][2 * i] * v0 + j[1][2 * i + 1] * v45;
        }
        return new Cancel(settings, new Split(rc, rs));
    }
}
