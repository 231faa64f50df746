package org.axistack.cli;

import java.io.PrintWriter;
import java.io.StringWriter;

/** Runs the command line in-process for tests: exit code and both output streams. */
public final class CliRun {

    private CliRun() {
    }

    /** One run's exit code, standard output and standard error. */
    public record Run(int code, String out, String err) {
    }

    public static Run run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.run(args, new PrintWriter(out), new PrintWriter(err));
        return new Run(code, out.toString(), err.toString());
    }
}
