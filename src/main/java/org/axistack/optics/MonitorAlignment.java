package org.axistack.optics;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import org.axistack.field.FieldSolution;
import org.axistack.field.MisalignmentResponse.Motion;
import org.axistack.field.SectorField;
import org.axistack.model.Sectors;
import org.axistack.model.Stack;

/**
 * The bench side of the misalignment study: where the central ray passes every monitor plane per unit decentre and
 * tilt of each electrode ({@link CentralRayShift}), and, for every split electrode, the x differential bias that
 * brings the central ray back to the axis at the screen per unit misalignment (minus the screen shift over the
 * screen offset per volt of that bias, {@link SplitDeflection}; by the rotational symmetry the y bias cancels the
 * y motions alike). First order in both. With it, the absolute central ray of the aligned stack: the beam's start
 * offset and slopes ({@code [beam]}) carried from the start plane through the round lens and the stored sector
 * biases' deflection ({@link SplitDeflection#ray(int, Map, org.axistack.model.StartRay)}), at the screen and every
 * monitor; the misalignment shifts add to it (their cross terms with the start offset are of second order).
 * Immutable.
 *
 * @param monitorNames labels of the stack's monitors
 * @param monitorZ_m   their planes, m
 * @param shift        shift[k][motion][monitor]: x of the central ray at the monitor per metre of decentre or per
 *                     radian of tilt of electrode k (m/m, m/rad)
 * @param steerers     split electrode names
 * @param cancelBias_V cancelBias_V[s][k][motion]: x bias of steerer s that cancels the screen displacement per metre
 *                     of decentre or per radian of tilt of electrode k (V/m, V/rad); NaN when the x bias does not
 *                     move the ray along x at the screen
 * @param startZ_m     where the beam's central ray starts (the [beam] start, else the optics' start plane), m
 * @param aligned      aligned[p] = {x, y, x', y'} of the central ray of the aligned stack (start offset and slopes,
 *                     stored sector biases) at the screen (p = 0) and at monitor p - 1, m and rad
 */
public record MonitorAlignment(List<String> monitorNames, double[] monitorZ_m, double[][][] shift,
        List<String> steerers, double[][][] cancelBias_V, double startZ_m, double[][] aligned) {

    /**
     * @param stack    the stack as biased in the study
     * @param solution its round solution
     * @param study    the misalignment study (its central-ray shifts and harmonic-1 operator)
     */
    public static MonitorAlignment of(Stack stack, FieldSolution solution, MisalignmentStudy study) {
        int ne = stack.electrodes().size();
        int nm = stack.monitors().size();
        List<String> labels = new ArrayList<>();
        double[] z = new double[nm];
        for (int i = 0; i < nm; i++) {
            labels.add(stack.monitorLabel(i));
            z[i] = stack.monitors().get(i).z_m();
        }
        double[][][] shift = new double[ne][2][nm];
        for (int k = 0; k < ne; k++) {
            for (Motion m : Motion.values()) {
                for (int i = 0; i < nm; i++) {
                    shift[k][m.ordinal()][i] = study.shift().at(k, m, z[i])[0];
                }
            }
        }
        List<String> names = new ArrayList<>();
        double[][][] cancel = new double[0][][];
        ParaxialOptics optics = study.optics();
        double screen = study.budget().screenZ_m();
        double start = stack.beam().startZ_m().orElse(optics.zStart_m());
        double[] planes = new double[nm + 1];
        planes[0] = screen;
        System.arraycopy(z, 0, planes, 1, nm);
        org.axistack.model.StartRay sr = stack.beam().startRay();
        double[][] aligned = new double[nm + 1][];
        for (int p = 0; p <= nm; p++) {
            TransferMatrix t = optics.transfer(start, planes[p]);
            aligned[p] = new double[] {t.height(sr.x_m(), sr.slopeX_rad()), t.height(sr.y_m(), sr.slopeY_rad()),
                t.slope(sr.x_m(), sr.slopeX_rad()), t.slope(sr.y_m(), sr.slopeY_rad())};
        }
        if (stack.hasSectors()) {
            Map<Integer, Sectors> byIndex = new LinkedHashMap<>();
            for (String n : stack.names()) {
                if (stack.sectors().containsKey(n)) {
                    byIndex.put(stack.indexOf(n), stack.sectors().get(n));
                    names.add(n);
                }
            }
            SectorField field = SectorField.dipole(solution, byIndex, study.dipole());
            SplitDeflection d = SplitDeflection.of(field, optics, optics.zStart_m(), new double[] {screen});
            Map<Integer, List<Double>> stored = new LinkedHashMap<>();
            byIndex.forEach((e, sec) -> stored.put(e, sec.biases_V()));
            SplitDeflection from = SplitDeflection.of(field, optics, start, planes);
            for (int p = 0; p <= nm; p++) {
                aligned[p] = from.ray(p, stored, sr);
            }
            cancel = new double[names.size()][ne][2];
            for (int s = 0; s < names.size(); s++) {
                double per = d.perVolt(0, stack.indexOf(names.get(s))).xPerVx_m();
                for (int k = 0; k < ne; k++) {
                    for (Motion m : Motion.values()) {
                        double sh = study.shift().at(k, m, screen)[0];
                        cancel[s][k][m.ordinal()] = per == 0 ? Double.NaN : -sh / per;
                    }
                }
            }
        }
        return new MonitorAlignment(labels, z, shift, names, cancel, start, aligned);
    }
}
