package org.axistack.report;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Paint;
import java.awt.geom.Ellipse2D;
import java.util.List;

import org.axistack.io.Units;
import org.axistack.size.Design;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.LogAxis;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;

/**
 * The sizing trade-off chart: spherical aberration (log scale) against bias magnitude for every feasible design
 * found, the front drawn in colour from red (little surface-field margin) to green (a margin of 2 or more), the
 * winner ringed. PNG/SVG via {@link ChartFiles}.
 */
public final class SizingFrontChart {

    private static final Color BACKGROUND = new Color(0xFBFAF7);
    private static final Color GRID = new Color(0xE4E1DA);
    private static final Color OTHER = new Color(0xB5B1A8);
    private static final Color WINNER = new Color(0x1B1B1B);

    private SizingFrontChart() {
    }

    /**
     * @param feasible every feasible design
     * @param front    the trade-off front
     * @param winner   the chosen design (may be null)
     */
    public static JFreeChart of(String title, List<Design> feasible, List<Design> front, Design winner) {
        XYSeries all = new XYSeries("feasible designs", false);
        for (Design d : feasible) {
            all.add(d.maxAbsBias_V() / 1e3, Units.mToMm(d.spherical_m()));
        }
        XYSeries f = new XYSeries("front (colour: surface-field margin, red 1 to green 2+)", false);
        for (Design d : front) {
            f.add(d.maxAbsBias_V() / 1e3, Units.mToMm(d.spherical_m()));
        }
        XYSeries w = new XYSeries("chosen design", false);
        if (winner != null) {
            w.add(winner.maxAbsBias_V() / 1e3, Units.mToMm(winner.spherical_m()));
        }
        XYSeriesCollection data = new XYSeriesCollection();
        data.addSeries(all);
        data.addSeries(f);
        data.addSeries(w);
        XYLineAndShapeRenderer r = new XYLineAndShapeRenderer(false, true) {
            private static final long serialVersionUID = 1L;

            @Override
            public Paint getItemPaint(int series, int item) {
                if (series == 1) {
                    return marginColour(front.get(item).fieldMargin());
                }
                return super.getItemPaint(series, item);
            }
        };
        r.setSeriesPaint(0, OTHER);
        r.setSeriesShape(0, new Ellipse2D.Double(-2.5, -2.5, 5, 5));
        r.setSeriesShape(1, new Ellipse2D.Double(-4.5, -4.5, 9, 9));
        r.setSeriesPaint(1, marginColour(1.5));
        r.setSeriesPaint(2, WINNER);
        r.setSeriesShape(2, new Ellipse2D.Double(-8, -8, 16, 16));
        r.setSeriesShapesFilled(2, false);
        r.setSeriesStroke(2, new BasicStroke(2f));
        r.setUseOutlinePaint(false);
        NumberAxis x = new NumberAxis("bias magnitude (kV)");
        x.setAutoRangeIncludesZero(true);
        LogAxis y = new LogAxis("spherical aberration Cs (mm)");
        y.setSmallestValue(1e-6);
        y.setNumberFormatOverride(new java.text.DecimalFormat("0.##E0"));
        XYPlot plot = new XYPlot(data, x, y, r);
        plot.setBackgroundPaint(BACKGROUND);
        plot.setDomainGridlinePaint(GRID);
        plot.setRangeGridlinePaint(GRID);
        return new JFreeChart(title, JFreeChart.DEFAULT_TITLE_FONT, plot, true);
    }

    /** Red at a margin of 1 (at the limit) through amber to green at 2 or more. */
    static Color marginColour(double margin) {
        double t = Math.max(0, Math.min(1, margin - 1));
        int red = (int) Math.round(200 * (1 - t) + 40 * t);
        int green = (int) Math.round(60 * (1 - t) + 150 * t);
        return new Color(red, green, 60);
    }
}
