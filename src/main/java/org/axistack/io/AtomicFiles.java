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

    private AtomicFiles() {
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
