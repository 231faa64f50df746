package org.axistack.cli;

import org.axistack.model.PhysicsMessage;
import java.io.PrintWriter;
import org.axistack.io.StackInputException;
import org.axistack.model.PhysicsException;
import org.axistack.model.PhysicsMessage;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Spec;

/**
 * The {@code axistack} command line. Subcommands are listed in {@link CommandList}. Exit codes: 0
 * success, 1 a physics outcome the user must act on, 2 bad input or usage, 3 an internal error.
 */
@Command(name = "axistack", mixinStandardHelpOptions = true, versionProvider = Version.class,
        description = {"Electrostatic beam-optics planner for einzel and immersion lenses.",
            "Run 'axistack plan' for the built-in demo lens, or 'axistack COMMAND --help'."},
        footer = {"", "Exit codes: 0 ok, 1 physics outcome to act on, 2 bad input or usage, 3 internal error."})
public final class Main implements Runnable {

    /** Exit code: a physics outcome the user must act on (no focus, reflection, electrode hit...). */
    public static final int EXIT_PHYSICS = 1;
    /** Exit code: bad input or bad usage. */
    public static final int EXIT_INPUT = 2;
    /** The command was cancelled (its thread interrupted); 128 + SIGINT, the shell convention for an interrupt. */
    public static final int EXIT_CANCELLED = 130;
    /** Exit code: an internal error (a bug). */
    public static final int EXIT_INTERNAL = 3;

    @Spec
    CommandSpec spec;

    @Override
    public void run() {
        spec.commandLine().usage(spec.commandLine().getOut());
    }

    public static void main(String[] args) {
        System.exit(run(args, new PrintWriter(System.out, true), new PrintWriter(System.err, true)));
    }

    /** Runs the tool with the given streams and returns the exit code (never throws). */
    public static int run(String[] args, PrintWriter out, PrintWriter err) {
        CommandLine cl = commandLine();
        cl.setOut(out);
        cl.setErr(err);
        try {
            return cl.execute(args);
        } finally {
            out.flush();
            err.flush();
        }
    }

    /** The configured command line with every subcommand of {@link CommandList}. */
    public static CommandLine commandLine() {
        CommandLine cl = new CommandLine(new Main());
        for (Object sub : CommandList.commands()) {
            cl.addSubcommand(sub);
        }
        return configure(cl);
    }

    /**
     * Applies the tool's conventions to a command line (and its subcommands added so far): bad input
     * and usage exit 2 with a message and no stack trace; option values may be negative.
     */
    static CommandLine configure(CommandLine cl) {
        cl.setExecutionExceptionHandler(Main::onExecutionException);
        cl.setParameterExceptionHandler(Main::onParameterException);
        cl.setUnmatchedOptionsAllowedAsOptionParameters(true);
        cl.setCaseInsensitiveEnumValuesAllowed(true);
        return cl;
    }

    private static int onExecutionException(Exception ex, CommandLine cl, CommandLine.ParseResult parsed) {
        PrintWriter err = cl.getErr();
        if (ex instanceof StackInputException s) {
            err.println("error: " + org.axistack.io.TextSafety.printable(s.getMessage()));
            return EXIT_INPUT;
        }
        if (ex instanceof CommandLine.ParameterException p) {
            return onParameterException(p, new String[0]);
        }
        if (ex instanceof org.axistack.field.SolveException m) {
            err.println("error: the field cannot be solved as given: " + m.getMessage() + ".");
            return EXIT_INPUT;
        }
        if (ex instanceof PhysicsException p) {
            err.println("error: " + org.axistack.io.TextSafety.printable(p.getMessage()));
            return p.kind() == PhysicsMessage.Kind.REQUEST ? EXIT_INPUT : EXIT_PHYSICS;
        }
        if (ex instanceof org.axistack.optics.BlockedAxisException b) {
            err.println(b.getMessage() + ".");
            return EXIT_PHYSICS;
        }
        if (ex instanceof org.axistack.io.OutputPathException o) {
            err.println("error: " + org.axistack.io.TextSafety.printable(o.getMessage()) + ".");
            return EXIT_INPUT;
        }
        if (ex instanceof java.io.IOException || ex instanceof java.io.UncheckedIOException) {
            // the file system refused (full, read-only, permissions): not a bug; atomic writes left earlier files whole
            err.println("error: a file could not be written or read: " + org.axistack.io.TextSafety.printable(ex.getMessage())
                    + ". Files already in place were left as they were; free space or choose another place.");
            return EXIT_INPUT;
        }
        if (ex instanceof java.util.concurrent.CancellationException c) {
            // only an interrupt of the command's thread gets here (Ctrl-C ends the process before)
            err.println("cancelled: " + c.getMessage() + "; files are written whole or not at all.");
            return EXIT_CANCELLED;
        }
        if (ex instanceof OutcomeException o) {
            err.println(o.getMessage());
            return EXIT_PHYSICS;
        }
        err.println("internal error: " + ex.getClass().getSimpleName() + ": " + ex.getMessage()
                + ". This is a bug in axistack; please report it with the command and the stack file."
                + " Set AXISTACK_DEBUG=1 to print the stack trace.");
        if (System.getenv("AXISTACK_DEBUG") != null) {
            ex.printStackTrace(err);
        }
        return EXIT_INTERNAL;
    }

    private static int onParameterException(CommandLine.ParameterException ex, String[] args) {
        CommandLine cl = ex.getCommandLine();
        PrintWriter err = cl.getErr();
        String message = org.axistack.io.TextSafety.printable(ex.getMessage());
        // a catalogued message carries its own fix; others point to the command's help
        err.println("error: " + message + (message.contains(". Fix: ") ? ""
                : ". Fix: see '" + cl.getCommandSpec().qualifiedName() + " --help'."));
        CommandLine.UnmatchedArgumentException.printSuggestions(ex, err);
        return EXIT_INPUT;
    }
}
