package nearfit.model;

import java.io.IOException;
import java.io.StringWriter;
import java.lang.annotation.ElementType;
import java.lang.annotation.Retention;
import java.lang.annotation.RetentionPolicy;
import java.lang.annotation.Target;
import java.lang.reflect.RecordComponent;
import java.math.BigDecimal;
import java.math.BigInteger;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import com.fasterxml.jackson.core.JsonFactory;
import com.fasterxml.jackson.core.JsonGenerator;
import com.fasterxml.jackson.core.JsonLocation;
import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.JsonToken;
import com.fasterxml.jackson.core.StreamReadConstraints;
import com.fasterxml.jackson.core.StreamReadFeature;

/**
 * The tool's JSON, through the Jackson library's streaming parser and generator (jackson-core; no data
 * binding: its set-up cost every model-reading command 110–200 ms, docs/bench-startup.md): model manifests
 * and the {@code --format json} outputs.
 *
 * <p>Reading gives plain values: objects as {@link LinkedHashMap} (key order kept; a JSON null is a key
 * mapped to null), arrays as {@link ArrayList}, numbers as {@link BigDecimal} (exact as written, so
 * {@code 4294967306} is never an int 10 and a double reads back to the nearest double, bit for bit),
 * strings, booleans and null. It is strict: a key twice in one object is refused (which one counts would be
 * a guess), so is text after the document and NaN or Infinity; nesting stops at 64 levels.
 *
 * <p>Writing is deterministic, so a manifest's bytes (and its SHA-256) depend on its values only:
 * compact, keys in the order given, record components in order with snake_case names, a whole double below
 * 10^15 written without a fraction ({@code 4}, not {@code 4.0}), other doubles in Java's shortest round-trip
 * form, and a non-finite number as {@code null} (JSON has no form for it). These are the bytes model files
 * of format 1.1 have always held.
 */
public final class JsonText {
    /** The deepest nesting read; a manifest needs 3 levels. */
    private static final int MAX_DEPTH = 64;

    /** The library's wording of a duplicate key, reworded as the tool's other messages are. */
    private static final java.util.regex.Pattern DUPLICATE = java.util.regex.Pattern.compile("Duplicate field '(.*)'");

    private static final JsonFactory FACTORY = JsonFactory.builder()
            .enable(StreamReadFeature.STRICT_DUPLICATE_DETECTION)
            .streamReadConstraints(StreamReadConstraints.builder().maxNestingDepth(MAX_DEPTH).build())
            .build();

    /** Marks a record component that is left out of the written object when null. */
    @Retention(RetentionPolicy.RUNTIME)
    @Target({ElementType.RECORD_COMPONENT, ElementType.METHOD})
    @interface OmitWhenNull {
    }

    private JsonText() {
    }

    /**
     * The compact JSON text of a value: maps, lists, double/int/long arrays, records, strings, numbers,
     * booleans, enums (by name) and null.
     */
    public static String write(Object value) {
        StringWriter text = new StringWriter();
        try (JsonGenerator out = FACTORY.createGenerator(text)) {
            writeValue(value, out);
        } catch (IOException e) {
            throw new IllegalStateException("cannot write JSON to a string", e); // a StringWriter does not fail
        }
        return text.toString();
    }

    /**
     * Parses one JSON document into plain values (see the class).
     *
     * @throws IllegalArgumentException in one line, {@code not valid JSON at character N: ...}
     */
    public static Object parse(String text) {
        try (JsonParser p = FACTORY.createParser(text)) {
            JsonToken first = p.nextToken();
            if (first == null) {
                throw new IllegalArgumentException("not valid JSON at character 0: no document");
            }
            Object value = read(p, first);
            if (p.nextToken() != null) {
                throw new IllegalArgumentException("not valid JSON at character " + p.currentTokenLocation().getCharOffset()
                        + ": text after the document");
            }
            return value;
        } catch (JsonProcessingException e) {
            throw new IllegalArgumentException(syntaxError(e), e);
        } catch (IOException e) {
            throw new IllegalStateException("cannot read JSON from a string", e); // a String does not fail
        }
    }

    private static Object read(JsonParser p, JsonToken t) throws IOException {
        switch (t) {
            case START_OBJECT -> {
                Map<String, Object> map = new LinkedHashMap<>();
                for (JsonToken k = p.nextToken(); k != JsonToken.END_OBJECT; k = p.nextToken()) {
                    String key = p.currentName();
                    map.put(key, read(p, p.nextToken()));
                }
                return map;
            }
            case START_ARRAY -> {
                List<Object> list = new ArrayList<>();
                for (JsonToken e = p.nextToken(); e != JsonToken.END_ARRAY; e = p.nextToken()) {
                    list.add(read(p, e));
                }
                return list;
            }
            case VALUE_STRING -> {
                return p.getText();
            }
            case VALUE_NUMBER_INT, VALUE_NUMBER_FLOAT -> {
                return new BigDecimal(p.getText());
            }
            case VALUE_TRUE -> {
                return Boolean.TRUE;
            }
            case VALUE_FALSE -> {
                return Boolean.FALSE;
            }
            case VALUE_NULL -> {
                return null;
            }
            default -> throw new IllegalArgumentException("not valid JSON at character "
                    + p.currentTokenLocation().getCharOffset() + ": unexpected " + t);
        }
    }

