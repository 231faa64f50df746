package org.axistack.io;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.axistack.cli.CliRun.run;

import java.io.IOException;
import java.io.Writer;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.axistack.cli.CliRun.Run;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * Every malformed stack file of {@link MalformedStacks} must give its catalogue message naming the
 * file, line and field, exit 2 through the command line, write nothing and never leak an exception.
 */
class MalformedStackTest {

    static Stream<MalformedStacks.Case> cases() {
        return MalformedStacks.cases().stream();
    }

    @Test
    void theTableHasAtLeastFiftyCases() {
        assertThat(MalformedStacks.cases()).hasSizeGreaterThanOrEqualTo(50);
    }

    @Test
    void theBaseFileIsValid() throws Exception {
        assertThat(StackReader.parse(MalformedStacks.BASE, "base.toml").electrodes()).hasSize(2);
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("cases")
    @Timeout(value = 10, unit = TimeUnit.SECONDS)
    void readerGivesTheCatalogueMessage(MalformedStacks.Case c) {
        assertThatThrownBy(() -> StackReader.parse(c.bytes(), "bad.toml"))
                .isInstanceOfSatisfying(StackInputException.class, e -> {
                    assertThat(e.id()).as(e.getMessage()).isEqualTo(c.id());
                    assertThat(e.line()).as(e.getMessage()).isEqualTo(c.line());
                    assertThat(e.field()).as(e.getMessage()).isEqualTo(c.field());
                    String m = e.getMessage();
                    assertThat(m).startsWith("bad.toml").contains(c.contains()).contains(". Fix: ").doesNotContain("\n");
                    if (c.line() > 0) {
                        assertThat(m).contains("line " + c.line());
                    }
                    if (c.field() != null) {
                        assertThat(m).contains("field " + c.field());
                    }
                });
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("cases")
    @Timeout(value = 10, unit = TimeUnit.SECONDS)
    void commandLineExitsTwoAndWritesNothing(MalformedStacks.Case c, @TempDir Path dir) throws IOException {
        Path file = dir.resolve("bad.toml");
        Files.write(file, c.bytes());
        Path out = dir.resolve("out");
        Run r = run("plan", file.toString(), "--out", out.toString());
        assertThat(r.code()).as(r.err()).isEqualTo(2);
        assertThat(r.err()).startsWith("error: " + file).contains(c.contains()).contains("Fix: ");
        assertNoTrace(r.err());
        assertThat(r.out()).isEmpty();
        assertThat(out).doesNotExist();
    }

    @Test
    @Timeout(value = 60, unit = TimeUnit.SECONDS)
    void aMillionElectrodesAreRefusedBeforeReading(@TempDir Path dir) throws IOException {
        Path file = dir.resolve("million.toml");
        try (Writer w = Files.newBufferedWriter(file)) {
            w.write(MalformedStacks.BASE);
            for (int i = 0; i < 1_000_000; i++) {
                w.write("[[electrode]]\nname = \"m" + i + "\"\n");
            }
        }
        assertThatThrownBy(() -> StackReader.read(file)).isInstanceOfSatisfying(StackInputException.class,
                e -> assertThat(e.id()).isEqualTo(StackMessage.FILE_TOO_LARGE));
        Run r = run("plan", file.toString());
        assertThat(r.code()).isEqualTo(2);
        assertThat(r.err()).contains("more than the limit of 1048576 bytes");
    }

    @Test
    void missingFileAndFolderGiveExitTwo(@TempDir Path dir) {
        Run r = run("plan", dir.resolve("nope.toml").toString());
        assertThat(r.code()).isEqualTo(2);
        assertThat(r.err()).contains("nope.toml").contains("does not exist");
        Run f = run("plan", dir.toString());
        assertThat(f.code()).isEqualTo(2);
        assertThat(f.err()).contains("not a regular file");
        assertNoTrace(r.err() + f.err());
    }

    static void assertNoTrace(String err) {
        assertThat(err).doesNotContain("\tat ").doesNotContain("Exception");
    }

    static List<String> ids() {
        return MalformedStacks.cases().stream().map(c -> c.id().name()).distinct().toList();
    }
}
