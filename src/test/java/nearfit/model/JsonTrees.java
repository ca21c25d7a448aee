package nearfit.model;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import com.fasterxml.jackson.databind.JsonNode;

/**
 * JSON documents as plain, mutable Java values for tests that read outputs or edit manifests:
 * objects as {@link LinkedHashMap} (key order kept), arrays as {@link List}, every number as a
 * {@link Double}, parsed and written through {@link JsonText}.
 */
public final class JsonTrees {
    private JsonTrees() {
    }

    /** Parses one document strictly (see {@link JsonText#parse}). */
    public static Object parse(String text) {
        return plain(JsonText.parse(text));
    }

    /** The compact JSON text the tool would write for {@code value}. */
    public static String write(Object value) {
        return JsonText.write(value);
    }

    private static Object plain(JsonNode node) {
        if (node.isObject()) {
            Map<String, Object> map = new LinkedHashMap<>();
            node.fields().forEachRemaining(e -> map.put(e.getKey(), plain(e.getValue())));
            return map;
        } else if (node.isArray()) {
            List<Object> list = new ArrayList<>();
            node.forEach(e -> list.add(plain(e)));
            return list;
        } else if (node.isNumber()) {
            return node.doubleValue();
        } else if (node.isTextual()) {
            return node.textValue();
        } else if (node.isBoolean()) {
            return node.booleanValue();
        }
        return null;
    }
}
