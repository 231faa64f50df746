package org.axistack.io;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;

/** Element start lines of TOML arrays, checked against hand-counted lines of small files. */
class ArrayLinesTest {

    @Test
    void findsTheStartLineOfEveryElement() {
        String text = String.join("\n",
                "a = 1",                             // 1
                "points_mm = [  # corners [not] here", // 2
                "  [0.0, 1.0], [2.0, 1.0],",        // 3
                "  # a comment with [brackets], and commas",
                "  [3.0, 2.0,",                      // 5
                "   2.5, 1.2],",                     // 6
                "  \"text, [odd]\",",                // 7
                "  4.0",                             // 8
                "]",                                  // 9
                "b = [9]");
        assertThat(ArrayLines.elementLines(text, 2)).containsExactly(3, 3, 5, 7, 8);
        assertThat(ArrayLines.elementLines(text, 10)).containsExactly(10);
    }

    @Test
    void emptyArraysAndBadInputGiveNoLines() {
        assertThat(ArrayLines.elementLines("p = []\n", 1)).isEmpty();
        assertThat(ArrayLines.elementLines(null, 1)).isEmpty();
        assertThat(ArrayLines.elementLines("p = [1]", 0)).isEmpty();
    }
}
