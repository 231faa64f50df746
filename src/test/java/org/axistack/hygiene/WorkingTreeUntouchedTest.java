package org.axistack.hygiene;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Path;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.Test;

/**
 * Runs after every other test class ({@link GuardLast}) and fails if the suite changed the project folder:
 * tests write only inside their own temporary folders (@TempDir), never the user's files (a test that ran
 * {@code plan} without {@code --out} once replaced the user's {@code plan-out/}). Common practice, no source.
 */
class WorkingTreeUntouchedTest {

    @Test
    void noTestWroteOutsideItsTemporaryFolder() {
        WorkingTree before = WorkingTree.atStart;
        Assumptions.assumeTrue(before != null, "the session listener did not record the folder");
        WorkingTree now = WorkingTree.of(Path.of("").toAbsolutePath());
        assertThat(now.changesSince(before)).as("files changed in the project folder during the test run "
                + "(tests must write only inside their @TempDir)").isEmpty();
    }

    @Test
    void theComparisonSeesAFileAddedAChangeAndARemoval(@org.junit.jupiter.api.io.TempDir Path dir)
            throws java.io.IOException {
        java.nio.file.Files.writeString(dir.resolve("kept.txt"), "a");
        java.nio.file.Files.writeString(dir.resolve("gone.txt"), "b");
        WorkingTree before = WorkingTree.of(dir);
        java.nio.file.Files.writeString(dir.resolve("kept.txt"), "a longer text");
        java.nio.file.Files.delete(dir.resolve("gone.txt"));
        java.nio.file.Files.createDirectories(dir.resolve("plan-out"));
        assertThat(WorkingTree.of(dir).changesSince(before)).hasSize(3)
                .anyMatch(s -> s.startsWith("changed kept.txt"))
                .contains("removed gone.txt", "added plan-out/");
    }
}
