package org.axistack.plan;

import java.io.IOException;
import java.nio.file.Path;
import java.util.Map;
import java.util.concurrent.CancellationException;
import java.util.function.BooleanSupplier;

import org.axistack.io.AtomicFiles;
import org.axistack.io.SweepTableCsv;
import org.axistack.report.HtmlReport;
import org.axistack.report.LensPlan;

/** The plan's output folder: report.html with its figures (PNG, SVG) and CSV tables, as the plan command writes it. */
public final class PlanFolder {

    private PlanFolder() {
    }

    /** Writes the folder's files into dir (created if missing), each file atomically; returns the HTML file. */
    public static Path write(LensPlan plan, Path dir) throws IOException {
        return HtmlReport.write(plan, dir, plan.sweep().isEmpty() ? Map.of()
                : Map.of("sweep.csv", SweepTableCsv.text(plan.sweep())));
    }

    /**
     * Writes the same files through a temporary folder that replaces dir's files only when all are written
     * ({@link AtomicFiles#writeFolder}): a failure, or a cancellation asked for while the files are made, leaves
     * dir as it was. Returns the HTML file.
     *
     * @throws CancellationException when cancelled says so before the files are moved into place
     */
    public static Path writeWhole(LensPlan plan, Path dir, BooleanSupplier cancelled) throws IOException {
        AtomicFiles.writeFolder(dir, tmp -> {
            write(plan, tmp);
            if (cancelled.getAsBoolean()) {
                throw new CancellationException("report cancelled");
            }
        });
        return dir.toAbsolutePath().normalize().resolve(HtmlReport.FILE);
    }
}
