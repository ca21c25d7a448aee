package nearfit.tui.paint;

import java.util.Locale;
import java.util.Map;

/**
 * How the explorer draws: braille and box lines or plain ASCII, colours or none.
 *
 * @param ascii  plain ASCII only ({@code --ascii}, or a locale that is not UTF-8)
 * @param colour colours on; off when {@code NO_COLOR} is set (no-color.org), shapes still tell layers apart
 */
public record Look(boolean ascii, boolean colour) {
    /**
     * The look for an environment. The locale is read as POSIX does: {@code LC_ALL}, then {@code LC_CTYPE},
     * then {@code LANG}, the first one set and not empty; none set means the C locale, which is not UTF-8.
     */
    public static Look of(boolean asciiAsked, Map<String, String> env) {
        String locale = firstSet(env, "LC_ALL", "LC_CTYPE", "LANG");
        String lower = locale == null ? "" : locale.toLowerCase(Locale.ROOT);
        boolean utf8 = lower.contains("utf-8") || lower.contains("utf8");
        String noColour = env.get("NO_COLOR");
        return new Look(asciiAsked || !utf8, noColour == null || noColour.isEmpty());
    }

    private static String firstSet(Map<String, String> env, String... names) {
        for (String n : names) {
            String v = env.get(n);
            if (v != null && !v.isEmpty()) {
                return v;
            }
        }
        return null;
    }
}
