package org.axistack.io;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class AtomicFilesTest {

    @Test
    void aFailedWriteLeavesTheOldFileAndNoTemporaryFile(@TempDir Path dir) throws IOException {
        Path f = dir.resolve("table.csv");
        AtomicFiles.writeString(f, "old\n");
        assertThatThrownBy(() -> AtomicFiles.write(f, out -> {
            out.write("half a fi".getBytes());
            throw new IOException("disk full");
        })).hasMessage("disk full");
        assertThat(Files.readString(f)).isEqualTo("old\n");
        try (var s = Files.list(dir)) {
            assertThat(s.map(p -> p.getFileName().toString()).toList()).containsExactly("table.csv");
        }
    }

    @Test
    void aFolderIsWrittenWholeOrNotAtAll(@TempDir Path dir) throws IOException {
        Path out = dir.resolve("report");
        // a new folder appears with all its files at once
        AtomicFiles.writeFolder(out, tmp -> {
            AtomicFiles.writeString(tmp.resolve("a.txt"), "a1");
            AtomicFiles.writeString(tmp.resolve("b.txt"), "b1");
        });
        assertThat(Files.readString(out.resolve("a.txt"))).isEqualTo("a1");
        assertThat(Files.readString(out.resolve("b.txt"))).isEqualTo("b1");
        // a failure half-way leaves the old files untouched
        assertThatThrownBy(() -> AtomicFiles.writeFolder(out, tmp -> {
            AtomicFiles.writeString(tmp.resolve("a.txt"), "a2");
            throw new IOException("disk full");
        })).hasMessage("disk full");
        assertThat(Files.readString(out.resolve("a.txt"))).isEqualTo("a1");
        // a cancellation (an unchecked exception) too
        assertThatThrownBy(() -> AtomicFiles.writeFolder(out, tmp -> {
            AtomicFiles.writeString(tmp.resolve("b.txt"), "b2");
            throw new java.util.concurrent.CancellationException("cancelled");
        })).isInstanceOf(java.util.concurrent.CancellationException.class);
        assertThat(Files.readString(out.resolve("b.txt"))).isEqualTo("b1");
        // a finished write replaces the files it wrote and keeps the others
        AtomicFiles.writeFolder(out, tmp -> AtomicFiles.writeString(tmp.resolve("a.txt"), "a3"));
        assertThat(Files.readString(out.resolve("a.txt"))).isEqualTo("a3");
        assertThat(Files.readString(out.resolve("b.txt"))).isEqualTo("b1");
        try (var s = Files.list(dir)) {
            assertThat(s.map(p -> p.getFileName().toString()).toList()).containsExactly("report"); // no temporary folder
        }
        Path file = Files.writeString(dir.resolve("plain"), "x");
        assertThatThrownBy(() -> AtomicFiles.writeFolder(file, tmp -> { })).isInstanceOf(IOException.class)
                .hasMessageContaining("not a folder");
    }

    @Test
    void namesInsideAnOutputFolderCannotClimbOut(@TempDir Path dir) {
        assertThat(AtomicFiles.inside(dir, "geometry.png")).isEqualTo(dir.toAbsolutePath().normalize().resolve("geometry.png"));
        for (String bad : new String[] {"../x.png", "sub/x.png", "/tmp/x.png", "..", "."}) {
            assertThatThrownBy(() -> AtomicFiles.inside(dir, bad)).as(bad).isInstanceOf(IllegalArgumentException.class);
        }
    }
}
