package org.axistack.io;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import org.axistack.model.Electrode;
import org.axistack.model.Stack;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/** Every stack of lens-library/ validates, says what it is for, and survives a write-read round trip. */
class LensLibraryTest {

    static final Path LIBRARY = Path.of("lens-library");

    static Stream<Path> files() throws IOException {
        try (Stream<Path> s = Files.list(LIBRARY)) {
            return s.filter(p -> p.toString().endsWith(".toml")).sorted().toList().stream();
        }
    }

    @Test
    void theLibraryHasAtLeastSixStacks() throws IOException {
        assertThat(files().count()).isGreaterThanOrEqualTo(6);
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("files")
    void validatesAndHasAPurposeHeader(Path file) throws Exception {
        Stack s = StackReader.read(file);
        assertThat(s.electrodes()).isNotEmpty();
        assertThat(s.title()).isNotBlank();
        List<String> lines = Files.readAllLines(file);
        assertThat(lines.get(0)).startsWith("#");
        assertThat(String.join("\n", lines)).contains("What it is for:");
        // the mesh budget is in the range the library promises (about 1000 to 1500 elements)
        assertThat(s.mesh().targetElements()).isBetween(1000, 1500);
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("files")
    void roundTripsThroughTheWriter(Path file) throws Exception {
        Stack s = StackReader.read(file);
        String text = StackWriter.toToml(s);
        Stack again = StackReader.parse(text, "written.toml");
        assertThat(again).isEqualTo(s);
        assertThat(StackWriter.toToml(again)).isEqualTo(text);
    }

    @Test
    void theDemoResourceIsAByteForByteCopyOfTheLibraryFile() throws Exception {
        byte[] library = Files.readAllBytes(LIBRARY.resolve(BuiltInStacks.DEMO_FILE));
        assertThat(BuiltInStacks.demoText().getBytes(java.nio.charset.StandardCharsets.UTF_8)).isEqualTo(library);
        assertThat(BuiltInStacks.demo()).isEqualTo(StackReader.read(LIBRARY.resolve(BuiltInStacks.DEMO_FILE)));
    }

    @Test
    void theShapedExampleUsesArcs() throws Exception {
        Stack s = StackReader.read(LIBRARY.resolve("rounded-bore-einzel.toml"));
        Electrode.Outline o = (Electrode.Outline) s.electrode("lens");
        assertThat(o.outline().segments()).anyMatch(g -> g instanceof org.axistack.model.Segment.Arc);
        assertThat(o.outline().closed()).isTrue();
    }
}
