package org.axistack.report;

import java.awt.BasicStroke;
import java.awt.Color;
import java.util.List;

import org.axistack.model.Units;
import org.axistack.model.Stack;
import org.axistack.tune.SweepPoint;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.LogAxis;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.plot.CombinedDomainXYPlot;
import org.jfree.chart.plot.IntervalMarker;
import org.jfree.chart.plot.ValueMarker;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.ui.Layer;
import org.jfree.chart.ui.RectangleAnchor;
import org.jfree.chart.ui.TextAnchor;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;

/**
 * Chart of a bias sweep: focal point, focal length and image position against the bias (upper panel, clipped
 * to a window of a few stack lengths because they run off to infinity where the lens passes through afocal), and
 * the aberration coefficients Cs and Cc on a log scale (lower panel). Gaps where the beam turns back. PNG/SVG via
 * {@link ChartFiles}.
 */
public final class SweepChart {

    private static final Color BACKGROUND = new Color(0xF7F8FA);
    private static final Color GRID = new Color(0xDADDE3);
    /** One colour per curve, none repeated between the two panels. */
    private static final Color[] LINES = {new Color(0x23395B), new Color(0x3E8E7E), new Color(0xB5543C),
        new Color(0x8A6FB0), new Color(0xC9901A), new Color(0x2F7FC1)};
    private static final Color MARK = new Color(0x6A3D9A);
    private static final Color REFLECTED = new Color(0xE9E2D0);

    private SweepChart() {
    }

    public static JFreeChart of(Stack stack, String electrode, List<SweepPoint> points, String title) {
        return of(stack, electrode, points, title, List.of());
    }

