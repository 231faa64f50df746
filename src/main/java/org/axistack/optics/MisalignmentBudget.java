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
 * single-error tolerance (only that electrode off) is allowed / |sensitivity|. Immutable.
 *
 * @param screenZ_m      plane the displacement is allowed at, m
 * @param allowed_m      allowed displacement of the spot at the screen, m
 * @param focusElectrode index of the electrode whose bias focuses (-1: none; walks are NaN)
 * @param rows           one per electrode, stack order
 * @param tightestDecentre index of the electrode with the smallest decentre tolerance
 * @param tightestTilt   index of the electrode with the smallest tilt tolerance
 */
public record MisalignmentBudget(double screenZ_m, double allowed_m, int focusElectrode, List<Row> rows,
        int tightestDecentre, int tightestTilt) {

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
     */
    public record Row(String name, double decentreShift, double decentreSlope, double tiltShift, double tiltSlope,
            double decentreWalk_per_V, double tiltWalk_per_V, double decentreTolerance_m, double tiltTolerance_rad,
            double decentreAlone_m, double tiltAlone_rad) {
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
            Row row = new Row(names.get(k), d[0], d[1], t[0], t[1], walkD, walkT,
                    allowed_m / (Math.abs(d[0]) * root), allowed_m / (Math.abs(t[0]) * root),
                    allowed_m / Math.abs(d[0]), allowed_m / Math.abs(t[0]));
            rows.add(row);
            if (tightD < 0 || row.decentreTolerance_m() < rows.get(tightD).decentreTolerance_m()) {
                tightD = k;
            }
            if (tightT < 0 || row.tiltTolerance_rad() < rows.get(tightT).tiltTolerance_rad()) {
                tightT = k;
            }
        }
        return new MisalignmentBudget(screenZ_m, allowed_m, focusElectrode, rows, tightD, tightT);
    }
}
