package org.axistack.ui;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.concurrent.CancellationException;
import java.util.concurrent.ExecutionException;
import java.util.function.Consumer;
import javax.swing.JCheckBox;
import javax.swing.JFileChooser;
import javax.swing.JOptionPane;
import javax.swing.SwingUtilities;
import javax.swing.SwingWorker;

import org.axistack.field.FieldSolution;
import org.axistack.model.Stack;
import org.axistack.plan.PlanAnalysis;
import org.axistack.report.PlanFolder;
import org.axistack.report.HtmlReport;
import org.axistack.plan.LensPlan;

/**
 * File > Export HTML report: the plan of the lens as shown (its geometry, the biases as set in the window, the
 * window's envelope beam) written as the {@code plan} command writes its folder: report.html with its figures and
 * CSV tables. The analysis re-uses the window's field solution ({@link PlanAnalysis#run}, no second solve) and runs
 * on a worker with the status-bar progress and Cancel; the folder is written through a temporary folder
 * ({@link PlanFolder#writeWhole}), so a cancelled or failed export leaves it as it was.
 */
final class ReportAction {

    private final LensWindow w;

    ReportAction(LensWindow w) {
        this.w = w;
    }

    /** Asks for the folder (and whether to run the verification cases), then exports. */
    void run() {
        if (w.session == null || w.biasPanel == null) {
            return;
        }
        JFileChooser fc = new JFileChooser(Path.of("").toAbsolutePath().toFile());
        fc.setDialogTitle("Export the HTML report into a folder");
        fc.setFileSelectionMode(JFileChooser.DIRECTORIES_ONLY);
        fc.setSelectedFile(Path.of("plan-out").toAbsolutePath().toFile());
        JCheckBox checks = new JCheckBox("<html>also run the built-in<br>verification cases<br>(a few seconds)</html>",
                true);
        fc.setAccessory(checks);
        if (fc.showSaveDialog(w) != JFileChooser.APPROVE_OPTION) {
            return;
        }
        Path dir = fc.getSelectedFile().toPath();
        if (Files.exists(dir) && !Files.isDirectory(dir)) {
            w.actions().error(dir.toString(), "this is a file, not a folder: choose or type the name of a folder for"
                    + " the report and its figures.");
            return;
        }
        if (Files.exists(dir.resolve(HtmlReport.FILE)) && JOptionPane.showConfirmDialog(w, dir + " already holds a"
                + " report. Replace its files?", "Export HTML report", JOptionPane.YES_NO_OPTION)
                != JOptionPane.YES_OPTION) {
            return;
        }
        export(dir, checks.isSelected(), w::status);
    }

    /**
     * Analyses the lens at the biases set in the window on a worker and writes the report folder; done gets a
     * one-line outcome (problems also show in a dialog). Call on the event thread.
     */
    void export(Path dir, boolean runChecks, Consumer<String> done) {
        if (w.session == null || w.biasPanel == null) {
            done.accept("no lens is open");
            return;
        }
        Stack geometry = w.session.stack();
        double[] biases = w.biasPanel.biases();
        Stack stack = geometry.withBiases(biases);
        FieldSolution solution = w.session.solution();
        String source = w.doc.shownAs() + (Arrays.equals(biases, geometry.biases_V()) ? ""
                : ", biases as set in the desktop window");
        PlanAnalysis.Settings settings = PlanAnalysis.Settings.defaults()
                .withEnvelope(w.envelope.current_A(), w.envelope.emittance_m_rad()).withChecks(runChecks);
        WindowActions actions = w.actions();
        actions.beginWork("report: optics");
        w.status("making the report for " + dir + " ...");
        new SwingWorker<Path, Void>() {
            @Override
            protected Path doInBackground() throws IOException {
                LensPlan plan = PlanAnalysis.run(stack, source, settings, solution, new PlanAnalysis.Progress() {
                    @Override
                    public boolean stage(String what, double fraction) {
                        show("report: " + what, fraction);
                        return !actions.cancelRequested();
                    }

                    @Override
                    public boolean within(double fraction) {
                        show(null, fraction);
                        return !actions.cancelRequested();
                    }
                });
                show("report: writing the files", 1);
                return PlanFolder.writeWhole(plan, dir, actions::cancelRequested);
            }

            @Override
            protected void done() {
                actions.endWork();
                try {
                    Path html = get();
                    done.accept("wrote " + html + " with its figures and tables");
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                    done.accept("report interrupted; the folder is unchanged");
                } catch (ExecutionException e) {
                    Throwable c = e.getCause() == null ? e : e.getCause();
                    if (c instanceof CancellationException) {
                        done.accept("report cancelled; the folder is unchanged");
                    } else if (c instanceof IOException || c instanceof UncheckedIOException) {
                        actions.error(dir.toString(), "the report was not written (" + c.getMessage() + "); choose a"
                                + " folder you can write to. The folder is unchanged.");
                        done.accept("report not written: " + c.getMessage());
                    } else {
                        actions.error(dir.toString(), "internal error while making the report: " + c + ". This is a"
                                + " bug; please report it with the stack file. The folder is unchanged.");
                        done.accept("report not written: " + c);
                    }
                }
            }
        }.execute();
    }

    private void show(String what, double fraction) {
        int v = (int) Math.round(1000 * Math.max(0, Math.min(1, fraction)));
        SwingUtilities.invokeLater(() -> {
            w.progress.setValue(v);
            if (what != null) {
                w.progress.setString(what);
            }
        });
    }
}
