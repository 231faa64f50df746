package org.axistack.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.axistack.cli.CliRun.run;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import org.axistack.cli.CliRun.Run;
import org.axistack.report.SafetyNotice;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class MainTest {

    @Test
    void helpOnTheToolAndOnEveryCommand() {
        Run top = run("--help");
        assertThat(top.code()).isZero();
        assertThat(top.out()).contains("plan").contains("Exit codes");
        for (String name : Main.commandLine().getSubcommands().keySet()) {
            Run r = run(name, "--help");
            assertThat(r.code()).as(name).isZero();
            assertThat(r.out()).as(name).contains("Usage:");
        }
        assertThat(run().code()).isZero();
    }

    /**
     * The command list shows each command's one-line summary whole (a first description line cut
     * mid-sentence once read "Boundary-element field solve: axial potential and field, electrode charges,"),
     * and no option's help sends the reader back to the help it is part of. Common practice, no source.
     */
    @Test
    void helpSummariesAreWholeSentencesOnOneLine() {
        picocli.CommandLine cl = Main.commandLine();
        String top = run("--help").out();
        for (var e : cl.getSubcommands().entrySet()) {
            String[] header = e.getValue().getCommandSpec().usageMessage().header();
            assertThat(header).as(e.getKey() + " summary").hasSize(1);
            assertThat(header[0]).as(e.getKey()).endsWith(".").doesNotContain(". ");
            // the summary sits on the command's own line of the list, unwrapped
            assertThat(top).as(e.getKey()).containsPattern("(?m)^  " + e.getKey() + " +"
                    + java.util.regex.Pattern.quote(header[0]) + "$");
            for (String d : e.getValue().getCommandSpec().usageMessage().description()) {
                assertThat(d.strip()).as(e.getKey() + " description paragraph").matches("(?s).*[.)]$");
            }
            for (var o : e.getValue().getCommandSpec().options()) {
                assertThat(String.join(" ", o.description())).as(e.getKey() + " " + o.longestName())
                        .doesNotContain("see --help");
            }
        }
    }

    /** --version prints the version of this build: the project version in pom.xml (read here as text). */
    @Test
    void versionIsTheProjectVersion() throws Exception {
        String pom = Files.readString(Path.of("pom.xml"));
        java.util.regex.Matcher m = java.util.regex.Pattern
                .compile("<artifactId>axistack</artifactId>\\s*<version>([^<]+)</version>").matcher(pom);
        assertThat(m.find()).as("project version in pom.xml").isTrue();
        Run r = run("--version");
        assertThat(r.code()).isZero();
        assertThat(r.out()).startsWith("axistack " + m.group(1) + System.lineSeparator());
    }

    @Test
    void setAcceptsNegativeVoltsInBothForms(@TempDir Path dir) {
        Run a = run("plan", "--set", "focus=-140", "--no-check", "-q", "--out", dir.resolve("a").toString());
        Run b = run("plan", "--set=focus=-90", "--no-check", "-q", "--out", dir.resolve("b").toString());
        assertThat(a.code()).as(a.err()).isZero();
        assertThat(b.code()).as(b.err()).isZero();
        assertThat(a.out()).containsPattern("focus\\s+tube\\s+-140");
        assertThat(b.out()).containsPattern("focus\\s+tube\\s+-90");
        assertThat(a.err()).isEmpty();
    }

    @Test
    void badSetAndUnknownOptionsExitTwoWithoutATrace() {
        Run a = run("plan", "--set", "fokus=-1400");
        assertThat(a.code()).isEqualTo(2);
        assertThat(a.err()).contains("did you mean 'focus'?");
        Run b = run("plan", "--bogus");
        assertThat(b.code()).isEqualTo(2);
        assertThat(b.err()).contains("--bogus").contains("--help");
        Run c = run("frobnicate");
        assertThat(c.code()).isEqualTo(2);
        for (Run r : new Run[] {a, b, c}) {
            assertThat(r.err()).doesNotContain("\tat ").doesNotContain("Exception");
        }
    }

    @Test
    void outThatIsAFileIsBadUsage(@TempDir Path dir) throws Exception {
        Path f = Files.writeString(dir.resolve("afile"), "x");
        Run r = run("plan", "--out", f.toString());
        assertThat(r.code()).isEqualTo(2);
        assertThat(r.err()).contains("not a folder");
    }

    @picocli.CommandLine.Command(name = "probe")
    static final class Probe implements Runnable {
        @picocli.CommandLine.Option(names = "--axis")
        String axis;
        @picocli.CommandLine.Option(names = "--object-z")
        double objectZ;

        @Override
        public void run() {
        }
    }

    @Test
    void negativeOptionValuesWorkInBothForms() {
        for (String[] args : new String[][] {{"--axis", "-15:15:0.5", "--object-z", "-80"},
            {"--axis=-15:15:0.5", "--object-z=-80"}}) {
            Probe p = new Probe();
            picocli.CommandLine cl = Main.configure(new picocli.CommandLine(p));
            assertThat(cl.execute(args)).isZero();
            assertThat(p.axis).isEqualTo("-15:15:0.5");
            assertThat(p.objectZ).isEqualTo(-80.0);
        }
    }

    @Test
    void aPhysicsOutcomeExitsOneAndABugExitsThreeWithoutATrace() {
        @picocli.CommandLine.Command(name = "x")
        final class Outcome implements Runnable {
            @Override
            public void run() {
                throw new OutcomeException("no focus between -2000 V and 0 V");
            }
        }
        @picocli.CommandLine.Command(name = "y")
        final class Bug implements Runnable {
            @Override
            public void run() {
                throw new IllegalStateException("oops");
            }
        }
        StringWriter err = new StringWriter();
        picocli.CommandLine a = Main.configure(new picocli.CommandLine(new Outcome()));
        a.setErr(new PrintWriter(err, true));
        assertThat(a.execute()).isEqualTo(1);
        picocli.CommandLine b = Main.configure(new picocli.CommandLine(new Bug()));
        b.setErr(new PrintWriter(err, true));
        assertThat(b.execute()).isEqualTo(3);
        assertThat(err.toString()).contains("no focus between").contains("internal error").doesNotContain("\tat ");
    }
}