    /**
     * The top-level fields of a map or a record, in order, as the writer names them ({@code toolVersion}
     * is {@code tool_version}); values stay as they are, for the writer to write.
     */
    static Map<String, Object> fieldsOf(Object value) {
        Map<String, Object> fields = new LinkedHashMap<>();
        if (value instanceof Map<?, ?> map) {
            for (Map.Entry<?, ?> e : map.entrySet()) {
                fields.put(String.valueOf(e.getKey()), e.getValue());
            }
        } else if (value instanceof Record record) {
            for (RecordComponent c : record.getClass().getRecordComponents()) {
                Object v = componentOf(record, c);
                if (v != null || !c.isAnnotationPresent(OmitWhenNull.class)) {
                    fields.put(snakeCase(c.getName()), v);
                }
            }
        } else {
            throw new IllegalArgumentException("not an object: " + value);
        }
        return fields;
    }

    private static Object componentOf(Record value, RecordComponent c) {
        try {
            c.getAccessor().setAccessible(true);
            return c.getAccessor().invoke(value);
        } catch (ReflectiveOperationException e) {
            throw new IllegalStateException("cannot read " + c, e);
        }
    }

    /**
     * A component's name as JSON names it: each capital letter lower-cased after an underscore, a run of
     * capitals taken as one word ({@code rmseSe} is {@code rmse_se}, {@code r2Pred} is {@code r2_pred}).
     */
    static String snakeCase(String name) {
        StringBuilder sb = new StringBuilder(name.length() + 4);
        boolean previousUpper = false;
        for (int i = 0; i < name.length(); i++) {
            char c = name.charAt(i);
            if (i == 0 && c == '_') {
                continue;
            }
            if (Character.isUpperCase(c)) {
                if (!previousUpper && sb.length() > 0 && sb.charAt(sb.length() - 1) != '_') {
                    sb.append('_');
                }
                c = Character.toLowerCase(c);
                previousUpper = true;
            } else {
                previousUpper = false;
            }
            sb.append(c);
        }
        return sb.toString();
    }

    /** The one-line message of a syntax error: the character offset and the library's reason. */
    static String syntaxError(JsonProcessingException e) {
        JsonLocation at = e.getLocation();
        String where = at == null || at.getCharOffset() < 0 ? "" : " at character " + at.getCharOffset();
        String why = e.getOriginalMessage() == null ? "" : e.getOriginalMessage().lines().findFirst().orElse("");
        java.util.regex.Matcher twice = DUPLICATE.matcher(why);
        if (twice.matches()) {
            why = "the key \"" + twice.group(1) + "\" appears twice"; // which value counts would be a guess
        }
        return "not valid JSON" + where + ": " + why;
    }

    private static void writeValue(Object v, JsonGenerator out) throws IOException {
        if (v == null) {
            out.writeNull();
        } else if (v instanceof String s) {
            out.writeString(s);
        } else if (v instanceof Double d) {
            writeDouble(d, out);
        } else if (v instanceof Float f) {
            writeDouble(f, out);
        } else if (v instanceof Integer || v instanceof Long || v instanceof Short || v instanceof Byte) {
            out.writeNumber(((Number) v).longValue());
        } else if (v instanceof BigDecimal d) {
            out.writeNumber(d);
        } else if (v instanceof BigInteger i) {
            out.writeNumber(i);
        } else if (v instanceof Boolean b) {
            out.writeBoolean(b);
        } else if (v instanceof Enum<?> e) {
            out.writeString(e.name());
        } else if (v instanceof double[] a) {
            out.writeStartArray(a, a.length);
            for (double d : a) {
                writeDouble(d, out);
            }
            out.writeEndArray();
        } else if (v instanceof int[] a) {
            out.writeArray(a, 0, a.length);
        } else if (v instanceof long[] a) {
            out.writeArray(a, 0, a.length);
        } else if (v instanceof Map<?, ?> || v instanceof Record) {
            out.writeStartObject();
            for (Map.Entry<String, Object> e : fieldsOf(v).entrySet()) {
                out.writeFieldName(e.getKey());
                writeValue(e.getValue(), out);
            }
            out.writeEndObject();
        } else if (v instanceof Iterable<?> list) {
            out.writeStartArray();
            for (Object e : list) {
                writeValue(e, out);
            }
            out.writeEndArray();
        } else {
            throw new IllegalArgumentException("no JSON form for " + v.getClass().getName());
        }
    }

    /** Writes one double in the deterministic form described on the class. */
    static void writeDouble(double d, JsonGenerator out) throws IOException {
        if (!Double.isFinite(d)) {
            out.writeNull();
        } else if (d == Math.rint(d) && Math.abs(d) < 1e15) {
            out.writeNumber((long) d);
        } else {
            out.writeNumber(Double.toString(d));
        }
    }
}
