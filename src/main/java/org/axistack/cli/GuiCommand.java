package org.axistack.cli;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.Callable;

import org.axistack.ui.Desktop;
import org.axistack.ui.RecentFiles;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code gui [STACK]}: the desktop window. */
@Command(name = "gui", mixinStandardHelpOptions = true,
        header = "Opens the desktop window to set biases and watch rays live.",
        description = {"Open the desktop window: the lens cross-section with equipotentials, rays and envelope over"
            + " the axial potential, a slider and number field per electrode bias (redrawn live from the stored"
            + " solution), the optical properties and surface-field margins, the stack text, and exports"
            + " (PNG, SVG, trajectory CSV, the HTML report of the plan command at the biases set in the window).",
            "Without STACK it opens the built-in demo lens. Needs a display."})
final class GuiCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Parameters(index = "0", arity = "0..1", paramLabel = "STACK", description = "Stack file (TOML) to open.")
    Path stack;

    @Override
    public Integer call() throws Exception {
        if (!Desktop.displayAvailable()) {
            spec.commandLine().getErr().println("error: gui needs a display, and none is available here (headless"
                    + " Java or no DISPLAY). Fix: run it on a desktop session, forward X11 (ssh -X), or use the"
                    + " plan, optics and trace commands, which need no display.");
            return Main.EXIT_INPUT;
        }
        if (stack != null && !Files.isRegularFile(stack)) {
            spec.commandLine().getErr().println("error: " + stack + ": no such stack file. Fix: give the path of a"
                    + " .toml stack file, or omit it to open the built-in demo lens.");
            return Main.EXIT_INPUT;
        }
        var w = Desktop.open(stack, RecentFiles.forUser());
        while (w.isDisplayable()) {
            Thread.sleep(300);
        }
        return 0;
    }
}
