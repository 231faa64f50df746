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
    void namesInsideAnOutputFolderCannotClimbOut(@TempDir Path dir) {
        assertThat(AtomicFiles.inside(dir, "geometry.png")).isEqualTo(dir.toAbsolutePath().normalize().resolve("geometry.png"));
        for (String bad : new String[] {"../x.png", "sub/x.png", "/tmp/x.png", "..", "."}) {
            assertThatThrownBy(() -> AtomicFiles.inside(dir, bad)).as(bad).isInstanceOf(IllegalArgumentException.class);
        }
    }
}
