package org.axistack.ui;

import java.awt.BorderLayout;
import java.awt.Dimension;
import java.awt.Font;
import java.awt.event.KeyEvent;
import java.awt.event.WindowAdapter;
import java.awt.event.WindowEvent;
import java.util.Arrays;
import java.util.Optional;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.atomic.AtomicReference;
import javax.swing.BorderFactory;
import javax.swing.Box;
import javax.swing.BoxLayout;
import javax.swing.JButton;
import javax.swing.JFrame;
import javax.swing.JLabel;
import javax.swing.JPanel;
import javax.swing.JProgressBar;
import javax.swing.JScrollPane;
import javax.swing.JSplitPane;
import javax.swing.JTabbedPane;
import javax.swing.JTextArea;
import javax.swing.JTextField;
import javax.swing.SwingUtilities;
import javax.swing.event.DocumentEvent;
import javax.swing.event.DocumentListener;

import org.axistack.model.Numbers;
import org.axistack.model.PhysicsException;
import org.axistack.io.BuiltInStacks;
import org.axistack.io.StackInputException;
import org.axistack.model.Stack;
import org.axistack.report.LensChart;

/**
 * The desktop window: the lens view (cross-section with equipotentials, rays, envelope and cardinal points over
 * the axial potential), bias controls, the property table and the stack text. Field solves, potential maps,
 * envelopes and bundles run off the event thread; a bias change re-biases the stored solution on a worker
 * and the newest change wins. File handling and exports live in {@link WindowActions}.
 */
public final class LensWindow extends JFrame {

    final RecentFiles recent;
    StackDocument doc;
    /** The stack of the open session (geometry as solved, biases as loaded). */
    Stack solvedStack;
    LensSession session;
    volatile LensView current;
    LensChart lensChart;
    BiasPanel biasPanel;
    EnvelopeLayer envelope = EnvelopeLayer.defaults();

    final TimedChartPanel chartPanel = new TimedChartPanel();
    final PropertiesTable properties = new PropertiesTable();
    final JTextArea editor = new JTextArea();
    final JLabel status = new JLabel(" ");
    final JLabel readout = new JLabel(" ");
    final JLabel timing = new JLabel(" ");
    final JProgressBar progress = new JProgressBar(0, 1000);
    final JButton cancel = new JButton("Cancel");
    final JPanel biasHolder = new JPanel(new BorderLayout());
    /** The probe-current curve at the biases shown (computed only while its tab shows). */
    final ProbePanel probePanel = new ProbePanel(this::status);
    final JTextField currentField = new JTextField(UiFormat.num(EnvelopeLayer.defaults().current_A() * 1e6), 6);
    final JTextField emittanceField = new JTextField(UiFormat.num(EnvelopeLayer.defaults().emittance_m_rad() * 1e6), 6);
    private final WindowActions actions;
    private final ExecutorService live = Executors.newSingleThreadExecutor(daemon("axistack-live"));
    private final ExecutorService slow = Executors.newSingleThreadExecutor(daemon("axistack-envelope"));
    private final AtomicReference<double[]> pending = new AtomicReference<>();
    /** The steering controls of split electrodes (null for a round stack). */
    SteeringPanel steeringPanel;
    /** The newest steering values, set with {@link #pending} (the live worker reads both). */
    private final AtomicReference<java.util.Map<String, double[]>> pendingSteering =
            new AtomicReference<>(java.util.Map.of());
    /** The view whose envelope starts once it has been painted (event thread only). */
    private LensView envelopeDue;
    /** The envelope being computed (event thread only). */
    private Future<?> envelopeJob;
    private boolean editorUpdating;

    public LensWindow(RecentFiles recent) {
        super("Axistack lens bench");
        this.recent = recent;
        this.actions = new WindowActions(this);
        setDefaultCloseOperation(DO_NOTHING_ON_CLOSE);
        addWindowListener(new WindowAdapter() {
            @Override
            public void windowClosing(WindowEvent e) {
                actions.closeWindow();
            }
        });
        setJMenuBar(actions.menuBar());
        layoutWindow();
        setSize(new Dimension(1360, 860));
        setLocationByPlatform(true);
    }

