package org.axistack.report;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;

import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.plot.CombinedDomainXYPlot;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.chart.title.TextTitle;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;

/** The axial potential V(z) and its first two derivatives, stacked on one z axis; PNG/SVG via {@link ChartFiles}. */
public final class AxialChart {

    private static final Color BACKGROUND = new Color(0xFBFAF7);
    private static final Color GRID = new Color(0xE4E1DA);
    private static final Color[] LINES = {new Color(0x1B1B1B), new Color(0x2F6DB0), new Color(0xC0502A)};

    private AxialChart() {
    }

    /**
     * @param z_mm    sample positions, mm
     * @param columns V (V), V' (V/mm), V'' (V/mm^2) at each sample
     */
    public static JFreeChart create(String title, double[] z_mm, double[][] columns) {
        String[] labels = {"V (V)", "V' (V/mm)", "V'' (V/mm²)"};
        CombinedDomainXYPlot plot = new CombinedDomainXYPlot(new NumberAxis("z (mm)"));
        plot.setGap(8);
        for (int c = 0; c < 3; c++) {
            XYSeries s = new XYSeries(labels[c], false);
            for (int i = 0; i < z_mm.length; i++) {
                s.add(z_mm[i], columns[c][i]);
            }
            XYLineAndShapeRenderer r = new XYLineAndShapeRenderer(true, false);
            r.setSeriesPaint(0, LINES[c]);
            r.setSeriesStroke(0, new BasicStroke(1.6f));
            NumberAxis y = new NumberAxis(labels[c]);
            y.setAutoRangeIncludesZero(true);
            XYPlot sub = new XYPlot(new XYSeriesCollection(s), null, y, r);
            sub.setBackgroundPaint(BACKGROUND);
            sub.setDomainGridlinePaint(GRID);
            sub.setRangeGridlinePaint(GRID);
            plot.add(sub, 1);
        }
        JFreeChart chart = new JFreeChart(null, JFreeChart.DEFAULT_TITLE_FONT, plot, false);
        chart.setBackgroundPaint(Color.WHITE);
        chart.addSubtitle(new TextTitle(title, new Font(Font.SANS_SERIF, Font.BOLD, 14)));
        return chart;
    }
}
