package nearfit.table;

/**
 * Text that a file supplies (column names, category labels, file names), made safe to show on a terminal.
 *
 * <p>A label such as {@code "\u001b]2;title\u0007"} would otherwise drive the user's terminal (set its title,
 * clear the screen). Every control character is replaced by a visible escape, so what is printed is what the
 * file holds and nothing more: ESC becomes {@code \e}, BEL {@code \a}, tab, line feed and carriage return
 * {@code \t} {@code \n} {@code \r}, any other C0 control or DEL {@code \xHH}, a C1 control (U+0080–U+009F,
 * which some terminals read as escape sequences) or a bidirectional override or isolate (U+202A–U+202E,
 * U+2066–U+2069, which reorder what follows) <code>&#92;u{HHHH}</code>. Other text is returned unchanged, the same
 * instance when nothing needs replacing, so the common case costs one scan.
 *
 * <p>JSON output escapes control characters by itself and does not need this; CSV cells keep their bytes.
 */
public final class VisibleText {
    private VisibleText() {
    }

    /** {@code s} with every control character made visible; {@code null} stays {@code null}. */
    public static String of(String s) {
        if (s == null) {
            return null;
        }
        int first = firstControl(s);
        if (first < 0) {
            return s;
        }
        StringBuilder out = new StringBuilder(s.length() + 8).append(s, 0, first);
        for (int i = first; i < s.length(); i++) {
            char c = s.charAt(i);
            if (!isControl(c)) {
                out.append(c);
                continue;
            }
            switch (c) {
                case 0x1b -> out.append("\\e");
                case 0x07 -> out.append("\\a");
                case '\t' -> out.append("\\t");
                case '\n' -> out.append("\\n");
                case '\r' -> out.append("\\r");
                default -> {
                    if (c < 0x80) {
                        out.append(String.format("\\x%02X", (int) c));
                    } else {
                        out.append(String.format("\\u{%04X}", (int) c));
                    }
                }
            }
        }
        return out.toString();
    }

    /** Whether {@code s} holds any character that {@link #of} would replace. */
    public static boolean needsEscape(String s) {
        return s != null && firstControl(s) >= 0;
    }

    private static int firstControl(String s) {
        for (int i = 0; i < s.length(); i++) {
            if (isControl(s.charAt(i))) {
                return i;
            }
        }
        return -1;
    }

    private static boolean isControl(char c) {
        return c < 0x20 || (c >= 0x7f && c <= 0x9f) || (c >= 0x202a && c <= 0x202e) || (c >= 0x2066 && c <= 0x2069);
    }
}