    private void layoutWindow() {
        chartPanel.setMouseWheelEnabled(true);
        chartPanel.afterPaint(() -> {
            TimedChartPanel.Redraw r = chartPanel.last();
            timing.setText(String.format(java.util.Locale.ROOT, "change to redraw %.0f ms (view computed in %.0f ms,"
                    + " drawn in %.0f ms)", r.total_ms(), r.compute_ms(), r.paint_ms()));
        });
        chartPanel.afterEveryPaint(() -> {
            if (envelopeDue != null) {
                LensView v = envelopeDue;
                envelopeDue = null;
                startEnvelope(v);
            }
        });
        chartPanel.addChartMouseListener(new CursorReadout(this));
        JPanel right = new JPanel(new BorderLayout());
        JTabbedPane tabs = new JTabbedPane();
        JPanel tune = new JPanel();
        tune.setLayout(new BoxLayout(tune, BoxLayout.Y_AXIS));
        tune.add(biasHolder);
        tune.add(envelopePanel());
        JScrollPane propScroll = new JScrollPane(properties);
        propScroll.setBorder(BorderFactory.createTitledBorder("Optical properties (paraxial, asymptotic; stack z)"));
        JPanel tuneTab = new JPanel(new BorderLayout());
        tuneTab.add(tune, BorderLayout.NORTH);
        // the probe curve beside the properties, under the bias controls, so it follows the sliders in view
        JTabbedPane below = new JTabbedPane();
        below.addTab("Properties", propScroll);
        below.addTab("Probe size", probePanel);
        below.setName("tune-lower-tabs");
        tuneTab.add(below, BorderLayout.CENTER);
        tabs.addTab("Tune", tuneTab);
        tabs.addTab("Stack text", editorPanel());
        tabs.addChangeListener(e -> {
            if (tabs.getSelectedIndex() == 1 && biasPanel != null) {
                syncText(biasPanel.biases());
            }
        });
        right.add(tabs, BorderLayout.CENTER);
        right.setPreferredSize(new Dimension(540, 600));

        JSplitPane split = new JSplitPane(JSplitPane.HORIZONTAL_SPLIT, chartPanel, right);
        split.setResizeWeight(1.0);
        getContentPane().add(split, BorderLayout.CENTER);

        JPanel bar = new JPanel();
        bar.setLayout(new BoxLayout(bar, BoxLayout.X_AXIS));
        bar.setBorder(BorderFactory.createEmptyBorder(3, 6, 3, 6));
        readout.setFont(readout.getFont().deriveFont(Font.PLAIN));
        bar.add(readout);
        bar.add(Box.createHorizontalStrut(24)); // the read-out and the status never run together
        bar.add(Box.createHorizontalGlue());
        bar.add(status);
        bar.add(Box.createHorizontalStrut(12));
        bar.add(timing);
        bar.add(Box.createHorizontalStrut(12));
        progress.setMaximumSize(new Dimension(200, 18));
        progress.setVisible(false);
        progress.setStringPainted(true);
        cancel.setVisible(false);
        cancel.setName("cancel");
        bar.add(progress);
        bar.add(cancel);
        getContentPane().add(bar, BorderLayout.SOUTH);
    }

    private JPanel envelopePanel() {
        JPanel p = new JPanel(new java.awt.GridLayout(2, 2, 6, 2));
        p.setBorder(BorderFactory.createTitledBorder("Beam envelope (parallel start, radius 25 % of the bore)"));
        p.add(new JLabel("beam current (uA), Enter to apply"));
        p.add(currentField);
        p.add(new JLabel("edge emittance (mm mrad)"));
        p.add(emittanceField);
        currentField.setName("envelope-current");
        emittanceField.setName("envelope-emittance");
        currentField.addActionListener(e -> envelopeChanged());
        emittanceField.addActionListener(e -> envelopeChanged());
        return p;
    }

    private void envelopeChanged() {
        try {
            double i = Double.parseDouble(currentField.getText().trim()) * 1e-6;
            double eps = Double.parseDouble(emittanceField.getText().trim()) * 1e-6;
            envelope = new EnvelopeLayer(i, eps, envelope.radiusFraction());
            if (current != null) {
                startEnvelope(current);
            }
        } catch (IllegalArgumentException | PhysicsException ex) {
            status("envelope: type a current >= 0 in microamperes and an emittance >= 0 in mm mrad");
        }
    }

