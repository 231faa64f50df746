package org.axistack.io;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;

/**
 * Writes files so that a reader never sees half of one: the content goes to a temporary file in the
 * same folder, which is then moved over the target (atomically where the file system allows).
 * Also guards output folders: a name given inside an output folder may not climb out of it.
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

    private AtomicFiles() {
    }

    /**
     * Writes a folder of files so that a failure or a cancellation (any exception from content) leaves the folder as
     * it was: content writes into a new temporary folder beside it, and only when it has finished are its files moved
     * in. A folder that did not exist is made by renaming the whole temporary folder (atomic where the file system
     * allows); into an existing folder each file is moved over its old version (atomically per file), and files that
     * content did not write stay. The temporary folder is always removed.
     *
     * @throws IOException when target exists and is not a folder, or a file cannot be written or moved
     */
    public static void writeFolder(Path target, FolderContent content) throws IOException {
        Path abs = target.toAbsolutePath().normalize();
        if (Files.exists(abs) && !Files.isDirectory(abs)) {
            throw new IOException(abs + " exists and is not a folder");
        }
        Path parent = abs.getParent();
        Files.createDirectories(parent);
        Path tmp = Files.createTempDirectory(parent, "." + abs.getFileName() + "-");
        try {
            content.writeInto(tmp);
            boolean renamed = false;
            if (!Files.exists(abs)) {
                try {
                    Files.move(tmp, abs, StandardCopyOption.ATOMIC_MOVE);
                    renamed = true;
                } catch (IOException e) {
                    Files.createDirectories(abs); // made meanwhile, or no atomic rename here: move file by file
                }
            }
            if (!renamed) {
                try (var files = Files.list(tmp)) {
                    for (Path f : (Iterable<Path>) files::iterator) {
                        Path to = abs.resolve(f.getFileName().toString());
                        try {
                            Files.move(f, to, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
                        } catch (AtomicMoveNotSupportedException e) {
                            Files.move(f, to, StandardCopyOption.REPLACE_EXISTING);
                        }
                    }
                }
            }
        } finally {
            deleteTree(tmp);
        }
    }

    /** Deletes a folder and what is in it, without following links; nothing if it is gone. */
    private static void deleteTree(Path dir) throws IOException {
        if (!Files.exists(dir, java.nio.file.LinkOption.NOFOLLOW_LINKS)) {
            return;
        }
        if (Files.isDirectory(dir, java.nio.file.LinkOption.NOFOLLOW_LINKS)) {
            try (var files = Files.list(dir)) {
                for (Path f : (Iterable<Path>) files::iterator) {
                    deleteTree(f);
                }
            }
        }
        Files.deleteIfExists(dir);
    }

    /** Writes target through a temporary sibling file and a move; on failure the target is untouched. */
    public static void write(Path target, Content content) throws IOException {
        Path abs = target.toAbsolutePath();
        Path dir = abs.getParent();
        Files.createDirectories(dir);
        Path tmp = Files.createTempFile(dir, "." + abs.getFileName(), ".part");
        try {
            try (OutputStream out = Files.newOutputStream(tmp)) {
                content.writeTo(out);
            }
            try {
                Files.move(tmp, abs, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
            } catch (AtomicMoveNotSupportedException e) {
                Files.move(tmp, abs, StandardCopyOption.REPLACE_EXISTING);
            }
        } finally {
            Files.deleteIfExists(tmp);
        }
    }

    /** Writes UTF-8 text atomically. */
    public static void writeString(Path target, String text) throws IOException {
        byte[] bytes = text.getBytes(StandardCharsets.UTF_8);
        write(target, out -> out.write(bytes));
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
