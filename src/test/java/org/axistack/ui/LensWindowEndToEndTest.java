package org.axistack.ui;

import static org.assertj.core.api.Assertions.assertThat;

import java.awt.GraphicsEnvironment;
import java.awt.image.BufferedImage;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import java.util.prefs.Preferences;
import javax.imageio.ImageIO;
import javax.swing.SwingUtilities;

import org.axistack.io.Units;
import org.axistack.model.Stack;
import org.axistack.optics.CardinalElements;
import org.axistack.optics.ParaxialOptics;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.Test;

/**
 * The window end to end, only where a display exists (CI runs the suite under xvfb-run): open a lens-library
 * file, move a bias slider, and check that the property table shows what the optics package computes for the
 * new biases (and that it changed). Also records change-to-redraw times of the demo lens, and, when the
 * system property axistack.screenshots names a folder, writes screenshots of the window there.
 */
class LensWindowEndToEndTest {

    private Preferences prefs;
    private LensWindow window;

    @AfterEach
    void close() throws Exception {
        if (window != null) {
            SwingUtilities.invokeAndWait(() -> {
                window.shutdown();
                window.dispose();
            });
        }
        if (prefs != null) {
            prefs.removeNode();
        }
    }

    private LensWindow open(String file) throws Exception {
        Assumptions.assumeFalse(GraphicsEnvironment.isHeadless(), "no display: the window test needs one");
        prefs = Preferences.userRoot().node("org/axistack/test-" + System.nanoTime());
        RecentFiles recent = new RecentFiles(prefs);
        recent.markCautionsSeen(); // the modal cautions dialog is for people; RecentFilesTest covers the flag
        window = Desktop.open(file == null ? null : Path.of(file), recent);
        waitFor(() -> window.current != null && window.session != null, "the first view");
        return window;
    }

    @Test
    void movingABiasChangesThePropertiesAsTheOpticsPackageSays() throws Exception {
        LensWindow w = open("lens-library/electron-flood-einzel.toml");
        Stack stack = w.session.stack();
        assertThat(new RecentFiles(prefs).list()).hasSize(1);
        String before = onEdt(() -> tableValue(w, PropertySheet.FOCAL_LENGTH_IMAGE));
        int k = middleElectrode(stack);
        double target = stack.biases_V()[k] * 1.2;
        SwingUtilities.invokeAndWait(() -> w.biasPanel.slider(k).setValue(w.biasPanel.scale().position(target)));
        double moved = w.biasPanel.scale().bias_V(w.biasPanel.scale().position(target));
        waitFor(() -> w.current.stack().electrodes().get(k).bias_V() == moved, "the view at the moved bias");
        double[] b = stack.biases_V();
        b[k] = moved;
        // reference: the optics package on the stored solution at the new biases
        CardinalElements ref = ParaxialOptics.of(w.session.solution().withBiases(b), stack.withBiases(b)).cardinal();
        String after = onEdt(() -> tableValue(w, PropertySheet.FOCAL_LENGTH_IMAGE));
        assertThat(after).isEqualTo(UiFormat.num(Units.mToMm(ref.focalLengthImage_m())));
        assertThat(after).isNotEqualTo(before);
        assertThat(onEdt(() -> tableValue(w, PropertySheet.FOCAL_POINT_IMAGE)))
                .isEqualTo(UiFormat.num(Units.mToMm(ref.focalPointImageZ_m())));
        assertThat(w.unsaved()).isTrue();

        // change-to-redraw times over a dozen bias changes (printed for src/site/markdown/gui.md, not asserted)
        List<Double> compute = new ArrayList<>();
        List<Double> computeCpu = new ArrayList<>();
        List<Double> paintCpu = new ArrayList<>();
        for (int i = 1; i <= 12; i++) {
            double v = moved * (1 + 0.01 * i);
            int n = w.chartPanel.times().size();
            SwingUtilities.invokeAndWait(() -> w.biasPanel.set(k, v, false));
            waitFor(() -> w.chartPanel.times().size() > n, "a redraw");
            compute.add(w.current.compute_ms());
            computeCpu.add(w.current.cpu_ms());
            paintCpu.add(w.chartPanel.lastPaintCpuMs);
        }
        List<Double> t = new ArrayList<>(w.chartPanel.times());
        System.out.printf("demo lens change to redraw: median %.1f ms, max %.1f ms over %d changes; view"
                + " computation median %.1f ms wall, %.1f ms cpu; paint median %.1f ms cpu; load average %.1f%n",
                median(t), t.stream().mapToDouble(d -> d).max().orElse(0), t.size(), median(compute),
                median(computeCpu), median(paintCpu),
                java.lang.management.ManagementFactory.getOperatingSystemMXBean().getSystemLoadAverage());
        waitFor(() -> w.current.layers().envelope().size() > 0, "the envelope");
        screenshot(w, "gui-electron-flood-einzel.png");
    }

    /** Screenshot of a second lens; runs only when screenshots are asked for (it solves another geometry). */
    @Test
    void screenshotOfTheArgonLens() throws Exception {
        Assumptions.assumeTrue(System.getProperty("axistack.screenshots") != null, "screenshots not asked for");
        LensWindow w = open("lens-library/argon-sputter-einzel.toml");
        waitFor(() -> w.current.layers().envelope().size() > 0, "the envelope");
        screenshot(w, "gui-argon-sputter-einzel.png");
    }

    private static double median(List<Double> l) {
        List<Double> s = new ArrayList<>(l);
        s.sort(null);
        return s.get(s.size() / 2);
    }

    private static int middleElectrode(Stack s) {
        return s.electrodes().size() / 2;
    }

    private static String tableValue(LensWindow w, String label) {
        return w.properties.rows().stream().filter(r -> r.label().equals(label)).findFirst().orElseThrow().value();
    }

    private static <T> T onEdt(Callable<T> c) throws Exception {
        Object[] out = new Object[1];
        Exception[] err = new Exception[1];
        SwingUtilities.invokeAndWait(() -> {
            try {
                out[0] = c.call();
            } catch (Exception e) {
                err[0] = e;
            }
        });
        if (err[0] != null) {
            throw err[0];
        }
        @SuppressWarnings("unchecked")
        T t = (T) out[0];
        return t;
    }

    private static void waitFor(Callable<Boolean> condition, String what) throws Exception {
        long end = System.nanoTime() + 180_000_000_000L;
        while (System.nanoTime() < end) {
            if (Boolean.TRUE.equals(onEdt(condition))) {
                return;
            }
            Thread.sleep(50);
        }
        throw new AssertionError("timed out waiting for " + what);
    }

    private static void screenshot(LensWindow w, String name) throws Exception {
        String dir = System.getProperty("axistack.screenshots");
        if (dir == null) {
            return;
        }
        Thread.sleep(500);
        BufferedImage img = onEdt(() -> {
            BufferedImage i = new BufferedImage(w.getWidth(), w.getHeight(), BufferedImage.TYPE_INT_RGB);
            w.getRootPane().paintAll(i.getGraphics());
            return i;
        });
        Files.createDirectories(Path.of(dir));
        ImageIO.write(img, "png", Path.of(dir, name).toFile());
    }
}