    private JPanel editorPanel() {
        JPanel p = new JPanel(new BorderLayout());
        editor.setFont(new Font(Font.MONOSPACED, Font.PLAIN, 12));
        editor.setName("stack-text");
        editor.getDocument().addDocumentListener(new DocumentListener() {
            @Override
            public void insertUpdate(DocumentEvent e) {
                edited();
            }

            @Override
            public void removeUpdate(DocumentEvent e) {
                edited();
            }

            @Override
            public void changedUpdate(DocumentEvent e) {
                edited();
            }
        });
        p.add(new JScrollPane(editor), BorderLayout.CENTER);
        JPanel buttons = new JPanel();
        JButton check = new JButton("Check");
        check.setMnemonic(KeyEvent.VK_C);
        check.addActionListener(e -> actions.checkText());
        JButton apply = new JButton("Apply and solve");
        apply.setMnemonic(KeyEvent.VK_A);
        apply.addActionListener(e -> actions.applyText());
        buttons.add(check);
        buttons.add(apply);
        p.add(buttons, BorderLayout.SOUTH);
        return p;
    }

    private void edited() {
        if (!editorUpdating && doc != null) {
            doc = doc.withText(editor.getText());
            updateTitle();
        }
    }

    /** Shows a document's text in the editor without marking it edited. */
    void showText(StackDocument d) {
        doc = d;
        editorUpdating = true;
        try {
            editor.setText(d.text());
            editor.setCaretPosition(0);
        } finally {
            editorUpdating = false;
        }
        updateTitle();
    }

    /**
     * Writes the biases set with the controls into the stack text in place (comments and layout kept), so the
     * "Stack text" tab never shows an old bias. Left alone while the text does not parse (being edited) or names
     * other electrodes than the solved stack.
     */
    void syncText(double[] biases) {
        if (doc == null || solvedStack == null) {
            return;
        }
        try {
            org.axistack.model.Stack parsed = doc.parse();
            if (!parsed.names().equals(solvedStack.names()) || Arrays.equals(parsed.biases_V(), biases)) {
                return;
            }
            String text = doc.textWithBiases(parsed, biases);
            int caret = editor.getCaretPosition();
            doc = doc.withText(text);
            editorUpdating = true;
            try {
                editor.setText(text);
                editor.setCaretPosition(Math.min(caret, text.length()));
            } finally {
                editorUpdating = false;
            }
            updateTitle();
        } catch (StackInputException e) {
            // the text is being edited and does not parse: leave it as typed
        }
    }

    /** Whether anything would be lost on close: edited text or biases moved since the last save. */
    boolean unsaved() {
        if (doc == null) {
            return false;
        }
        if (doc.modified()) {
            return true;
        }
        return biasPanel != null && solvedStack != null
                && !Arrays.equals(biasPanel.biases(), textBiases().orElse(solvedStack.biases_V()));
    }

    private String parsedText;
    private Optional<double[]> parsedBiases = Optional.empty();

    /** The biases written in the text (read once per text, not on every bias change). */
    private Optional<double[]> textBiases() {
        if (!doc.text().equals(parsedText)) {
            parsedText = doc.text();
            try {
                parsedBiases = Optional.of(doc.parse().biases_V());
            } catch (StackInputException e) {
                parsedBiases = Optional.empty();
            }
        }
        return parsedBiases;
    }

    void updateTitle() {
        String name = doc == null ? "" : doc.shownAs();
        setTitle("Axistack lens bench" + (name.isEmpty() ? "" : " - " + name) + (unsaved() ? " (unsaved)" : ""));
    }

    void status(String text) {
        status.setText(text);
        status.setToolTipText(text); // a long line is cut at the window's edge: the whole of it on hover
    }

    /** Installs a freshly solved session: new chart, new bias controls, first view. */
    void install(LensSession s) {
        session = s;
        solvedStack = s.stack();
        lensChart = LensChart.create(s.stack());
        chartPanel.setChart(lensChart.chart());
        chartPanel.setDomainZoomable(true);
        chartPanel.setRangeZoomable(true);
        lensChart.section().setDomainPannable(true);
        lensChart.section().setRangePannable(true);
        biasPanel = new BiasPanel(s.stack(), this::biasesChanged, this::status);
        biasHolder.removeAll();
        biasHolder.add(biasPanel, BorderLayout.CENTER);
        steeringPanel = s.stack().hasSectors()
                ? new SteeringPanel(s.stack(), () -> biasesChanged(biasPanel.biases()), this::status) : null;
        if (steeringPanel != null) {
            biasHolder.add(steeringPanel, BorderLayout.SOUTH);
        }
        biasHolder.revalidate();
        status(String.format(java.util.Locale.ROOT, "field solved: %d unknowns in %s s (once per geometry); %s",
                s.solution().unknowns(), Numbers.seconds(s.solution().solveSeconds()), s.solution().meshErrorStatement()));
        biasesChanged(s.stack().biases_V());
    }

