package nearfit.model;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * JSON documents as plain, mutable Java values for tests that read outputs or edit manifests:
 * objects as {@link LinkedHashMap} (key order kept), arrays as {@link List}, every number as a
 * {@link Double}, parsed and written through {@link JsonText}.
 */
public final class JsonTrees {
    private JsonTrees() {
    }

    /** Parses one document strictly (see {@link JsonText#parse}); numbers as Double. */
    public static Object parse(String text) {
        return plain(JsonText.parse(text));
    }

    /** The compact JSON text the tool would write for {@code value}. */
    public static String write(Object value) {
        return JsonText.write(value);
    }

    private static Object plain(Object node) {
        if (node instanceof Map<?, ?> object) {
            Map<String, Object> map = new LinkedHashMap<>();
            object.forEach((k, v) -> map.put((String) k, plain(v)));
            return map;
        } else if (node instanceof List<?> array) {
            List<Object> list = new ArrayList<>();
            array.forEach(e -> list.add(plain(e)));
            return list;
        } else if (node instanceof java.math.BigDecimal number) {
            return Double.parseDouble(number.toString());
        }
        return node;
    }
}
