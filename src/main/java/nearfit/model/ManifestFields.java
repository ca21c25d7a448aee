package nearfit.model;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;

/**
 * Typed reads of fields from a parsed manifest (see {@link Json#parse}); each failure is an
 * {@link IllegalArgumentException} naming the field, which {@link ModelFile} turns into a message
 * about the file.
 */
final class ManifestFields {
    private ManifestFields() {
    }

    static Object required(Map<?, ?> m, String key) {
        if (!m.containsKey(key)) {
            throw new IllegalArgumentException("field \"" + key + "\" is missing");
        }
        return m.get(key);
    }

    static String text(Map<?, ?> m, String key) {
        if (!(required(m, key) instanceof String s)) {
            throw new IllegalArgumentException("field \"" + key + "\" is not text");
        }
        return s;
    }

    /** Text, or the fallback when the key is absent (a field added after files were written). */
    static String textOr(Map<?, ?> m, String key, String fallback) {
        return m.containsKey(key) ? text(m, key) : fallback;
    }

    /** Text or null; the key must still be present. */
    static String textOrNull(Map<?, ?> m, String key) {
        Object v = required(m, key);
        if (v != null && !(v instanceof String)) {
            throw new IllegalArgumentException("field \"" + key + "\" is not text or null");
        }
        return (String) v;
    }

    static double number(Map<?, ?> m, String key) {
        if (!(required(m, key) instanceof Double d)) {
            throw new IllegalArgumentException("field \"" + key + "\" is not a number");
        }
        return d;
    }

    /** A number that is a whole number (the reader gives every number as a double). */
    static long whole(Map<?, ?> m, String key) {
        double d = number(m, key);
        if (d != Math.rint(d) || Math.abs(d) > 1e15) {
            throw new IllegalArgumentException("field \"" + key + "\" is not a whole number");
        }
        return (long) d;
    }

    static Map<?, ?> object(Map<?, ?> m, String key) {
        if (!(required(m, key) instanceof Map<?, ?> o)) {
            throw new IllegalArgumentException("field \"" + key + "\" is not an object");
        }
        return o;
    }

    static List<?> list(Map<?, ?> m, String key) {
        if (!(required(m, key) instanceof List<?> l)) {
            throw new IllegalArgumentException("field \"" + key + "\" is not a list");
        }
        return l;
    }

    static List<String> texts(Map<?, ?> m, String key) {
        List<String> out = new ArrayList<>();
        for (Object o : list(m, key)) {
            if (!(o instanceof String s)) {
                throw new IllegalArgumentException("field \"" + key + "\" holds a value that is not text");
            }
            out.add(s);
        }
        return out;
    }

    /** A list of numbers; JSON null (how the writer spells a non-finite number) reads as NaN. */
    static double[] doubles(Map<?, ?> m, String key) {
        List<?> l = list(m, key);
        double[] out = new double[l.size()];
        for (int i = 0; i < out.length; i++) {
            Object o = l.get(i);
            if (o == null) {
                out[i] = Double.NaN;
            } else if (o instanceof Double d) {
                out[i] = d;
            } else {
                throw new IllegalArgumentException("field \"" + key + "\" holds a value that is not a number");
            }
        }
        return out;
    }

    static int[] ints(Map<?, ?> m, String key) {
        double[] d = doubles(m, key);
        int[] out = new int[d.length];
        for (int i = 0; i < d.length; i++) {
            if (d[i] != Math.rint(d[i]) || Math.abs(d[i]) > Integer.MAX_VALUE) {
                throw new IllegalArgumentException("field \"" + key + "\" holds a value that is not a whole number");
            }
            out[i] = (int) d[i];
        }
        return out;
    }
}
