package org.axistack.hostile;

import static org.assertj.core.api.Assertions.assertThat;
import static org.axistack.hostile.SpecialFiles.BLOCK;
import static org.axistack.hostile.SpecialFiles.CHAR;
import static org.axistack.hostile.SpecialFiles.FIFO;
import static org.axistack.hostile.SpecialFiles.FOLDER;
import static org.axistack.hostile.SpecialFiles.LINK;
import static org.axistack.hostile.SpecialFiles.REGULAR;
import static org.axistack.hostile.SpecialFiles.SOCKET;
import static org.axistack.hostile.SpecialFiles.type;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.TimeUnit;

import org.axistack.cli.CliRun;
import org.axistack.cli.CliRun.Run;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import org.junit.jupiter.api.io.TempDir;

/**
 * Output paths of every kind for every command that writes a file (sweep, envelope, trace) and for the plan's
 * folder: a new path, a regular file, a link, a character device, a FIFO, a block device, a socket, a folder, a
 * dangling link, a link loop, a path under a regular file. The rules (io.AtomicFiles): regular files and new
 * paths are replaced atomically; links are followed; character devices and FIFOs are written straight through and
 * stay what they are; folders, block devices, sockets and dangling links are refused before any work with exit 2
 * naming the option. Special files are look-alikes made in the temporary folder (see {@link SpecialFiles}).
 */
class OutputPathsTest {

    /** A small coarse stack so that every run is short. */
    static final String STACK = HostileStackFilesTest.BASE + "[mesh]\ntarget_elements = 240\n";

    private record Cmd(String name, List<String> args, List<String> fileOptions) {
    }

    private static List<Cmd> commands(Path stack) {
        String s = stack.toString();
        return List.of(
                new Cmd("sweep", List.of("sweep", s, "--vary", "b", "--from", "-300", "--to", "-250", "--steps", "1", "--quiet"),
                        List.of("--csv", "--png")),
                new Cmd("envelope", List.of("envelope", s, "--current", "1e-6", "--emittance", "1", "--scan-steps", "2"),
                        List.of("--csv", "--png", "--scan-csv", "--scan-png")),
                new Cmd("trace", List.of("trace", s, "--count", "3"), List.of("--table")),
                new Cmd("misalign", List.of("misalign", s, "--quiet"), List.of("--csv")));
    }

    private static Path stack(Path dir) throws Exception {
        return Files.writeString(dir.resolve("lens.toml"), STACK);
    }

    /** Makes a path of a refused kind; returns it. */
    private static Path refused(String kind, Path dir, String name) throws Exception {
        Path p = dir.resolve(name);
        switch (kind) {
            case "folder" -> Files.createDirectory(p);
            case "block device" -> SpecialFiles.blockDevice(p);
            case "socket" -> SpecialFiles.socket(p);
            case "dangling link" -> Files.createSymbolicLink(p, dir.resolve("nowhere-" + name));
            case "link loop" -> {
                Files.createSymbolicLink(p, dir.resolve(name + "-2"));
                Files.createSymbolicLink(dir.resolve(name + "-2"), p);
            }
            case "under a file" -> {
                Files.writeString(p, "a file");
                return p.resolve("x.csv");
            }
            default -> throw new IllegalArgumentException(kind);
        }
        return p;
    }

    private static final List<String> REFUSED = List.of("folder", "block device", "socket", "dangling link", "link loop",
            "under a file");

    /** Every refused kind for every file option of every command: exit 2 before any solve, the node untouched. */
    @Test
    @Timeout(value = 120, unit = TimeUnit.SECONDS)
    void everyRefusedKindForEveryFileOption(@TempDir Path dir) throws Exception {
        Path stack = stack(dir);
        int n = 0;
        for (Cmd c : commands(stack)) {
            for (String opt : c.fileOptions()) {
                for (String kind : REFUSED) {
                    Path p = refused(kind, dir, "o" + n++);
                    Path node = kind.equals("under a file") ? p.getParent() : p;
                    int before = type(node);
                    List<String> args = new ArrayList<>(c.args());
                    args.add(opt + "=" + p);
                    Run r = CliRun.run(args.toArray(String[]::new));
                    assertThat(r.code()).as(c.name() + " " + opt + " " + kind + ": " + r.err()).isEqualTo(2);
                    assertThat(r.err()).as(kind).contains(opt).contains("output").doesNotContain("solving")
                            .doesNotContain("Exception").doesNotContain("\tat ");
                    assertThat(type(node)).as(kind).isEqualTo(before);
                }
            }
        }
        try (var s = Files.list(dir)) {
            assertThat(s.map(p -> p.getFileName().toString()).filter(f -> f.startsWith("."))).as("no temporary files").isEmpty();
        }
    }

