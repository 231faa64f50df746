package org.axistack.report;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.util.ArrayList;
import java.util.List;
import org.axistack.model.Stack;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.plot.CombinedDomainXYPlot;
import org.jfree.chart.plot.ValueMarker;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.chart.title.TextTitle;
import org.jfree.chart.ui.Layer;
import org.jfree.chart.ui.RectangleAnchor;
import org.jfree.chart.ui.TextAnchor;
import org.jfree.data.xy.DefaultXYDataset;

/**
 * The lens view: the meridian cross-section of {@link GeometryChart} with equipotential lines, rays and the
 * beam envelope drawn over it, and the axial potential below on the same z axis (a JFreeChart
 * {@link CombinedDomainXYPlot}); cardinal points are vertical markers through both. The same chart draws to
 * PNG/SVG ({@link ChartFiles}) and inside the desktop window. Principal-plane labels sit at the top, the
 * others at the bottom; of two marks with the same letter the one further left is labelled on the left of its
 * line, so crossed principal planes stay readable. Layers are replaced in one batch by
 * {@link #show(Layers)}, which redraws once.
 */
public final class LensChart {

    private static final Color EQUIPOTENTIAL = new Color(0x8A9A5B);
    private static final Color RAY = new Color(0x4B2463);
    private static final Color LOST_RAY = new Color(0xD9822B);
    private static final Color ENVELOPE = new Color(0x1C7C74);
    private static final Color POTENTIAL = new Color(0x1B1B1B);
    private static final Color MARKER = new Color(0x5A5A5A);
    private static final Color BACKGROUND = new Color(0xFBFAF7);
    private static final Color GRID = new Color(0xE4E1DA);
    /** Thin solid grid lines: the dashed default costs a quarter of a redraw in anti-aliased dash pieces. */
    private static final BasicStroke GRID_STROKE = new BasicStroke(0.5f);

    /**
     * Poly-lines in the (z, r) plane, mm, as one coordinate list where NaN separates the pieces (so thousands
     * of pieces draw as one series).
     *
     * @param z_mm z values, NaN between pieces
     * @param r_mm r values (negative below the axis), NaN between pieces
     */
    public record Lines(double[] z_mm, double[] r_mm) {
        public Lines {
            if (z_mm.length != r_mm.length) {
                throw new IllegalArgumentException("z and r need the same length");
            }
            z_mm = z_mm.clone();
            r_mm = r_mm.clone();
        }

        /** No lines. */
        public static Lines none() {
            return new Lines(new double[0], new double[0]);
        }

        /** Number of stored points including the NaN separators. */
        public int size() {
            return z_mm.length;
        }
    }

    /** Collects pieces of poly-lines into {@link Lines}. */
    public static final class LinesBuilder {
        private double[] z = new double[64];
        private double[] r = new double[64];
        private int n;

        /** Adds a point to the current piece. */
        public LinesBuilder add(double z_mm, double r_mm) {
            if (n == z.length) {
                z = java.util.Arrays.copyOf(z, 2 * n);
                r = java.util.Arrays.copyOf(r, 2 * n);
            }
            z[n] = z_mm;
            r[n] = r_mm;
            n++;
            return this;
        }

        /** Ends the current piece (the next point starts a new one). */
        public LinesBuilder breakLine() {
            if (n > 0 && !Double.isNaN(z[n - 1])) {
                add(Double.NaN, Double.NaN);
            }
            return this;
        }

        public Lines build() {
            return new Lines(java.util.Arrays.copyOf(z, n), java.util.Arrays.copyOf(r, n));
        }
    }

    /**
     * A vertical marker through both plots.
     *
     * @param label short name drawn beside it ("F2", "H1", "image")
     * @param z_mm  where, mm
     */
    public record Mark(String label, double z_mm) {
    }

