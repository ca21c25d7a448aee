package nearfit.model;

import java.nio.file.Path;
import java.time.Instant;
import java.time.format.DateTimeParseException;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.Collection;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import nearfit.table.NearfitException;

/**
 * Saves and loads a {@link ReferenceModel} as a model file (suggested extension {@code .nfm}): a
 * {@link ModelArchive} whose manifest carries the settings and whose arrays carry the reference rows.
 *
 * <p>Arrays: {@code input.J} (f64, input J in manifest order), {@code response} (f64) or
 * {@code response_code} (i32), {@code group_code} (i32, only with a group) and {@code source_line}
 * (i64). The manifest fields are listed in docs of {@link #manifestOf}; loading checks that each is
 * present, of its type and consistent with the arrays, and reports the first problem as one line
 * naming the file.
 */
public final class ModelFile {
    private ModelFile() {
    }

    /** Writes {@code model} to {@code target} atomically; an existing file only with {@code force}. */
    public static void write(ReferenceModel model, Path target, boolean force, Collection<Path> inputs) {
        Map<String, Object> arrays = new LinkedHashMap<>();
        ReferenceRows rows = model.rows();
        for (int j = 0; j < rows.inputs().length; j++) {
            arrays.put("input." + j, rows.inputs()[j]);
        }
        if (rows.response() != null) {
            arrays.put("response", rows.response());
        } else {
            arrays.put("response_code", rows.responseCodes());
        }
        if (rows.groupCodes() != null) {
            arrays.put("group_code", rows.groupCodes());
        }
        arrays.put("source_line", rows.sourceLines());
        ModelArchive.write(target, force, inputs, manifestOf(model), arrays);
    }

