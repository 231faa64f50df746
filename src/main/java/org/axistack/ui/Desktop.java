package org.axistack.ui;

import java.awt.GraphicsEnvironment;
import java.nio.file.Path;
import javax.swing.SwingUtilities;
import javax.swing.UIManager;

/** Starts the desktop window (on the event thread). */
public final class Desktop {
    private Desktop() {
    }

    /** Whether a window can be shown here (false on a machine without a display). */
    public static boolean displayAvailable() {
        return !GraphicsEnvironment.isHeadless();
    }

    /**
     * Opens the window with a stack file, or with the built-in demo lens when file is null; the high-voltage
     * cautions are shown first on the account's first start.
     *
     * @return the window (already visible)
     */
    public static LensWindow open(Path file, RecentFiles recent) throws Exception {
        LensWindow[] out = new LensWindow[1];
        Exception[] failure = new Exception[1];
        SwingUtilities.invokeAndWait(() -> {
            try {
                try {
                    UIManager.setLookAndFeel(UIManager.getCrossPlatformLookAndFeelClassName());
                } catch (Exception ignored) {
                    // the default look stays
                }
                LensWindow w = new LensWindow(recent);
                w.setVisible(true);
                if (!recent.cautionsSeen()) {
                    w.actions().showCautions();
                }
                if (file == null) {
                    w.openDemo();
                } else {
                    w.actions().open(file);
                }
                out[0] = w;
            } catch (Exception e) {
                failure[0] = e;
            }
        });
        if (failure[0] != null) {
            throw failure[0];
        }
        return out[0];
    }
}
