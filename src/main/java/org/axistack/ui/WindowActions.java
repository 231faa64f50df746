package org.axistack.ui;

import java.awt.event.InputEvent;
import java.awt.event.KeyEvent;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.CancellationException;
import java.util.concurrent.ExecutionException;
import java.util.function.Consumer;
import javax.swing.JFileChooser;
import javax.swing.JMenu;
import javax.swing.JMenuBar;
import javax.swing.JMenuItem;
import javax.swing.JOptionPane;
import javax.swing.JScrollPane;
import javax.swing.JTextArea;
import javax.swing.KeyStroke;
import javax.swing.SwingWorker;
import javax.swing.filechooser.FileNameExtensionFilter;

import org.axistack.field.SolveException;
import org.axistack.io.StackInputException;
import org.axistack.io.TraceTableCsv;
import org.axistack.model.Stack;
import org.axistack.report.ChartFiles;
import org.axistack.report.SafetyNotice;
import org.axistack.trace.BundleResult;
import org.axistack.trace.TraceProgress;

/**
 * What the window's menus and buttons do: open, check, apply, save (atomically, biases written back into the
 * text), exports (PNG, SVG, trajectory CSV; the HTML report in {@link ReportAction}), the cautions, and closing
 * with a warning about unsaved changes.
 * Long work runs in {@link SwingWorker}s with the status-bar progress and Cancel button.
 */
final class WindowActions {

    private final LensWindow w;
    private volatile boolean cancelRequested;
    private SwingWorker<?, ?> running;

    WindowActions(LensWindow w) {
        this.w = w;
        w.cancel.addActionListener(e -> {
            cancelRequested = true;
            w.status("cancelling ...");
        });
    }

    JMenuBar menuBar() {
        JMenuBar bar = new JMenuBar();
        JMenu file = new JMenu("File");
        file.setMnemonic(KeyEvent.VK_F);
        file.add(item("Open stack file...", KeyEvent.VK_O, e -> openChosen()));
        JMenu recentMenu = new JMenu("Open recent");
        recentMenu.addMenuListener(new javax.swing.event.MenuListener() {
            @Override
            public void menuSelected(javax.swing.event.MenuEvent e) {
                recentMenu.removeAll();
                List<Path> files = w.recent.list();
                if (files.isEmpty()) {
                    JMenuItem none = new JMenuItem("(none yet)");
                    none.setEnabled(false);
                    recentMenu.add(none);
                }
                for (Path p : files) {
                    JMenuItem it = new JMenuItem(p.toString());
                    it.addActionListener(ev -> open(p));
                    recentMenu.add(it);
                }
            }

            @Override
            public void menuDeselected(javax.swing.event.MenuEvent e) {
            }

            @Override
            public void menuCanceled(javax.swing.event.MenuEvent e) {
            }
        });
        file.add(recentMenu);
        file.add(item("Open the demo lens", 0, e -> {
            if (confirmDiscard()) {
                try {
                    w.openDemo();
                } catch (StackInputException ex) {
                    error("The built-in demo", ex.getMessage());
                }
            }
        }));
        file.addSeparator();
        file.add(item("Save", KeyEvent.VK_S, e -> save(false)));
        JMenuItem saveAs = item("Save as...", 0, e -> save(true));
        file.add(saveAs);
        file.addSeparator();
        JMenu export = new JMenu("Export");
        export.add(item("Lens view as PNG...", 0, e -> exportChart("png")));
        export.add(item("Lens view as SVG...", 0, e -> exportChart("svg")));
        export.add(item("Trajectory table (CSV)...", 0, e -> exportTable()));
        file.add(export);
        file.add(item("Export HTML report...", KeyEvent.VK_R, e -> new ReportAction(w).run()));
        file.addSeparator();
        file.add(item("Quit", KeyEvent.VK_Q, e -> closeWindow()));
        bar.add(file);

        JMenu view = new JMenu("View");
        // Ctrl-F (fit), not Ctrl-0, which looks like Ctrl-O (open)
        view.add(item("Fit the whole lens", KeyEvent.VK_F, e -> w.chartPanel.restoreAutoBounds()));
        JMenuItem help = item("Zoom and pan: drag a box to zoom, wheel to zoom, Ctrl-drag to pan", 0, e -> { });
        help.setEnabled(false);
        view.add(help);
        bar.add(view);

        JMenu tuneMenu = new JMenu("Tune");
        tuneMenu.add(item("Focus on a plane...", KeyEvent.VK_T, e -> new FocusAction(w).run()));
        bar.add(tuneMenu);

        JMenu helpMenu = new JMenu("Help");
        helpMenu.add(item("High-voltage cautions", 0, e -> showCautions()));
        bar.add(helpMenu);
        return bar;
    }

    private static JMenuItem item(String text, int key, java.awt.event.ActionListener a) {
        JMenuItem it = new JMenuItem(text);
        if (key != 0) {
            it.setAccelerator(KeyStroke.getKeyStroke(key, InputEvent.CTRL_DOWN_MASK));
        }
        it.addActionListener(a);
        return it;
    }

