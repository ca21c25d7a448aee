package nearfit.model;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;

/**
 * Typed, checked reads of one JSON object of a parsed manifest (see {@link Json#parse}), which knows
 * its path from the manifest's root ({@code ""}, {@code "scaling"}, {@code "tuning"}), so each failure
 * is an {@link IllegalArgumentException} naming the whole field, e.g.
 * {@code manifest field "scaling.spread[0]" is 0; a spread must be positive}, which {@link ModelFile}
 * prefixes with the file.
 *
 * <p>Numbers are read as the JSON reader gives them (doubles); a whole number must be exactly whole
 * and within the range asked for, so {@code 4294967306} is never read as an int 10.
 *
 * @param path the object's dotted path, {@code ""} for the manifest itself
 * @param map  the object's fields
 */
record ManifestFields(String path, Map<?, ?> map) {
    /** The manifest's root object. */
    static ManifestFields root(Map<?, ?> manifest) {
        return new ManifestFields("", manifest);
    }

    /** The full name of a field of this object, as messages spell it. */
    String nameOf(String key) {
        return path.isEmpty() ? key : path + "." + key;
    }

    /** The error for a field: {@code manifest field "a.b" } followed by what is wrong. */
    IllegalArgumentException bad(String key, String what) {
        return new IllegalArgumentException("manifest field \"" + nameOf(key) + "\" " + what);
    }

    Object required(String key) {
        if (!map.containsKey(key)) {
            throw bad(key, "is missing");
        }
        return map.get(key);
    }

    /** Whether the field is present and not null. */
    boolean present(String key) {
        return map.get(key) != null;
    }

    String text(String key) {
        if (!(required(key) instanceof String s)) {
            throw bad(key, "is not text");
        }
        return s;
    }

    /** Text or null; the key must still be present. */
    String textOrNull(String key) {
        Object v = required(key);
        if (v != null && !(v instanceof String)) {
            throw bad(key, "is not text or null");
        }
        return (String) v;
    }

    /** Text that is one of the words allowed. */
    String oneOf(String key, List<String> allowed) {
        String s = text(key);
        if (!allowed.contains(s)) {
            throw bad(key, "is \"" + s + "\"; it must be one of " + String.join(", ", allowed));
        }
        return s;
    }

    /** A finite number. */
    double number(String key) {
        if (!(required(key) instanceof Double d) || !Double.isFinite(d)) {
            throw bad(key, "is not a finite number");
        }
        return d;
    }

    /** A finite number, or NaN for JSON null (how the writer spells a number it does not have). */
    double numberOrNaN(String key) {
        return required(key) == null ? Double.NaN : number(key);
    }

    /** A whole number from {@code min} to {@code max}. */
    long whole(String key, long min, long max) {
        Object v = required(key);
        if (!(v instanceof Double d) || d != Math.rint(d) || d < min || d > max) {
            throw bad(key, "is " + Json.write(v) + "; it must be a whole number from " + min + " to " + max);
        }
        return (long) (double) d;
    }

    /** A whole number from {@code min} to {@code max}, both within the int range. */
    int integer(String key, int min, int max) {
        return (int) whole(key, min, max);
    }

    ManifestFields object(String key) {
        if (!(required(key) instanceof Map<?, ?> o)) {
            throw bad(key, "is not an object");
        }
        return new ManifestFields(nameOf(key), o);
    }

    List<?> list(String key) {
        if (!(required(key) instanceof List<?> l)) {
            throw bad(key, "is not a list");
        }
        return l;
    }

    List<String> texts(String key) {
        List<String> out = new ArrayList<>();
        List<?> l = list(key);
        for (int i = 0; i < l.size(); i++) {
            if (!(l.get(i) instanceof String s)) {
                throw bad(key + "[" + i + "]", "is not text");
            }
            out.add(s);
        }
        return out;
    }

    /** A list of numbers; JSON null (how the writer spells a non-finite number) reads as NaN. */
    double[] doubles(String key) {
        List<?> l = list(key);
        double[] out = new double[l.size()];
        for (int i = 0; i < out.length; i++) {
            Object o = l.get(i);
            if (o == null) {
                out[i] = Double.NaN;
            } else if (o instanceof Double d) {
                out[i] = d;
            } else {
                throw bad(key + "[" + i + "]", "is not a number");
            }
        }
        return out;
    }

    /** A list of exactly {@code length} finite numbers. */
    double[] finiteDoubles(String key, int length) {
        double[] out = doubles(key);
        if (out.length != length) {
            throw bad(key, "has " + out.length + " values; it must have " + length);
        }
        for (int i = 0; i < out.length; i++) {
            if (!Double.isFinite(out[i])) {
                throw bad(key + "[" + i + "]", "is " + (Double.isNaN(out[i]) ? "missing (null)" : out[i])
                        + "; it must be a finite number");
            }
        }
        return out;
    }

    /** A list of whole numbers from {@code min} to {@code max}. */
    int[] ints(String key, int min, int max) {
        List<?> l = list(key);
        int[] out = new int[l.size()];
        for (int i = 0; i < out.length; i++) {
            Object o = l.get(i);
            if (!(o instanceof Double d) || d != Math.rint(d) || d < min || d > max) {
                throw bad(key + "[" + i + "]", "is " + Json.write(o) + "; it must be a whole number from "
                        + min + " to " + max);
            }
            out[i] = (int) (double) d;
        }
        return out;
    }
}