    /**
     * The manifest fields of a model (ModelArchive adds format, format_version and entries):
     * tool_version, created (ISO 8601 UTC), source {name, size, sha256}, row_condition, rows,
     * columns {inputs, response, response_labels, group, group_labels}, scaling {method, center,
     * spread, whitening}, metric, weights, k, band, estimate (absent in files written before it: the
     * mean), flags {threshold, residual_median, residual_scale,
     * z_scale}, tuning (the tune JSON object, or null).
     */
    static Map<String, Object> manifestOf(ReferenceModel model) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("tool_version", model.toolVersion());
        m.put("created", model.created().truncatedTo(ChronoUnit.SECONDS).toString());
        Map<String, Object> source = new LinkedHashMap<>();
        source.put("name", model.source().name());
        source.put("size", model.source().sizeBytes() < 0 ? null : (Object) model.source().sizeBytes());
        source.put("sha256", model.source().sha256());
        m.put("source", source);
        m.put("row_condition", model.source().rowCondition());
        m.put("rows", (long) model.rows().size());
        ModelColumns c = model.columns();
        Map<String, Object> columns = new LinkedHashMap<>();
        columns.put("inputs", c.inputs());
        columns.put("response", c.response());
        columns.put("response_labels", c.responseLabels());
        columns.put("group", c.group());
        columns.put("group_labels", c.groupLabels());
        m.put("columns", columns);
        Map<String, Object> scaling = new LinkedHashMap<>();
        scaling.put("method", model.settings().scaling());
        scaling.put("center", model.scaleCenter());
        scaling.put("spread", model.scaleSpread());
        scaling.put("whitening", model.whitening());
        m.put("scaling", scaling);
        m.put("metric", model.settings().metric());
        m.put("weights", model.settings().weights());
        m.put("k", (long) model.settings().k());
        m.put("band", model.settings().band());
        m.put("estimate", model.settings().estimate());
        Map<String, Object> flags = new LinkedHashMap<>();
        flags.put("threshold", model.settings().flagThreshold());
        flags.put("residual_median", model.residualScale().median());
        flags.put("residual_scale", model.residualScale().scale());
        flags.put("z_scale", model.settings().zScale());
        m.put("flags", flags);
        m.put("tuning", model.tuning() == null ? null : model.tuning().toJson());
        return m;
    }

    /**
     * Reads a model file.
     *
     * @throws NearfitException naming the file when it is missing, not a model, damaged, truncated,
     *                          of another major version, or its manifest is incomplete or inconsistent
     */
    public static ReferenceModel read(Path path) {
        ModelArchive.Contents contents = ModelArchive.read(path);
        try {
            return modelOf(contents);
        } catch (IllegalArgumentException | NearfitException e) {
            String detail = e instanceof NearfitException ne ? ne.detail() : e.getMessage();
            throw NearfitException.inFile(path.toString(), "is a damaged model file: " + detail, e);
        }
    }

    private static ReferenceModel modelOf(ModelArchive.Contents contents) {
        Map<String, Object> m = contents.manifest();
        Map<?, ?> src = ManifestFields.object(m, "source");
        Object size = ManifestFields.required(src, "size");
        SourceInfo source = new SourceInfo(ManifestFields.text(src, "name"),
                size == null ? -1 : ManifestFields.whole(src, "size"),
                ManifestFields.textOrNull(src, "sha256"), ManifestFields.textOrNull(m, "row_condition"));
        Map<?, ?> col = ManifestFields.object(m, "columns");
        ModelColumns columns = new ModelColumns(ManifestFields.texts(col, "inputs"),
                ManifestFields.text(col, "response"), ManifestFields.texts(col, "response_labels"),
                ManifestFields.textOrNull(col, "group"), ManifestFields.texts(col, "group_labels"));
        Map<?, ?> scaling = ManifestFields.object(m, "scaling");
        Map<?, ?> flags = ManifestFields.object(m, "flags");
        ModelSettings settings = new ModelSettings(ManifestFields.text(m, "metric"),
                ManifestFields.text(m, "weights"), ManifestFields.text(scaling, "method"),
                (int) ManifestFields.whole(m, "k"), ManifestFields.text(m, "band"),
                ManifestFields.number(flags, "threshold"), ManifestFields.text(flags, "z_scale"),
                ManifestFields.textOr(m, "estimate", ModelSettings.ESTIMATES.get(0)));
        ReferenceModel.ResidualScale residual = new ReferenceModel.ResidualScale(
                numberOrNaN(flags, "residual_median"), numberOrNaN(flags, "residual_scale"));
        Object tuningField = ManifestFields.required(m, "tuning");
        TuningSummary tuning = tuningField == null ? null : TuningSummary.fromJson(ManifestFields.object(m, "tuning"));
        ReferenceRows rows = rowsOf(contents, columns);
        if (ManifestFields.whole(m, "rows") != rows.size()) {
            throw new IllegalArgumentException("field \"rows\" does not match the stored rows");
        }
        checkCodes(rows, columns);
        return new ReferenceModel(ManifestFields.text(m, "tool_version"), created(m), source, columns, settings,
                ManifestFields.doubles(scaling, "center"), ManifestFields.doubles(scaling, "spread"),
                ManifestFields.required(scaling, "whitening") == null ? null
                        : ManifestFields.doubles(scaling, "whitening"),
                residual, tuning, rows);
    }

    private static ReferenceRows rowsOf(ModelArchive.Contents contents, ModelColumns columns) {
        List<double[]> inputs = new ArrayList<>();
        for (int j = 0; j < columns.inputs().size(); j++) {
            inputs.add(contents.doubles("input." + j));
        }
        boolean category = columns.categoryResponse();
        return new ReferenceRows(inputs.toArray(new double[0][]),
                category ? null : contents.doubles("response"),
                category ? contents.ints("response_code") : null,
                columns.group() == null ? null : contents.ints("group_code"),
                contents.longs("source_line"));
    }

    private static void checkCodes(ReferenceRows rows, ModelColumns columns) {
        if (rows.responseCodes() != null) {
            checkRange(rows.responseCodes(), 0, columns.responseLabels().size(), "response_code");
        }
        if (rows.groupCodes() != null) {
            checkRange(rows.groupCodes(), -1, columns.groupLabels().size(), "group_code");
        }
    }

    private static void checkRange(int[] codes, int lowest, int limit, String name) {
        for (int code : codes) {
            if (code < lowest || code >= limit) {
                throw new IllegalArgumentException("entry " + name + " holds code " + code
                        + " outside its dictionary");
            }
        }
    }

    private static double numberOrNaN(Map<?, ?> m, String key) {
        return ManifestFields.required(m, key) == null ? Double.NaN : ManifestFields.number(m, key);
    }

    private static Instant created(Map<?, ?> m) {
        String text = ManifestFields.text(m, "created");
        try {
            return Instant.parse(text);
        } catch (DateTimeParseException e) {
            throw new IllegalArgumentException("field \"created\" is not an ISO 8601 UTC time: " + text);
        }
    }
}