    /** The high-voltage cautions in a dialog (first start and the Help menu). */
    void showCautions() {
        JTextArea t = new JTextArea(String.join("\n\n", SafetyNotice.CAUTIONS), 14, 60);
        t.setLineWrap(true);
        t.setWrapStyleWord(true);
        t.setEditable(false);
        t.setName("cautions");
        JOptionPane.showMessageDialog(w, new JScrollPane(t), SafetyNotice.TITLE, JOptionPane.WARNING_MESSAGE);
        w.recent.markCautionsSeen();
    }

    private void openChosen() {
        if (!confirmDiscard()) {
            return;
        }
        JFileChooser fc = chooser("Stack files (TOML)", "toml");
        if (fc.showOpenDialog(w) == JFileChooser.APPROVE_OPTION) {
            open(fc.getSelectedFile().toPath());
        }
    }

    /** Opens, checks and solves a stack file. */
    void open(Path file) {
        StackDocument d;
        try {
            d = StackDocument.open(file);
        } catch (IOException e) {
            error(file.toString(), "cannot read the file (" + e.getMessage() + "); check the path and permissions.");
            return;
        }
        Stack s;
        try {
            s = d.parse();
        } catch (StackInputException e) {
            w.showText(d);
            error(file.toString(), e.getMessage() + "\n\nThe text is in the Stack text tab: fix it there and press"
                    + " Apply and solve.");
            return;
        }
        w.recent.add(file);
        w.showText(d);
        solve(s);
    }

    /** Solves a stack's field and maps its potential on a worker, then installs the session. */
    void solve(Stack s) {
        if (running != null && !running.isDone()) {
            running.cancel(true); // its result is ignored; the new solve starts at once
        }
        cancelRequested = false;
        w.progress.setValue(0);
        w.progress.setVisible(true);
        w.cancel.setVisible(true);
        w.status("solving the field (" + s.mesh().targetElements() + " elements) ...");
        SwingWorker<LensSession, Void> job = new SwingWorker<>() {
            @Override
            protected LensSession doInBackground() {
                return LensSession.open(s, (stage, f) -> {
                    int v = (int) Math.round(1000 * f);
                    javax.swing.SwingUtilities.invokeLater(() -> {
                        w.progress.setValue(v);
                        w.progress.setString(stage);
                    });
                    return !cancelRequested && !isCancelled();
                });
            }

            @Override
            protected void done() {
                if (running != this) {
                    return; // a newer solve replaced this one
                }
                w.progress.setVisible(false);
                w.cancel.setVisible(false);
                try {
                    w.install(get());
                } catch (CancellationException | InterruptedException e) {
                    w.status("solve cancelled; the previous lens stays shown");
                } catch (ExecutionException e) {
                    Throwable c = e.getCause();
                    if (c instanceof CancellationException) {
                        w.status("solve cancelled; the previous lens stays shown");
                    } else if (c instanceof SolveException m) {
                        error(w.doc.shownAs(), "the field cannot be solved as given: " + m.getMessage());
                    } else {
                        error(w.doc.shownAs(), "internal error while solving: " + c + ". This is a bug; please report"
                                + " it with the stack file.");
                    }
                }
            }
        };
        running = job;
        job.execute();
    }

    void checkText() {
        try {
            Stack s = w.doc.parse();
            w.status("the text reads as a valid stack: " + s.electrodes().size() + " electrodes");
        } catch (StackInputException e) {
            error(w.doc.shownAs(), e.getMessage());
        }
    }

    void applyText() {
        try {
            solve(w.doc.parse());
        } catch (StackInputException e) {
            error(w.doc.shownAs(), e.getMessage());
        }
    }

    /** Saves; returns whether the file was written. */
    boolean save(boolean choose) {
        if (w.doc == null) {
            return false;
        }
        Stack parsed;
        try {
            parsed = w.doc.parse();
        } catch (StackInputException e) {
            error(w.doc.shownAs(), e.getMessage() + "\n\nNothing was saved: fix the text first.");
            return false;
        }
        String text = w.doc.text();
        if (w.biasPanel != null && w.solvedStack != null && parsed.names().equals(w.solvedStack.names())) {
            text = w.doc.textWithBiases(parsed, w.biasPanel.biases());
        }
        Path target = w.doc.path().orElse(null);
        if (choose || target == null) {
            JFileChooser fc = chooser("Stack files (TOML)", "toml");
            if (fc.showSaveDialog(w) != JFileChooser.APPROVE_OPTION) {
                return false;
            }
            target = withExtension(fc.getSelectedFile().toPath(), "toml");
            if (Files.exists(target) && !target.equals(w.doc.path().orElse(null))
                    && JOptionPane.showConfirmDialog(w, target + " exists. Replace it?", "Save",
                            JOptionPane.YES_NO_OPTION) != JOptionPane.YES_OPTION) {
                return false;
            }
        }
        try {
            w.showText(w.doc.saveAs(target, text));
            w.recent.add(target);
            w.status("saved " + target);
            return true;
        } catch (IOException e) {
            error(target.toString(), "cannot write the file (" + e.getMessage() + "); choose a folder you can write"
                    + " to. The file on disk is unchanged.");
            return false;
        }
    }

