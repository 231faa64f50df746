package org.axistack.hygiene;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.FileVisitResult;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.SimpleFileVisitor;
import java.nio.file.attribute.BasicFileAttributes;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.TreeMap;
import java.util.TreeSet;

/**
 * What the project folder (the folder the tests run in, without {@code target/} and {@code .git}) holds:
 * every file with its size and modification time. Tests write only inside their own temporary folders;
 * comparing two snapshots shows a test that wrote, replaced or deleted anything else (a command run
 * without {@code --out}, for example, would leave {@code plan-out/} behind).
 */
record WorkingTree(Map<String, String> files) {

    /** Set by {@link WorkingTreeSnapshot} when the test session opens; null when it did not run. */
    static volatile WorkingTree atStart;

    static WorkingTree of(Path root) {
        Map<String, String> files = new TreeMap<>();
        try {
            Files.walkFileTree(root, new SimpleFileVisitor<>() {
                @Override
                public FileVisitResult preVisitDirectory(Path dir, BasicFileAttributes a) {
                    Path rel = root.relativize(dir);
                    if (rel.getNameCount() == 1 && (rel.toString().equals("target") || rel.toString().equals(".git"))) {
                        return FileVisitResult.SKIP_SUBTREE;
                    }
                    files.put(rel + "/", "folder");
                    return FileVisitResult.CONTINUE;
                }

                @Override
                public FileVisitResult visitFile(Path f, BasicFileAttributes a) {
                    Path rel = root.relativize(f);
                    if (!rel.toString().equals(".git")) {
                        files.put(rel.toString(), a.size() + " bytes, modified " + a.lastModifiedTime());
                    }
                    return FileVisitResult.CONTINUE;
                }

                @Override
                public FileVisitResult visitFileFailed(Path f, IOException e) {
                    files.put(root.relativize(f).toString(), "unreadable: " + e.getMessage());
                    return FileVisitResult.CONTINUE;
                }
            });
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return new WorkingTree(files);
    }

    /** The paths added, removed or changed since {@code before}, one line each. */
    List<String> changesSince(WorkingTree before) {
        List<String> out = new ArrayList<>();
        TreeSet<String> all = new TreeSet<>(before.files.keySet());
        all.addAll(files.keySet());
        for (String p : all) {
            String was = before.files.get(p);
            String now = files.get(p);
            if (was == null) {
                out.add("added " + p);
            } else if (now == null) {
                out.add("removed " + p);
            } else if (!Objects.equals(was, now)) {
                out.add("changed " + p + " (" + was + " -> " + now + ")");
            }
        }
        return out;
    }
}
