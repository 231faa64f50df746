package org.axistack.report;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.Paint;
import java.awt.geom.Path2D;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import org.axistack.model.Units;
import org.axistack.model.Contour;
import org.axistack.model.Electrode;
import org.axistack.model.Segment;
import org.axistack.model.Stack;
import org.axistack.model.ZR;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.annotations.XYShapeAnnotation;
import org.jfree.chart.annotations.XYTextAnnotation;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.chart.title.TextTitle;
import org.jfree.chart.ui.RectangleInsets;
import org.jfree.chart.ui.TextAnchor;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;

/**
 * The stack's meridian cross-section: z across, r up, mirrored below the axis, each electrode drawn
 * from its contour (closed outlines filled, thin sheets as thick lines) and labelled with its name
 * and bias. Electrode colour shows the bias: grey at 0 V, warm for positive, cool for negative,
 * stronger for larger |bias|. One factory for files (headless) and the desktop window ({@link LensChart}).
 */
public final class GeometryChart {

    private static final Color BACKGROUND = new Color(0xFBFAF7);
    private static final Color GRID = new Color(0xE4E1DA);
    private static final Color AXIS_LINE = new Color(0x6B6B6B);
    private static final Color GROUND = new Color(0x8C8C8C);
    private static final Color POSITIVE = new Color(0xC0502A);
    private static final Color NEGATIVE = new Color(0x2F6DB0);
    private static final Color RAY = new Color(0x3A7D44);
    private static final Font LABEL_FONT = new Font(Font.SANS_SERIF, Font.PLAIN, 12);

    private GeometryChart() {
    }

    /** Chart of the stack's electrodes. */
    public static JFreeChart create(Stack stack) {
        JFreeChart chart = new JFreeChart(null, JFreeChart.DEFAULT_TITLE_FONT, plot(stack), false);
        chart.setBackgroundPaint(Color.WHITE);
        String title = stack.title().isBlank() ? "Electrode stack" : stack.title();
        chart.addSubtitle(new TextTitle(title + ": meridian section (mirrored about the axis)",
                new Font(Font.SANS_SERIF, Font.BOLD, 14)));
        return chart;
    }

    /**
     * The cross-section plot alone (z across in mm, r up in mm, mirrored), for charts that add layers to it
     * (the desktop window's lens view, {@link LensChart}). Dataset 0 is the dash-dotted axis line.
     */
    public static XYPlot plot(Stack stack) {
        double z0 = Units.mToMm(stack.minZ_m()), z1 = Units.mToMm(stack.maxZ_m());
        double rMax = maxRadius_mm(stack);
        double padZ = 0.04 * (z1 - z0);
        double labelRoom = 0.45 * rMax;

        XYSeries axis = new XYSeries("axis");
        axis.add(z0 - padZ, 0.0);
        axis.add(z1 + padZ, 0.0);
        XYLineAndShapeRenderer renderer = new XYLineAndShapeRenderer(true, false);
        renderer.setSeriesPaint(0, AXIS_LINE);
        renderer.setSeriesStroke(0, new BasicStroke(1f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10f,
                new float[] {8f, 4f, 2f, 4f}, 0f));
        renderer.setDefaultSeriesVisibleInLegend(false);

        NumberAxis zAxis = new NumberAxis("z (mm)");
        zAxis.setRange(z0 - padZ, z1 + padZ);
        NumberAxis rAxis = new NumberAxis("r (mm)");
        rAxis.setRange(-1.08 * rMax, 1.08 * rMax + labelRoom);
        XYPlot plot = new XYPlot(new XYSeriesCollection(axis), zAxis, rAxis, renderer);
        plot.setBackgroundPaint(BACKGROUND);
        plot.setDomainGridlinePaint(GRID);
        plot.setRangeGridlinePaint(GRID);
        plot.setOutlinePaint(AXIS_LINE);
        plot.setAxisOffset(RectangleInsets.ZERO_INSETS);
        drawElectrodes(plot, stack);
        return plot;
    }

