package org.axistack.ui;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import org.axistack.field.SectorField;
import org.axistack.model.Units;
import org.axistack.model.Sectors;
import org.axistack.model.Stack;
import org.axistack.optics.ParaxialOptics;
import org.axistack.optics.SplitDeflection;
import org.axistack.report.LensChart;

/**
 * The central ray of a stack with split electrodes, as the window draws it: x(z) and y(z) from the beam start to
 * the screen at the sector biases shown, first order in the sector biases (the dipole harmonic, as the optics and
 * aim commands compute it) and including the beam's start offset and slopes, and where it lands on the screen.
 *
 * @param x          x of the central ray against z, mm
 * @param y          y of the central ray against z, mm
 * @param screenZ_mm the plane it is followed to (the screen, else the image-side reference plane), mm
 * @param screen     {x, y, x', y'} at that plane, mm and mrad
 */
public record CentralRayView(LensChart.Lines x, LensChart.Lines y, double screenZ_mm, double[] screen) {

    /** Planes at which the ray is sampled for the drawing. */
    static final int PLANES = 81;

    public CentralRayView {
        screen = screen.clone();
    }

    /** {x, y, x', y'} at the screen, mm and mrad (a copy). */
    @Override
    public double[] screen() {
        return screen.clone();
    }

    /**
     * The central ray for the stack's biases and sector biases.
     *
     * @param stack   the stack at the biases shown (its sectors carry the sector biases)
     * @param optics  the round lens's paraxial optics at those biases
     * @param sectors the solved dipole harmonic of the split electrodes
     */
    static CentralRayView of(Stack stack, ParaxialOptics optics, SectorField sectors) {
        double zEnd = stack.screenZ_m().orElse(optics.zEnd_m());
        double zStart = stack.beam().startZ_m().orElse(optics.zStart_m());
        double[] planes = new double[PLANES];
        for (int p = 0; p < PLANES; p++) {
            planes[p] = zStart + (zEnd - zStart) * p / (PLANES - 1);
        }
        SplitDeflection d = SplitDeflection.of(sectors, optics, zStart, planes);
        Map<Integer, List<Double>> biases = new LinkedHashMap<>();
        stack.sectors().forEach((name, s) -> biases.put(stack.indexOf(name), s.biases_V()));
        LensChart.LinesBuilder x = new LensChart.LinesBuilder();
        LensChart.LinesBuilder y = new LensChart.LinesBuilder();
        double[] last = null;
        for (int p = 0; p < PLANES; p++) {
            last = d.ray(p, biases, stack.beam().startRay());
            x.add(Units.mToMm(planes[p]), Units.mToMm(last[0]));
            y.add(Units.mToMm(planes[p]), Units.mToMm(last[1]));
        }
        return new CentralRayView(x.build(), y.build(), Units.mToMm(zEnd), new double[] {Units.mToMm(last[0]),
            Units.mToMm(last[1]), Units.radToMrad(last[2]), Units.radToMrad(last[3])});
    }

    /**
     * The stack with each named split electrode's sectors set from its bias (common mode) and the given x and y
     * differential biases; a sector pattern beyond the dipole (stigmation) is not kept for those. Electrodes not
     * named keep their stored sector biases (moved in common mode with their bias).
     */
    static Stack withDifferentials(Stack stack, Map<String, double[]> xy_V) {
        Stack out = stack;
        for (Map.Entry<String, Sectors> e : stack.sectors().entrySet()) {
            Sectors s = e.getValue();
            double[] d = xy_V.get(e.getKey());
            if (d == null) {
                continue;
            }
            out = out.withSectors(e.getKey(), Sectors.fromDifferentials(s.count(), s.rotation_rad(), s.slitWidth_m(),
                    stack.electrode(e.getKey()).bias_V(), d[0], d[1]));
        }
        return out;
    }
}
