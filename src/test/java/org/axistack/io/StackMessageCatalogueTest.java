package org.axistack.io;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.EnumSet;
import java.util.HashMap;
import java.util.Map;
import java.util.Set;
import java.util.stream.Collectors;
import org.junit.jupiter.api.Test;

/** Checks the catalogue of user-facing messages (style.md item 5): complete, fillable, exercised. */
class StackMessageCatalogueTest {

    @Test
    void everyEntryHasAProblemAndAFixAndFillsCleanly() {
        for (StackMessage m : StackMessage.values()) {
            assertThat(m.problemTemplate()).as(m.name()).isNotBlank().doesNotEndWith(".").doesNotContain("\n");
            assertThat(m.fixTemplate()).as(m.name()).isNotBlank().doesNotEndWith(".").doesNotContain("\n");
            Map<String, Object> values = new HashMap<>();
            for (String p : m.placeholders()) {
                values.put(p, "<" + p + ">");
            }
            String text = m.format(values);
            assertThat(text).as(m.name()).contains(". Fix: ").doesNotContain("{").endsWith(".");
        }
    }

    @Test
    void aMissingPlaceholderValueIsAProgrammingError() {
        assertThatThrownBy(() -> StackMessage.NOT_POSITIVE.format(Map.of("unit", "mm")))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("{value}");
    }

    @Test
    void unitsInMessagesAreTheStackFileUnits() {
        for (StackMessage m : StackMessage.values()) {
            String t = m.problemTemplate() + " " + m.fixTemplate();
            assertThat(t).as(m.name()).doesNotContain(" m ").doesNotContain("V/m ").doesNotContainPattern("\\bmetres?\\b");
        }
    }

    /** Every entry is produced by at least one malformed-file case or one --set case, except those listed. */
    @Test
    void everyEntryIsExercisedByATest() {
        Set<StackMessage> covered = MalformedStacks.cases().stream().map(MalformedStacks.Case::id)
                .collect(Collectors.toCollection(() -> EnumSet.noneOf(StackMessage.class)));
        covered.addAll(BiasOverridesTest.COVERED);
        covered.addAll(RequirementsReaderTest.COVERED);
        // FILE_NOT_FOUND and FILE_UNREADABLE are covered by MalformedStackTest.missingFileAndFolderGiveExitTwo;
        // MODEL_REJECTED is the safety net for model checks the reader does not repeat.
        covered.addAll(EnumSet.of(StackMessage.FILE_NOT_FOUND, StackMessage.FILE_UNREADABLE, StackMessage.MODEL_REJECTED));
        assertThat(EnumSet.complementOf(EnumSet.copyOf(covered))).isEmpty();
    }
}
