package org.axistack.report;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Paint;
import java.awt.geom.Ellipse2D;
import java.util.List;

import org.axistack.model.Units;
import org.axistack.size.Design;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.LogAxis;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;

/**
 * The sizing trade-off chart: spherical aberration (log scale, plain tick labels) against the signed bias for every
 * feasible design found, the front drawn in colour from red (little surface-field margin) to green (a margin of 2
 * or more) with a colour bar, the winner ringed; the Cs axis spans the front and the winner (designs far above it
 * are counted in the legend, not allowed to squash the useful ones). PNG/SVG via {@link ChartFiles}.
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
        double lo = Double.POSITIVE_INFINITY;
        double hi = 0;
        List<Design> shown = new java.util.ArrayList<>(front);
        if (winner != null) {
            shown.add(winner);
        }
        for (Design d : shown) {
            double cs = Units.mToMm(d.spherical_m());
            if (cs > 0 && Double.isFinite(cs)) {
                lo = Math.min(lo, cs);
                hi = Math.max(hi, cs);
            }
        }
        double top = hi * 4;
        long above = hi > 0 ? feasible.stream().filter(d -> Units.mToMm(d.spherical_m()) > top).count() : 0;
        XYSeries all = new XYSeries(above > 0 ? "feasible designs (" + above + " with larger Cs above the range)"
                : "feasible designs", false);
        for (Design d : feasible) {
            all.add(d.bias_V() / 1e3, Units.mToMm(d.spherical_m()));
        }
        XYSeries f = new XYSeries("front (colour: surface-field margin, red 1 to green 2+)", false);
        for (Design d : front) {
            f.add(d.bias_V() / 1e3, Units.mToMm(d.spherical_m()));
        }
        XYSeries w = new XYSeries("chosen design", false);
        if (winner != null) {
            w.add(winner.bias_V() / 1e3, Units.mToMm(winner.spherical_m()));
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
        NumberAxis x = new NumberAxis("bias of the focusing electrode (kV; the sign is the bias's own)");
        x.setAutoRangeIncludesZero(true);
        LogAxis y = new LogAxis("spherical aberration Cs (mm)");
        y.setSmallestValue(1e-6);
        y.setNumberFormatOverride(new java.text.DecimalFormat("#,##0.###",
                java.text.DecimalFormatSymbols.getInstance(java.util.Locale.ROOT)));
        if (hi > 0) {
            y.setRange(lo / 2, hi * 4);
        }
        XYPlot plot = new XYPlot(data, x, y, r);
        plot.setBackgroundPaint(BACKGROUND);
        plot.setDomainGridlinePaint(GRID);
        plot.setRangeGridlinePaint(GRID);
        JFreeChart chart = new JFreeChart(title, JFreeChart.DEFAULT_TITLE_FONT, plot, true);
        // colour bar of the front's surface-field margin
        org.jfree.chart.renderer.LookupPaintScale scale = new org.jfree.chart.renderer.LookupPaintScale(1, 2.0001,
                marginColour(1));
        for (int i = 0; i <= 20; i++) {
            double m = 1 + i / 20.0;
            scale.add(m, marginColour(m));
        }
        NumberAxis marginAxis = new NumberAxis("surface-field margin of the front (limit / field)");
        marginAxis.setRange(1, 2);
        org.jfree.chart.title.PaintScaleLegend bar = new org.jfree.chart.title.PaintScaleLegend(scale, marginAxis);
        bar.setPosition(org.jfree.chart.ui.RectangleEdge.RIGHT);
        bar.setMargin(4, 4, 4, 4);
        bar.setStripWidth(12);
        chart.addSubtitle(bar);
        return chart;
    }

    /** Red at a margin of 1 (at the limit) through amber to green at 2 or more. */
    static Color marginColour(double margin) {
        double t = Math.max(0, Math.min(1, margin - 1));
        int red = (int) Math.round(200 * (1 - t) + 40 * t);
        int green = (int) Math.round(60 * (1 - t) + 150 * t);
        return new Color(red, green, 60);
    }
}