    private static final List<String> ACCEPTED = List.of("new", "regular", "link", "character device", "fifo");

    /**
     * The accepted kinds through every command: each command runs once, its file options given the kinds in turn
     * (a new path in a new folder, a regular file, a link to a regular file, a character device look-alike of the
     * null device, a FIFO read by another thread), so that the three runs cover every kind. The node keeps its
     * kind; the link stays a link and its target gets the content. (Every kind for every path is checked on the
     * writer itself in {@link #theWriterAcceptsEveryKind}.)
     */
    @Test
    @Timeout(value = 300, unit = TimeUnit.SECONDS)
    void acceptedKindsThroughEveryCommand(@TempDir Path dir) throws Exception {
        Path stack = stack(dir);
        int n = 0;
        for (Cmd c : commands(stack)) {
            List<String> args = new ArrayList<>(c.args());
            Map<Path, CompletableFuture<byte[]>> readers = new HashMap<>();
            Map<String, Path> paths = new HashMap<>();
            Map<String, String> kinds = new HashMap<>();
            for (String opt : c.fileOptions()) {
                String kind = ACCEPTED.get(n % ACCEPTED.size());
                Path p = make(kind, dir, "k" + n++ + (opt.endsWith("png") ? ".png" : ".csv"), readers);
                paths.put(opt, p);
                kinds.put(opt, kind);
                args.add(opt + "=" + p);
            }
            Run r = CliRun.run(args.toArray(String[]::new));
            assertThat(r.code()).as(c.name() + " " + kinds + ": " + r.err()).isZero();
            for (var e : paths.entrySet()) {
                check(c.name() + " " + e.getKey(), kinds.get(e.getKey()), e.getValue(), readers, e.getKey().endsWith("png"));
            }
        }
        assertThat(n).isGreaterThanOrEqualTo(ACCEPTED.size());
        assertNoPartFiles(dir);
    }

    /** Every accepted kind on the one writer all commands use. */
    @Test
    @Timeout(value = 60, unit = TimeUnit.SECONDS)
    void theWriterAcceptsEveryKind(@TempDir Path dir) throws Exception {
        int n = 0;
        for (String kind : ACCEPTED) {
            for (boolean png : new boolean[] {false, true}) {
                Map<Path, CompletableFuture<byte[]>> readers = new HashMap<>();
                Path p = make(kind, dir, "w" + n++ + (png ? ".png" : ".csv"), readers);
                byte[] bytes = png ? new byte[] {(byte) 0x89, 'P', 'N', 'G', 1, 2} : "a,b\n1,2\n".getBytes(StandardCharsets.UTF_8);
                org.axistack.io.AtomicFiles.write(p, out -> out.write(bytes));
                check("writer", kind, p, readers, png);
            }
        }
        assertNoPartFiles(dir);
    }

    private static Path make(String kind, Path dir, String name, Map<Path, CompletableFuture<byte[]>> readers)
            throws Exception {
        Path p = dir.resolve(name);
        switch (kind) {
            case "new" -> p = dir.resolve("new-" + name).resolve("sub").resolve(name);
            case "regular" -> Files.writeString(p, "old");
            case "link" -> Files.createSymbolicLink(p, Files.writeString(dir.resolve("target-" + name), "old"));
            case "character device" -> SpecialFiles.charDevice(p);
            case "fifo" -> {
                SpecialFiles.fifo(p);
                Path fifo = p;
                readers.put(p, CompletableFuture.supplyAsync(() -> {
                    try {
                        return Files.readAllBytes(fifo);
                    } catch (java.io.IOException e) {
                        throw new java.io.UncheckedIOException(e);
                    }
                }));
            }
            default -> throw new IllegalArgumentException(kind);
        }
        return p;
    }

    private static void check(String what, String kind, Path p, Map<Path, CompletableFuture<byte[]>> readers, boolean png)
            throws Exception {
        what = what + " " + kind;
        switch (kind) {
            case "new", "regular" -> {
                assertThat(type(p)).as(what).isEqualTo(REGULAR);
                assertContent(what, png, Files.readAllBytes(p));
            }
            case "link" -> {
                assertThat(type(p)).as(what).isEqualTo(LINK);
                assertContent(what, png, Files.readAllBytes(p.toRealPath()));
            }
            case "character device" -> assertThat(type(p)).as(what).isEqualTo(CHAR);
            case "fifo" -> {
                assertThat(type(p)).as(what).isEqualTo(FIFO);
                assertContent(what, png, readers.get(p).get(30, TimeUnit.SECONDS));
            }
            default -> throw new IllegalArgumentException(kind);
        }
    }

