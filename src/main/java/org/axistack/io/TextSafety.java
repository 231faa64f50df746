package org.axistack.io;

/**
 * Characters that must not reach a terminal or a file from a received stack: control characters (C0, DEL, C1:
 * escape sequences clear the screen or retitle the window, NUL and bell), the bidirectional-text overrides and
 * isolates (they make text read differently from what it is) and the Unicode line and paragraph separators.
 * Stack text holding one is refused at input ({@link StackMessage#CONTROL_CHARACTER}); messages that echo other
 * text (a path, a command-line value) show such characters escaped ({@link #printable}).
 */
public final class TextSafety {

    private TextSafety() {
    }

    /** Whether the code point is one that must not be shown raw. */
    public static boolean unsafe(int cp) {
        int type = Character.getType(cp);
        return type == Character.CONTROL || type == Character.LINE_SEPARATOR || type == Character.PARAGRAPH_SEPARATOR
                || (cp >= 0x202A && cp <= 0x202E) || (cp >= 0x2066 && cp <= 0x2069) || cp == 0x200E || cp == 0x200F
                || cp == 0x061C;
    }

    /** The char index of the first unsafe character of s, or -1. */
    public static int firstUnsafe(String s) {
        for (int i = 0; i < s.length(); i = s.offsetByCodePoints(i, 1)) {
            if (unsafe(s.codePointAt(i))) {
                return i;
            }
        }
        return -1;
    }

    /** The character's code as U+XXXX with its usual name where it has a short one. */
    public static String describe(int cp) {
        String code = String.format(java.util.Locale.ROOT, "U+%04X", cp);
        String name = switch (cp) {
            case 0 -> "NUL";
            case 7 -> "bell";
            case 8 -> "backspace";
            case 9 -> "tab";
            case 10 -> "line feed";
            case 13 -> "carriage return";
            case 27 -> "escape";
            case 127 -> "delete";
            default -> null;
        };
        return name == null ? code : code + " (" + name + ")";
    }

    /** s with every unsafe character replaced by its \\uXXXX escape (line feeds kept), for messages. */
    public static String printable(String s) {
        if (s == null || firstUnsafe(s) < 0) {
            return s;
        }
        StringBuilder b = new StringBuilder(s.length() + 16);
        s.codePoints().forEach(cp -> {
            if (unsafe(cp) && cp != '\n') {
                b.append(String.format(java.util.Locale.ROOT, "\\u%04X", cp));
            } else {
                b.appendCodePoint(cp);
            }
        });
        return b.toString();
    }
}
