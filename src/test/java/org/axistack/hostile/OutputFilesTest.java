package org.axistack.hostile;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.BufferedReader;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import javax.imageio.ImageIO;

import org.axistack.cli.CliRun;
import org.axistack.trace.BundleTracer;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import org.junit.jupiter.api.io.TempDir;

/**
 * Output files: replaced atomically (a run killed mid-write leaves the old file whole), never written
 * outside the folder given with --out, and resource limits refused up front with a clear message.
 */
class OutputFilesTest {

    private static Process java(String mainClass, String xmx, String... args) throws Exception {
        List<String> cmd = new ArrayList<>();
        cmd.add(Path.of(System.getProperty("java.home"), "bin", "java").toString());
        cmd.add("-Xmx" + xmx);
        cmd.add("-Djava.awt.headless=true");
        cmd.add("-cp");
        cmd.add(System.getProperty("java.class.path"));
        cmd.add(mainClass);
        cmd.addAll(List.of(args));
        return new ProcessBuilder(cmd).redirectErrorStream(false).start();
    }

    /** A process killed (SIGKILL) half-way through writing leaves the previous file byte for byte. */
    @Test
    @Timeout(value = 60, unit = TimeUnit.SECONDS)
    void aKilledWriteLeavesTheOldFile(@TempDir Path dir) throws Exception {
        Path target = dir.resolve("table.csv");
        Files.writeString(target, "old,table\n1,2\n");
        Process p = java(WriteThenHang.class.getName(), "64m", target.toString());
        try (BufferedReader r = new BufferedReader(new InputStreamReader(p.getInputStream(), StandardCharsets.UTF_8))) {
            assertThat(r.readLine()).isEqualTo("HALF");
            p.destroyForcibly();
            assertThat(p.waitFor(20, TimeUnit.SECONDS)).isTrue();
        }
        assertThat(Files.readString(target)).isEqualTo("old,table\n1,2\n");
    }

    /**
     * The real command killed at some moment of its run: every output file is either the old one or a whole
     * new PNG (readable to the end); never a torn one.
     */
    @Test
    @Timeout(value = 120, unit = TimeUnit.SECONDS)
    void aKilledPlanRunLeavesOldOrWholeFiles(@TempDir Path dir) throws Exception {
        Path out = dir.resolve("out");
        Files.createDirectories(out);
        byte[] old = "not yet drawn".getBytes(StandardCharsets.UTF_8);
        Path png = out.resolve("geometry.png");
        for (int attempt = 0; attempt < 3; attempt++) {
            Files.write(png, old);
            Process p = java("org.axistack.cli.Main", "512m", "plan", "--out", out.toString());
            long t0 = System.nanoTime();
            // kill as soon as a temporary file shows up (mid-write), or after a few seconds
            while (p.isAlive() && System.nanoTime() - t0 < 8e9) {
                try (var s = Files.list(out)) {
                    if (s.anyMatch(f -> f.getFileName().toString().endsWith(".part"))) {
                        break;
                    }
                }
                Thread.sleep(1);
            }
            p.destroyForcibly();
            p.waitFor(20, TimeUnit.SECONDS);
            byte[] now = Files.readAllBytes(png);
            if (!java.util.Arrays.equals(now, old)) {
                assertThat(ImageIO.read(png.toFile())).as("a whole PNG").isNotNull();
            }
        }
    }

    /** A link planted in the output folder is replaced, not followed: the file it points to is untouched. */
    @Test
    void outputNeverFollowsALinkOutOfTheFolder(@TempDir Path dir) throws Exception {
        Path outside = dir.resolve("precious.png");
        Files.writeString(outside, "keep me");
        Path out = dir.resolve("out");
        Files.createDirectories(out);
        Files.createSymbolicLink(out.resolve("geometry.png"), outside);
        CliRun.Run r = CliRun.run("plan", "--out", out.toString());
        assertThat(r.code()).as(r.err()).isZero();
        assertThat(Files.readString(outside)).isEqualTo("keep me");
        assertThat(Files.isSymbolicLink(out.resolve("geometry.png"))).isFalse();
        assertThat(ImageIO.read(out.resolve("geometry.png").toFile())).isNotNull();
    }

    /** The ray limit follows the heap and the number of planes, and a bundle beyond it is refused before any solve. */
    @Test
    @Timeout(value = 30, unit = TimeUnit.SECONDS)
    void tooManyRaysAreRefusedUpFront() {
        int one = BundleTracer.maxRaysForHeap(1), many = BundleTracer.maxRaysForHeap(100);
        assertThat(one).isPositive().isLessThanOrEqualTo(BundleTracer.MAX_RAYS);
        assertThat(many).isPositive().isLessThan(one);
        CliRun.Run r = CliRun.run("trace", "--count", "2000000000");
        assertThat(r.code()).isEqualTo(2);
        assertThat(r.err()).contains("more than this heap can hold").contains("--count").doesNotContain("solving")
                .doesNotContain("Exception");
        CliRun.Run fan = CliRun.run("trace", "--rays", "fan", "--count", "100000",
                "--azimuths", "100000");
        assertThat(fan.code()).isEqualTo(2);
        assertThat(fan.err()).contains("--azimuths");
    }

    /** In a 256 MB heap the solver refuses a mesh the dense matrix would not fit, with the fix in the message. */
    @Test
    @Timeout(value = 120, unit = TimeUnit.SECONDS)
    void aMeshTooLargeForTheHeapIsRefused(@TempDir Path dir) throws Exception {
        Path f = dir.resolve("fine.toml");
        Files.writeString(f, HostileStackFilesTest.BASE + "[mesh]\ntarget_elements = 8000\n");
        Process p = java("org.axistack.cli.Main", "256m", "optics", f.toString());
        String err = new String(p.getErrorStream().readAllBytes(), StandardCharsets.UTF_8);
        assertThat(p.waitFor(60, TimeUnit.SECONDS)).isTrue();
        assertThat(p.exitValue()).as(err).isEqualTo(2);
        assertThat(err).contains("this heap supports at most").contains("-Xmx").doesNotContain("OutOfMemory")
                .doesNotContain("\tat ");
    }
}