    /**
     * What is drawn over the electrodes for one set of biases.
     *
     * @param stack          the stack with the biases shown (electrode colours and labels)
     * @param equipotentials equipotential lines, mirrored
     * @param levelsNote     how the equipotentials are spaced, in words (shown under the title)
     * @param rays           rays that reached the end plane
     * @param lostRays       rays that hit, turned back or left
     * @param raysNote       what the rays are and how they were computed, in words
     * @param envelope       the beam envelope (edge radius), mirrored; may be empty
     * @param axisPotential  the axial potential: z (mm) against potential (V), one piece
     * @param marks          cardinal points and the image
     * @param centralX       the central ray's x against z, mm (stacks with split electrodes; else empty)
     * @param centralY       the central ray's y against z, mm
     */
    public record Layers(Stack stack, Lines equipotentials, String levelsNote, Lines rays, Lines lostRays,
            String raysNote, Lines envelope, Lines axisPotential, List<Mark> marks, Lines centralX, Lines centralY) {
        public Layers {
            marks = List.copyOf(marks);
        }

        /** Layers of a round lens (no central-ray deflection). */
        public Layers(Stack stack, Lines equipotentials, String levelsNote, Lines rays, Lines lostRays,
                String raysNote, Lines envelope, Lines axisPotential, List<Mark> marks) {
            this(stack, equipotentials, levelsNote, rays, lostRays, raysNote, envelope, axisPotential, marks,
                    Lines.none(), Lines.none());
        }

        /** The same layers with another envelope. */
        public Layers withEnvelope(Lines newEnvelope) {
            return new Layers(stack, equipotentials, levelsNote, rays, lostRays, raysNote, newEnvelope, axisPotential,
                    marks, centralX, centralY);
        }
    }

    private final JFreeChart chart;
    private final XYPlot section;
    private final XYPlot potential;
    private final DefaultXYDataset lines = new DefaultXYDataset();
    private final DefaultXYDataset axis = new DefaultXYDataset();
    private final DefaultXYDataset central = new DefaultXYDataset();
    /** The central ray's x and y against z (only for stacks with split electrodes; else null). */
    private final XYPlot steering;
    private final TextTitle note;

    private LensChart(Stack stack) {
        section = GeometryChart.plot(stack);
        XYLineAndShapeRenderer r = new PolylineRenderer(); // one path per series; NaN points break it into pieces
        r.setSeriesPaint(0, EQUIPOTENTIAL);
        r.setSeriesStroke(0, new BasicStroke(0.8f));
        r.setSeriesPaint(1, ENVELOPE);
        r.setSeriesStroke(1, new BasicStroke(2.2f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10f,
                new float[] {7f, 3f}, 0f));
        r.setSeriesPaint(2, RAY);
        r.setSeriesStroke(2, new BasicStroke(1.1f));
        r.setSeriesPaint(3, LOST_RAY);
        r.setSeriesStroke(3, new BasicStroke(1.3f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10f,
                new float[] {3f, 2f}, 0f));
        section.setDataset(1, lines);
        section.setRenderer(1, r);
        section.setDatasetRenderingOrder(org.jfree.chart.plot.DatasetRenderingOrder.FORWARD);
        section.setDomainGridlineStroke(GRID_STROKE);
        section.setRangeGridlineStroke(GRID_STROKE);

        NumberAxis vAxis = new NumberAxis("axial potential (V)");
        vAxis.setAutoRangeIncludesZero(true);
        XYLineAndShapeRenderer pr = new PolylineRenderer();
        pr.setSeriesPaint(0, POTENTIAL);
        pr.setSeriesStroke(0, new BasicStroke(1.6f));
        // the potential keeps its own range fitted to the curve: a box zoom on the section (which zooms the
        // shared z axis) must never zoom it to a band the curve is not in
        potential = new XYPlot(axis, null, vAxis, pr) {
            @Override
            public void zoomRangeAxes(double factor, org.jfree.chart.plot.PlotRenderingInfo info,
                    java.awt.geom.Point2D source) {
                // fitted, not zoomed
            }

            @Override
            public void zoomRangeAxes(double factor, org.jfree.chart.plot.PlotRenderingInfo info,
                    java.awt.geom.Point2D source, boolean useAnchor) {
                // fitted, not zoomed
            }

            @Override
            public void zoomRangeAxes(double lowerPercent, double upperPercent,
                    org.jfree.chart.plot.PlotRenderingInfo info, java.awt.geom.Point2D source) {
                // fitted, not zoomed
            }
        };
        potential.setBackgroundPaint(BACKGROUND);
        potential.setDomainGridlinePaint(GRID);
        potential.setRangeGridlinePaint(GRID);
        potential.setDomainGridlineStroke(GRID_STROKE);
        potential.setRangeGridlineStroke(GRID_STROKE);

        CombinedDomainXYPlot combined = new CombinedDomainXYPlot((NumberAxis) section.getDomainAxis());
        combined.setGap(8);
        combined.add(section, 3);
        combined.add(potential, 1);
        if (stack.hasSectors()) {
            NumberAxis dAxis = new NumberAxis("central ray (mm)");
            dAxis.setAutoRangeIncludesZero(true);
            XYLineAndShapeRenderer dr = new PolylineRenderer();
            dr.setSeriesPaint(0, RAY);
            dr.setSeriesStroke(0, new BasicStroke(1.6f));
            dr.setSeriesPaint(1, ENVELOPE);
            dr.setSeriesStroke(1, new BasicStroke(1.6f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10f,
                    new float[] {6f, 3f}, 0f));
            steering = new XYPlot(central, null, dAxis, dr);
            steering.setBackgroundPaint(BACKGROUND);
            steering.setDomainGridlinePaint(GRID);
            steering.setRangeGridlinePaint(GRID);
            steering.setDomainGridlineStroke(GRID_STROKE);
            steering.setRangeGridlineStroke(GRID_STROKE);
            combined.add(steering, 1);
        } else {
            steering = null;
        }
        chart = new JFreeChart(null, JFreeChart.DEFAULT_TITLE_FONT, combined, true);
        chart.setBackgroundPaint(Color.WHITE);
        String title = stack.title().isBlank() ? "Electrode stack" : stack.title();
        chart.addSubtitle(new TextTitle(title, new Font(Font.SANS_SERIF, Font.BOLD, 14)));
        note = new TextTitle("", new Font(Font.SANS_SERIF, Font.PLAIN, 11));
        chart.addSubtitle(note);
    }