    private void exportChart(String kind) {
        if (w.session == null) {
            return;
        }
        JFileChooser fc = chooser(kind.toUpperCase(Locale.ROOT) + " image", kind);
        if (fc.showSaveDialog(w) != JFileChooser.APPROVE_OPTION) {
            return;
        }
        Path p = withExtension(fc.getSelectedFile().toPath(), kind);
        int[] size = w.session.chartSize();
        try {
            if (kind.equals("png")) {
                ChartFiles.writePng(w.lensChart.chart(), size[0], size[1], p);
            } else {
                ChartFiles.writeSvg(w.lensChart.chart(), size[0], size[1], p);
            }
            w.status("wrote " + p);
        } catch (IOException e) {
            error(p.toString(), "cannot write the image (" + e.getMessage() + "); choose a folder you can write to.");
        }
    }

    private void exportTable() {
        if (w.current == null) {
            return;
        }
        JFileChooser fc = chooser("CSV table", "csv");
        if (fc.showSaveDialog(w) != JFileChooser.APPROVE_OPTION) {
            return;
        }
        Path p = withExtension(fc.getSelectedFile().toPath(), "csv");
        writeTable(p, r -> w.status(r));
    }

    /** Shows the progress bar and Cancel button for a long job and clears the cancel request. */
    void beginWork(String what) {
        cancelRequested = false;
        w.progress.setValue(0);
        w.progress.setString(what);
        w.progress.setVisible(true);
        w.cancel.setVisible(true);
    }

    /** Hides the progress bar and Cancel button. */
    void endWork() {
        w.progress.setVisible(false);
        w.cancel.setVisible(false);
    }

    /** Whether Cancel was pressed since the last {@link #beginWork}. */
    boolean cancelRequested() {
        return cancelRequested;
    }

    /** Traces the table bundle at the shown biases on a worker and writes the CSV (not when cancelled). */
    void writeTable(Path p, Consumer<String> done) {
        LensView v = w.current;
        beginWork("tracing " + TableBundle.RAYS + " rays");
        new SwingWorker<String, Void>() {
            @Override
            protected String doInBackground() throws IOException {
                BundleResult r = TableBundle.trace(v.stack(), v.field(), new TraceProgress() {
                    @Override
                    public void raysDone(int d, int total) {
                        int val = (int) (1000L * d / Math.max(total, 1));
                        javax.swing.SwingUtilities.invokeLater(() -> w.progress.setValue(val));
                    }

                    @Override
                    public boolean isCancelled() {
                        return cancelRequested;
                    }
                });
                if (cancelRequested) {
                    throw new CancellationException("cancelled");
                }
                TraceTableCsv.write(p, r);
                return String.format(Locale.ROOT, "wrote %s: %d rays, %d lost", p, r.trajectories().size(), r.lost());
            }

            @Override
            protected void done() {
                endWork();
                try {
                    done.accept(get());
                } catch (InterruptedException | ExecutionException e) {
                    Throwable c = e.getCause() == null ? e : e.getCause();
                    if (c instanceof CancellationException) {
                        done.accept("trajectory table cancelled; nothing was written");
                    } else {
                        error(p.toString(), "the trajectory table was not written: " + c.getMessage());
                    }
                }
            }
        }.execute();
    }

    /** Asks before unsaved changes are dropped; true when it is fine to go on. */
    boolean confirmDiscard() {
        if (!w.unsaved()) {
            return true;
        }
        int a = JOptionPane.showConfirmDialog(w, "The stack has unsaved changes (text or biases). Save them first?",
                "Unsaved changes", JOptionPane.YES_NO_CANCEL_OPTION, JOptionPane.WARNING_MESSAGE);
        if (a == JOptionPane.YES_OPTION) {
            return save(false);
        }
        return a == JOptionPane.NO_OPTION;
    }

    void closeWindow() {
        if (confirmDiscard()) {
            w.shutdown();
            w.dispose();
        }
    }

    /** A problem in a dialog (the message names the fix) and in the status bar. */
    void error(String where, String message) {
        JTextArea t = new JTextArea(message, 6, 60);
        t.setLineWrap(true);
        t.setWrapStyleWord(true);
        t.setEditable(false);
        JOptionPane.showMessageDialog(w, new JScrollPane(t), "Problem with " + where, JOptionPane.ERROR_MESSAGE);
        w.status("problem: " + message.lines().findFirst().orElse(""));
    }

    private static JFileChooser chooser(String what, String ext) {
        JFileChooser fc = new JFileChooser(Path.of("").toAbsolutePath().toFile());
        fc.setFileFilter(new FileNameExtensionFilter(what, ext));
        return fc;
    }

    private static Path withExtension(Path p, String ext) {
        String n = p.getFileName().toString();
        return n.toLowerCase(Locale.ROOT).endsWith("." + ext) ? p : p.resolveSibling(n + "." + ext);
    }
}
