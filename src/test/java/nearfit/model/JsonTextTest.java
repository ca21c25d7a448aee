package nearfit.model;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;

import org.junit.jupiter.api.Test;

/** The tool's JSON through the library: strict reading, deterministic writing (RFC 8259). */
class JsonTextTest {
    @Test
    void writesCompactlyInTheGivenKeyOrderWithEscapes() {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("rows", 3L);
        m.put("name", "a \"b\"\n");
        m.put("xs", new double[] {1, 2.5, Double.NaN, Double.POSITIVE_INFINITY, 1e15, -0.0});
        m.put("none", null);
        m.put("nested", List.of(Map.of("k", true)));
        assertEquals("{\"rows\":3,\"name\":\"a \\\"b\\\"\\n\",\"xs\":[1,2.5,null,null,1.0E15,0],\"none\":null,"
                + "\"nested\":[{\"k\":true}]}", JsonText.write(m));
    }

    @Test
    void everyDoubleWrittenReadsBackBitForBit() {
        Random random = new Random(20261202);
        List<Double> values = new ArrayList<>(List.of(Double.MIN_VALUE, Double.MAX_VALUE, Double.MIN_NORMAL, 0.1,
                1.0 / 3, 4294967306.0, 9.007199254740993e15));
        for (int i = 0; i < 2000; i++) {
            values.add(Double.longBitsToDouble(random.nextLong()));
            values.add(random.nextGaussian() * Math.pow(10, random.nextInt(40) - 20));
        }
        values.removeIf(v -> !Double.isFinite(v));
        List<?> back = (List<?>) JsonTrees.parse(JsonText.write(values));
        for (int i = 0; i < values.size(); i++) {
            assertEquals(Double.doubleToLongBits(values.get(i)), Double.doubleToLongBits((Double) back.get(i)),
                    "value " + values.get(i));
        }
    }

    // RFC 8259 section 13 example, shortened: nested objects, arrays, booleans and numbers.
    @Test
    void readsTheRfcExample() {
        Object v = JsonTrees.parse("{\"Image\": {\"Width\": 800, \"Animated\" : false, \"IDs\": [116, 943, 234, 38793]}}");
        @SuppressWarnings("unchecked")
        Map<String, Object> image = (Map<String, Object>) ((Map<String, Object>) v).get("Image");
        assertEquals(800.0, image.get("Width"));
        assertEquals(Boolean.FALSE, image.get("Animated"));
        assertEquals(4, ((List<?>) image.get("IDs")).size());
    }

    @Test
    void refusesTextAfterTheDocumentInOneLineNamingTheCharacter() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> JsonText.parse("{} x"));
        assertTrue(e.getMessage().startsWith("not valid JSON at character "), e.getMessage());
        assertEquals(1, e.getMessage().lines().count(), e.getMessage());
    }

    // RFC 8259 §4: names within an object SHOULD be unique; readers differ on which value wins, so none is guessed.
    @Test
    void refusesAKeyGivenTwiceInOneObject() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> JsonText.parse("{\"k\":7,\"k\":70}"));
        assertEquals("not valid JSON at character 10: the key \"k\" appears twice", e.getMessage());
    }

    @Test
    void refusesNonNumericNumbersAndDeepNesting() {
        assertThrows(IllegalArgumentException.class, () -> JsonText.parse("[NaN]"));
        assertThrows(IllegalArgumentException.class, () -> JsonText.parse("[Infinity]"));
        assertThrows(IllegalArgumentException.class, () -> JsonText.parse("[".repeat(100) + "]".repeat(100)));
    }
}