    /** An empty lens view of the stack (electrodes only) until {@link #show} adds the layers. */
    public static LensChart create(Stack stack) {
        return new LensChart(stack);
    }

    /** A lens view with its layers drawn, for files. */
    public static LensChart create(Layers layers) {
        LensChart c = new LensChart(layers.stack());
        c.show(layers);
        return c;
    }

    public JFreeChart chart() {
        return chart;
    }

    /** The cross-section plot (for zoom limits and cursor read-out). */
    public XYPlot section() {
        return section;
    }

    /** The axial potential plot. */
    public XYPlot potential() {
        return potential;
    }

    /** Replaces every layer and redraws once. */
    public void show(Layers l) {
        chart.setNotify(false);
        try {
            GeometryChart.drawElectrodes(section, l.stack());
            put(lines, "equipotentials", l.equipotentials());
            put(lines, "beam envelope (edge radius)", l.envelope());
            put(lines, "rays", l.rays());
            put(lines, "lost rays", l.lostRays());
            put(axis, "axial potential", l.axisPotential());
            if (steering != null) {
                put(central, "central ray x (side view)", l.centralX());
                put(central, "central ray y (top view)", l.centralY());
            }
            section.clearDomainMarkers();
            potential.clearDomainMarkers();
            for (Mark m : l.marks()) {
                if (!Double.isFinite(m.z_mm())) {
                    continue;
                }
                boolean left = l.marks().stream().anyMatch(o -> o != m && o.label().charAt(0) == m.label().charAt(0)
                        && o.z_mm() > m.z_mm());
                section.addDomainMarker(marker(m, true, left), Layer.FOREGROUND);
                potential.addDomainMarker(marker(m, false, false), Layer.FOREGROUND);
            }
            List<String> parts = new ArrayList<>();
            if (!l.levelsNote().isBlank()) {
                parts.add(l.levelsNote());
            }
            if (!l.raysNote().isBlank()) {
                parts.add(l.raysNote());
            }
            note.setText(String.join("; ", parts));
        } finally {
            chart.setNotify(true);
        }
    }

    private static void put(DefaultXYDataset d, String key, Lines lines) {
        d.addSeries(key, new double[][] {lines.z_mm(), lines.r_mm()});
    }

    private static ValueMarker marker(Mark m, boolean labelled, boolean left) {
        ValueMarker v = new ValueMarker(m.z_mm(), MARKER, new BasicStroke(0.9f, BasicStroke.CAP_BUTT,
                BasicStroke.JOIN_MITER, 10f, new float[] {4f, 3f}, 0f));
        if (labelled) {
            v.setLabel(m.label());
            v.setLabelFont(new Font(Font.SANS_SERIF, Font.BOLD, 11));
            v.setLabelPaint(MARKER);
            boolean top = m.label().startsWith("H");
            v.setLabelAnchor(top ? (left ? RectangleAnchor.TOP_LEFT : RectangleAnchor.TOP_RIGHT)
                    : (left ? RectangleAnchor.BOTTOM_LEFT : RectangleAnchor.BOTTOM_RIGHT));
            v.setLabelTextAnchor(top ? (left ? TextAnchor.TOP_RIGHT : TextAnchor.TOP_LEFT)
                    : (left ? TextAnchor.BOTTOM_RIGHT : TextAnchor.BOTTOM_LEFT));
        }
        return v;
    }
}
