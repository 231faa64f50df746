package org.axistack.cli;

import java.util.List;

/**
 * Every subcommand of the tool, in the order --help lists them. To add a command, add one line here.
 * Commands whose physics is not built yet are absent, not fake.
 */
final class CommandList {
    private CommandList() {
    }

    static List<Object> commands() {
        return List.of(
                new PlanCommand(),
                new FieldCommand(),
                new OpticsCommand(),
                new TraceCommand(),
                new EnvelopeCommand(),
                new TuneCommand(),
                new SweepCommand(),
                new ProbeCommand(),
                new MisalignCommand(),
                new AimCommand(),
                new SizeCommand(),
                new BenchCommand(),
                new CheckCommand(),
                new GuiCommand());
    }
}
