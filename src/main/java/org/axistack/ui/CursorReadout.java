package org.axistack.ui;

import java.awt.geom.Point2D;
import java.awt.geom.Rectangle2D;
import java.util.Locale;

import org.axistack.model.Units;
import org.jfree.chart.ChartMouseEvent;
import org.jfree.chart.ChartMouseListener;
import org.jfree.chart.ChartRenderingInfo;
import org.jfree.chart.plot.PlotRenderingInfo;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.ui.RectangleEdge;

/**
 * The status-bar read-out under the mouse: over the cross-section z, r, the potential and the field (E_z, E_r)
 * of the re-biased boundary-element field there; over the axial plot z and the axial potential.
 */
final class CursorReadout implements ChartMouseListener {

    private final LensWindow w;

    CursorReadout(LensWindow w) {
        this.w = w;
    }

    @Override
    public void chartMouseClicked(ChartMouseEvent event) {
    }

    @Override
    public void chartMouseMoved(ChartMouseEvent event) {
        LensView v = w.current;
        ChartRenderingInfo info = w.chartPanel.getChartRenderingInfo();
        if (v == null || w.lensChart == null || info == null) {
            return;
        }
        Point2D p = w.chartPanel.translateScreenToJava2D(event.getTrigger().getPoint());
        PlotRenderingInfo plotInfo = info.getPlotInfo();
        int i = plotInfo.getSubplotIndex(p);
        if (i < 0) {
            w.readout.setText(" ");
            return;
        }
        Rectangle2D area = plotInfo.getSubplotInfo(i).getDataArea();
        XYPlot plot = i == 0 ? w.lensChart.section() : w.lensChart.potential();
        double zMm = plot.getDomainAxis().java2DToValue(p.getX(), area, RectangleEdge.BOTTOM);
        double yVal = plot.getRangeAxis().java2DToValue(p.getY(), area, RectangleEdge.LEFT);
        w.readout.setText(text(v, i == 0, zMm, yVal));
    }

    /** The read-out text at z (mm) and, over the cross-section, r (mm). */
    static String text(LensView v, boolean section, double zMm, double rMm) {
        double z = Units.mmToM(zMm);
        if (section) {
            double[] e = new double[2];
            double phi = v.field().evaluate(z, Math.abs(Units.mmToM(rMm)), e);
            return String.format(Locale.ROOT, "z %s mm  r %s mm  potential %s V  E_z %s V/mm  E_r %s V/mm",
                    UiFormat.num(zMm), UiFormat.num(rMm), UiFormat.num(phi), UiFormat.num(Units.vPerMToVPerMm(e[0])),
                    UiFormat.num(Math.signum(rMm) * Units.vPerMToVPerMm(e[1])));
        }
        double[] out = new double[2];
        v.field().axial(z, 1, out);
        return String.format(Locale.ROOT, "z %s mm  axial potential %s V  E_z %s V/mm", UiFormat.num(zMm),
                UiFormat.num(out[0]), UiFormat.num(-Units.vPerMToVPerMm(out[1])));
    }
}
