package org.axistack.cli;

import java.io.PrintWriter;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;

import org.axistack.model.Numbers;
import org.axistack.verify.CheckResult;
import org.axistack.verify.VerificationSuite;

import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code check}: runs the built-in verification cases and prints computed, reference, error, tolerance, source. */
@Command(name = "check", mixinStandardHelpOptions = true,
        header = "Runs the built-in checks against closed-form answers.",
        description = {"Runs the built-in verification cases on this machine: the field solver, the paraxial optics"
            + " and the envelope against classical closed forms (thin disk, sphere, two-tube Bessel integral,"
            + " uniform-field ray, Helmholtz-Lagrange ratio, universal beam-spread curve). Prints the computed"
            + " and reference values, the error, its tolerance and the source of each reference.",
            "Exit 1 when any case is outside its tolerance."})
final class CheckCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Option(names = {"-q", "--quiet"}, description = "No progress lines on the error stream.")
    boolean quiet;

    @Override
    public Integer call() {
        PrintWriter out = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        List<CheckResult> results = VerificationSuite.run((i, n, name) -> {
            if (!quiet) {
                err.printf(Locale.ROOT, "check group %d/%d: %s%n", i + 1, n, name); // a group may hold several cases
                err.flush();
            }
            return true;
        });
        print(out, results);
        long failed = results.stream().filter(r -> !r.passed()).count();
        if (failed > 0) {
            throw new OutcomeException(failed + " of " + results.size() + " verification cases are outside their "
                    + "tolerance: the installation or a change to the code gives wrong numbers; do not trust its "
                    + "results until this is understood (report it with this output)");
        }
        return 0;
    }

    /** The verification table as plain text (also used by plan's console summary). */
    static void print(PrintWriter w, List<CheckResult> results) {
        w.println("Verification against closed forms (error: dimensionless, see 'measure')");
        w.println(String.format(Locale.ROOT, "  %-30s %-5s %18s %18s %9s %9s  %s", "case", "unit", "computed", "reference",
                "error", "tolerance", "result"));
        for (CheckResult r : results) {
            w.println(String.format(Locale.ROOT, "  %-30s %-5s %18.12g %18.12g %9.2e %9.0e  %s", r.name(), r.unit(),
                    r.computed(), r.reference(), r.error(), r.tolerance(), r.passed() ? "pass" : "FAIL"));
        }
        w.println("Details:");
        for (CheckResult r : results) {
            w.println("  " + r.name() + ": " + r.quantity());
            w.println("      measure: " + r.errorMeasure() + "; project: " + r.method()
                    + " (" + Numbers.seconds(r.seconds()) + " s)");
            w.println("      reference: " + r.source());
        }
        long passed = results.stream().filter(CheckResult::passed).count();
        w.println("verification: " + passed + " of " + results.size() + " cases within tolerance");
    }
}
