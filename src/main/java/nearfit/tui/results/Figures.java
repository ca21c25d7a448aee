package nearfit.tui.results;

import java.util.Locale;

/** Numbers as the screen shows them: a few significant digits, thousands grouped for counts. */
public final class Figures {
    private Figures() {
    }

    /** A value with about four significant digits; "-" for NaN. */
    public static String value(double v) {
        if (Double.isNaN(v)) {
            return "-";
        }
        if (Double.isInfinite(v)) {
            return v > 0 ? "inf" : "-inf";
        }
        double a = Math.abs(v);
        if (a != 0 && (a >= 1e7 || a < 1e-3)) {
            return String.format(Locale.ROOT, "%.3g", v);
        }
        int decimals = a >= 1000 ? 0 : a >= 100 ? 1 : a >= 10 ? 2 : 3;
        return String.format(Locale.ROOT, "%." + decimals + "f", v);
    }

    /** ISO 8601 date and time to the minute, UTC, with a space for the T (ISO 8601 allows it by agreement). */
    private static final java.time.format.DateTimeFormatter MINUTES =
            java.time.format.DateTimeFormatter.ofPattern("uuuu-MM-dd HH:mm", Locale.ROOT).withZone(java.time.ZoneOffset.UTC);

    /** Epoch milliseconds as a UTC date and time to the minute, such as {@code 2025-01-15 06:00}; "-" for NaN. */
    public static String time(double epochMillis) {
        if (!Double.isFinite(epochMillis)) {
            return "-";
        }
        return MINUTES.format(java.time.Instant.ofEpochMilli(Math.round(epochMillis)));
    }

    /**
     * A span of milliseconds in the largest unit that keeps it at or above 1 (s, min, h, d), such as
     * {@code 3.2 h} or {@code 2.1 d}; one decimal below 100 of the unit, none above. "-" for NaN.
     */
    public static String duration(double millis) {
        if (!Double.isFinite(millis)) {
            return "-";
        }
        double a = Math.abs(millis);
        double unit = a >= 86_400_000 ? 86_400_000 : a >= 3_600_000 ? 3_600_000 : a >= 60_000 ? 60_000 : 1000;
        String name = unit == 86_400_000 ? "d" : unit == 3_600_000 ? "h" : unit == 60_000 ? "min" : "s";
        double v = millis / unit;
        return String.format(Locale.ROOT, Math.abs(v) >= 100 ? "%.0f %s" : "%.1f %s", v, name);
    }

    /** A count with thousands separated by commas. */
    public static String count(long n) {
        return String.format(Locale.ROOT, "%,d", n);
    }

    /** A share as a percentage with two decimals. */
    public static String percent(double share) {
        return String.format(Locale.ROOT, "%.2f %%", 100 * share);
    }

    /** Text cut to {@code width} characters, ending with a marker when cut. */
    public static String fit(String text, int width, boolean ascii) {
        if (width <= 0) {
            return "";
        }
        if (text.length() <= width) {
            return text;
        }
        return text.substring(0, Math.max(0, width - 1)) + (ascii ? "~" : "…");
    }

    /** Text padded with spaces or cut to exactly {@code width} characters. */
    public static String pad(String text, int width) {
        if (text.length() >= width) {
            return text.substring(0, Math.max(0, width));
        }
        return text + " ".repeat(width - text.length());
    }
}
