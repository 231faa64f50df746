package org.axistack.cli;

import java.nio.file.Path;

import org.axistack.io.AtomicFiles;
import org.axistack.io.OutputPathException;
import picocli.CommandLine;

/**
 * Checks the output paths a command was given before the work starts, so that a path that cannot be written
 * (a folder, a block device, a read-only folder, a dangling link...) is refused in a second with exit 2 and the
 * option named, not after a long solve. The rules are those of {@link AtomicFiles}.
 */
final class OutputCheck {

    private OutputCheck() {
    }

    /** Checks a file option (nothing when the option was not given). */
    static void file(CommandLine cl, String option, Path p) {
        if (p == null) {
            return;
        }
        try {
            AtomicFiles.checkFile(p);
        } catch (OutputPathException e) {
            throw new CommandLine.ParameterException(cl, option + ": " + e.getMessage());
        }
    }

    /** Checks a folder option: a new path, an empty folder or one holding marker. */
    static void folder(CommandLine cl, String option, Path p, String marker) {
        try {
            AtomicFiles.checkFolder(p, marker);
        } catch (OutputPathException e) {
            throw new CommandLine.ParameterException(cl, option + ": " + e.getMessage());
        }
    }
}
