package org.axistack.hostile;

import static org.assertj.core.api.Assertions.assertThat;
import static org.axistack.cli.CliRun.run;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.TimeUnit;
import org.axistack.cli.CliRun.Run;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import org.junit.jupiter.api.io.TempDir;

/**
 * Hostile stack files beyond the malformed-file table of the io tests (which covers truncation, wrong
 * types, NaN and inf, huge numbers, negative sizes, self-crossing outlines, too many electrodes, non-UTF-8
 * bytes): each must end with exit 2 and a one-line message naming the file and a fix, quickly, with no stack
 * trace, no out-of-memory and no output folder created.
 */
class HostileStackFilesTest {

    static final String BASE = String.join("\n", "[beam]", "particle = \"electron\"", "energy_eV = 500.0",
            "[[electrode]]", "name = \"a\"", "shape = \"tube\"", "bias_V = 0.0", "radius_mm = 5.0",
            "z_start_mm = -20.0", "z_end_mm = -1.0",
            "[[electrode]]", "name = \"b\"", "shape = \"tube\"", "bias_V = -300.0", "radius_mm = 5.0",
            "z_start_mm = 1.0", "z_end_mm = 20.0", "");

    static void assertRefused(Path file, Path dir) {
        Path out = dir.resolve("out");
        Run r = run("plan", file.toString(), "--out", out.toString());
        assertThat(r.code()).as(r.err()).isEqualTo(2);
        assertThat(r.err()).startsWith("error: " + file).contains("Fix: ");
        assertThat(r.err().strip()).doesNotContain("\n");
        assertThat(r.err()).doesNotContain("\tat ").doesNotContain("Exception").doesNotContain("Error:");
        assertThat(r.out()).isEmpty();
        assertThat(out).doesNotExist();
    }

    /** A 100 MB file (generated here, stack text repeated) is refused by its size before it is read. */
    @Test
    @Timeout(value = 20, unit = TimeUnit.SECONDS)
    void aHundredMegabyteFile(@TempDir Path dir) throws IOException {
        Path file = dir.resolve("huge.toml");
        byte[] block = ("# padding " + "x".repeat(1000) + "\n").getBytes(StandardCharsets.UTF_8);
        try (OutputStream o = Files.newOutputStream(file)) {
            o.write(BASE.getBytes(StandardCharsets.UTF_8));
            for (long n = 0; n < 100_000_000L; n += block.length) {
                o.write(block);
            }
        }
        assertThat(Files.size(file)).isGreaterThan(100_000_000L);
        long t0 = System.nanoTime();
        assertRefused(file, dir);
        assertThat((System.nanoTime() - t0) * 1e-9).as("seconds to refuse").isLessThan(2);
    }

    private static Path write(Path dir, String name, byte[] bytes) throws IOException {
        Path f = dir.resolve(name);
        Files.write(f, bytes);
        return f;
    }

    /** Arrays nested 100 000 deep (a recursive-descent parser would overflow its stack). */
    @Test
    @Timeout(value = 20, unit = TimeUnit.SECONDS)
    void deeplyNestedArrays(@TempDir Path dir) throws IOException {
        String text = BASE + "[screen]\nz_mm = 1.0\nextra = " + "[".repeat(100_000) + "]".repeat(100_000) + "\n";
        assertRefused(write(dir, "nested.toml", text.getBytes(StandardCharsets.UTF_8)), dir);
    }

    /** Inline tables nested deep on one short line each. */
    @Test
    @Timeout(value = 20, unit = TimeUnit.SECONDS)
    void deeplyNestedInlineTables(@TempDir Path dir) throws IOException {
        String text = BASE + "[screen]\nz_mm = 1.0\nextra = " + "{a = ".repeat(20_000) + "1" + "}".repeat(20_000) + "\n";
        assertRefused(write(dir, "inline.toml", text.getBytes(StandardCharsets.UTF_8)), dir);
    }

    /** A dotted table name of 30 000 parts. */
    @Test
    @Timeout(value = 20, unit = TimeUnit.SECONDS)
    void aVeryDeepDottedTableName(@TempDir Path dir) throws IOException {
        String text = BASE + "[" + "a.".repeat(15_000) + "b]\nx = 1\n";
        assertRefused(write(dir, "dotted.toml", text.getBytes(StandardCharsets.UTF_8)), dir);
    }

    /** NUL bytes inside the text. */
    @Test
    void nulBytes(@TempDir Path dir) throws IOException {
        assertRefused(write(dir, "nul.toml", (BASE + "title = \"a\0b\"\n\0\0\0").getBytes(StandardCharsets.UTF_8)), dir);
    }

    /** The same stack saved as UTF-16 (what some editors do). */
    @Test
    void utf16Text(@TempDir Path dir) throws IOException {
        assertRefused(write(dir, "utf16.toml", BASE.getBytes(StandardCharsets.UTF_16)), dir);
    }

    /** A gzip-compressed stack file. */
    @Test
    void compressedFile(@TempDir Path dir) throws IOException {
        java.io.ByteArrayOutputStream b = new java.io.ByteArrayOutputStream();
        try (var z = new java.util.zip.GZIPOutputStream(b)) {
            z.write(BASE.getBytes(StandardCharsets.UTF_8));
        }
        assertRefused(write(dir, "stack.toml.gz", b.toByteArray()), dir);
    }

    /** --set with NaN, infinity and absurd values is refused like the file's own fields. */
    @Test
    void biasOverridesThatAreNotNumbers(@TempDir Path dir) throws IOException {
        Path f = write(dir, "ok.toml", BASE.getBytes(StandardCharsets.UTF_8));
        for (String bad : new String[] {"b=NaN", "b=Infinity", "b=-inf", "b=1e400", "b=1e12", "b=", "=5", "zz=5", "b=0x10"}) {
            Run r = run("plan", f.toString(), "--set", bad, "--out", dir.resolve("out").toString());
            assertThat(r.code()).as(bad + ": " + r.err()).isEqualTo(2);
            assertThat(r.err()).as(bad).doesNotContain("\tat ").doesNotContain("Exception");
            assertThat(dir.resolve("out")).as(bad).doesNotExist();
        }
    }

    /** A valid file with a UTF-8 byte-order mark and CRLF line ends is a valid file (not hostile, but common). */
    @Test
    void byteOrderMarkAndCrlfAreAccepted(@TempDir Path dir) throws IOException {
        byte[] body = BASE.replace("\n", "\r\n").getBytes(StandardCharsets.UTF_8);
        byte[] bom = {(byte) 0xEF, (byte) 0xBB, (byte) 0xBF};
        byte[] all = new byte[bom.length + body.length];
        System.arraycopy(bom, 0, all, 0, 3);
        System.arraycopy(body, 0, all, 3, body.length);
        Path f = write(dir, "bom.toml", all);
        Run r = run("plan", f.toString(), "--out", dir.resolve("out").toString()); // never the default ./plan-out
        assertThat(r.code()).as(r.err()).isEqualTo(0);
    }
}
