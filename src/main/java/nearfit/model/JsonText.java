package nearfit.model;

import java.io.IOException;
import java.lang.reflect.RecordComponent;
import java.util.LinkedHashMap;
import java.util.Map;

import com.fasterxml.jackson.core.JsonGenerator;
import com.fasterxml.jackson.core.JsonLocation;
import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.StreamReadConstraints;
import com.fasterxml.jackson.core.json.JsonReadFeature;
import com.fasterxml.jackson.databind.DeserializationFeature;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.MapperFeature;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.PropertyNamingStrategies;
import com.fasterxml.jackson.databind.SerializerProvider;
import com.fasterxml.jackson.databind.cfg.CoercionAction;
import com.fasterxml.jackson.databind.cfg.CoercionInputShape;
import com.fasterxml.jackson.databind.json.JsonMapper;
import com.fasterxml.jackson.databind.module.SimpleModule;
import com.fasterxml.jackson.databind.ser.std.StdSerializer;
import com.fasterxml.jackson.databind.type.LogicalType;

/**
 * The tool's JSON, through the Jackson library: model manifests and the {@code --format json}
 * outputs. One configured mapper, never changed after this class is loaded.
 *
 * <p>Reading is strict: a key twice in one object is refused (which one counts would be a guess),
 * so is text after the document; no value is coerced into another type (a number is never read as
 * text, nor text as a number). Floating-point numbers are parsed to the nearest double, so every
 * double the writer wrote reads back bit for bit.
 *
 * <p>Writing is deterministic, so a manifest's bytes (and its SHA-256) depend on its values only:
 * compact, keys in the order given, a whole double below 10^15 written without a fraction
 * ({@code 4}, not {@code 4.0}), other doubles in Java's shortest round-trip form, and a non-finite
 * number as {@code null} (JSON has no form for it). These are the bytes model files of format 1.1
 * have always held.
 */
public final class JsonText {
    /** The deepest nesting read; a manifest needs 3 levels. */
    private static final int MAX_DEPTH = 64;

    /** The library's wording of a duplicate key, reworded as the tool's other messages are. */
    private static final java.util.regex.Pattern DUPLICATE = java.util.regex.Pattern.compile("Duplicate field '(.*)'");

    private static final ObjectMapper MAPPER = newMapper();

    private JsonText() {
    }

    /** The mapper: strict reading, the deterministic number form, snake_case names for records. */
    static ObjectMapper mapper() {
        return MAPPER;
    }

    /** The compact JSON text of a value: maps, lists, arrays, records, strings, numbers, booleans, null. */
    public static String write(Object value) {
        try {
            return MAPPER.writeValueAsString(value);
        } catch (JsonProcessingException e) {
            throw new IllegalArgumentException("no JSON form: " + e.getOriginalMessage(), e);
        }
    }

    /**
     * Parses one JSON document into the library's tree.
     *
     * @throws IllegalArgumentException in one line, {@code not valid JSON at character N: ...}
     */
    public static JsonNode parse(String text) {
        try {
            JsonNode node = MAPPER.readTree(text);
            if (node == null || node.isMissingNode()) {
                throw new IllegalArgumentException("not valid JSON at character 0: no document");
            }
            return node;
        } catch (JsonProcessingException e) {
            throw new IllegalArgumentException(syntaxError(e), e);
        }
    }

    /**
     * The top-level fields of a map or a record, in order, as the writer names them ({@code toolVersion}
     * is {@code tool_version}); values stay as they are, for the writer to write.
     */
    static Map<String, Object> fieldsOf(Object value) {
        Map<String, Object> fields = new LinkedHashMap<>();
        if (value instanceof Map<?, ?> map) {
            map.forEach((k, v) -> fields.put(String.valueOf(k), v));
        } else if (value instanceof Record) {
            for (RecordComponent c : value.getClass().getRecordComponents()) {
                try {
                    c.getAccessor().setAccessible(true);
                    fields.put(PropertyNamingStrategies.SnakeCaseStrategy.INSTANCE.translate(c.getName()),
                            c.getAccessor().invoke(value));
                } catch (ReflectiveOperationException e) {
                    throw new IllegalStateException("cannot read " + c, e);
                }
            }
        } else {
            throw new IllegalArgumentException("not an object: " + value);
        }
        return fields;
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

    private static ObjectMapper newMapper() {
        SimpleModule numbers = new SimpleModule("nearfit-numbers");
        numbers.addSerializer(Double.class, new DoubleForm());
        numbers.addSerializer(double.class, new DoubleForm());
        numbers.addSerializer(double[].class, new DoubleArrayForm());
        JsonMapper mapper = JsonMapper.builder()
                .enable(JsonParser.Feature.STRICT_DUPLICATE_DETECTION)
                .disable(JsonReadFeature.ALLOW_NON_NUMERIC_NUMBERS)
                .enable(DeserializationFeature.FAIL_ON_TRAILING_TOKENS)
                // Forward compatibility within a major version: fields a later minor adds are ignored.
                .disable(DeserializationFeature.FAIL_ON_UNKNOWN_PROPERTIES)
                .disable(MapperFeature.ALLOW_COERCION_OF_SCALARS)
                .disable(JsonGenerator.Feature.AUTO_CLOSE_TARGET)
                .propertyNamingStrategy(PropertyNamingStrategies.SNAKE_CASE)
                .addModule(numbers)
                .build();
        mapper.getFactory().setStreamReadConstraints(StreamReadConstraints.builder().maxNestingDepth(MAX_DEPTH).build());
        mapper.coercionConfigFor(LogicalType.Textual)
                .setCoercion(CoercionInputShape.Integer, CoercionAction.Fail)
                .setCoercion(CoercionInputShape.Float, CoercionAction.Fail)
                .setCoercion(CoercionInputShape.Boolean, CoercionAction.Fail);
        mapper.coercionConfigFor(LogicalType.Float)
                .setCoercion(CoercionInputShape.String, CoercionAction.Fail)
                .setCoercion(CoercionInputShape.Boolean, CoercionAction.Fail);
        mapper.coercionConfigFor(LogicalType.Integer)
                .setCoercion(CoercionInputShape.String, CoercionAction.Fail)
                .setCoercion(CoercionInputShape.Boolean, CoercionAction.Fail);
        return mapper;
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

    private static final class DoubleForm extends StdSerializer<Double> {
        DoubleForm() {
            super(Double.class);
        }

        @Override
        public void serialize(Double value, JsonGenerator out, SerializerProvider provider) throws IOException {
            writeDouble(value, out);
        }
    }

    private static final class DoubleArrayForm extends StdSerializer<double[]> {
        DoubleArrayForm() {
            super(double[].class);
        }

        @Override
        public void serialize(double[] values, JsonGenerator out, SerializerProvider provider) throws IOException {
            out.writeStartArray(values, values.length);
            for (double v : values) {
                writeDouble(v, out);
            }
            out.writeEndArray();
        }
    }
}