    /**
     * Replaces the plot's annotations by the stack's electrodes (filled or sheet outlines, coloured by bias)
     * and their name-and-bias labels: called again when the biases change.
     */
    public static void drawElectrodes(XYPlot plot, Stack stack) {
        plot.clearAnnotations();
        double maxBias = 0;
        for (Electrode e : stack.electrodes()) {
            maxBias = Math.max(maxBias, Math.abs(e.bias_V()));
        }
        for (Electrode e : stack.electrodes()) {
            Paint paint = colour(e.bias_V(), maxBias);
            Contour c = e.contour();
            boolean sheet = c.isSheet();
            for (boolean mirror : new boolean[] {false, true}) {
                Path2D path = path(c, mirror);
                if (sheet) {
                    // a sheet is drawn segment by segment: a shape annotation maps its bounding box onto the data
                    // area, which for a straight sheet (a tube of zero wall: zero height) divides 0 by 0 and gives
                    // NaN coordinates (missing from the PNG, NaN in the SVG)
                    BasicStroke stroke = new BasicStroke(3.5f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_ROUND);
                    double[] prev = null;
                    for (java.awt.geom.PathIterator it = path.getPathIterator(null); !it.isDone(); it.next()) {
                        double[] q = new double[6];
                        int type = it.currentSegment(q);
                        double[] pt = {q[0], q[1]};
                        if (type == java.awt.geom.PathIterator.SEG_LINETO && prev != null) {
                            plot.addAnnotation(new org.jfree.chart.annotations.XYLineAnnotation(prev[0], prev[1], pt[0],
                                    pt[1], stroke, paint), false);
                        }
                        prev = type == java.awt.geom.PathIterator.SEG_CLOSE ? prev : pt;
                    }
                } else {
                    plot.addAnnotation(new XYShapeAnnotation(path, new BasicStroke(1f), darker(paint), paint), false);
                }
            }
        }
        labels(plot, stack, maxRadius_mm(stack));
    }

    /** Largest electrode radius, mm. */
    static double maxRadius_mm(Stack stack) {
        double rMax = 0;
        for (Electrode e : stack.electrodes()) {
            rMax = Math.max(rMax, Units.mToMm(e.contour().maxR_m()));
        }
        return rMax;
    }

    /**
     * The stack's chart with traced ray paths drawn over it (z, x in the meridian plane; each path as a list of
     * {z_m, x_m} points). Rays are drawn in one dark colour, thin, under the electrode outlines.
     */
    public static JFreeChart withRays(Stack stack, List<List<double[]>> paths, String caption) {
        JFreeChart chart = create(stack);
        XYPlot plot = chart.getXYPlot();
        XYSeriesCollection rays = new XYSeriesCollection();
        XYLineAndShapeRenderer r = new XYLineAndShapeRenderer(true, false);
        int k = 0;
        for (List<double[]> path : paths) {
            XYSeries s = new XYSeries("ray " + k, false);
            for (double[] p : path) {
                s.add(Units.mToMm(p[0]), Units.mToMm(p[1]));
            }
            rays.addSeries(s);
            r.setSeriesPaint(k, RAY);
            r.setSeriesStroke(k, new BasicStroke(0.9f));
            k++;
        }
        r.setDefaultSeriesVisibleInLegend(false);
        plot.setDataset(1, rays);
        plot.setRenderer(1, r);
        // the planes the rays run between: the beam start and the screen, where the rays stop
        stack.beam().startZ_m().ifPresent(z -> plot.addDomainMarker(plane(z, "beam start"),
                org.jfree.chart.ui.Layer.FOREGROUND));
        stack.screenZ_m().ifPresent(z -> plot.addDomainMarker(plane(z, "screen"), org.jfree.chart.ui.Layer.FOREGROUND));
        if (caption != null && !caption.isBlank()) {
            chart.addSubtitle(new TextTitle(caption, LABEL_FONT));
        }
        return chart;
    }

    /** A labelled vertical line at a plane z (m). */
    private static org.jfree.chart.plot.ValueMarker plane(double z_m, String label) {
        org.jfree.chart.plot.ValueMarker m = new org.jfree.chart.plot.ValueMarker(Units.mToMm(z_m), PLANE,
                new BasicStroke(1.6f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10f, new float[] {6f, 3f}, 0f));
        m.setLabel(label);
        m.setLabelFont(LABEL_FONT);
        m.setLabelPaint(PLANE);
        m.setLabelAnchor(org.jfree.chart.ui.RectangleAnchor.TOP_LEFT);
        m.setLabelTextAnchor(org.jfree.chart.ui.TextAnchor.TOP_RIGHT);
        return m;
    }

