package org.axistack.arch;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;

/**
 * Keeps the current source style (DEVELOPERS.md, style.md; common practice, no source): every public type in
 * main code has a Javadoc comment, main code prints to the console only in the command line (picocli's
 * writers or System.out/err), and no source file uses a star import (static star imports are allowed in tests,
 * for catalogue tables). Each failure names the file and line.
 */
class SourceStyleTest {

    private static final Path MAIN = Path.of("src", "main", "java");
    private static final Path TEST = Path.of("src", "test", "java");

    /** A public type declaration at any depth: class, interface, record, enum or annotation. */
    private static final Pattern PUBLIC_TYPE = Pattern.compile(
            "(?m)^[ \\t]*public\\s+(?:(?:final|abstract|sealed|non-sealed|static|strictfp)\\s+)*"
                    + "(?:class|interface|record|enum|@interface)\\s+(\\w+)");
    private static final Pattern STAR_IMPORT = Pattern.compile("(?m)^import\\s+(static\\s+)?[\\w.]+\\.\\*\\s*;");
    private static final Pattern CONSOLE = Pattern.compile("\\bSystem\\s*\\.\\s*(out|err)\\b");

    @Test
    void everyPublicTypeInMainCodeHasJavadoc() throws IOException {
        List<String> missing = new ArrayList<>();
        for (Path f : javaFiles(MAIN)) {
            String s = Files.readString(f);
            Matcher m = PUBLIC_TYPE.matcher(s);
            while (m.find()) {
                if (!javadocBefore(s, m.start())) {
                    missing.add(f + ":" + line(s, m.start()) + " " + m.group(1));
                }
            }
        }
        assertThat(missing).as("public types without a Javadoc comment").isEmpty();
    }

    @Test
    void onlyTheCommandLinePrintsToTheConsole() throws IOException {
        Path cli = MAIN.resolve(Path.of("org", "axistack", "cli"));
        List<String> printing = new ArrayList<>();
        for (Path f : javaFiles(MAIN)) {
            if (f.startsWith(cli)) {
                continue;
            }
            String s = withoutComments(Files.readString(f));
            Matcher m = CONSOLE.matcher(s);
            while (m.find()) {
                printing.add(f + ":" + line(s, m.start()));
            }
        }
        assertThat(printing).as("System.out/err outside org.axistack.cli (hand a PrintWriter in instead)").isEmpty();
    }

    @Test
    void noStarImports() throws IOException {
        List<String> star = new ArrayList<>();
        for (Path root : List.of(MAIN, TEST)) {
            for (Path f : javaFiles(root)) {
                String s = Files.readString(f);
                Matcher m = STAR_IMPORT.matcher(s);
                while (m.find()) {
                    boolean allowed = root.equals(TEST) && m.group(1) != null;
                    if (!allowed) {
                        star.add(f + ":" + line(s, m.start()) + " " + m.group().trim());
                    }
                }
            }
        }
        assertThat(star).as("star imports (name each imported type)").isEmpty();
    }

    @Test
    void theChecksSeeTheSourcesAndCatchWhatTheyLookFor() throws IOException {
        // the rules above must not pass because they read nothing or match nothing
        assertThat(javaFiles(MAIN)).hasSizeGreaterThan(100);
        assertThat(documented("/** A. */\n@Deprecated(since = \"1\")\npublic final class A {}")).isTrue();
        assertThat(documented("import a.B;\n\npublic class A {}")).isFalse();
        assertThat(documented("/* not Javadoc */\npublic class A {}")).isFalse();
        assertThat(documented("/** B. */\nint b;\npublic class A {}")).isFalse();
        assertThat(documented("/** A. */\n@Command(name = \"a;\", footer = {\"(\", \"x\"})\npublic class A {}"))
                .isTrue();
        assertThat(STAR_IMPORT.matcher("import java.util.*;").find()).isTrue();
        assertThat(CONSOLE.matcher(withoutComments("// System.out.println\nint a;")).find()).isFalse();
        assertThat(CONSOLE.matcher(withoutComments("System.err.println(x);")).find()).isTrue();
    }

    private static boolean documented(String source) {
        return javadocBefore(source, source.indexOf("public"));
    }

    /** True when the nearest comment before the declaration is a Javadoc comment with only annotations between. */
    private static boolean javadocBefore(String s, int declaration) {
        String before = s.substring(0, declaration);
        int end = before.lastIndexOf("*/");
        if (end < 0) {
            return false;
        }
        // only annotations may stand between: without strings and bracketed arguments, nothing but @Names
        String between = before.substring(end + 2).replaceAll("\"(?:[^\"\\\\]|\\\\.)*\"", "\"\"");
        String flat;
        while (!(flat = between.replaceAll("\\([^()]*\\)", "")).equals(between)) {
            between = flat;
        }
        if (!between.matches("(?s)\\s*(@[\\w.]+\\s*)*")) {
            return false; // the comment belongs to something earlier (an import, a member, a block)
        }
        int start = before.lastIndexOf("/*", end);
        return start >= 0 && before.startsWith("/**", start);
    }

    private static String withoutComments(String s) {
        // blanks comments but keeps the line breaks, so line numbers stay right; string literals are left alone
        StringBuilder b = new StringBuilder(s.length());
        int i = 0;
        while (i < s.length()) {
            char c = s.charAt(i);
            if (c == '"') {
                int j = i + 1;
                while (j < s.length() && s.charAt(j) != '"' && s.charAt(j) != '\n') {
                    j += s.charAt(j) == '\\' ? 2 : 1;
                }
                j = Math.min(j + 1, s.length());
                b.append(s, i, j);
                i = j;
            } else if (s.startsWith("//", i)) {
                int j = s.indexOf('\n', i);
                i = j < 0 ? s.length() : j;
            } else if (s.startsWith("/*", i)) {
                int j = s.indexOf("*/", i + 2);
                j = j < 0 ? s.length() : j + 2;
                s.substring(i, j).chars().filter(ch -> ch == '\n').forEach(ch -> b.append('\n'));
                i = j;
            } else {
                b.append(c);
                i++;
            }
        }
        return b.toString();
    }

    private static int line(String s, int index) {
        int n = 1;
        for (int i = 0; i < index; i++) {
            if (s.charAt(i) == '\n') {
                n++;
            }
        }
        return n;
    }

    private static List<Path> javaFiles(Path root) throws IOException {
        try (Stream<Path> files = Files.walk(root)) {
            return files.filter(p -> p.toString().endsWith(".java")).sorted().toList();
        }
    }
}
