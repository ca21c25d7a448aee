package nearfit.tui;

import java.util.Locale;

/** Numbers as the screen shows them: a few significant digits, thousands grouped for counts. */
final class Figures {
    private Figures() {
    }

    /** A value with about four significant digits; "-" for NaN. */
    static String value(double v) {
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

    /** A count with thousands separated by commas. */
    static String count(long n) {
        return String.format(Locale.ROOT, "%,d", n);
    }

    /** A share as a percentage with two decimals. */
    static String percent(double share) {
        return String.format(Locale.ROOT, "%.2f %%", 100 * share);
    }

    /** Text cut to {@code width} characters, ending with a marker when cut. */
    static String fit(String text, int width, boolean ascii) {
        if (width <= 0) {
            return "";
        }
        if (text.length() <= width) {
            return text;
        }
        return text.substring(0, Math.max(0, width - 1)) + (ascii ? "~" : "…");
    }

    /** Text padded with spaces or cut to exactly {@code width} characters. */
    static String pad(String text, int width) {
        if (text.length() >= width) {
            return text.substring(0, Math.max(0, width));
        }
        return text + " ".repeat(width - text.length());
    }
}
