package org.axistack.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.util.concurrent.CancellationException;

import com.fasterxml.jackson.databind.ObjectMapper;
import org.axistack.field.BemSolver;
import org.axistack.io.BuiltInStacks;
import org.axistack.model.Stack;
import org.junit.jupiter.api.Test;

/**
 * Long work shows a sign of life and can be stopped (issue 24, item 8): the solve under --json reports on the error
 * stream and leaves standard output pure JSON; -q silences it; an interrupted command thread cancels the solve and
 * the command exits 130. Common practice, no source.
 */
class ProgressAndCancelTest {

    @Test
    void opticsAndFieldUnderJsonReportProgressOnTheErrorStreamOnly() throws Exception {
        for (String command : new String[] {"optics", "field"}) {
            CliRun.Run r = CliRun.run(command, "--json");
            assertThat(r.code()).as(command).isZero();
            assertThat(r.err()).as(command).contains("field solve: assembling").contains("field solve: done, 100%");
            assertThat(new ObjectMapper().readTree(r.out()).isObject()).as(command + " stdout is one JSON object").isTrue();
            CliRun.Run q = CliRun.run(command, "--json", "-q");
            assertThat(q.code()).isZero();
            assertThat(q.err()).as(command + " -q").isEmpty();
            assertThat(new ObjectMapper().readTree(q.out()).isObject()).isTrue();
        }
    }

    @Test
    void anInterruptedThreadCancelsTheSolveThroughTheReporter() throws Exception {
        Stack demo = BuiltInStacks.demo();
        StringWriter err = new StringWriter();
        Thread.currentThread().interrupt();
        try {
            assertThatThrownBy(() -> BemSolver.solve(demo.electrodes(), demo.mesh(),
                    SolveReporter.to(new PrintWriter(err), true))).isInstanceOf(CancellationException.class);
        } finally {
            Thread.interrupted();
        }
    }

    @Test
    void anInterruptedCommandExitsWithTheCancelCodeAndNoStackTrace() {
        Thread.currentThread().interrupt();
        CliRun.Run r;
        try {
            r = CliRun.run("field", "-q");
        } finally {
            Thread.interrupted();
        }
        assertThat(r.code()).isEqualTo(Main.EXIT_CANCELLED);
        assertThat(r.err()).startsWith("cancelled: field solve cancelled").doesNotContain("Exception").doesNotContain("\tat ");
        assertThat(r.out()).isEmpty();
    }

    @Test
    void theEnvelopeCommandReportsAndCanBeSilenced() {
        CliRun.Run q = CliRun.run("envelope", "--current=1e-5", "--emittance=1", "-q");
        assertThat(q.code()).isZero();
        assertThat(q.err()).isEmpty();
    }
}
