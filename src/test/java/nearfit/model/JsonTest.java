package nearfit.model;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.List;
import java.util.Map;

import org.junit.jupiter.api.Test;

class JsonTest {
    @Test
    void writesCommasNestingAndEscapes() {
        String s = new Json.Writer().beginObject()
                .key("rows").value(3)
                .key("name").value("a \"b\"\n")
                .key("xs").array(new double[] {1, 2.5, Double.NaN})
                .key("none").nullValue()
                .key("nested").beginArray().beginObject().key("k").value(true).endObject().endArray()
                .endObject().toString();
        assertEquals("{\"rows\":3,\"name\":\"a \\\"b\\\"\\n\",\"xs\":[1,2.5,null],\"none\":null,"
                + "\"nested\":[{\"k\":true}]}", s);
    }

    @Test
    void readsWhatItWrites() {
        String s = new Json.Writer().beginObject().key("a").array(new double[] {1.25, -3e-7})
                .key("b").value("x\ty").endObject().toString();
        @SuppressWarnings("unchecked")
        Map<String, Object> m = (Map<String, Object>) Json.parse(s);
        assertEquals(List.of(1.25, -3e-7), m.get("a"));
        assertEquals("x\ty", m.get("b"));
    }

    // RFC 8259 section 13 example, shortened: nested objects, arrays, booleans and numbers.
    @Test
    void readsTheRfcExample() {
        Object v = Json.parse("{\"Image\": {\"Width\": 800, \"Animated\" : false, \"IDs\": [116, 943, 234, 38793]}}");
        @SuppressWarnings("unchecked")
        Map<String, Object> image = (Map<String, Object>) ((Map<String, Object>) v).get("Image");
        assertEquals(800.0, image.get("Width"));
        assertEquals(Boolean.FALSE, image.get("Animated"));
        assertEquals(4, ((List<?>) image.get("IDs")).size());
    }

    @Test
    void rejectsTrailingGarbageWithItsOffset() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> Json.parse("{} x"));
        assertEquals("not valid JSON at character 3: text after the end of the document", e.getMessage());
    }

    // RFC 8259 §4: names within an object SHOULD be unique; readers differ on which value wins, so none is guessed.
    @Test
    void rejectsAKeyGivenTwiceInOneObject() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> Json.parse("{\"k\":7,\"k\":70}"));
        assertEquals("not valid JSON at character 10: the key \"k\" appears twice", e.getMessage());
    }
}
