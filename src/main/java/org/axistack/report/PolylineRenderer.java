package org.axistack.report;

import java.awt.Graphics2D;
import java.awt.geom.Path2D;
import java.awt.geom.Rectangle2D;

import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.axis.ValueAxis;
import org.jfree.chart.plot.CrosshairState;
import org.jfree.chart.plot.PlotOrientation;
import org.jfree.chart.plot.PlotRenderingInfo;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.XYItemRendererState;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.chart.ui.RectangleEdge;
import org.jfree.data.xy.XYDataset;

/**
 * Draws each series as one path, NaN points lifting the pen: the series of {@link LensChart.Lines} hold thousands
 * of short pieces, and drawing them as one shape per series (points mapped to the screen once, one stroke) costs
 * a fraction of the per-item work of {@link XYLineAndShapeRenderer}. Same look and legend as that renderer with
 * lines and no shapes.
 */
final class PolylineRenderer extends XYLineAndShapeRenderer {

    private static final long serialVersionUID = 1L;

    PolylineRenderer() {
        super(true, false);
    }

    @Override
    public int getPassCount() {
        return 1;
    }

    @Override
    public void drawItem(Graphics2D g2, XYItemRendererState state, Rectangle2D dataArea, PlotRenderingInfo info,
            XYPlot plot, ValueAxis domainAxis, ValueAxis rangeAxis, XYDataset dataset, int series, int item,
            CrosshairState crosshairState, int pass) {
        if (item != 0 || !getItemVisible(series, item)) {
            return;
        }
        RectangleEdge xEdge = plot.getDomainAxisEdge();
        RectangleEdge yEdge = plot.getRangeAxisEdge();
        boolean linear = domainAxis instanceof NumberAxis && rangeAxis instanceof NumberAxis;
        // a linear axis maps screen = a + b * value: a and b from two points of each
        double ax = domainAxis.valueToJava2D(0, dataArea, xEdge);
        double bx = domainAxis.valueToJava2D(1, dataArea, xEdge) - ax;
        double ay = rangeAxis.valueToJava2D(0, dataArea, yEdge);
        double by = rangeAxis.valueToJava2D(1, dataArea, yEdge) - ay;
        boolean vertical = plot.getOrientation() == PlotOrientation.VERTICAL;
        int n = dataset.getItemCount(series);
        Path2D.Double path = new Path2D.Double(Path2D.WIND_NON_ZERO, n);
        boolean penDown = false;
        for (int i = 0; i < n; i++) {
            double x = dataset.getXValue(series, i);
            double y = dataset.getYValue(series, i);
            if (Double.isNaN(x) || Double.isNaN(y)) {
                penDown = false;
                continue;
            }
            double sx = linear ? ax + bx * x : domainAxis.valueToJava2D(x, dataArea, xEdge);
            double sy = linear ? ay + by * y : rangeAxis.valueToJava2D(y, dataArea, yEdge);
            if (!vertical) {
                double t = sx;
                sx = sy;
                sy = t;
            }
            if (penDown) {
                path.lineTo(sx, sy);
            } else {
                path.moveTo(sx, sy);
                penDown = true;
            }
        }
        g2.setStroke(getItemStroke(series, item));
        g2.setPaint(getItemPaint(series, item));
        g2.draw(path);
    }
}
