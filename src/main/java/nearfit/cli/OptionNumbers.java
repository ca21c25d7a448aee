package nearfit.cli;

import java.util.Locale;

import picocli.CommandLine;
import picocli.CommandLine.TypeConversionException;

/**
 * The number options of every command as picocli typed options: one converter per kind of value, so
 * a bad value is refused while parsing, before any file is read, in one line naming the option, e.g.
 * {@code Invalid value for option '--k': "abc" is not a whole number of at least 1 or auto}. Values
 * are read without surrounding spaces, as the choice words are ({@link OptionChoices}).
 */
final class OptionNumbers {
    /** {@code --k auto}: k chosen by tuning (the one-SE k). */
    static final int K_AUTO = 0;

    private OptionNumbers() {
    }

    private static int wholeAtLeast(String text, int least, String what) {
        try {
            int v = Integer.parseInt(text.trim());
            if (v >= least) {
                return v;
            }
        } catch (NumberFormatException e) {
            // Reported below.
        }
        throw new TypeConversionException("\"" + text + "\" is not " + what);
    }

    /** {@code --k}: {@code auto} ({@link #K_AUTO}) or a whole number of at least 1. */
    static final class KOrAuto implements CommandLine.ITypeConverter<Integer> {
        @Override
        public Integer convert(String text) {
            return text.trim().equalsIgnoreCase("auto") ? K_AUTO
                    : wholeAtLeast(text, 1, "a whole number of at least 1 or auto");
        }
    }

    /** A whole number of at least 1 ({@code --kmax}, {@code --sample}, {@code --threads}, {@code --min-rows}). */
    static final class Count implements CommandLine.ITypeConverter<Integer> {
        @Override
        public Integer convert(String text) {
            return wholeAtLeast(text, 1, "a whole number of at least 1");
        }
    }

    /** A positive finite number ({@code --threshold}). */
    static final class Positive implements CommandLine.ITypeConverter<Double> {
        @Override
        public Double convert(String text) {
            try {
                double v = Double.parseDouble(text.trim());
                if (v > 0 && Double.isFinite(v)) {
                    return v;
                }
            } catch (NumberFormatException e) {
                // Reported below.
            }
            throw new TypeConversionException("\"" + text + "\" is not a positive number");
        }
    }

    /** A percentage such as {@code 1}, {@code 0.5} or {@code 2%}, from 0 to 100, as a fraction. */
    static final class Percent implements CommandLine.ITypeConverter<Double> {
        @Override
        public Double convert(String text) {
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
                // Reported below.
            }
            throw new TypeConversionException("\"" + text + "\" is not a percentage from 0 to 100");
        }
    }

    /** A picture size: width and height, in cells or pixels. */
    record PlotSize(int width, int height) {
    }

    /** {@code WxH}, both parts whole numbers from 1 to 8000 (the command narrows the range by mode). */
    static final class Size implements CommandLine.ITypeConverter<PlotSize> {
        @Override
        public PlotSize convert(String text) {
            String[] parts = text.trim().toLowerCase(Locale.ROOT).split("x", -1);
            if (parts.length == 2) {
                try {
                    int w = Integer.parseInt(parts[0].trim());
                    int h = Integer.parseInt(parts[1].trim());
                    if (w >= 1 && h >= 1 && w <= 8000 && h <= 8000) {
                        return new PlotSize(w, h);
                    }
                } catch (NumberFormatException e) {
                    // Reported below.
                }
            }
            throw new TypeConversionException("\"" + text + "\" is not WIDTHxHEIGHT");
        }
    }
}
