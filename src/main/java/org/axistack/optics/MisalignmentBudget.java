package org.axistack.optics;

import java.util.ArrayList;
import java.util.List;

import org.axistack.field.MisalignmentResponse.Motion;

/**
 * Misalignment sensitivities of every electrode at a screen plane and the tolerance budget that keeps the
 * central ray within an allowed displacement there.
 *
 * <p>Per electrode: the central ray's displacement and slope at the screen per unit decentre (m per m) and
 * per unit tilt (m per rad; tilt about a transverse axis through the electrode's centre), and how much the
 * displacement changes per volt of the focus bias (the spot walk on refocusing).
 *
 * <p>Budget (assumption stated in every output): the misalignments are independent random errors, each
 * electrode's decentre and tilt taken as RMS values; the displacement along one transverse direction is fed by
 * the decentre along it and the tilt about the other transverse axis of every electrode, N = 2 x electrodes
 * terms, which add in quadrature; the allowance is shared equally, so each tolerance is
 * allowed / (|sensitivity| sqrt(N)) and the RMS displacement along each direction equals the allowance. The
 * single-error tolerance (only that electrode off) is allowed / |sensitivity|.
 *
 * <p>Spot growth (when the beam has a real image and an aperture angle is given): each misalignment adds axial coma
 * ({@link MisalignmentAberrations}); its figure at the beam's image-side half-angle has a length ell per unit
 * misalignment. The coma of all errors (decentre and tilt along both transverse directions: 4 x electrodes terms)
 * adds in quadrature (exact for the RMS of each coma coefficient when the errors are independent and random; the
 * figure's length taken as that of the RMS coefficients), the growth allowance shared equally: a growth tolerance
 * allowedGrowth / (ell sqrt(4 x electrodes)). Each budget tolerance is the smaller of its displacement and growth
 * tolerances. Immutable.
 *
 * @param screenZ_m      plane the displacement is allowed at, m
 * @param allowed_m      allowed displacement of the spot at the screen, m
 * @param focusElectrode index of the electrode whose bias focuses (-1: none; walks are NaN)
 * @param rows           one per electrode, stack order
 * @param tightestDecentre index of the electrode with the smallest decentre tolerance
 * @param tightestTilt   index of the electrode with the smallest tilt tolerance
 * @param aperture_rad   image-side half-angle of the beam the growth is computed at (NaN: no growth computed)
 * @param allowedGrowth_m allowed growth of the spot (length of the coma figure), m (NaN: no growth computed)
 * @param imageZ_m       the beam's Gaussian image, where the coma is given (NaN: none)
 */
