package org.axistack.hostile;

import java.nio.file.Path;

import org.axistack.io.AtomicFiles;

/** Child process for {@link OutputFilesTest}: starts an atomic write, says so, and hangs half-way until killed. */
public final class WriteThenHang {

    private WriteThenHang() {
    }

    public static void main(String[] args) throws Exception {
        AtomicFiles.write(Path.of(args[0]), out -> {
            out.write("NEW CONTENT, FIRST HALF ".repeat(1000).getBytes(java.nio.charset.StandardCharsets.UTF_8));
            out.flush();
            System.out.println("HALF");
            System.out.flush();
            try {
                Thread.sleep(120_000);
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
            }
        });
    }
}
