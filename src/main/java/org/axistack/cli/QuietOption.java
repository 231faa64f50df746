package org.axistack.cli;

import picocli.CommandLine.Option;

/**
 * The shared {@code -q/--quiet} option of commands that do long work: progress goes to the error stream (never to
 * standard output, so {@code --json} output stays clean) unless it is given. Use with {@code @Mixin QuietOption quiet;}.
 */
public final class QuietOption {

    @Option(names = {"-q", "--quiet"}, description = "No progress lines on the error stream (progress never goes to"
            + " standard output, so --json stays clean without it).")
    boolean quiet;

    /** Whether progress is silenced. */
    public boolean on() {
        return quiet;
    }
}
