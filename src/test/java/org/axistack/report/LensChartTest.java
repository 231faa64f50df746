package org.axistack.report;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.axistack.io.BuiltInStacks;
import org.axistack.model.Stack;
import org.jfree.chart.plot.CombinedDomainXYPlot;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The lens view chart draws headless to PNG and SVG and carries its layers and markers (no display needed). */
class LensChartTest {

    @Test
    void layersMarkersAndFiles(@TempDir Path dir) throws Exception {
        Stack s = BuiltInStacks.demo();
        LensChart.Lines iso = new LensChart.LinesBuilder().add(-5, 0).add(-5, 4).breakLine().add(5, 0).add(5, 4)
                .build();
        LensChart.Lines axis = new LensChart.LinesBuilder().add(-40, 0).add(0, -120).add(40, 0).build();
        LensChart.Layers layers = new LensChart.Layers(s, iso, "equipotentials every 10 V", LensChart.Lines.none(),
                LensChart.Lines.none(), "no rays", LensChart.Lines.none(), axis,
                List.of(new LensChart.Mark("F2", 30), new LensChart.Mark("F1", -30)));
        LensChart c = LensChart.create(layers);
        assertThat(c.chart().getPlot()).isInstanceOf(CombinedDomainXYPlot.class);
        assertThat(((CombinedDomainXYPlot) c.chart().getPlot()).getSubplots()).hasSize(2);
        assertThat((java.util.Collection<?>) c.section().getDomainMarkers(org.jfree.chart.ui.Layer.FOREGROUND)).hasSize(2);
        assertThat(iso.size()).isEqualTo(5); // two pieces and one NaN separator
        // the same shared z axis in both plots
        assertThat(c.potential().getDomainAxis()).isSameAs(c.section().getDomainAxis());
        Path png = dir.resolve("lens.png");
        Path svg = dir.resolve("lens.svg");
        ChartFiles.writePng(c.chart(), 1000, 700, png);
        ChartFiles.writeSvg(c.chart(), 1000, 700, svg);
        assertThat(Files.size(png)).isGreaterThan(10_000);
        assertThat(Files.readString(svg)).contains("<svg").contains("F2");
        // re-biasing redraws the electrode labels with the new bias
        c.show(new LensChart.Layers(s.withBias("focus", -150), iso, "", LensChart.Lines.none(),
                LensChart.Lines.none(), "", LensChart.Lines.none(), axis, List.of()));
        assertThat(c.section().getAnnotations().toString()).isNotEmpty();
        assertThat((java.util.Collection<?>) c.section().getDomainMarkers(org.jfree.chart.ui.Layer.FOREGROUND)).isNull();
    }
}
