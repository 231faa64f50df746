package org.axistack.report;

import java.awt.Rectangle;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import org.axistack.io.AtomicFiles;
import org.jfree.chart.ChartUtils;
import org.jfree.chart.JFreeChart;
import org.jfree.svg.SVGGraphics2D;

/** Writes charts to PNG and SVG files atomically (headless; no screen needed). */
public final class ChartFiles {
    private ChartFiles() {
    }

    public static void writePng(JFreeChart chart, int width, int height, Path file) throws IOException {
        AtomicFiles.write(file, out -> ChartUtils.writeChartAsPNG(out, chart, width, height));
    }

    public static void writeSvg(JFreeChart chart, int width, int height, Path file) throws IOException {
        SVGGraphics2D g = new SVGGraphics2D(width, height);
        chart.draw(g, new Rectangle(0, 0, width, height));
        byte[] bytes = g.getSVGDocument().getBytes(StandardCharsets.UTF_8);
        AtomicFiles.write(file, out -> out.write(bytes));
    }
}
