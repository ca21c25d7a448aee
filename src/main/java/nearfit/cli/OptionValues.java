package nearfit.cli;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import nearfit.table.NearfitException;

/**
 * Parses and checks the number, percentage, size and column-list option values early, with messages
 * that name the option, for example {@code --k: "abc" is not a whole number or auto}. Choice options
 * are typed options instead ({@link OptionChoices}).
 */
final class OptionValues {
    /** k chosen by tuning (the one-SE k). */
    static final int K_AUTO = 0;

    private OptionValues() {
    }

    /** {@code auto} gives {@link #K_AUTO}; otherwise a whole number of at least 1. */
    static int k(String option, String text) {
        if (text.trim().equalsIgnoreCase("auto")) {
            return K_AUTO;
        }
        return positive(option, text, "a whole number or auto");
    }

    /** A whole number of at least 1. */
    static int positive(String option, String text, String what) {
        try {
            int v = Integer.parseInt(text.trim());
            if (v >= 1) {
                return v;
            }
        } catch (NumberFormatException e) {
            // Reported below with the option's name.
        }
        throw new NearfitException(option + ": \"" + text + "\" is not " + what);
    }

    /** A positive finite number. */
    static double positiveNumber(String option, String text) {
        try {
            double v = Double.parseDouble(text.trim());
            if (v > 0 && Double.isFinite(v)) {
                return v;
            }
        } catch (NumberFormatException e) {
            // Reported below with the option's name.
        }
        throw new NearfitException(option + ": \"" + text + "\" is not a positive number");
    }

    /** A percentage such as {@code 1}, {@code 0.5} or {@code 2%}, from 0 to 100, as a fraction. */
    static double percent(String option, String text) {
        String t = text.trim();
        if (t.endsWith("%")) {
            t = t.substring(0, t.length() - 1).trim();
        }
        try {
            double v = Double.parseDouble(t);
            if (v >= 0 && v <= 100) {
                return v / 100.0;
            }
        } catch (NumberFormatException e) {
            // Reported below with the option's name.
        }
        throw new NearfitException(option + ": \"" + text + "\" is not a percentage from 0 to 100");
    }

    /** A comma-separated list of column names, none empty, none repeated. */
    static List<String> columnList(String option, String text) {
        List<String> names = new ArrayList<>();
        for (String part : text.split(",", -1)) {
            String name = part.trim();
            if (name.isEmpty()) {
                throw new NearfitException(option + ": \"" + text + "\" has an empty column name");
            }
            if (names.contains(name)) {
                throw new NearfitException(option + ": column \"" + name + "\" is named twice");
            }
            names.add(name);
        }
        return names;
    }

    /** {@code WxH} with both parts whole numbers within [minimum, maximum]. */
    static int[] size(String option, String text, int minimum, int maximum) {
        String[] parts = text.trim().toLowerCase(Locale.ROOT).split("x", -1);
        if (parts.length == 2) {
            try {
                int w = Integer.parseInt(parts[0].trim());
                int h = Integer.parseInt(parts[1].trim());
                if (w >= minimum && h >= minimum && w <= maximum && h <= maximum) {
                    return new int[] {w, h};
                }
            } catch (NumberFormatException e) {
                // Reported below with the option's name.
            }
        }
        throw new NearfitException(option + ": \"" + text + "\" is not WIDTHxHEIGHT with each from "
                + minimum + " to " + maximum);
    }
}
