package org.axistack.cli;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;

/** {@code check} runs every built-in verification case (closed forms, see org.axistack.verify) and exits 0. */
class CheckCommandTest {

    @Test
    void checkPassesAndPrintsTheTable() {
        CliRun.Run r = CliRun.run("check");
        assertThat(r.code()).as(r.err()).isZero();
        assertThat(r.out()).contains("thin disk capacitance", "sphere capacitance", "two-tube lens axial potential",
                "uniform-field paraxial ray", "Helmholtz-Lagrange f2/f1", "universal beam-spread curve",
                "verification: 7 of 7 cases within tolerance", "reference: C = 8 eps0 a");
        assertThat(r.out().lines().filter(l -> l.endsWith("  pass")).count()).isEqualTo(7);
        // the progress counts groups of cases (the thin-disk group holds two), and says so: 7 cases, 6 groups
        assertThat(r.err()).contains("check group 1/6: thin disk", "check group 6/6: beam spread");
    }
}