    /** A bias moved: compute the view on the live worker (newest change wins) and redraw. */
    void biasesChanged(double[] biases) {
        if (session == null) {
            return;
        }
        chartPanel.markChange(System.nanoTime());
        cancelEnvelope();
        pendingSteering.set(steeringPanel == null ? java.util.Map.of() : steeringPanel.differentials());
        pending.set(biases);
        if (editor.isShowing()) {
            syncText(biases);
        }
        LensSession s = session;
        submit(live, () -> {
            double[] b = pending.getAndSet(null);
            if (b == null) {
                return;
            }
            java.util.Map<String, double[]> steering = pendingSteering.get();
            try {
                long t0 = System.nanoTime();
                LensView v = s.view(b, steering);
                long t1 = System.nanoTime();
                SwingUtilities.invokeLater(() -> apply(s, v, t0, t1));
            } catch (RuntimeException ex) {
                SwingUtilities.invokeLater(() -> status("could not redraw: " + ex.getMessage()));
            }
        });
        updateTitle();
    }

    private void apply(LensSession s, LensView v, long started, long computed) {
        if (s != session) {
            return;
        }
        chartPanel.markApplied(started, computed, v.cpu_ms());
        current = v;
        lensChart.show(v.layers());
        properties.show(v.properties());
        probePanel.viewChanged(s, v);
        // the envelope (tens of ms) waits for this paint, so it never competes with the live redraw
        envelopeDue = v;
        if (!chartPanel.isShowing()) {
            envelopeDue = null;
            startEnvelope(v);
        }
    }

    /** Drops a pending envelope and interrupts a running one: the biases moved again. */
    private void cancelEnvelope() {
        envelopeDue = null;
        if (envelopeJob != null) {
            envelopeJob.cancel(true);
            envelopeJob = null;
        }
    }

    private void startEnvelope(LensView v) {
        EnvelopeLayer env = envelope;
        if (envelopeJob != null) {
            envelopeJob.cancel(true);
        }
        envelopeJob = submit(slow, () -> {
            if (current != v) {
                return;
            }
            try {
                LensChart.Lines lines = env.lines(v.stack(), v.field());
                SwingUtilities.invokeLater(() -> {
                    if (current == v) {
                        current = v.withEnvelope(lines);
                        lensChart.show(current.layers());
                    }
                });
            } catch (java.util.concurrent.CancellationException ex) {
                // the biases moved on; the next view starts its own envelope
            } catch (RuntimeException ex) {
                SwingUtilities.invokeLater(() -> status("envelope not drawn: " + ex.getMessage()));
            }
        });
    }

    /** Opens the built-in demo lens. */
    void openDemo() throws StackInputException {
        StackDocument d = StackDocument.unsaved("built-in demo (" + BuiltInStacks.DEMO_FILE + ")",
                BuiltInStacks.demoText());
        showText(d);
        actions.solve(d.parse());
    }

    WindowActions actions() {
        return actions;
    }

    /**
     * Hands work to a worker, or drops it once the window has stopped its workers: a slider event or a
     * queued redraw may still arrive on the event thread after {@link #shutdown()}, and nothing may throw there.
     */
    private static java.util.concurrent.Future<?> submit(ExecutorService worker, Runnable job) {
        if (worker.isShutdown()) {
            return null;
        }
        try {
            return worker.submit(job);
        } catch (java.util.concurrent.RejectedExecutionException closing) {
            return null; // shut down between the check and the submit
        }
    }

    /** Stops the workers (the window is closing). */
    void shutdown() {
        live.shutdownNow();
        slow.shutdownNow();
        probePanel.shutdown();
    }

    private static java.util.concurrent.ThreadFactory daemon(String name) {
        return r -> {
            Thread t = new Thread(r, name);
            t.setDaemon(true);
            return t;
        };
    }
}
