package org.axistack.hygiene;

import java.nio.file.Path;
import org.junit.platform.launcher.LauncherSession;
import org.junit.platform.launcher.LauncherSessionListener;

/**
 * Records the project folder when the test session opens (registered in
 * {@code META-INF/services/org.junit.platform.launcher.LauncherSessionListener}), so that
 * {@link WorkingTreeUntouchedTest}, ordered last, can tell whether any test wrote outside its temporary folder.
 */
public final class WorkingTreeSnapshot implements LauncherSessionListener {

    @Override
    public void launcherSessionOpened(LauncherSession session) {
        if (WorkingTree.atStart == null) {
            WorkingTree.atStart = WorkingTree.of(Path.of("").toAbsolutePath());
        }
    }
}
