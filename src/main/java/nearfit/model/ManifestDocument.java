package nearfit.model;

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
import java.util.Map;

import nearfit.model.JsonText.OmitWhenNull;

/**
 * A model manifest's fields as {@link JsonText} writes them and {@link #of} binds them; on reading, before any value
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

    /**
     * {@code "source"}: the file the reference was fitted on; for Parquet rows also {@code parquet_files}, the files
     * the rows' file numbers point at (absent for CSV lines, and in files written before it).
     */
    record SourceFields(String name, BigDecimal size, String sha256,
                        @MayBeAbsent @OmitWhenNull List<FileFields> parquetFiles) {
    }

    /** One entry of {@code "source.parquet_files"}. */
    record FileFields(String name, BigDecimal size, String sha256) {
    }

    /** {@code "columns"}. */
    record ColumnFields(List<String> inputs, String response, List<String> responseLabels, String group,
                   List<String> groupLabels) {
    }

    /** {@code "scaling"}: method, and per input the centre and spread; whitening only for mahalanobis. */
    record ScalingFields(String method, List<Double> center, List<Double> spread, List<Double> whitening) {
    }

    /**
     * {@code "flags"}; {@code residual_scheme} (the {@code --cv} words of the scheme that held the stored
     * {@code heldout_residual} entry out) is absent in files written before that entry existed.
     */
    record FlagFields(Double threshold, Double residualMedian, Double residualScale, String zScale,
                      @MayBeAbsent @OmitWhenNull String residualScheme) {
    }

    /** {@code "tuning"}: the tune table; one family of figures (rmse... or error_rate...) is present. */
    record TuningFields(BigDecimal rows, List<BigDecimal> k, @MayBeAbsent @OmitWhenNull List<Double> rmse,
                        @MayBeAbsent @OmitWhenNull List<Double> rmseSe,
                        @MayBeAbsent @OmitWhenNull List<Double> mae,
                        @MayBeAbsent @OmitWhenNull List<Double> press,
                        @MayBeAbsent @OmitWhenNull List<Double> r2Pred,
                        @MayBeAbsent @OmitWhenNull List<Double> errorRate,
                        @MayBeAbsent @OmitWhenNull List<Double> errorRateSe, BigDecimal bestK,
                        BigDecimal oneSeK, @MayBeAbsent BigDecimal sampled,
                        @MayBeAbsent @OmitWhenNull String scheme,
                        @MayBeAbsent @OmitWhenNull String cv,
                        @MayBeAbsent @OmitWhenNull BigDecimal blocks,
                        @MayBeAbsent @OmitWhenNull String seBasis,
                        @MayBeAbsent @OmitWhenNull Boolean bestAtEdge,
                        @MayBeAbsent @OmitWhenNull Boolean oneSeAtEdge) {
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
     * Binds a parsed manifest ({@link JsonText#parse}: maps, lists, numbers as BigDecimal, text). No value is
     * coerced into another type: a number is never read as text, nor text as a number.
     *
     * @throws IllegalArgumentException naming the field, e.g. {@code manifest field "k" is missing} or
     *                                  {@code manifest field "scaling.center[1]" is not a number}
     */
    static ManifestDocument of(Object manifest) {
        requirePresent(manifest, ManifestDocument.class, "");
        return (ManifestDocument) bind(manifest, ManifestDocument.class, "");
    }

    /** The error for a field: {@code manifest field "a.b" } followed by what is wrong. */
    static IllegalArgumentException bad(String path, String what) {
        return new IllegalArgumentException("manifest field \"" + path + "\" " + what);
    }

    /**
     * Checks that every field of {@code type} not marked {@link MayBeAbsent} is present in
     * {@code node}, recursing into the nested records, before any type is checked.
     */
    private static void requirePresent(Object node, Class<?> type, String path) {
        if (!(node instanceof Map<?, ?> map)) {
            return; // the binding reports the wrong type
        }
        for (RecordComponent c : type.getRecordComponents()) {
            String key = JsonText.snakeCase(c.getName());
            String name = path.isEmpty() ? key : path + "." + key;
            if (!map.containsKey(key)) {
                if (c.isAnnotationPresent(MayBeAbsent.class)) {
                    continue;
                }
                throw bad(name, "is missing");
            }
            Object value = map.get(key);
            if (c.getType().isRecord()) {
                requirePresent(value, c.getType(), name);
            }
        }
    }

    /** {@code node} as a value of {@code type}: text, BigDecimal, Double, Boolean, a list of them, or a record; null stays null. */
    private static Object bind(Object node, Type type, String path) {
        if (node == null) {
            return null;
        }
        Class<?> raw = type instanceof Class<?> c ? c : (Class<?>) ((ParameterizedType) type).getRawType();
        if (raw == String.class && node instanceof String) {
            return node;
        } else if (raw == BigDecimal.class && node instanceof BigDecimal) {
            return node;
        } else if (raw == Boolean.class && node instanceof Boolean) {
            return node;
        } else if (raw == Double.class && node instanceof BigDecimal d) {
            return Double.parseDouble(d.toString()); // the nearest double to the digits written
        } else if (raw == List.class && node instanceof List<?> list) {
            Type element = ((ParameterizedType) type).getActualTypeArguments()[0];
            List<Object> out = new ArrayList<>(list.size());
            for (int i = 0; i < list.size(); i++) {
                out.add(bind(list.get(i), element, path + "[" + i + "]"));
            }
            return out;
        } else if (raw.isRecord() && node instanceof Map<?, ?> map) {
            RecordComponent[] components = raw.getRecordComponents();
            Object[] values = new Object[components.length];
            Class<?>[] types = new Class<?>[components.length];
            for (int i = 0; i < components.length; i++) {
                String key = JsonText.snakeCase(components[i].getName());
                values[i] = bind(map.get(key), components[i].getGenericType(), path.isEmpty() ? key : path + "." + key);
                types[i] = components[i].getType();
            }
            try {
                var constructor = raw.getDeclaredConstructor(types);
                constructor.setAccessible(true);
                return constructor.newInstance(values);
            } catch (ReflectiveOperationException e) {
                throw new IllegalStateException("cannot make " + raw.getSimpleName(), e);
            }
        }
        throw bad(path, wrongType(raw));
    }

    private static String wrongType(Class<?> raw) {
        if (raw == String.class) {
            return "is not text";
        } else if (raw == Boolean.class) {
            return "is not true or false";
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
