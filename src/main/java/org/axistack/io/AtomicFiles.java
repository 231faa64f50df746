package org.axistack.io;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.FileSystemException;
import java.nio.file.Files;
import java.nio.file.LinkOption;
import java.nio.file.NoSuchFileException;
import java.nio.file.NotDirectoryException;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;
import java.nio.file.attribute.BasicFileAttributes;
import java.util.HashSet;
import java.util.Locale;
import java.util.Set;
import java.util.concurrent.ThreadLocalRandom;
import java.util.function.Predicate;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * The one way the tool writes files, so that a reader never sees half of one and a special file is never replaced.
 *
 * <p><b>Files</b> ({@link #write}). What the output path names decides what happens:
 * <ul>
 * <li>nothing yet, or a regular file: the content goes to a temporary file {@code .NAME.PID-RANDOM.part} in the
 * same folder, which is then renamed over the target (atomic on one file system); a replaced file keeps its
 * permission bits; a new one gets the usual mode under the user's umask (0666 &amp; ~umask);</li>
 * <li>a symbolic link: followed (as a shell's {@code >} does); the rules below apply to the file it names, so the
 * link stays a link and its target is replaced; a link to nothing, or a loop, is refused;</li>
 * <li>a character device or a FIFO (named pipe): written straight through, without a temporary file, because
 * that is what naming one means ({@code /dev/null} to discard, {@code /dev/stdout}, a terminal, a pipe read by
 * another program); the node itself is never replaced;</li>
 * <li>a folder, a block device (a disk: writing over it would destroy it) or a socket: refused with an
 * {@link OutputPathException} (the command line exits 2).</li>
 * </ul>
 *
 * <p><b>Folders</b> ({@link #writeFolder}) are replaced as a set: the new files are written into a new folder
 * {@code .NAME.new-PID-RANDOM} beside the target, then the old folder is renamed aside ({@code .NAME.old-...}),
 * the new one renamed into place, and the old one deleted. A reader of the folder sees the whole old set, then
 * (for the microseconds between the two renames) no folder, then the whole new set; never a mix. A run that is
 * killed leaves only hidden siblings; the next write of the same folder finishes or undoes an interrupted swap
 * and removes them ({@link #recoverFolder}). Temporary files of a dead writer (its PID is no longer running) are
 * removed by the next write into the same folder.
 *
 * <p>Also guards output folders: a name given inside an output folder may not climb out of it ({@link #inside}).
 */
public final class AtomicFiles {

    /** Writes content to a stream. */
    @FunctionalInterface
    public interface Content {
        void writeTo(OutputStream out) throws IOException;
    }

    /** Writes the files of a folder into the folder it is given. */
    @FunctionalInterface
    public interface FolderContent {
        void writeInto(Path folder) throws IOException;
    }

    /** What a path names, without following a link. */
    enum Kind {
        MISSING("nothing"), REGULAR("regular file"), FOLDER("folder"), LINK("symbolic link"),
        CHAR_DEVICE("character device"), FIFO("named pipe (FIFO)"), BLOCK_DEVICE("block device (a disk)"),
        SOCKET("socket"), OTHER("special file");

        final String words;

        Kind(String words) {
            this.words = words;
        }
    }

    private static final long PID = ProcessHandle.current().pid();
    private static final Pattern PART = Pattern.compile("\\.(.+)\\.(\\d+)-[0-9a-z]+\\.part");
    private static final Pattern SIDE = Pattern.compile("\\.(.+)\\.(new|old)-(\\d+)-[0-9a-z]+");

    private AtomicFiles() {
    }

    // ---------------------------------------------------------------- files

    /**
     * Checks, before any work, that target can be written as a file by {@link #write}: refuses a folder, a block
     * device, a socket, a dangling link, a path under a regular file, and a folder (or device) that this user
     * cannot write. Returns the path the bytes will go to (the link target where target is a link).
     */
    public static Path checkFile(Path target) throws OutputPathException {
        Resolved r = resolveFile(target);
        if (r.kind == Kind.CHAR_DEVICE || r.kind == Kind.FIFO) {
            if (!Files.isWritable(r.path)) {
                throw new OutputPathException(shown(target) + " is a " + r.kind.words
                        + " this user cannot write to: name a file in a folder you can write");
            }
            return r.path;
        }
        Path dir = r.path.getParent();
        Path existing = dir;
        while (existing != null && kind(existing) == Kind.MISSING) {
            existing = existing.getParent();
        }
        if (existing == null) {
            throw new OutputPathException(shown(target) + ": no part of its folder exists: name a file in an existing folder");
        }
        Path real = existing;
        try {
            real = existing.toRealPath();
        } catch (IOException e) {
            // keep the path as given; the checks below say what is wrong
        }
        if (!Files.isDirectory(real)) {
            throw new OutputPathException(shown(target) + " cannot be written: " + existing + " is a " + kind(existing).words
                    + ", not a folder: name a file in a folder");
        }
        if (!Files.isWritable(real)) {
            throw new OutputPathException(shown(target) + " cannot be written: the folder " + real
                    + " is read-only for this user: name a file in a folder you can write");
        }
        return r.path;
    }

    /**
     * Writes target as described in the class comment: through a temporary sibling and a rename for a new or
     * regular file (on failure the target is untouched), straight through for a character device or a FIFO.
     *
     * @throws OutputPathException when the path names something that must not be written (see {@link #checkFile})
     */
    public static void write(Path target, Content content) throws IOException {
        Path to = checkFile(target);
        Kind k = kind(to);
        if (k == Kind.CHAR_DEVICE || k == Kind.FIFO) {
            try (OutputStream out = Files.newOutputStream(to, StandardOpenOption.WRITE)) {
                content.writeTo(out);
            }
            return;
        }
        Path dir = to.getParent();
        Files.createDirectories(dir);
        String name = to.getFileName().toString();
        removeDeadParts(dir, name);
        Path tmp = newPart(dir, name);
        try {
            if (k == Kind.REGULAR) {
                copyPermissions(to, tmp);
            }
            try (OutputStream out = Files.newOutputStream(tmp, StandardOpenOption.WRITE)) {
                content.writeTo(out);
            }
            try {
                Files.move(tmp, to, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
            } catch (AtomicMoveNotSupportedException e) {
                Files.move(tmp, to, StandardCopyOption.REPLACE_EXISTING);
            }
        } finally {
            Files.deleteIfExists(tmp);
        }
    }

    /** Writes UTF-8 text as {@link #write} does. */
    public static void writeString(Path target, String text) throws IOException {
        byte[] bytes = text.getBytes(StandardCharsets.UTF_8);
        write(target, out -> out.write(bytes));
    }

    private record Resolved(Path path, Kind kind) {
    }

    private static Resolved resolveFile(Path target) throws OutputPathException {
        Path abs = target.toAbsolutePath();
        Kind k = kind(abs);
        if (k == Kind.LINK) {
            abs = followLink(target, abs);
            k = kind(abs);
        }
        switch (k) {
            case FOLDER -> throw new OutputPathException(shown(target) + " is a folder: name a file inside it (for example "
                    + abs.resolve("out.csv") + ")");
            case BLOCK_DEVICE, SOCKET, OTHER -> throw new OutputPathException(shown(target) + " is a " + k.words
                    + "; axistack writes only to a regular file, a new path, a character device or a named pipe:"
                    + " name a regular file");
            default -> {
                return new Resolved(abs, k);
            }
        }
    }

    private static Path followLink(Path target, Path abs) throws OutputPathException {
        try {
            return abs.toRealPath();
        } catch (NoSuchFileException e) {
            String to;
            try {
                to = Files.readSymbolicLink(abs).toString();
            } catch (IOException x) {
                to = "?";
            }
            throw new OutputPathException(shown(target) + " is a symbolic link to " + to
                    + ", which does not exist: name the file itself, or make the link point to one");
        } catch (IOException e) {
            throw new OutputPathException(shown(target) + " is a symbolic link that cannot be followed ("
                    + e.getMessage() + "): name a regular file");
        }
    }

    private static String shown(Path p) {
        return "output " + p;
    }

    /** What path names, not following a link (MISSING also where a part of the path is not a folder). */
    static Kind kind(Path p) {
        try {
            int mode = (Integer) Files.getAttribute(p, "unix:mode", LinkOption.NOFOLLOW_LINKS);
            return switch (mode & 0170000) {
                case 0100000 -> Kind.REGULAR;
                case 0040000 -> Kind.FOLDER;
                case 0120000 -> Kind.LINK;
                case 0020000 -> Kind.CHAR_DEVICE;
                case 0010000 -> Kind.FIFO;
                case 0060000 -> Kind.BLOCK_DEVICE;
                case 0140000 -> Kind.SOCKET;
                default -> Kind.OTHER;
            };
        } catch (NoSuchFileException | NotDirectoryException e) {
            return Kind.MISSING;
        } catch (UnsupportedOperationException | IllegalArgumentException | ClassCastException e) {
            return basicKind(p);
        } catch (FileSystemException e) {
            return e.getReason() != null && e.getReason().toLowerCase(Locale.ROOT).contains("not a directory")
                    ? Kind.MISSING : basicKind(p);
        } catch (IOException e) {
            return basicKind(p);
        }
    }

    private static Kind basicKind(Path p) {
        try {
            BasicFileAttributes a = Files.readAttributes(p, BasicFileAttributes.class, LinkOption.NOFOLLOW_LINKS);
            return a.isSymbolicLink() ? Kind.LINK : a.isDirectory() ? Kind.FOLDER : a.isRegularFile() ? Kind.REGULAR
                    : Kind.OTHER;
        } catch (IOException e) {
            return Kind.MISSING;
        }
    }

    private static Path newPart(Path dir, String name) throws IOException {
        for (int i = 0;; i++) {
            Path tmp = dir.resolve("." + name + "." + PID + "-" + token() + ".part");
            try {
                // CREATE_NEW without attributes: the mode is 0666 & ~umask, as for any file the user makes
                Files.newOutputStream(tmp, StandardOpenOption.CREATE_NEW, StandardOpenOption.WRITE).close();
                return tmp;
            } catch (java.nio.file.FileAlreadyExistsException e) {
                if (i > 100) {
                    throw e;
                }
            }
        }
    }

    private static String token() {
        return Long.toString(ThreadLocalRandom.current().nextLong() & Long.MAX_VALUE, 36);
    }

    private static void copyPermissions(Path from, Path to) {
        try {
            Files.setPosixFilePermissions(to, Files.getPosixFilePermissions(from));
        } catch (IOException | UnsupportedOperationException e) {
            // not a POSIX file system, or not ours to change: the new file keeps the umask mode
        }
    }

    private static boolean alive(long pid) {
        return pid == PID || ProcessHandle.of(pid).map(ProcessHandle::isAlive).orElse(false);
    }

    /** Removes temporary files of dead writers of dir/name (and the unnumbered ones of earlier versions). */
    private static void removeDeadParts(Path dir, String name) {
        try (var files = Files.list(dir)) {
            for (Path f : (Iterable<Path>) files::iterator) {
                String n = f.getFileName().toString();
                Matcher m = PART.matcher(n);
                boolean stale = m.matches() && m.group(1).equals(name) && !alive(Long.parseLong(m.group(2)));
                boolean legacy = n.matches("\\." + Pattern.quote(name) + "\\d+\\.part");
                if ((stale || legacy) && kind(f) == Kind.REGULAR) {
                    Files.deleteIfExists(f);
                }
            }
        } catch (IOException | NumberFormatException e) {
            // best effort: a leftover that cannot be removed now is tried again next time
        }
    }

    // ---------------------------------------------------------------- folders

    /**
     * Writes a folder of files as one set (see the class comment). Content writes into a new folder beside the
     * target; when it has finished, the new folder replaces the old one in two renames. From the old folder, files
     * that {@code ours} says belong to the set and that content did not write again are dropped (a report never
     * keeps a figure of an earlier run); other files (the user's own notes) are carried over into the new set by
     * hard link (or copy). A failure or a cancellation (any exception from content) leaves the target as it was;
     * the temporary folder is always removed.
     *
     * @param marker a file name that marks a folder as an earlier set of this kind: an existing folder is replaced
     *               only if it is empty or holds this file, so a folder of other things is never swallowed
     * @param ours   names of files that belong to the set
     * @throws OutputPathException when target names something other than a folder, or a folder of other things
     */
    public static void writeFolder(Path target, String marker, Predicate<String> ours, FolderContent content)
            throws IOException {
        Path abs = checkFolder(target, marker);
        Path parent = abs.getParent();
        String name = abs.getFileName().toString();
        Files.createDirectories(parent);
        recoverFolder(abs);
        boolean existed = kind(abs) == Kind.FOLDER;
        String id = PID + "-" + token();
        Path tmp = parent.resolve("." + name + ".new-" + id);
        Files.createDirectory(tmp); // no attributes: 0777 & ~umask
        try {
            if (existed) {
                copyPermissions(abs, tmp);
            }
            content.writeInto(tmp);
            if (!existed) {
                Files.move(tmp, abs, StandardCopyOption.ATOMIC_MOVE);
                return;
            }
            carryOver(abs, tmp, ours);
            Path old = parent.resolve("." + name + ".old-" + id);
            Files.move(abs, old, StandardCopyOption.ATOMIC_MOVE);
            try {
                Files.move(tmp, abs, StandardCopyOption.ATOMIC_MOVE);
            } catch (IOException e) {
                Files.move(old, abs, StandardCopyOption.ATOMIC_MOVE);
                throw e;
            }
            deleteTree(old);
        } finally {
            deleteTree(tmp);
        }
    }

    /**
     * Checks, before any work, that target can be written by {@link #writeFolder}: a new path (its nearest existing
     * folder writable), or a folder that is empty or holds marker (any folder when marker is null), in a folder
     * this user can write. Follows a link to a folder. Returns the folder that will be replaced.
     */
    public static Path checkFolder(Path target, String marker) throws OutputPathException {
        if (target.toString().isEmpty()) {
            throw new OutputPathException("the output folder is empty (''): name a folder, for example --out=plan-out");
        }
        Path abs = target.toAbsolutePath().normalize();
        Kind k = kind(abs);
        if (k == Kind.LINK) {
            abs = followLink(target, abs);
            k = kind(abs);
        }
        if (abs.getParent() == null) {
            throw new OutputPathException("output folder " + target + " is the root of the file system: name a new folder");
        }
        if (k != Kind.MISSING && k != Kind.FOLDER) {
            throw new OutputPathException("output folder " + target + " is a " + k.words
                    + ", not a folder: name a new folder, or an earlier report folder");
        }
        if (k == Kind.FOLDER && marker != null) {
            try (var files = Files.list(abs)) {
                var names = files.map(f -> f.getFileName().toString()).sorted().toList();
                if (!names.isEmpty() && !names.contains(marker)) {
                    throw new OutputPathException("output folder " + target + " already holds files that are not a report ("
                            + String.join(", ", names.subList(0, Math.min(3, names.size())))
                            + (names.size() > 3 ? ", ..." : "") + "): name a new or empty folder, or an earlier report folder");
                }
            } catch (OutputPathException e) {
                throw e;
            } catch (IOException e) {
                throw new OutputPathException("output folder " + target + " cannot be read (" + e.getMessage()
                        + "): name a folder you can read and write");
            }
        }
        Path existing = abs.getParent();
        while (existing.getParent() != null && kind(existing) == Kind.MISSING) {
            existing = existing.getParent();
        }
        if (!Files.isDirectory(existing)) {
            throw new OutputPathException("output folder " + target + " cannot be made: " + existing + " is a "
                    + kind(existing).words + ", not a folder");
        }
        if (!Files.isWritable(existing)) {
            throw new OutputPathException("output folder " + target + " cannot be written: " + existing
                    + " is read-only for this user: name a folder you can write");
        }
        return abs;
    }

    /**
     * Clears what killed writes of the folder target left beside it: an interrupted swap (the old folder renamed
     * aside, the new one not yet in place) is finished with the new set, which was whole before the first rename;
     * then the hidden new/old folders and temporary files of writers that no longer run are deleted. Writers still
     * running are left alone. Called by {@link #writeFolder} before it writes; safe to call any time.
     */
    public static void recoverFolder(Path target) throws IOException {
        Path abs = target.toAbsolutePath().normalize();
        Path parent = abs.getParent();
        if (parent == null || kind(parent) != Kind.FOLDER) {
            return;
        }
        String name = abs.getFileName().toString();
        Set<Path> dead = new HashSet<>();
        String interrupted = null;
        try (var files = Files.list(parent)) {
            for (Path f : (Iterable<Path>) files::iterator) {
                Matcher m = SIDE.matcher(f.getFileName().toString());
                if (f.getFileName().toString().matches("\\." + Pattern.quote(name) + "-\\d+")) {
                    dead.add(f); // the temporary folder of an earlier version
                } else if (m.matches() && m.group(1).equals(name) && !alive(Long.parseLong(m.group(3)))) {
                    dead.add(f);
                    if (m.group(2).equals("old")) {
                        interrupted = f.getFileName().toString().substring(name.length() + 6);
                    }
                }
            }
        }
        if (interrupted != null && kind(abs) == Kind.MISSING) {
            Path fresh = parent.resolve("." + name + ".new-" + interrupted);
            Path old = parent.resolve("." + name + ".old-" + interrupted);
            Files.move(kind(fresh) == Kind.FOLDER ? fresh : old, abs, StandardCopyOption.ATOMIC_MOVE);
        }
        for (Path f : dead) {
            deleteTree(f);
        }
        removeDeadParts(parent, name);
    }

    private static void carryOver(Path from, Path to, Predicate<String> ours) throws IOException {
        try (var files = Files.list(from)) {
            for (Path f : (Iterable<Path>) files::iterator) {
                String n = f.getFileName().toString();
                Path dest = to.resolve(n);
                if (ours.test(n) || kind(dest) != Kind.MISSING || PART.matcher(n).matches()) {
                    continue;
                }
                copyTree(f, dest);
            }
        }
    }

    private static void copyTree(Path from, Path to) throws IOException {
        Kind k = kind(from);
        if (k == Kind.FOLDER) {
            Files.createDirectory(to);
            copyPermissions(from, to);
            try (var files = Files.list(from)) {
                for (Path f : (Iterable<Path>) files::iterator) {
                    copyTree(f, to.resolve(f.getFileName().toString()));
                }
            }
        } else if (k == Kind.REGULAR) {
            try {
                Files.createLink(to, from);
            } catch (IOException | UnsupportedOperationException e) {
                Files.copy(from, to, StandardCopyOption.COPY_ATTRIBUTES);
            }
        } else if (k == Kind.LINK) {
            Files.createSymbolicLink(to, Files.readSymbolicLink(from));
        }
        // devices, pipes and sockets inside a report folder are not carried over
    }

    /** Deletes a folder and what is in it, without following links; nothing if it is gone. */
    private static void deleteTree(Path dir) throws IOException {
        Kind k = kind(dir);
        if (k == Kind.MISSING) {
            return;
        }
        if (k == Kind.FOLDER) {
            try (var files = Files.list(dir)) {
                for (Path f : (Iterable<Path>) files::iterator) {
                    deleteTree(f);
                }
            }
        }
        Files.deleteIfExists(dir);
    }

    /**
     * Resolves a plain file name inside an output folder, refusing names that would land outside it
     * (absolute paths, "..", separators).
     */
    public static Path inside(Path folder, String fileName) {
        Path base = folder.toAbsolutePath().normalize();
        Path p = base.resolve(fileName).normalize();
        if (!p.getParent().equals(base)) {
            throw new IllegalArgumentException("output name '" + fileName + "' would be written outside " + base);
        }
        return p;
    }
}
