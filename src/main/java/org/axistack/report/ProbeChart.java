package org.axistack.report;

import java.awt.BasicStroke;
import java.awt.Color;

import org.axistack.probe.ProbePoint;
import org.axistack.probe.ProbeStudy;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.LogAxis;
import org.jfree.chart.axis.LogarithmicAxis;
import org.jfree.chart.axis.NumberTickUnit;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;

/**
 * Probe current against probe diameter (FW50, root-power-sum, solid) for each working point of a probe study, both
 * axes logarithmic; the quadrature sum of the same partial diameters dashed, for comparison. PNG/SVG via
 * {@link ChartFiles}.
 */
public final class ProbeChart {

    private static final Color BACKGROUND = new Color(0xFAFAF6);
    private static final Color GRID = new Color(0xDCDCD4);
    private static final Color[] LINES = {new Color(0x1F4E79), new Color(0xA23B2A), new Color(0x3C7A3A), new Color(0x7A4E9C)};

    private ProbeChart() {
    }

    public static JFreeChart of(ProbeStudy study, String title) {
        XYSeriesCollection data = new XYSeriesCollection();
        XYLineAndShapeRenderer r = new XYLineAndShapeRenderer(true, false);
        int s = 0;
        int curve = 0;
        for (ProbeStudy.Curve c : study.curves()) {
            if (c.points().isEmpty()) {
                continue;
            }
            XYSeries rps = new XYSeries(c.workingPoint().label(), false, true);
            XYSeries quad = new XYSeries(c.workingPoint().label() + ": quadrature", false, true);
            for (ProbePoint p : c.points()) {
                rps.add(p.fw50_m() * 1e9, p.current_A());
                quad.add(p.quadrature_m() * 1e9, p.current_A());
            }
            Color colour = LINES[curve % LINES.length];
            data.addSeries(rps);
            r.setSeriesPaint(s, colour);
            r.setSeriesStroke(s++, new BasicStroke(2f));
            data.addSeries(quad);
            r.setSeriesPaint(s, colour);
            r.setSeriesVisibleInLegend(s, false);
            r.setSeriesStroke(s++, new BasicStroke(1.2f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10f,
                    new float[] {6f, 4f}, 0f));
            curve++;
        }
        // the sizes often span a decade or less: 1, 2, .. 9 times each power of ten are labelled where they fit
        LogarithmicAxis size = new LogarithmicAxis("probe diameter, FW50 (nm; solid: root-power-sum, dashed: quadrature)");
        size.setAutoRangeNextLogFlag(false);
        LogAxis current = new LogAxis("probe current (A)");
        current.setTickUnit(new NumberTickUnit(1)); // one tick per decade
        current.setMinorTickMarksVisible(true);
        XYPlot plot = new XYPlot(data, size, current, r);
        plot.setBackgroundPaint(BACKGROUND);
        plot.setDomainGridlinePaint(GRID);
        plot.setRangeGridlinePaint(GRID);
        return new JFreeChart(title, JFreeChart.DEFAULT_TITLE_FONT, plot, true);
    }
}
