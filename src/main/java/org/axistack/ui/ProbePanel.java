package org.axistack.ui;

import java.awt.BorderLayout;
import java.awt.Font;
import java.awt.GridLayout;
import java.awt.event.HierarchyEvent;
import java.util.Locale;
import java.util.OptionalDouble;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.RejectedExecutionException;
import java.util.concurrent.atomic.AtomicReference;
import java.util.function.Consumer;
import javax.swing.BorderFactory;
import javax.swing.JLabel;
import javax.swing.JPanel;
import javax.swing.JScrollPane;
import javax.swing.JTextArea;
import javax.swing.JTextField;
import javax.swing.SwingUtilities;

import org.axistack.model.PhysicsException;
import org.axistack.model.Stack;
import org.axistack.probe.ProbeSource;
import org.axistack.report.ProbeChart;
import org.jfree.chart.ChartPanel;

/**
 * The window's probe tab: the source (reduced brightness, energy spread, optionally a virtual source size) and the
 * probe-current-against-size curve for the biases set in the window ({@link ProbeCurveView}), with a few lines of
 * text under it. The curve is computed on its own worker after the lens view has been drawn, only while the tab is
 * showing; a newer bias change drops a waiting computation and the result of a running one (newest wins), so the
 * lens view's change-to-redraw budget is not touched.
 */
final class ProbePanel extends JPanel {

    /**
     * Start value of the brightness field, A/(m^2 sr V): an example of the order of a thermionic cathode (the
     * probe command's help names the same order; common practice, no source), to be replaced by the user's source.
     */
    static final double START_BRIGHTNESS = 1e5;
    /** Start value of the energy spread, eV FWHM: the plan's and the probe command's default. */
    static final double START_ENERGY_SPREAD_EV = 1;

    final JTextField brightnessField = new JTextField(UiFormat.num(START_BRIGHTNESS), 8);
    final JTextField spreadField = new JTextField(UiFormat.num(START_ENERGY_SPREAD_EV), 8);
    final JTextField sourceSizeField = new JTextField("", 8);
    private final ChartPanel chart = new ChartPanel(null);
    private final JTextArea summary = new JTextArea(9, 40);
    private final Consumer<String> status;
    private final ExecutorService worker = Executors.newSingleThreadExecutor(r -> {
        Thread t = new Thread(r, "axistack-probe");
        t.setDaemon(true);
        return t;
    });
    private final AtomicReference<Job> pending = new AtomicReference<>();
    private ProbeSource source = new ProbeSource(START_BRIGHTNESS, START_ENERGY_SPREAD_EV, OptionalDouble.empty());
    /** The newest session and view (event thread only). */
    private LensSession session;
    private LensView latest;
    /** Counts requests; a result is shown only if no newer request was made (event thread only). */
    private long generation;
    private boolean stale;
    private Future<?> running;
    /** The curve on display (read by tests from any thread). */
    private volatile ProbeCurveView shown;

    private record Job(long generation, LensSession session, Stack stack, ProbeSource source) {
    }

    ProbePanel(Consumer<String> status) {
        super(new BorderLayout());
        this.status = status;
        JPanel inputs = new JPanel(new GridLayout(3, 2, 6, 2));
        inputs.setBorder(BorderFactory.createTitledBorder("Source (Enter to apply; the start values are examples)"));
        inputs.add(new JLabel("reduced brightness (A/(m^2 sr V))"));
        inputs.add(brightnessField);
        inputs.add(new JLabel("energy spread, FWHM (eV)"));
        inputs.add(spreadField);
        inputs.add(new JLabel("virtual source FW50 (nm; blank: free magnification)"));
        inputs.add(sourceSizeField);
        brightnessField.setName("probe-brightness");
        spreadField.setName("probe-energy-spread");
        sourceSizeField.setName("probe-source-size");
        for (JTextField f : new JTextField[] {brightnessField, spreadField, sourceSizeField}) {
            f.setHorizontalAlignment(JTextField.RIGHT);
            BiasPanel.onCommit(f, this::sourceTyped);
        }
        add(inputs, BorderLayout.NORTH);
        chart.setName("probe-chart");
        chart.setBorder(BorderFactory.createTitledBorder("Probe current against probe size at the biases shown"));
        add(chart, BorderLayout.CENTER);
        summary.setEditable(false);
        summary.setLineWrap(true);
        summary.setWrapStyleWord(true);
        summary.setName("probe-summary");
        summary.setFont(summary.getFont().deriveFont(Font.PLAIN, 11f));
        summary.setText("The curve appears once a lens is solved.");
        add(new JScrollPane(summary), BorderLayout.SOUTH);
        addHierarchyListener(e -> {
            if ((e.getChangeFlags() & HierarchyEvent.SHOWING_CHANGED) != 0 && isShowing() && stale) {
                start();
            }
        });
    }

