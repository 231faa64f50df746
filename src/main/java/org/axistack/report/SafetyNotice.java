package org.axistack.report;

import java.util.List;

/**
 * The high-voltage cautions, in one place: the command line, the report and the desktop window all
 * show this text. It informs; it does not replace training, local electrical codes or a licensed
 * electrician's judgement.
 */
public final class SafetyNotice {

    /** Heading shown above the cautions. */
    public static final String TITLE = "HIGH VOLTAGE: lens biases can injure or kill";

    /** The cautions, one per line. */
    public static final List<String> CAUTIONS = List.of(
            "Lens supplies of hundreds to tens of thousands of volts can deliver a lethal shock; stored charge in cables, capacitors and electrodes stays after switch-off.",
            "Keep every live part inside a grounded, closed enclosure with interlocks that cut the supplies when a cover or feedthrough is opened.",
            "Fit bleed resistors and ground the electrodes with a grounding hook before touching anything; check with a rated meter that they are dead.",
            "Work one-handed near live circuits (keep the other hand away from grounded metal), never alone, and only as or under qualified, authorised staff.",
            "Computed fields, biases and gaps are design aids, not proof of safety: follow local electrical codes, your site's rules and licensed practice (for laboratory equipment, for example IEC 61010-1).");

    private SafetyNotice() {
    }

    /** Title and cautions as plain text lines, each caution a bullet. */
    public static List<String> lines() {
        java.util.ArrayList<String> out = new java.util.ArrayList<>();
        out.add(TITLE);
        for (String c : CAUTIONS) {
            out.add("  * " + c);
        }
        return out;
    }

    /** Title and cautions as one block of text with line breaks. */
    public static String text() {
        return String.join(System.lineSeparator(), lines());
    }
}
