package nearfit.model;

import static com.fasterxml.jackson.annotation.JsonInclude.Include.NON_NULL;

import java.lang.annotation.ElementType;
import java.lang.annotation.Retention;
import java.lang.annotation.RetentionPolicy;
import java.lang.annotation.Target;
import java.lang.reflect.ParameterizedType;
import java.lang.reflect.RecordComponent;
import java.lang.reflect.Type;
import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.List;

import com.fasterxml.jackson.annotation.JsonInclude;

import com.fasterxml.jackson.databind.JsonMappingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.PropertyNamingStrategies;
import com.fasterxml.jackson.databind.exc.MismatchedInputException;

/**
 * A model manifest's fields as the JSON library writes and binds them; on reading, before any value
 * is checked ({@link ModelFile} checks each and names the field of the first that is wrong). The JSON names are
 * the components' names in snake_case ({@code toolVersion} is {@code "tool_version"}).
 *
 * <p>Types are what JSON can hold, not yet what the model needs: numbers whose range is checked
 * later are {@link BigDecimal} (exact, so {@code 4294967306} is never read as an int 10) or
 * {@link Double} (null where the writer wrote a non-finite number), so a message can quote the value
 * as written. Every field must be present, even when null, except those marked {@link MayBeAbsent};
 * fields this build does not know are ignored (a later minor version may add some).
 */
record ManifestDocument(String toolVersion, String created, SourceFields source, String rowCondition, BigDecimal rows,
                        ColumnFields columns, ScalingFields scaling, String metric, String weights, BigDecimal k, String band,
                        @MayBeAbsent String estimate, FlagFields flags, TuningFields tuning) {

    /** Marks a field that files written before it existed lack. */
    @Retention(RetentionPolicy.RUNTIME)
    @Target({ElementType.RECORD_COMPONENT, ElementType.PARAMETER, ElementType.FIELD, ElementType.METHOD})
    @interface MayBeAbsent {
    }

    /** {@code "source"}: the file the reference was fitted on. */
    record SourceFields(String name, BigDecimal size, String sha256) {
    }

    /** {@code "columns"}. */
    record ColumnFields(List<String> inputs, String response, List<String> responseLabels, String group,
                   List<String> groupLabels) {
    }

    /** {@code "scaling"}: method, and per input the centre and spread; whitening only for mahalanobis. */
    record ScalingFields(String method, List<Double> center, List<Double> spread, List<Double> whitening) {
    }

    /** {@code "flags"}. */
    record FlagFields(Double threshold, Double residualMedian, Double residualScale, String zScale) {
    }

    /** {@code "tuning"}: the tune table; one family of figures (rmse... or error_rate...) is present. */
    record TuningFields(BigDecimal rows, List<BigDecimal> k, @MayBeAbsent @JsonInclude(NON_NULL) List<Double> rmse,
                        @MayBeAbsent @JsonInclude(NON_NULL) List<Double> rmseSe,
                        @MayBeAbsent @JsonInclude(NON_NULL) List<Double> mae,
                        @MayBeAbsent @JsonInclude(NON_NULL) List<Double> press,
                        @MayBeAbsent @JsonInclude(NON_NULL) List<Double> r2Pred,
                        @MayBeAbsent @JsonInclude(NON_NULL) List<Double> errorRate,
                        @MayBeAbsent @JsonInclude(NON_NULL) List<Double> errorRateSe, BigDecimal bestK,
                        BigDecimal oneSeK, @MayBeAbsent BigDecimal sampled,
                        @MayBeAbsent @JsonInclude(NON_NULL) String scheme,
                        @MayBeAbsent @JsonInclude(NON_NULL) String cv,
                        @MayBeAbsent @JsonInclude(NON_NULL) BigDecimal blocks,
                        @MayBeAbsent @JsonInclude(NON_NULL) String seBasis,
                        @MayBeAbsent @JsonInclude(NON_NULL) Boolean bestAtEdge,
                        @MayBeAbsent @JsonInclude(NON_NULL) Boolean oneSeAtEdge) {
    }

    /** The doubles as the writer writes them (NaN as null); null for no array. */
    static List<Double> listOf(double[] values) {
        if (values == null) {
            return null;
        }
        List<Double> out = new ArrayList<>(values.length);
        for (double v : values) {
            out.add(v);
        }
        return out;
    }

    /**
     * Binds a parsed manifest.
     *
     * @throws IllegalArgumentException naming the field, e.g. {@code manifest field "k" is missing} or
     *                                  {@code manifest field "scaling.center[1]" is not a number}
     */
    static ManifestDocument of(JsonNode manifest) {
        requirePresent(manifest, ManifestDocument.class, "");
        try {
            return JsonText.mapper().treeToValue(manifest, ManifestDocument.class);
        } catch (MismatchedInputException e) {
            throw new IllegalArgumentException("manifest field \"" + pathOf(e) + "\" " + wrongType(e.getTargetType()),
                    e);
        } catch (JsonMappingException e) {
            throw new IllegalArgumentException("manifest field \"" + pathOf(e) + "\" cannot be read: "
                    + e.getOriginalMessage().lines().findFirst().orElse(""), e);
        } catch (com.fasterxml.jackson.core.JsonProcessingException e) {
            throw new IllegalArgumentException(JsonText.syntaxError(e), e);
        }
    }

    /** The error for a field: {@code manifest field "a.b" } followed by what is wrong. */
    static IllegalArgumentException bad(String path, String what) {
        return new IllegalArgumentException("manifest field \"" + path + "\" " + what);
    }

    /**
     * Checks that every field of {@code type} not marked {@link MayBeAbsent} is present in
     * {@code node}, recursing into the nested records; the binding cannot tell absent from null.
     */
    private static void requirePresent(JsonNode node, Class<?> type, String path) {
        if (!node.isObject()) {
            return; // the binding reports the wrong type
        }
        for (RecordComponent c : type.getRecordComponents()) {
            String key = PropertyNamingStrategies.SnakeCaseStrategy.INSTANCE.translate(c.getName());
            String name = path.isEmpty() ? key : path + "." + key;
            JsonNode value = node.get(key);
            if (value == null) {
                if (c.isAnnotationPresent(MayBeAbsent.class)) {
                    continue;
                }
                throw bad(name, "is missing");
            }
            if (c.getType().isRecord()) {
                requirePresent(value, c.getType(), name);
            }
        }
    }

    private static String pathOf(JsonMappingException e) {
        StringBuilder path = new StringBuilder();
        for (JsonMappingException.Reference r : e.getPath()) {
            if (r.getFieldName() != null) {
                if (path.length() > 0) {
                    path.append('.');
                }
                path.append(r.getFieldName());
            } else if (r.getIndex() >= 0) {
                path.append('[').append(r.getIndex()).append(']');
            }
        }
        return path.toString();
    }

    private static String wrongType(Type target) {
        Class<?> raw = target instanceof Class<?> c ? c
                : target instanceof ParameterizedType p ? (Class<?>) p.getRawType() : Object.class;
        if (raw == String.class) {
            return "is not text";
        } else if (Number.class.isAssignableFrom(raw)) {
            return "is not a number";
        } else if (List.class.isAssignableFrom(raw)) {
            return "is not a list";
        } else if (raw.isRecord()) {
            return "is not an object";
        }
        return "is not of the right type";
    }
}
