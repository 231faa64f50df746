package org.axistack.report;

import java.awt.BasicStroke;
import java.awt.Color;
import java.util.List;
import org.axistack.beam.EnvelopeCurve;
import org.axistack.beam.EnvelopePoint;
import org.axistack.beam.EnvelopeStudyResult;
import org.axistack.beam.ScanPoint;
import org.axistack.beam.ScanResult;
import org.axistack.model.Units;
import org.axistack.model.Electrode;
import org.axistack.model.Segment;
import org.axistack.model.Stack;
import org.axistack.model.ZR;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;

/** Charts of the beam envelope (with the electrode walls) and of a current scan; PNG/SVG via {@link ChartFiles}. */
public final class EnvelopeChart {

    private static final Color BACKGROUND = new Color(0xFBFAF7);
    private static final Color GRID = new Color(0xE4E1DA);
    private static final Color FULL = new Color(0x1B1B1B);
    private static final Color NO_CURRENT = new Color(0x2F6DB0);
    private static final Color NO_EMITTANCE = new Color(0xC0502A);
    private static final Color WALL = new Color(0x8C8C8C);

    private EnvelopeChart() {
    }

    private static XYSeries series(String name, EnvelopeCurve c) {
        XYSeries s = new XYSeries(name, false);
        for (EnvelopePoint p : c.points()) {
            s.add(Units.mToMm(p.z_m()), Units.mToMm(p.radius_m()));
        }
        return s;
    }

    /** Envelope radius against z for the three cases, over the electrode outlines (upper half-plane). */
    public static JFreeChart envelope(Stack stack, EnvelopeStudyResult r) {
        XYSeriesCollection data = new XYSeriesCollection();
        data.addSeries(series("with current and emittance", r.full()));
        data.addSeries(series("zero current (emittance only)", r.emittanceOnly()));
        data.addSeries(series("zero emittance (space charge only)", r.spaceChargeOnly()));
        XYLineAndShapeRenderer rend = new XYLineAndShapeRenderer(true, false);
        rend.setSeriesPaint(0, FULL);
        rend.setSeriesStroke(0, new BasicStroke(2.2f));
        rend.setSeriesPaint(1, NO_CURRENT);
        rend.setSeriesStroke(1, new BasicStroke(1.3f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10f,
                new float[] {6f, 4f}, 0f));
        rend.setSeriesPaint(2, NO_EMITTANCE);
        rend.setSeriesStroke(2, new BasicStroke(1.3f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10f,
                new float[] {2f, 3f}, 0f));
        double z0 = Units.mToMm(r.zStart_m());
        double z1 = Units.mToMm(r.zEnd_m());
        double rBeam = Units.mToMm(r.full().largest().radius_m());
        double narrowest = Double.POSITIVE_INFINITY;
        int k = 3;
        for (Electrode e : stack.electrodes()) {
            XYSeries w = new XYSeries("electrode " + e.name(), false);
            boolean first = true;
            for (Segment s : e.contour().segments()) {
                int n = s instanceof Segment.Arc ? 32 : 1;
                for (int i = first ? 0 : 1; i <= n; i++) {
                    ZR p = s.at((double) i / n);
                    w.add(Units.mToMm(p.z_m()), Units.mToMm(p.r_m()));
                }
                first = false;
            }
            if (e.contour().closed()) {
                ZR p = e.contour().segments().get(0).start();
                w.add(Units.mToMm(p.z_m()), Units.mToMm(p.r_m()));
            }
            if (e.contour().minR_m() > 0) {
                narrowest = Math.min(narrowest, Units.mToMm(e.contour().minR_m()));
            }
            data.addSeries(w);
            rend.setSeriesPaint(k, WALL);
            rend.setSeriesStroke(k, new BasicStroke(2f));
            rend.setSeriesVisibleInLegend(k, k == 3);
            k++;
        }
        // the narrowest bore (what the envelope is compared with) is always inside the range
        double rTop = Double.isFinite(narrowest) ? Math.max(rBeam, 1.15 * narrowest) : rBeam;
        NumberAxis zAxis = new NumberAxis("z (mm)");
        zAxis.setRange(z0, z1);
        NumberAxis rAxis = new NumberAxis("envelope radius (mm), edge");
        rAxis.setRange(0, Math.max(rTop, 1e-6) * 1.08);
        XYPlot plot = new XYPlot(data, zAxis, rAxis, rend);
        // the thick full curve first, the thin comparison curves over it: where the zero-emittance curve
        // coincides with the full one it stays visible
        plot.setSeriesRenderingOrder(org.jfree.chart.plot.SeriesRenderingOrder.FORWARD);
        style(plot);
        return new JFreeChart("Beam envelope: " + r.dominance(), JFreeChart.DEFAULT_TITLE_FONT, plot, true);
    }

    /** Waist position and waist radius against beam current. */
    public static JFreeChart scan(ScanResult scan) {
        XYSeries z = new XYSeries("waist position z (mm)", false);
        XYSeries w = new XYSeries("waist radius (mm)", false);
        List<ScanPoint> pts = scan.points();
        for (ScanPoint p : pts) {
            if (p.waist().isPresent()) {
                z.add(p.current_A() * 1e3, Units.mToMm(p.waist().get().z_m()));
                w.add(p.current_A() * 1e3, Units.mToMm(p.waist().get().radius_m()));
            }
        }
        NumberAxis iAxis = new NumberAxis("beam current (mA)");
        NumberAxis zAxis = new NumberAxis("waist z (mm)");
        zAxis.setAutoRangeIncludesZero(false);
        NumberAxis rAxis = new NumberAxis("waist radius (mm)");
        XYLineAndShapeRenderer r0 = new XYLineAndShapeRenderer(true, true);
        r0.setSeriesPaint(0, NO_CURRENT);
        XYLineAndShapeRenderer r1 = new XYLineAndShapeRenderer(true, true);
        r1.setSeriesPaint(0, NO_EMITTANCE);
        XYPlot plot = new XYPlot(new XYSeriesCollection(z), iAxis, zAxis, r0);
        plot.setRangeAxis(1, rAxis);
        plot.setDataset(1, new XYSeriesCollection(w));
        plot.setRenderer(1, r1);
        plot.mapDatasetToRangeAxis(1, 1);
        style(plot);
        String title = scan.vanishingCurrent_A().isPresent()
                ? String.format(java.util.Locale.ROOT, "Waist against current (waist leaves the range at %.4g mA)",
                        scan.vanishingCurrent_A().getAsDouble() * 1e3)
                : "Waist against current";
        return new JFreeChart(title, JFreeChart.DEFAULT_TITLE_FONT, plot, true);
    }

    private static void style(XYPlot plot) {
        plot.setBackgroundPaint(BACKGROUND);
        plot.setDomainGridlinePaint(GRID);
        plot.setRangeGridlinePaint(GRID);
    }
}
