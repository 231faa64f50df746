package org.axistack.verify;

import java.util.ArrayList;
import java.util.List;
import java.util.function.Supplier;

/**
 * The built-in verification cases: the project's own solver, optics and envelope code against the classical
 * closed forms of the physics brief (thin disk, sphere, two-tube Bessel integral, uniform-field ray,
 * Helmholtz-Lagrange, universal beam-spread curve). Modest meshes keep the whole suite to a few seconds. Each
 * tolerance sits 10 to 1000 times above the error measured on its mesh (measured: disk and sphere capacitance
 * 2e-12 and 2e-13, disk axis 7e-13, two-tube axis 2.3e-7 of V2-V1, uniform-field ray 5e-14, f2/f1 8e-11,
 * beam spread 2e-15), so a real regression fails while rounding differences between machines do not.
 */
public final class VerificationSuite {

    /** Progress between cases; return false to cancel the remaining ones. */
    @FunctionalInterface
    public interface Progress {
        boolean before(int index, int total, String name);

        Progress NONE = (i, n, name) -> true;
    }

    private record Case(String name, Supplier<List<CheckResult>> run) {
    }

    private VerificationSuite() {
    }

    private static List<Case> cases() {
        return List.of(
                new Case("thin disk", FieldChecks::thinDisk),
                new Case("sphere", () -> List.of(FieldChecks.sphere())),
                new Case("two-tube lens", () -> List.of(FieldChecks.twoTubeGap())),
                new Case("uniform field", () -> List.of(OpticsChecks.uniformFieldRay())),
                new Case("Helmholtz-Lagrange", () -> List.of(OpticsChecks.helmholtzLagrange())),
                new Case("beam spread", () -> List.of(OpticsChecks.universalBeamSpread())));
    }

    /** Names of the case groups, in the order they run. */
    public static List<String> names() {
        return cases().stream().map(Case::name).toList();
    }

    /** Runs every case (a group may give more than one row); stops early when progress says so. */
    public static List<CheckResult> run(Progress progress) {
        List<Case> cases = cases();
        List<CheckResult> out = new ArrayList<>();
        for (int i = 0; i < cases.size(); i++) {
            if (!progress.before(i, cases.size(), cases.get(i).name())) {
                break;
            }
            out.addAll(cases.get(i).run().get());
        }
        return List.copyOf(out);
    }

    /** True when every result passed. */
    public static boolean allPassed(List<CheckResult> results) {
        return !results.isEmpty() && results.stream().allMatch(CheckResult::passed);
    }
}
