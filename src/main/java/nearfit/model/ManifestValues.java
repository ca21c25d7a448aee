package nearfit.model;

import java.math.BigDecimal;
import java.util.List;

import nearfit.knn.ChoiceWord;

/**
 * Checks of the values a {@link ManifestDocument} was bound with, each failure an
 * {@link IllegalArgumentException} naming the field's whole path, e.g.
 * {@code manifest field "scaling.spread[0]" is 0; a spread must be positive}, which {@link ModelFile}
 * prefixes with the file.
 *
 * <p>A whole number must be exactly whole and within the range asked for, so {@code 4294967306} is
 * never read as an int 10. Values are quoted in messages as the manifest writer spells them.
 */
final class ManifestValues {
    private ManifestValues() {
    }

    /** The full name of field {@code key} of the object at {@code path}, as messages spell it. */
    static String field(String path, String key) {
        return path.isEmpty() ? key : path + "." + key;
    }

    static <T> T object(String path, T value) {
        if (value == null) {
            throw ManifestDocument.bad(path, "is not an object");
        }
        return value;
    }

    static String text(String path, String value) {
        if (value == null) {
            throw ManifestDocument.bad(path, "is not text");
        }
        return value;
    }

    /** The choice whose word the text is; its words are those of {@link ChoiceWord}. */
    static <E extends ChoiceWord> E choice(String path, String value, E[] allowed) {
        text(path, value);
        E found = ChoiceWord.find(allowed, value);
        if (found == null) {
            throw ManifestDocument.bad(path, "is \"" + value + "\"; it must be one of "
                    + String.join(", ", ChoiceWord.words(allowed)));
        }
        return found;
    }

    /** A finite number. */
    static double number(String path, Double value) {
        if (value == null || !Double.isFinite(value)) {
            throw ManifestDocument.bad(path, "is not a finite number");
        }
        return value;
    }

    /** A finite number, or NaN for JSON null (how the writer spells a number it does not have). */
    static double numberOrNaN(String path, Double value) {
        return value == null ? Double.NaN : number(path, value);
    }

    /** A whole number from {@code min} to {@code max}. */
    static long whole(String path, BigDecimal value, long min, long max) {
        if (value == null || value.signum() != 0 && value.stripTrailingZeros().scale() > 0
                || value.compareTo(BigDecimal.valueOf(min)) < 0 || value.compareTo(BigDecimal.valueOf(max)) > 0) {
            throw ManifestDocument.bad(path, "is " + spelled(value) + "; it must be a whole number from " + min
                    + " to " + max);
        }
        return value.longValueExact();
    }

    /** A whole number from {@code min} to {@code max}, both within the int range. */
    static int integer(String path, BigDecimal value, int min, int max) {
        return (int) whole(path, value, min, max);
    }

    static List<String> texts(String path, List<String> values) {
        list(path, values);
        for (int i = 0; i < values.size(); i++) {
            if (values.get(i) == null) {
                throw ManifestDocument.bad(path + "[" + i + "]", "is not text");
            }
        }
        return values;
    }

    /** A list of numbers; JSON null (how the writer spells a non-finite number) reads as NaN. */
    static double[] doubles(String path, List<Double> values) {
        list(path, values);
        double[] out = new double[values.size()];
        for (int i = 0; i < out.length; i++) {
            Double v = values.get(i);
            out[i] = v == null ? Double.NaN : v;
        }
        return out;
    }

    /** A list of exactly {@code length} finite numbers. */
    static double[] finiteDoubles(String path, List<Double> values, int length) {
        double[] out = doubles(path, values);
        if (out.length != length) {
            throw ManifestDocument.bad(path, "has " + out.length + " values; it must have " + length);
        }
        for (int i = 0; i < out.length; i++) {
            if (!Double.isFinite(out[i])) {
                throw ManifestDocument.bad(path + "[" + i + "]", "is "
                        + (Double.isNaN(out[i]) ? "missing (null)" : out[i]) + "; it must be a finite number");
            }
        }
        return out;
    }

    /** A list of whole numbers from {@code min} to {@code max}. */
    static int[] ints(String path, List<BigDecimal> values, int min, int max) {
        list(path, values);
        int[] out = new int[values.size()];
        for (int i = 0; i < out.length; i++) {
            out[i] = integer(path + "[" + i + "]", values.get(i), min, max);
        }
        return out;
    }

    /** A number as the manifest writer spells it: whole numbers without a fraction. */
    static String spelled(BigDecimal value) {
        if (value == null) {
            return "null";
        }
        if (value.signum() == 0 || value.stripTrailingZeros().scale() <= 0) {
            return value.toBigInteger().toString();
        }
        return JsonText.write(value.doubleValue());
    }

    /** A double as the manifest writer spells it. */
    static String spelled(double value) {
        return JsonText.write(value);
    }

    private static void list(String path, List<?> values) {
        if (values == null) {
            throw ManifestDocument.bad(path, "is not a list");
        }
    }
}
