package org.axistack.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.Map;

import org.junit.jupiter.api.Test;
import picocli.CommandLine;

/**
 * Help tells the truth about the STACK argument (issue 24, item 10): every command that reads a stack takes it as
 * optional and falls back to the built-in demo, and says so in its help; optics and field are run without it.
 * Common practice, no source.
 */
class StackArgumentHelpTest {

    @Test
    void everyCommandThatReadsAStackSaysItIsOptionalAndNamesTheDemo() {
        CommandLine root = Main.commandLine();
        int readers = 0;
        for (Map.Entry<String, CommandLine> e : root.getSubcommands().entrySet()) {
            var positional = e.getValue().getCommandSpec().positionalParameters().stream()
                    .filter(p -> "STACK".equals(p.paramLabel())).findFirst();
            if (positional.isEmpty()) {
                continue;
            }
            readers++;
            assertThat(positional.get().arity().min()).as("%s STACK arity", e.getKey()).isZero();
            String help = e.getValue().getUsageMessage(CommandLine.Help.Ansi.OFF);
            assertThat(help).as(e.getKey()).contains("[STACK]").contains("built-in demo lens");
        }
        assertThat(readers).as("commands that read a stack").isGreaterThanOrEqualTo(10);
    }

    @Test
    void opticsAndFieldRunOnTheDemoWithoutAStack() {
        CliRun.Run optics = CliRun.run("optics", "--json");
        assertThat(optics.code()).isZero();
        assertThat(optics.out()).contains("built-in demo");
        CliRun.Run field = CliRun.run("field", "--json");
        assertThat(field.code()).isZero();
        assertThat(field.out()).contains("built-in demo").contains("capacitance_check");
    }
}
