package org.axistack.ui;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import org.axistack.io.BuiltInStacks;
import org.axistack.io.StackReader;
import org.axistack.model.Stack;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Writing moved biases back into the stack text, and saving. */
class StackDocumentTest {

    @Test
    void biasesAreReplacedInPlaceKeepingComments() throws Exception {
        String text = BuiltInStacks.demoText();
        StackDocument d = StackDocument.unsaved("demo", text);
        Stack s = d.parse();
        double[] b = s.biases_V();
        b[1] = -137.25;
        String out = d.textWithBiases(s, b);
        // every comment line survives and exactly one line changed
        String[] before = text.split("\n", -1);
        String[] after = out.split("\n", -1);
        assertThat(after).hasSameSizeAs(before);
        int changed = 0;
        for (int i = 0; i < before.length; i++) {
            if (!before[i].equals(after[i])) {
                changed++;
                assertThat(after[i]).contains("bias_V").contains("-137.25");
            }
        }
        assertThat(changed).isEqualTo(1);
        assertThat(StackReader.parse(out, "x").biases_V()).containsExactly(b);
    }

    @Test
    void headerCommentsAreFineAndTablesWithoutABiasLineAreNotEditedInPlace() throws Exception {
        String text = BuiltInStacks.demoText().replace("[[electrode]]", "[[electrode]] # table");
        StackDocument d = StackDocument.unsaved("demo", text);
        Stack s = d.parse();
        double[] b = s.biases_V();
        b[0] = 12.5;
        // the header comment is a valid form too, so the in-place edit still works
        assertThat(StackReader.parse(d.textWithBiases(s, b), "x").biases_V()).containsExactly(b);
        // without a bias_V line in every electrode table the in-place edit refuses (the canonical writer is used)
        String inline = d.textWithBiases(s, b).replaceAll("(?m)^\\s*bias_V\\s*=.*$", "");
        assertThat(StackDocument.replaceBiases(inline, b)).isNull();
    }

    @Test
    void saveIsAtomicAndClearsTheModifiedFlag(@TempDir Path dir) throws Exception {
        Path f = dir.resolve("lens.toml");
        Files.writeString(f, BuiltInStacks.demoText());
        StackDocument d = StackDocument.open(f).withText(BuiltInStacks.demoText() + "\n# note\n");
        assertThat(d.modified()).isTrue();
        StackDocument saved = d.saveAs(f, d.text());
        assertThat(saved.modified()).isFalse();
        assertThat(Files.readString(f)).endsWith("# note\n");
        try (var files = Files.list(dir)) {
            assertThat(files).containsExactly(f); // no temporary file left behind
        }
    }

    @Test
    void tomlNumbersAreFloats() {
        assertThat(StackDocument.tomlNumber(-120)).isEqualTo("-120.0");
        assertThat(StackDocument.tomlNumber(0.1)).isEqualTo("0.1");
        assertThat(StackDocument.tomlNumber(1e7)).isEqualTo("10000000.0");
    }
}
