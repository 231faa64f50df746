package org.axistack.hostile;

import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.io.IOException;
import java.net.StandardProtocolFamily;
import java.net.UnixDomainSocketAddress;
import java.nio.channels.ServerSocketChannel;
import java.nio.file.Files;
import java.nio.file.LinkOption;
import java.nio.file.Path;

/**
 * Look-alike special files made inside a test's temporary folder (never a real system file): a character device
 * with the numbers of the null device (writes are discarded), a block device with numbers from the range kept for
 * local use (major 240, which no driver here claims: opening it would fail, and nothing opens it), a FIFO and a
 * socket. Device nodes need root (mknod); tests that need them are skipped without it.
 */
final class SpecialFiles {

    private SpecialFiles() {
    }

    static Path charDevice(Path p) throws Exception {
        run("mknod", p.toString(), "c", "1", "3");
        return p;
    }

    static Path blockDevice(Path p) throws Exception {
        run("mknod", p.toString(), "b", "240", "0");
        return p;
    }

    static Path fifo(Path p) throws Exception {
        run("mkfifo", p.toString());
        return p;
    }

    /** A socket file (the channel is closed at once; the node stays). */
    static Path socket(Path p) throws IOException {
        try (ServerSocketChannel ch = ServerSocketChannel.open(StandardProtocolFamily.UNIX)) {
            ch.bind(UnixDomainSocketAddress.of(p));
        }
        return p;
    }

    /** The file type bits of the node (S_IFMT of its mode), not following links. */
    static int type(Path p) throws IOException {
        return (Integer) Files.getAttribute(p, "unix:mode", LinkOption.NOFOLLOW_LINKS) & 0170000;
    }

    static final int CHAR = 0020000, BLOCK = 0060000, FIFO = 0010000, SOCKET = 0140000, LINK = 0120000, REGULAR = 0100000,
            FOLDER = 0040000;

    private static void run(String... cmd) throws Exception {
        Process p = new ProcessBuilder(cmd).redirectErrorStream(true).start();
        String out = new String(p.getInputStream().readAllBytes());
        assumeTrue(p.waitFor() == 0, "cannot make a special file here (" + String.join(" ", cmd) + "): " + out);
    }
}