public record MisalignmentBudget(double screenZ_m, double allowed_m, int focusElectrode, List<Row> rows,
        int tightestDecentre, int tightestTilt, double aperture_rad, double allowedGrowth_m, double imageZ_m) {

    /**
     * One electrode.
     *
     * @param name                   electrode name
     * @param decentreShift          screen displacement per metre of decentre (m/m)
     * @param decentreSlope          central-ray slope at the screen per metre of decentre (1/m)
     * @param tiltShift              screen displacement per radian of tilt (m/rad)
     * @param tiltSlope              slope per radian of tilt (1/rad)
     * @param decentreWalk_per_V     change of the decentre displacement per volt of focus bias (m/m/V)
     * @param tiltWalk_per_V         change of the tilt displacement per volt of focus bias (m/rad/V)
     * @param decentreTolerance_m    budget tolerance on the decentre (RMS, each direction), m
     * @param tiltTolerance_rad      budget tolerance on the tilt (RMS, about each axis), rad
     * @param decentreAlone_m        tolerance if this decentre were the only error, m
     * @param tiltAlone_rad          tolerance if this tilt were the only error, rad
     * @param coma                   the axial coma of the decentre and the tilt (NaN when not computed)
     */
    public record Row(String name, double decentreShift, double decentreSlope, double tiltShift, double tiltSlope,
            double decentreWalk_per_V, double tiltWalk_per_V, double decentreTolerance_m, double tiltTolerance_rad,
            double decentreAlone_m, double tiltAlone_rad, Coma coma) {

        /** Whether the decentre tolerance is set by the spot growth rather than the displacement. */
        public boolean decentreLimitedByGrowth() {
            return coma.decentreGrowthTolerance_m() <= decentreTolerance_m;
        }

        /** Whether the tilt tolerance is set by the spot growth rather than the displacement. */
        public boolean tiltLimitedByGrowth() {
            return coma.tiltGrowthTolerance_rad() <= tiltTolerance_rad;
        }
    }

    /**
     * The axial coma one electrode's misalignment adds at the beam's image (image-side aperture alpha: a ray lands
     * at eps [A alpha conj(alpha) + B alpha^2] from the central ray, {@link MisalignmentAberrations}).
     *
     * @param decentreRound_m           A per metre of decentre, m per rad^2 of aperture
     * @param decentreCircle_m          B per metre of decentre
     * @param tiltRound_m               A per radian of tilt, m per rad^2
     * @param tiltCircle_m              B per radian of tilt
     * @param decentreGrowth            length of the coma figure at the beam's aperture per metre of decentre (m/m)
     * @param tiltGrowth                the same per radian of tilt (m/rad)
     * @param decentreGrowthTolerance_m decentre that uses this electrode's share of the growth allowance, m
     * @param tiltGrowthTolerance_rad   tilt that uses its share, rad
     */
    public record Coma(double decentreRound_m, double decentreCircle_m, double tiltRound_m, double tiltCircle_m,
            double decentreGrowth, double tiltGrowth, double decentreGrowthTolerance_m, double tiltGrowthTolerance_rad) {

        /** No coma computed. */
        public static final Coma NONE = new Coma(Double.NaN, Double.NaN, Double.NaN, Double.NaN, Double.NaN, Double.NaN,
                Double.POSITIVE_INFINITY, Double.POSITIVE_INFINITY);
    }

    public MisalignmentBudget {
        rows = List.copyOf(rows);
    }

    /** Number of terms added in quadrature along one transverse direction. */
    public int terms() {
        return 2 * rows.size();
    }

    /** The stated assumption, for every output. */
    public static String assumption() {
        return "tolerances assume independent random errors (decentre and tilt of each electrode as RMS values) "
                + "adding in quadrature, the allowance shared equally over 2 x electrodes terms per transverse "
                + "direction; first-order (linear) responses";
    }

    /** The stated assumption of the growth budget, for every output. */
    public static String growthAssumption() {
        return "spot growth: the axial coma of every error (decentre and tilt along both transverse directions, "
                + "4 x electrodes terms) adds in quadrature, the growth allowance shared equally; growth = length of "
                + "the coma figure of the beam's cone at its image; each tolerance is the smaller of the displacement "
                + "and growth tolerances";
    }

    /** Whether the spot growth was computed (a real image and an aperture angle). */
    public boolean hasGrowth() {
        return Double.isFinite(aperture_rad) && Double.isFinite(imageZ_m);
    }

    /**
     * Builds the budget.
     *
     * @param names     electrode names, stack order
     * @param shift     the central-ray shifts of the stack as biased
     * @param focusUp   the shifts with the focus bias raised by {@code step_V} (null: no walks)
     * @param focusDown the shifts with the focus bias lowered by {@code step_V} (null: no walks)
     * @param step_V    the focus-bias step of the central difference, V
     */
    public static MisalignmentBudget of(List<String> names, CentralRayShift shift, int focusElectrode,
            CentralRayShift focusUp, CentralRayShift focusDown, double step_V, double screenZ_m, double allowed_m) {
        return of(names, shift, focusElectrode, focusUp, focusDown, step_V, screenZ_m, allowed_m, null, Double.NaN,
                Double.NaN);
    }

    /**
     * Builds the budget with the spot-growth allowance.
     *
     * @param coma            the axial coma of every electrode's decentre and tilt (null: no growth budget)
     * @param aperture_rad    the beam's image-side half-angle
     * @param allowedGrowth_m allowed length of the coma figure, m
     */
    public static MisalignmentBudget of(List<String> names, CentralRayShift shift, int focusElectrode,
            CentralRayShift focusUp, CentralRayShift focusDown, double step_V, double screenZ_m, double allowed_m,
            MisalignmentAberrations coma, double aperture_rad, double allowedGrowth_m) {
        if (coma != null && (!(aperture_rad > 0) || !Double.isFinite(aperture_rad) || !(allowedGrowth_m > 0)
                || !Double.isFinite(allowedGrowth_m))) {
            throw new IllegalArgumentException("aperture angle and allowed growth must be positive and finite, got "
                    + aperture_rad + ", " + allowedGrowth_m);
        }
        double rootGrowth = Math.sqrt(4.0 * names.size());
        if (!(allowed_m > 0) || !Double.isFinite(allowed_m)) {
            throw new IllegalArgumentException("allowed displacement must be positive and finite, got " + allowed_m);
        }
        int ne = names.size();
        double root = Math.sqrt(2.0 * ne);
        List<Row> rows = new ArrayList<>();
        int tightD = -1;
        int tightT = -1;
        for (int k = 0; k < ne; k++) {
            double[] d = shift.at(k, Motion.DECENTRE, screenZ_m);
            double[] t = shift.at(k, Motion.TILT, screenZ_m);
            double walkD = Double.NaN;
            double walkT = Double.NaN;
            if (focusUp != null && focusDown != null) {
                walkD = (focusUp.at(k, Motion.DECENTRE, screenZ_m)[0] - focusDown.at(k, Motion.DECENTRE, screenZ_m)[0])
                        / (2 * step_V);
                walkT = (focusUp.at(k, Motion.TILT, screenZ_m)[0] - focusDown.at(k, Motion.TILT, screenZ_m)[0])
                        / (2 * step_V);
            }
            Coma c = Coma.NONE;
            double aloneD = Double.POSITIVE_INFINITY;
            double aloneT = Double.POSITIVE_INFINITY;
            if (coma != null) {
                double gd = coma.comaLength(2 * k, aperture_rad);
                double gt = coma.comaLength(2 * k + 1, aperture_rad);
                c = new Coma(coma.comaRound()[2 * k], coma.comaCircle()[2 * k], coma.comaRound()[2 * k + 1],
                        coma.comaCircle()[2 * k + 1], gd, gt, allowedGrowth_m / (gd * rootGrowth),
                        allowedGrowth_m / (gt * rootGrowth));
                aloneD = allowedGrowth_m / gd;
                aloneT = allowedGrowth_m / gt;
            }
            Row row = new Row(names.get(k), d[0], d[1], t[0], t[1], walkD, walkT,
                    Math.min(allowed_m / (Math.abs(d[0]) * root), c.decentreGrowthTolerance_m()),
                    Math.min(allowed_m / (Math.abs(t[0]) * root), c.tiltGrowthTolerance_rad()),
                    Math.min(allowed_m / Math.abs(d[0]), aloneD), Math.min(allowed_m / Math.abs(t[0]), aloneT), c);
            rows.add(row);
            if (tightD < 0 || row.decentreTolerance_m() < rows.get(tightD).decentreTolerance_m()) {
                tightD = k;
            }
            if (tightT < 0 || row.tiltTolerance_rad() < rows.get(tightT).tiltTolerance_rad()) {
                tightT = k;
            }
        }
        return new MisalignmentBudget(screenZ_m, allowed_m, focusElectrode, rows, tightD, tightT,
                coma == null ? Double.NaN : aperture_rad, coma == null ? Double.NaN : allowedGrowth_m,
                coma == null ? Double.NaN : coma.imageZ_m());
    }
}
