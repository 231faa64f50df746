package org.axistack.io;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.PosixFilePermissions;
import java.util.List;
import java.util.function.Predicate;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class AtomicFilesTest {

    private static final Predicate<String> TXT = n -> n.endsWith(".txt");

    private static List<String> names(Path dir) throws IOException {
        try (var s = Files.list(dir)) {
            return s.map(p -> p.getFileName().toString()).sorted().toList();
        }
    }

    /** A process id that is not running: one of a process that has just ended. */
    static long deadPid() throws Exception {
        Process p = new ProcessBuilder("true").start();
        p.waitFor();
        return p.pid();
    }

    @Test
    void aFailedWriteLeavesTheOldFileAndNoTemporaryFile(@TempDir Path dir) throws IOException {
        Path f = dir.resolve("table.csv");
        AtomicFiles.writeString(f, "old\n");
        assertThatThrownBy(() -> AtomicFiles.write(f, out -> {
            out.write("half a fi".getBytes());
            throw new IOException("disk full");
        })).hasMessage("disk full");
        assertThat(Files.readString(f)).isEqualTo("old\n");
        assertThat(names(dir)).containsExactly("table.csv");
    }

    @Test
    void aFolderIsReplacedAsASetOrNotAtAll(@TempDir Path dir) throws IOException {
        Path out = dir.resolve("report");
        // a new folder appears with all its files at once
        AtomicFiles.writeFolder(out, "a.txt", TXT, tmp -> {
            AtomicFiles.writeString(tmp.resolve("a.txt"), "a1");
            AtomicFiles.writeString(tmp.resolve("b.txt"), "b1");
        });
        assertThat(Files.readString(out.resolve("a.txt"))).isEqualTo("a1");
        assertThat(Files.readString(out.resolve("b.txt"))).isEqualTo("b1");
        Files.writeString(out.resolve("notes.md"), "the user's own notes");
        // a failure half-way leaves the old files untouched
        assertThatThrownBy(() -> AtomicFiles.writeFolder(out, "a.txt", TXT, tmp -> {
            AtomicFiles.writeString(tmp.resolve("a.txt"), "a2");
            throw new IOException("disk full");
        })).hasMessage("disk full");
        assertThat(Files.readString(out.resolve("a.txt"))).isEqualTo("a1");
        // a cancellation (an unchecked exception) too
        assertThatThrownBy(() -> AtomicFiles.writeFolder(out, "a.txt", TXT, tmp -> {
            AtomicFiles.writeString(tmp.resolve("b.txt"), "b2");
            throw new java.util.concurrent.CancellationException("cancelled");
        })).isInstanceOf(java.util.concurrent.CancellationException.class);
        assertThat(Files.readString(out.resolve("b.txt"))).isEqualTo("b1");
        // a finished write replaces the set: b.txt of the old set goes, the user's notes stay
        AtomicFiles.writeFolder(out, "a.txt", TXT, tmp -> AtomicFiles.writeString(tmp.resolve("a.txt"), "a3"));
        assertThat(names(out)).containsExactly("a.txt", "notes.md");
        assertThat(Files.readString(out.resolve("a.txt"))).isEqualTo("a3");
        assertThat(Files.readString(out.resolve("notes.md"))).isEqualTo("the user's own notes");
        assertThat(names(dir)).containsExactly("report"); // no temporary folder
        // not a folder, or a folder of other things: refused before anything is written
        Path file = Files.writeString(dir.resolve("plain"), "x");
        assertThatThrownBy(() -> AtomicFiles.writeFolder(file, "a.txt", TXT, tmp -> { }))
                .isInstanceOf(OutputPathException.class).hasMessageContaining("regular file, not a folder");
        Path other = Files.createDirectory(dir.resolve("other"));
        Files.writeString(other.resolve("thesis.tex"), "x");
        assertThatThrownBy(() -> AtomicFiles.writeFolder(other, "a.txt", TXT, tmp -> { }))
                .isInstanceOf(OutputPathException.class).hasMessageContaining("already holds files that are not a report")
                .hasMessageContaining("thesis.tex");
        assertThatThrownBy(() -> AtomicFiles.writeFolder(Path.of(""), "a.txt", TXT, tmp -> { }))
                .isInstanceOf(OutputPathException.class).hasMessageContaining("empty");
    }

    /**
     * New files and folders get the mode the user's umask gives (compared with a file and a folder the JDK makes
     * without attributes, and with the umask the shell reports); a replaced file keeps its own mode.
     */
    @Test
    void modesFollowTheUmaskAndAReplacedFileKeepsItsMode(@TempDir Path dir) throws Exception {
        Process sh = new ProcessBuilder("sh", "-c", "umask").start();
        int umask = Integer.parseInt(new String(sh.getInputStream().readAllBytes(), StandardCharsets.US_ASCII).trim(), 8);
        sh.waitFor();
        Path f = dir.resolve("new.csv");
        AtomicFiles.writeString(f, "x");
        Path ref = Files.createFile(dir.resolve("reference"));
        assertThat(Files.getPosixFilePermissions(f)).isEqualTo(Files.getPosixFilePermissions(ref));
        assertThat(mode(f)).isEqualTo(0666 & ~umask);
        Path folder = dir.resolve("report");
        AtomicFiles.writeFolder(folder, "a.txt", TXT, tmp -> AtomicFiles.writeString(tmp.resolve("a.txt"), "a"));
        assertThat(mode(folder)).isEqualTo(0777 & ~umask);
        assertThat(mode(folder.resolve("a.txt"))).isEqualTo(0666 & ~umask);
        Files.setPosixFilePermissions(f, PosixFilePermissions.fromString("rw-r-----"));
        AtomicFiles.writeString(f, "y");
        assertThat(PosixFilePermissions.toString(Files.getPosixFilePermissions(f))).isEqualTo("rw-r-----");
        Files.setPosixFilePermissions(folder, PosixFilePermissions.fromString("rwxr-x---"));
        AtomicFiles.writeFolder(folder, "a.txt", TXT, tmp -> AtomicFiles.writeString(tmp.resolve("a.txt"), "b"));
        assertThat(PosixFilePermissions.toString(Files.getPosixFilePermissions(folder))).isEqualTo("rwxr-x---");
    }

    private static int mode(Path p) throws IOException {
        return (Integer) Files.getAttribute(p, "unix:mode") & 0777;
    }

    /** Temporary files of a writer that no longer runs are removed by the next write; a live writer's stay. */
    @Test
    void leftoversOfDeadWritersAreRemovedByTheNextWrite(@TempDir Path dir) throws Exception {
        long dead = deadPid();
        Path stale = Files.writeString(dir.resolve(".table.csv." + dead + "-abc.part"), "half");
        Path legacy = Files.writeString(dir.resolve(".table.csv123456789.part"), "");
        Path live = Files.writeString(dir.resolve(".table.csv." + ProcessHandle.current().pid() + "-abc.part"), "");
        Path otherFile = Files.writeString(dir.resolve(".other.csv." + dead + "-abc.part"), "");
        AtomicFiles.writeString(dir.resolve("table.csv"), "new");
        assertThat(stale).doesNotExist();
        assertThat(legacy).doesNotExist();
        assertThat(live).exists();
        assertThat(otherFile).exists();
    }

    /**
     * A swap killed between its two renames (old folder aside, new not yet in place) is finished by the next write
     * with the new set, which was whole before the first rename; dead writers' hidden folders are removed.
     */
    @Test
    void anInterruptedSwapIsFinishedByTheNextRun(@TempDir Path dir) throws Exception {
        long dead = deadPid();
        Path oldSet = Files.createDirectory(dir.resolve(".report.old-" + dead + "-k1"));
        Files.writeString(oldSet.resolve("a.txt"), "old");
        Path newSet = Files.createDirectory(dir.resolve(".report.new-" + dead + "-k1"));
        Files.writeString(newSet.resolve("a.txt"), "new");
        Path abandoned = Files.createDirectory(dir.resolve(".report.new-" + dead + "-k2"));
        Files.writeString(abandoned.resolve("a.txt"), "half");
        Path legacy = Files.createDirectory(dir.resolve(".report-123456"));
        Path report = dir.resolve("report");
        AtomicFiles.recoverFolder(report);
        assertThat(Files.readString(report.resolve("a.txt"))).isEqualTo("new");
        assertThat(names(dir)).containsExactly("report");
        assertThat(legacy).doesNotExist();
        // with the folder in place, dead writers' folders are only removed
        Files.createDirectory(dir.resolve(".report.new-" + dead + "-k3"));
        AtomicFiles.writeFolder(report, "a.txt", TXT, tmp -> AtomicFiles.writeString(tmp.resolve("a.txt"), "newer"));
        assertThat(names(dir)).containsExactly("report");
        assertThat(Files.readString(report.resolve("a.txt"))).isEqualTo("newer");
    }

    @Test
    void namesInsideAnOutputFolderCannotClimbOut(@TempDir Path dir) {
        assertThat(AtomicFiles.inside(dir, "geometry.png")).isEqualTo(dir.toAbsolutePath().normalize().resolve("geometry.png"));
        for (String bad : new String[] {"../x.png", "sub/x.png", "/tmp/x.png", "..", "."}) {
            assertThatThrownBy(() -> AtomicFiles.inside(dir, bad)).as(bad).isInstanceOf(IllegalArgumentException.class);
        }
    }
}