    private static void assertNoPartFiles(Path dir) throws Exception {
        try (var s = Files.walk(dir)) {
            assertThat(s.map(p -> p.getFileName().toString()).filter(f -> f.endsWith(".part"))).as("no temporary files").isEmpty();
        }
    }

    private static void assertContent(String what, boolean png, byte[] bytes) {
        if (png) {
            assertThat(bytes).as(what).startsWith(0x89, 'P', 'N', 'G');
        } else {
            String text = new String(bytes, StandardCharsets.UTF_8);
            assertThat(text).as(what).isNotEqualTo("old").contains(",").endsWith("\n");
        }
    }

    /**
     * The plan's folder: a new path, an empty folder, an earlier report (replaced as a set: an old figure the new
     * report does not make is gone, the user's own notes stay), a link to a report folder (followed: the link
     * stays); refused with exit 2 before the work: empty name, a regular file, devices, FIFO, socket, a dangling
     * link, a folder of other things.
     */
    @Test
    @Timeout(value = 300, unit = TimeUnit.SECONDS)
    void thePlanFolderOfEveryKind(@TempDir Path dir) throws Exception {
        Path stack = stack(dir);
        List<Path> refusedPaths = new ArrayList<>();
        refusedPaths.add(Path.of(""));
        refusedPaths.add(Files.writeString(dir.resolve("file"), "x"));
        refusedPaths.add(SpecialFiles.fifo(dir.resolve("fifo")));
        refusedPaths.add(SpecialFiles.socket(dir.resolve("sock")));
        refusedPaths.add(Files.createSymbolicLink(dir.resolve("dangling"), dir.resolve("nowhere")));
        Path other = Files.createDirectory(dir.resolve("thesis"));
        Files.writeString(other.resolve("chapter1.tex"), "keep");
        refusedPaths.add(other);
        refusedPaths.add(SpecialFiles.charDevice(dir.resolve("chr")));
        refusedPaths.add(SpecialFiles.blockDevice(dir.resolve("blk")));
        for (Path p : refusedPaths) {
            Run r = CliRun.run("plan", stack.toString(), "--no-check", "-q", "--out=" + p);
            assertThat(r.code()).as(p + ": " + r.err()).isEqualTo(2);
            assertThat(r.err()).as(p.toString()).contains("--out").doesNotContain("Exception").doesNotContain("solving");
            assertThat(r.out()).isEmpty();
        }
        assertThat(Files.readString(other.resolve("chapter1.tex"))).isEqualTo("keep");
        assertThat(type(dir.resolve("chr"))).isEqualTo(CHAR);
        assertThat(type(dir.resolve("blk"))).isEqualTo(BLOCK);
        assertThat(type(dir.resolve("fifo"))).isEqualTo(FIFO);
        assertThat(type(dir.resolve("sock"))).isEqualTo(SOCKET);

        // an earlier report, reached through a link; a stale figure and the user's notes in it
        Path report = dir.resolve("report");
        Run first = CliRun.run("plan", stack.toString(), "--no-check", "-q", "--out=" + report);
        assertThat(first.code()).as(first.err()).isZero();
        Files.writeString(report.resolve("old-figure.png"), "stale");
        Files.writeString(report.resolve("notes.txt"), "mine");
        Path link = Files.createSymbolicLink(dir.resolve("latest"), report);
        Run again = CliRun.run("plan", stack.toString(), "--no-check", "-q", "--set", "b=-280", "--out=" + link);
        assertThat(again.code()).as(again.err()).isZero();
        assertThat(type(link)).isEqualTo(LINK);
        assertThat(type(report)).isEqualTo(FOLDER);
        assertThat(report.resolve("old-figure.png")).doesNotExist();
        assertThat(Files.readString(report.resolve("notes.txt"))).isEqualTo("mine");
        assertThat(Files.readString(report.resolve("stack.toml"))).contains("-280");
        Path empty = Files.createDirectory(dir.resolve("empty"));
        Run intoEmpty = CliRun.run("plan", stack.toString(), "--no-check", "-q", "--out=" + empty);
        assertThat(intoEmpty.code()).as(intoEmpty.err()).isZero();
        assertThat(empty.resolve("report.html")).exists();
        try (var s = Files.list(dir)) {
            assertThat(s.map(p -> p.getFileName().toString()).filter(f -> f.startsWith("."))).as("no temporary folders").isEmpty();
        }
    }
}
