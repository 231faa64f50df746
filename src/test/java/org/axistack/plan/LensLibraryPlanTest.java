package org.axistack.plan;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.regex.Pattern;
import java.util.stream.Stream;

import org.axistack.testing.LibrarySolutions;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * Every stack of lens-library/ works as its header says (issue 19): the plan at its stored biases, on its own mesh,
 * gives no warning the file does not announce. A file announces the warnings it expects on a header line
 * {@code # Plan warnings expected: kind, kind} ("none" for none), with the kinds of {@link #KINDS}; a warning of a
 * kind the file does not list, or of no known kind, fails the test, and so does a listed kind that no longer occurs
 * (so the header stays true). The verification cases are left out (they do not depend on the stack).
 */
class LensLibraryPlanTest {

    /** Warning kinds and how a warning of the plan is recognised (the words the plan writes). */
    static final Map<String, Pattern> KINDS = new LinkedHashMap<>();

    static {
        KINDS.put("surface-field", Pattern.compile("^electrode \\S+: (surface field|sharp corner)"));
        KINDS.put("gap", Pattern.compile("^gap "));
        KINDS.put("optics-accuracy", Pattern.compile("the cardinal elements carry an estimated error"));
        KINDS.put("near-mirror", Pattern.compile("^focusing bias .* is near a mirror"));
        KINDS.put("no-focus", Pattern.compile("does not focus|no bias of .* focuses|none in range"));
        KINDS.put("envelope", Pattern.compile("^envelope: "));
        KINDS.put("open-lens", Pattern.compile("^the lens is open"));
        KINDS.put("budget", Pattern.compile("^no budget"));
    }

    static final Pattern HEADER = Pattern.compile("^# Plan warnings expected: (.*)$");

    static Stream<Path> library() throws IOException {
        try (Stream<Path> files = Files.list(Path.of("lens-library"))) {
            return files.filter(p -> p.toString().endsWith(".toml")).sorted().toList().stream();
        }
    }

    static List<String> announced(Path file) throws IOException {
        for (String line : Files.readAllLines(file)) {
            var m = HEADER.matcher(line.strip());
            if (m.matches()) {
                String list = m.group(1).replaceAll("\\(.*?\\)", "").strip();
                List<String> out = new ArrayList<>();
                if (!list.equals("none")) {
                    for (String k : list.split(",")) {
                        out.add(k.strip());
                    }
                }
                return out;
            }
        }
        throw new AssertionError(file + " has no '# Plan warnings expected:' header line");
    }

    static String kind(String warning) {
        for (var e : KINDS.entrySet()) {
            if (e.getValue().matcher(warning).find()) {
                return e.getKey();
            }
        }
        return "unknown";
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("library")
    void planWarnsOnlyOfWhatTheHeaderAnnounces(Path file) throws Exception {
        List<String> expected = announced(file);
        assertThat(KINDS.keySet()).as("kinds announced in %s", file).containsAll(expected);
        LibrarySolutions.Solved solved = LibrarySolutions.of(file);
        LensPlan plan = PlanAnalysis.run(solved.stack(), file.toString(), PlanAnalysis.Settings.defaults().withChecks(false),
                solved.solution(), PlanAnalysis.Progress.NONE);
        plan.tune().ifPresent(t -> t.solutions().forEach(f -> System.out.printf(Locale.ROOT, "%s: focus on the screen at "
                + "%s = %.1f V (%s, %d crossings)%n", file.getFileName(), f.electrode(), f.bias_V(), f.mode(), f.axisCrossings())));
        plan.cardinal().ifPresent(c -> System.out.printf(Locale.ROOT, "%s: ends %s / %s, error estimate %.2e%n",
                file.getFileName(), c.objectEnd().rule().key(), c.imageEnd().rule().key(), c.errorEstimate()));
        List<String> kinds = new ArrayList<>();
        for (String w : plan.warnings()) {
            System.out.printf(Locale.ROOT, "%s: [%s] %s%n", file.getFileName(), kind(w), w);
            kinds.add(kind(w));
        }
        for (int i = 0; i < kinds.size(); i++) {
            assertThat(expected).as("%s: warning not announced in the header: %s", file, plan.warnings().get(i))
                    .contains(kinds.get(i));
        }
        assertThat(kinds).as("%s: kinds announced but not warned of (keep the header true)", file).containsAll(expected);
    }
}