    /**
     * The chart with the screen plane (a horizontal line in the upper panel), the biases that focus on it
     * (vertical lines) and the biases where the beam turns back or has no usable planes (shaded, labelled).
     */
    public static JFreeChart of(Stack stack, String electrode, List<SweepPoint> points, String title,
            List<Double> focusBiases_V) {
        double window = 3 * Units.mToMm(stack.maxZ_m() - stack.minZ_m());
        double centre = Units.mToMm(0.5 * (stack.minZ_m() + stack.maxZ_m()));
        XYSeriesCollection top = new XYSeriesCollection();
        top.addSeries(series("image focal point F2 z (mm)", points, SweepPoint::focalPointImageZ_m, centre, window));
        top.addSeries(series("image-side focal length f2 (mm)", points, SweepPoint::focalLengthImage_m, 0, window));
        if (points.stream().anyMatch(p -> Double.isFinite(p.imageZ_m()))) {
            top.addSeries(series("image z of the object (mm)", points, SweepPoint::imageZ_m, centre, window));
        }
        XYSeriesCollection bottom = new XYSeriesCollection();
        bottom.addSeries(series("Cs (mm)", points, SweepPoint::sphericalAberration_m, 0, 1e3 * window));
        bottom.addSeries(series("Cc (mm)", points, SweepPoint::chromaticAberration_m, 0, 1e3 * window));
        NumberAxis bias = new NumberAxis("bias of " + electrode + " (V)");
        NumberAxis mm = new NumberAxis("z or length (mm)");
        mm.setAutoRangeIncludesZero(false);
        LogAxis ab = new LogAxis("Cs, Cc (mm, log scale)");
        ab.setSmallestValue(1e-3);
        ab.setNumberFormatOverride(new java.text.DecimalFormat("#,##0.###", // plain tick labels: 10, 100, 1,000
                java.text.DecimalFormatSymbols.getInstance(java.util.Locale.ROOT)));
        ab.setAutoTickUnitSelection(false);
        ab.setTickUnit(new org.jfree.chart.axis.NumberTickUnit(1), false, false); // one tick per decade
        XYPlot upper = new XYPlot(top, null, mm, renderer(0));
        XYPlot lower = new XYPlot(bottom, null, ab, renderer(3));
        stack.screenZ_m().ifPresent(z -> {
            ValueMarker screen = new ValueMarker(Units.mToMm(z), MARK, new BasicStroke(1.2f, BasicStroke.CAP_BUTT,
                    BasicStroke.JOIN_MITER, 10f, new float[] {6f, 3f}, 0f));
            screen.setLabel("screen z = " + HtmlReport.num(Units.mToMm(z)) + " mm");
            screen.setLabelPaint(MARK);
            screen.setLabelAnchor(RectangleAnchor.TOP_LEFT);
            screen.setLabelTextAnchor(TextAnchor.BOTTOM_LEFT);
            upper.addRangeMarker(screen, Layer.FOREGROUND);
        });
        double span = points.isEmpty() ? 1 : Math.abs(points.get(points.size() - 1).bias_V() - points.get(0).bias_V());
        List<Double> labelled = new java.util.ArrayList<>();
        for (double b : focusBiases_V) {
            ValueMarker m = new ValueMarker(b, MARK, new BasicStroke(1.0f));
            // labels only where they do not overlap (near-mirror biases sit within a few volts of each other)
            if (labelled.stream().allMatch(o -> Math.abs(o - b) > 0.12 * span)) {
                m.setLabel("focus " + HtmlReport.num(b) + " V");
                labelled.add(b);
            }
            m.setLabelPaint(MARK);
            m.setLabelAnchor(RectangleAnchor.TOP_RIGHT);
            m.setLabelTextAnchor(TextAnchor.TOP_LEFT);
            upper.addDomainMarker(m, Layer.FOREGROUND);
            lower.addDomainMarker(new ValueMarker(b, MARK, new BasicStroke(1.0f)), Layer.FOREGROUND);
        }
        // runs of biases without optics (the beam turns back): shaded and said, never silently empty
        int i = 0;
        while (i < points.size()) {
            if (points.get(i).ok()) {
                i++;
                continue;
            }
            int j = i;
            while (j + 1 < points.size() && !points.get(j + 1).ok()) {
                j++;
            }
            double a = points.get(i).bias_V();
            double b = points.get(j).bias_V();
            String why = points.get(i).status().startsWith("reflect") ? "beam reflected" : points.get(i).status();
            for (XYPlot p : new XYPlot[] {upper, lower}) {
                IntervalMarker band = new IntervalMarker(Math.min(a, b), Math.max(a, b), REFLECTED);
                if (p == upper) {
                    band.setLabel(why + " (" + HtmlReport.num(Math.min(a, b)) + " .. " + HtmlReport.num(Math.max(a, b))
                            + " V)");
                    band.setLabelAnchor(RectangleAnchor.CENTER);
                    band.setLabelTextAnchor(TextAnchor.CENTER);
                }
                p.addDomainMarker(band, Layer.BACKGROUND);
            }
            i = j + 1;
        }
        CombinedDomainXYPlot plot = new CombinedDomainXYPlot(bias);
        plot.add(upper, 3);
        plot.add(lower, 2);
        for (XYPlot p : new XYPlot[] {upper, lower}) {
            p.setBackgroundPaint(BACKGROUND);
            p.setDomainGridlinePaint(GRID);
            p.setRangeGridlinePaint(GRID);
        }
        return new JFreeChart(title, JFreeChart.DEFAULT_TITLE_FONT, plot, true);
    }

    private static XYLineAndShapeRenderer renderer(int firstColour) {
        XYLineAndShapeRenderer r = new XYLineAndShapeRenderer(true, false);
        for (int i = 0; i < 3; i++) {
            r.setSeriesPaint(i, LINES[firstColour + i]);
            r.setSeriesStroke(i, i == 1 ? new BasicStroke(1.8f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10f,
                    new float[] {7f, 4f}, 0f) : new BasicStroke(1.8f));
        }
        return r;
    }

    /** A series in mm; values outside centre +/- window (and undefined ones) leave a gap. */
    private static XYSeries series(String name, List<SweepPoint> points, java.util.function.ToDoubleFunction<SweepPoint> f,
            double centre_mm, double window_mm) {
        XYSeries s = new XYSeries(name, false);
        for (SweepPoint p : points) {
            double v = Units.mToMm(f.applyAsDouble(p));
            s.add(p.bias_V(), Double.isFinite(v) && Math.abs(v - centre_mm) <= window_mm ? (Double) v : null);
        }
        return s;
    }
}
