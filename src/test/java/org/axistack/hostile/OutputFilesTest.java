package org.axistack.hostile;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.BasicFileAttributes;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.concurrent.TimeUnit;
import javax.imageio.ImageIO;

import org.axistack.cli.CliRun;
import org.axistack.io.AtomicFiles;
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

    /** What a folder holds: each file's name with its identity on disk (device and inode). */
    private static Map<String, Object> snapshot(Path dir) throws IOException {
        Map<String, Object> m = new TreeMap<>();
        try (var s = Files.list(dir)) {
            for (Path f : (Iterable<Path>) s::iterator) {
                m.put(f.getFileName().toString(), Files.readAttributes(f, BasicFileAttributes.class).fileKey());
            }
        }
        return m;
    }

    /**
     * The plan killed (SIGKILL) at random moments of its run into a folder holding a complete report: after the
     * kill and the recovery the next run does first, the folder is the whole old set (the same files, the same
     * inodes) or the whole new set (no file of the old set, every file the new report links present, the new
     * bias in stack.toml); no temporary file or folder remains. One kill is aimed at the write phase (as soon as
     * the hidden new folder appears); the other moments are drawn from a fixed seed over the length of a run.
     */
    @Test
    @Timeout(value = 300, unit = TimeUnit.SECONDS)
    void aKilledPlanLeavesTheWholeOldOrTheWholeNewReport(@TempDir Path dir) throws Exception {
        Path stack = Files.writeString(dir.resolve("lens.toml"), OutputPathsTest.STACK);
        Path out = dir.resolve("out");
        long t0 = System.nanoTime();
        CliRun.Run first = CliRun.run("plan", stack.toString(), "--no-check", "-q", "--out", out.toString());
        assertThat(first.code()).as(first.err()).isZero();
        double runSeconds = (System.nanoTime() - t0) * 1e-9 + 1.0; // plus the start of a new JVM
        java.util.Random random = new java.util.Random(20261205L);
        int wholeOld = 0, wholeNew = 0;
        for (int attempt = 0; attempt < 4; attempt++) {
            Map<String, Object> old = snapshot(out);
            String bias = Integer.toString(-250 - 10 * attempt);
            Process p = java("org.axistack.cli.Main", "512m", "plan", stack.toString(), "--no-check", "-q", "--set",
                    "b=" + bias, "--out", out.toString());
            long start = System.nanoTime();
            double killAt = attempt == 0 ? Double.POSITIVE_INFINITY : 0.3 + random.nextDouble() * 1.2 * runSeconds;
            while (p.isAlive() && (System.nanoTime() - start) * 1e-9 < Math.min(killAt, 60)) {
                if (attempt == 0) {
                    try (var s = Files.list(dir)) {
                        if (s.anyMatch(f -> f.getFileName().toString().startsWith(".out.new-"))) {
                            Thread.sleep(random.nextInt(300));
                            break;
                        }
                    }
                }
                Thread.sleep(2);
            }
            p.destroyForcibly();
            assertThat(p.waitFor(20, TimeUnit.SECONDS)).isTrue();
            AtomicFiles.recoverFolder(out); // what the next run does first
            Map<String, Object> now = snapshot(out);
            if (now.equals(old)) {
                wholeOld++;
            } else {
                wholeNew++;
                for (var e : now.entrySet()) {
                    assertThat(old.containsValue(e.getValue())).as("attempt " + attempt + ": " + e.getKey()
                            + " of the old set beside the new report").isFalse();
                }
                String html = Files.readString(out.resolve("report.html"));
                java.util.regex.Matcher m = java.util.regex.Pattern.compile("(?:src|href)=\"([^\":#]+)\"").matcher(html);
                while (m.find()) {
                    assertThat(out.resolve(m.group(1))).as("linked from the report").exists();
                }
                assertThat(Files.readString(out.resolve("stack.toml"))).contains("bias_V = " + bias);
            }
            try (var s = Files.list(dir)) {
                assertThat(s.map(f -> f.getFileName().toString()).sorted().toList()).as("attempt " + attempt)
                        .containsExactly("lens.toml", "out");
            }
        }
        assertThat(wholeOld + wholeNew).isEqualTo(4);
    }

    /** A link planted in the report folder is replaced with the rest of the set, never followed: its target stays. */
    @Test
    void outputNeverFollowsALinkOutOfTheFolder(@TempDir Path dir) throws Exception {
        Path stack = Files.writeString(dir.resolve("lens.toml"), OutputPathsTest.STACK);
        Path outside = dir.resolve("precious.png");
        Files.writeString(outside, "keep me");
        Path out = dir.resolve("out");
        Files.createDirectories(out);
        Files.writeString(out.resolve("report.html"), "an earlier report");
        Files.createSymbolicLink(out.resolve("geometry.png"), outside);
        CliRun.Run r = CliRun.run("plan", stack.toString(), "--no-check", "-q", "--out", out.toString());
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

    /** A tiny field-map step is refused before the solve with the node count (no overflow) and the smallest step. */
    @Test
    @Timeout(value = 30, unit = TimeUnit.SECONDS)
    void aTinyMapStepIsRefusedUpFront() {
        for (String step : new String[] {"1e-9", "1e-300", "0.0001"}) {
            CliRun.Run r = CliRun.run("trace", "--count", "3", "--map-step", step);
            assertThat(r.code()).as(r.err()).isEqualTo(2);
            assertThat(r.err()).contains("--map-step").contains("more than the limit of 4000000").contains("use a step of at least")
                    .doesNotContain("solving").doesNotContain("4611686018427387904").doesNotContain("E-");
        }
        assertThat(org.axistack.trace.FieldMap.nodeCount(0, 0.1, 0.01, 1e-12)).isGreaterThan(1e18).isFinite();
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
