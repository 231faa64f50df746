package org.axistack.report;

import java.io.IOException;
import java.nio.file.Path;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.CancellationException;
import java.util.function.BooleanSupplier;

import org.axistack.io.AtomicFiles;
import org.axistack.io.OutputPathException;
import org.axistack.io.SweepTableCsv;
import org.axistack.plan.LensPlan;

/**
 * The plan's output folder: report.html with its figures (PNG, SVG) and CSV tables, as the plan command and the
 * window write it. The folder is replaced as one set ({@link AtomicFiles#writeFolder}): a reader never finds the
 * new report beside figures of an earlier run. Files of the report's kinds (.html, .png, .svg, .csv, .toml) left
 * from an earlier report are dropped; other files the user put in the folder are kept.
 */
public final class PlanFolder {

    private PlanFolder() {
    }

    /** Whether a file name is of a kind the report writes (an earlier report's such files are not kept). */
    public static boolean ours(String name) {
        String n = name.toLowerCase(Locale.ROOT);
        return n.endsWith(".html") || n.endsWith(".png") || n.endsWith(".svg") || n.endsWith(".csv")
                || n.endsWith(".toml");
    }

    /**
     * Checks before the work that dir can take a report: a new path, an empty folder or an earlier report folder,
     * writable by this user (see {@link AtomicFiles#checkFolder}).
     */
    public static void check(Path dir) throws OutputPathException {
        AtomicFiles.checkFolder(dir, HtmlReport.FILE);
    }

    /** Writes the report folder as one set; returns the HTML file. */
    public static Path write(LensPlan plan, Path dir) throws IOException {
        return writeWhole(plan, dir, () -> false);
    }

    /**
     * Writes the report folder as one set: a failure, or a cancellation asked for while the files are made, leaves
     * dir as it was. Returns the HTML file.
     *
     * @throws CancellationException when cancelled says so before the new set is swapped in
     */
    public static Path writeWhole(LensPlan plan, Path dir, BooleanSupplier cancelled) throws IOException {
        Path real = AtomicFiles.checkFolder(dir, HtmlReport.FILE);
        AtomicFiles.writeFolder(real, HtmlReport.FILE, PlanFolder::ours, tmp -> {
            HtmlReport.write(plan, tmp, plan.sweep().isEmpty() ? Map.of()
                    : Map.of("sweep.csv", SweepTableCsv.text(plan.sweep())));
            if (cancelled.getAsBoolean()) {
                throw new CancellationException("report cancelled");
            }
        });
        return real.resolve(HtmlReport.FILE);
    }
}