    /** Colour of the beam-start and screen planes. */
    private static final Color PLANE = new Color(0x6A3D9A);

    /** Width and height in pixels that keep millimetres roughly square, within sensible bounds. */
    public static int[] preferredSize(Stack stack) {
        double z = Units.mToMm(stack.maxZ_m() - stack.minZ_m()) * 1.08;
        double rMax = 0;
        for (Electrode e : stack.electrodes()) {
            rMax = Math.max(rMax, Units.mToMm(e.contour().maxR_m()));
        }
        double h = 2.6 * rMax;
        int width = 1200;
        int height = (int) Math.round(Math.max(420, Math.min(900, 100 + (width - 120) * h / Math.max(z, 1e-9))));
        return new int[] {width, height};
    }

    private static void labels(XYPlot plot, Stack stack, double rMax) {
        List<Electrode> sorted = new ArrayList<>(stack.electrodes());
        sorted.sort(Comparator.comparingDouble(e -> e.contour().minZ_m()));
        double zSpan = Units.mToMm(stack.maxZ_m() - stack.minZ_m());
        double minSpacing = 0.14 * zSpan;
        double rowHeight = 0.11 * rMax;
        double[] rowEnd = {Double.NEGATIVE_INFINITY, Double.NEGATIVE_INFINITY, Double.NEGATIVE_INFINITY};
        for (Electrode e : sorted) {
            double zc = Units.mToMm((e.contour().minZ_m() + e.contour().maxZ_m()) / 2);
            int row = 0;
            while (row < rowEnd.length - 1 && zc - rowEnd[row] < minSpacing) {
                row++;
            }
            rowEnd[row] = zc;
            double y = 1.08 * rMax + rowHeight * (0.8 + 1.1 * row);
            XYTextAnnotation a = new XYTextAnnotation(e.name() + "  " + volts(e.bias_V()), zc, y);
            a.setFont(LABEL_FONT);
            a.setPaint(Color.DARK_GRAY);
            a.setTextAnchor(TextAnchor.CENTER);
            plot.addAnnotation(a, false);
            double top = Units.mToMm(e.contour().maxR_m());
            plot.addAnnotation(new org.jfree.chart.annotations.XYLineAnnotation(zc, top, zc,
                    y - 0.35 * rowHeight, new BasicStroke(0.6f), GRID.darker()), false);
        }
    }

    static String volts(double v) {
        if (v == Math.rint(v) && Math.abs(v) < 1e9) {
            return String.format(Locale.ROOT, "%+d V", (long) v).replace("+0 V", "0 V");
        }
        return String.format(Locale.ROOT, "%+.4g V", v);
    }

    private static Path2D path(Contour c, boolean mirror) {
        Path2D.Double p = new Path2D.Double();
        double sign = mirror ? -1 : 1;
        ZR s = c.segments().get(0).start();
        p.moveTo(Units.mToMm(s.z_m()), sign * Units.mToMm(s.r_m()));
        for (Segment g : c.segments()) {
            int n = g instanceof Segment.Arc ? 32 : 1;
            for (int k = 1; k <= n; k++) {
                ZR q = g.at((double) k / n);
                p.lineTo(Units.mToMm(q.z_m()), sign * Units.mToMm(q.r_m()));
            }
        }
        if (c.closed() || !c.isSheet()) {
            p.closePath();
        }
        return p;
    }

    static Color colour(double bias, double maxBias) {
        if (bias == 0 || maxBias == 0) {
            return GROUND;
        }
        double t = 0.35 + 0.65 * Math.min(1, Math.abs(bias) / maxBias);
        Color target = bias > 0 ? POSITIVE : NEGATIVE;
        return mix(GROUND, target, t);
    }

    private static Color mix(Color a, Color b, double t) {
        return new Color((int) Math.round(a.getRed() + t * (b.getRed() - a.getRed())),
                (int) Math.round(a.getGreen() + t * (b.getGreen() - a.getGreen())),
                (int) Math.round(a.getBlue() + t * (b.getBlue() - a.getBlue())));
    }

    private static Paint darker(Paint p) {
        return p instanceof Color c ? c.darker() : p;
    }
}
