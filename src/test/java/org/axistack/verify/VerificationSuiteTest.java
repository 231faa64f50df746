package org.axistack.verify;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;

import org.junit.jupiter.api.Test;

/** The built-in verification cases all pass, name their sources, and can be cancelled between cases. */
class VerificationSuiteTest {

    @Test
    void everyCasePassesWithItsSourceNamed() {
        long t0 = System.nanoTime();
        List<CheckResult> results = VerificationSuite.run(VerificationSuite.Progress.NONE);
        for (CheckResult r : results) {
            System.out.printf(java.util.Locale.ROOT, "%-32s computed %.10g reference %.10g error %.2e (tol %.0e) %.2f s%n",
                    r.name(), r.computed(), r.reference(), r.error(), r.tolerance(), r.seconds());
        }
        System.out.printf(java.util.Locale.ROOT, "suite %.2f s%n", (System.nanoTime() - t0) * 1e-9);
        assertThat(results).hasSize(7);
        assertThat(results).allSatisfy(r -> {
            assertThat(r.passed()).as(r.name() + " error " + r.error()).isTrue();
            assertThat(r.source()).isNotBlank();
            assertThat(r.error()).isLessThan(r.tolerance());
        });
        assertThat(VerificationSuite.allPassed(results)).isTrue();
    }

    @Test
    void aFailedCaseIsReportedAsFailed() {
        CheckResult off = new CheckResult("x", "q", "V", 1.1, 1.0, 0.1, 1e-3, "relative", "s", "m", 0);
        CheckResult nan = new CheckResult("x", "q", "V", Double.NaN, 1.0, Double.NaN, 1e-3, "relative", "s", "m", 0);
        assertThat(off.passed()).isFalse();
        assertThat(nan.passed()).isFalse();
        assertThat(VerificationSuite.allPassed(List.of(off))).isFalse();
        assertThat(VerificationSuite.allPassed(List.of())).isFalse();
    }

    @Test
    void cancelStopsBeforeTheNextCase() {
        List<CheckResult> results = VerificationSuite.run((i, n, name) -> i < 1);
        assertThat(results).extracting(CheckResult::name).containsExactly("thin disk capacitance", "thin disk axial potential");
    }
}
