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
    /** The most inputs a model file may declare (the whitening matrix holds their square). */
    private static final int MAX_INPUTS = 1000;
    /** The largest whole number a JSON number (a double) holds exactly: 2^53. */
    private static final long MAX_EXACT_WHOLE = 1L << 53;

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
     * Reads a model file: the manifest first, every value checked (finite, in range, consistent with
     * the others), then only the arrays the model needs, each with exactly the manifest's row count,
     * then the arrays themselves (stored inputs finite, codes inside their dictionaries, the stored
     * scaling giving finite coordinates, enough usable rows for k). So a file that loads cannot make
     * the index search spin or fail inside the engine.
     *
     * @throws NearfitException in one line naming the file when it is missing, not a model, damaged,
     *                          truncated, of another major version, or a manifest value is missing,
     *                          out of range or inconsistent (naming the field)
     */
    public static ReferenceModel read(Path path) {
        String name = path.toString();
        try (ModelArchive.Opened archive = ModelArchive.open(path)) {
            ManifestFields m = ManifestFields.root(archive.manifest());
            int rows = m.integer("rows", 0, Integer.MAX_VALUE);
            ModelColumns columns = columnsOf(m.object("columns"));
            Described described = describedOf(m, columns, rows);
            ReferenceRows stored = rowsOf(archive.read(needs(columns, rows)), columns);
            checkCodes(stored, columns);
            StoredRowCheck.check(stored, columns, described.settings(), described.center(), described.spread(),
                    described.whitening());
            return described.with(stored);
        } catch (IllegalArgumentException e) {
            // Each check says what is wrong in a sentence of its own (the field, entry or row, and why).
            throw NearfitException.inFile(name, e.getMessage(), e);
        } catch (NearfitException e) {
            throw e.file() != null ? e : NearfitException.inFile(name, e.detail(), e);
        }
    }

    /** The arrays of a model with these columns and rows, in the order the writer stores them. */
    private static List<ModelArchive.Need> needs(ModelColumns columns, int rows) {
        List<ModelArchive.Need> needs = new ArrayList<>();
        for (int j = 0; j < columns.inputs().size(); j++) {
            needs.add(new ModelArchive.Need("input." + j, ModelArchive.ElementType.F64, rows));
        }
        needs.add(columns.categoryResponse() ? new ModelArchive.Need("response_code", ModelArchive.ElementType.I32, rows)
                : new ModelArchive.Need("response", ModelArchive.ElementType.F64, rows));
        if (columns.group() != null) {
            needs.add(new ModelArchive.Need("group_code", ModelArchive.ElementType.I32, rows));
        }
        needs.add(new ModelArchive.Need("source_line", ModelArchive.ElementType.I64, rows));
        return needs;
    }

    private static ModelColumns columnsOf(ManifestFields col) {
        List<String> inputs = col.texts("inputs");
        String response = col.text("response");
        List<String> responseLabels = col.texts("response_labels");
        String group = col.textOrNull("group");
        List<String> groupLabels = col.texts("group_labels");
        if (inputs.isEmpty() || inputs.size() > MAX_INPUTS) {
            throw col.bad("inputs", "has " + inputs.size() + " names; a model has 1 to " + MAX_INPUTS + " inputs");
        }
        try {
            return new ModelColumns(inputs, response, responseLabels, group, groupLabels);
        } catch (IllegalArgumentException e) {
            throw new IllegalArgumentException("manifest field \"" + col.path() + "\": " + e.getMessage(), e);
        }
    }

    /** What the manifest says of a model besides its rows, every value checked. */
    private record Described(String toolVersion, Instant created, SourceInfo source, ModelColumns columns,
                             ModelSettings settings, double[] center, double[] spread, double[] whitening,
                             ReferenceModel.ResidualScale residual, TuningSummary tuning) {
        ReferenceModel with(ReferenceRows rows) {
            return new ReferenceModel(toolVersion, created, source, columns, settings, center, spread, whitening,
                    residual, tuning, rows);
        }
    }

    private static Described describedOf(ManifestFields m, ModelColumns columns, int rows) {
        ManifestFields src = m.object("source");
        String sha = src.textOrNull("sha256");
        if (sha != null && !sha.matches("[0-9a-f]{64}")) {
            throw src.bad("sha256", "is not 64 lower-case hex digits");
        }
        String sourceName = src.text("name");
        if (sourceName.isEmpty()) {
            throw src.bad("name", "is empty");
        }
        SourceInfo source = new SourceInfo(sourceName,
                src.required("size") == null ? -1 : src.whole("size", 0, MAX_EXACT_WHOLE), sha,
                m.textOrNull("row_condition"));
        ModelSettings settings = settingsOf(m, rows);
        ManifestFields scaling = m.object("scaling");
        int d = columns.inputs().size();
        double[] center = scaling.finiteDoubles("center", d);
        double[] spread = scaling.finiteDoubles("spread", d);
        checkScaling(scaling, settings.scaling(), center, spread);
        double[] whitening = whiteningOf(scaling, settings.metric(), d);
        ManifestFields flags = m.object("flags");
        ReferenceModel.ResidualScale residual = new ReferenceModel.ResidualScale(
                flags.numberOrNaN("residual_median"), flags.numberOrNaN("residual_scale"));
        if (residual.scale() < 0) {
            throw flags.bad("residual_scale", "is " + Json.write(residual.scale()) + "; a scale cannot be negative");
        }
        TuningSummary tuning = m.required("tuning") == null ? null : TuningSummary.fromJson(m.object("tuning"));
        return new Described(m.text("tool_version"), created(m), source, columns, settings, center, spread,
                whitening, residual, tuning);
    }

    /** The settings; k must be at least 1 and at most the stored rows. */
    private static ModelSettings settingsOf(ManifestFields m, int rows) {
        ManifestFields scaling = m.object("scaling");
        ManifestFields flags = m.object("flags");
        String metric = m.oneOf("metric", ModelSettings.METRICS);
        String weights = m.oneOf("weights", ModelSettings.WEIGHTS);
        String method = scaling.oneOf("method", ModelSettings.SCALINGS);
        String band = m.oneOf("band", ModelSettings.BANDS);
        String zScale = flags.oneOf("z_scale", ModelSettings.Z_SCALES);
        if (rows == 0) {
            throw new IllegalArgumentException("the model holds no usable reference rows (its manifest says \"rows\": 0)");
        }
        int k = m.integer("k", 1, rows);
        double threshold = flags.number("threshold");
        if (!(threshold > 0)) {
            throw flags.bad("threshold", "is " + Json.write(threshold) + "; a flag threshold must be positive");
        }
        // Files written before the estimate existed have no field: they were fitted with the mean.
        String estimate = m.present("estimate") ? m.oneOf("estimate", ModelSettings.ESTIMATES) : ModelSettings.ESTIMATES.get(0);
        return new ModelSettings(metric, weights, method, k, band, threshold, zScale, estimate);
    }

    /** Spreads positive and of normal size (a subnormal divisor overflows); "none" is centre 0, spread 1. */
    private static void checkScaling(ManifestFields scaling, String method, double[] center, double[] spread) {
        for (int j = 0; j < spread.length; j++) {
            if (!(spread[j] >= Double.MIN_NORMAL)) {
                throw scaling.bad("spread[" + j + "]", "is " + Json.write(spread[j]) + "; a spread must be positive"
                        + (spread[j] > 0 ? " and at least " + Double.MIN_NORMAL : ""));
            }
            if ("none".equals(method) && (center[j] != 0 || spread[j] != 1)) {
                throw scaling.bad(center[j] != 0 ? "center[" + j + "]" : "spread[" + j + "]",
                        "must be " + (center[j] != 0 ? "0" : "1") + " when \"scaling.method\" is none");
            }
        }
    }

    /**
     * The whitening matrix: for the Mahalanobis metric d×d finite values, lower triangular with a
     * positive diagonal (the inverse of a Cholesky factor, as the fit computes it); else null.
     */
    private static double[] whiteningOf(ManifestFields scaling, String metric, int d) {
        boolean mahalanobis = "mahalanobis".equals(metric);
        if (!mahalanobis) {
            if (scaling.required("whitening") != null) {
                throw scaling.bad("whitening", "must be null for the " + metric + " metric");
            }
            return null;
        }
        if (scaling.required("whitening") == null) {
            throw scaling.bad("whitening", "is missing (null); the mahalanobis metric needs it");
        }
        double[] w = scaling.finiteDoubles("whitening", d * d);
        for (int i = 0; i < d; i++) {
            if (!(w[i * d + i] > 0)) {
                throw scaling.bad("whitening[" + (i * d + i) + "]", "is " + Json.write(w[i * d + i])
                        + "; the diagonal of the whitening matrix must be positive");
            }
            for (int k = i + 1; k < d; k++) {
                if (w[i * d + k] != 0) {
                    throw scaling.bad("whitening[" + (i * d + k) + "]", "is " + Json.write(w[i * d + k])
                            + "; the whitening matrix is lower triangular, so it must be 0");
                }
            }
        }
        return w;
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

    private static Instant created(ManifestFields m) {
        String text = m.text("created");
        try {
            return Instant.parse(text);
        } catch (DateTimeParseException e) {
            throw m.bad("created", "is not an ISO 8601 UTC time: " + text);
        }
    }
}
