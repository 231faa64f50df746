package org.axistack.ui;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.prefs.Preferences;

/** The most recently opened stack files, newest first, kept in java.util.prefs under the given node. */
public final class RecentFiles {

    /** How many files are remembered. */
    public static final int MAX = 8;
    private static final String KEY = "recent.";

    private final Preferences node;

    public RecentFiles(Preferences node) {
        this.node = node;
    }

    /** The user's own list for the window. */
    public static RecentFiles forUser() {
        return new RecentFiles(Preferences.userRoot().node("org/axistack/desktop"));
    }

    /** A list kept in memory only, never in the user's preferences (for tests and benchmarks). */
    public static RecentFiles inMemory() {
        return new RecentFiles(new MemoryPreferences().node("org/axistack/desktop"));
    }

    /** The remembered files, newest first. */
    public List<Path> list() {
        List<Path> out = new ArrayList<>();
        for (int i = 0; i < MAX; i++) {
            String v = node.get(KEY + i, null);
            if (v != null && !v.isBlank()) {
                out.add(Path.of(v));
            }
        }
        return out;
    }

    /** Puts a file first (removing an older entry for it) and forgets the oldest beyond {@link #MAX}. */
    public void add(Path file) {
        Path abs = file.toAbsolutePath().normalize();
        List<Path> l = list();
        l.remove(abs);
        l.add(0, abs);
        for (int i = 0; i < MAX; i++) {
            if (i < l.size()) {
                node.put(KEY + i, l.get(i).toString());
            } else {
                node.remove(KEY + i);
            }
        }
    }

    /** Whether the cautions have been shown once on this account. */
    public boolean cautionsSeen() {
        return node.getBoolean("cautions.seen", false);
    }

    /** Remembers that the cautions were shown. */
    public void markCautionsSeen() {
        node.putBoolean("cautions.seen", true);
    }
}