    /** A new lens view was installed (event thread): recompute now if the tab shows, else when it is shown. */
    void viewChanged(LensSession s, LensView v) {
        session = s;
        latest = v;
        if (isShowing()) {
            start();
        } else {
            stale = true;
        }
    }

    private void sourceTyped() {
        ProbeSource typed;
        try {
            double b = Double.parseDouble(brightnessField.getText().trim());
            double de = Double.parseDouble(spreadField.getText().trim());
            String d = sourceSizeField.getText().trim();
            typed = new ProbeSource(b, de, d.isEmpty() ? OptionalDouble.empty()
                    : OptionalDouble.of(Double.parseDouble(d) * 1e-9));
        } catch (IllegalArgumentException | PhysicsException ex) {
            status.accept("probe: type a reduced brightness > 0 in A/(m^2 sr V), an energy spread >= 0 in eV and a"
                    + " virtual source size > 0 in nm (or leave it blank)");
            showSource(); // back to the values in use
            return;
        }
        if (!typed.equals(source)) {
            source = typed;
            if (latest != null) {
                viewChanged(session, latest);
            }
        }
    }

    private void showSource() {
        brightnessField.setText(UiFormat.num(source.reducedBrightness_A_per_m2_sr_V()));
        spreadField.setText(UiFormat.num(source.energySpread_eV()));
        sourceSizeField.setText(source.virtualSourceSize_m().isPresent()
                ? UiFormat.num(source.virtualSourceSize_m().getAsDouble() * 1e9) : "");
    }

    private void start() {
        stale = false;
        if (latest == null) {
            return;
        }
        Job job = new Job(++generation, session, latest.stack(), source);
        pending.set(job);
        if (running != null) {
            running.cancel(true); // its result would be dropped anyway; a queued one has nothing left to do
        }
        try {
            running = worker.submit(() -> {
                Job j = pending.getAndSet(null);
                if (j == null) {
                    return;
                }
                try {
                    ProbeCurveView v = ProbeCurveView.of(j.session().solution(), j.stack(), j.source());
                    SwingUtilities.invokeLater(() -> {
                        if (j.generation() == generation) {
                            show(v);
                        }
                    });
                } catch (RuntimeException ex) {
                    SwingUtilities.invokeLater(() -> status.accept("probe curve not drawn: " + ex.getMessage()));
                }
            });
        } catch (RejectedExecutionException closing) {
            running = null; // the window is closing
        }
    }

    private void show(ProbeCurveView v) {
        shown = v;
        chart.setChart(ProbeChart.of(v.study(), null));
        StringBuilder b = new StringBuilder();
        for (String line : v.summary()) {
            b.append(line).append('\n');
        }
        b.append(String.format(Locale.ROOT, "FW50 by the root-power-sum of Barth and Kruit (about 10 %%), dashed the"
                + " quadrature sum; no space charge; computed in %.0f ms after the lens view", v.compute_ms()));
        summary.setText(b.toString());
        summary.setCaretPosition(0);
    }

    /** The curve on display (null before the first). */
    ProbeCurveView shown() {
        return shown;
    }

    /** Stops the worker (the window is closing). */
    void shutdown() {
        worker.shutdownNow();
    }
}
