package nearfit.model;

import java.math.BigDecimal;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.time.format.DateTimeParseException;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.Collection;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import nearfit.knn.Band;
import nearfit.knn.EstimateKind;
import nearfit.knn.FlagScale;
import nearfit.knn.KnnSettings;
import nearfit.knn.Metric;
import nearfit.knn.Scaling;
import nearfit.knn.Weighting;
import nearfit.table.NearfitException;

import static nearfit.model.ManifestValues.choice;
import static nearfit.model.ManifestValues.finiteDoubles;
import static nearfit.model.ManifestValues.integer;
import static nearfit.model.ManifestValues.number;
import static nearfit.model.ManifestValues.numberOrNaN;
import static nearfit.model.ManifestValues.object;
import static nearfit.model.ManifestValues.spelled;
import static nearfit.model.ManifestValues.text;
import static nearfit.model.ManifestValues.texts;
import static nearfit.model.ManifestValues.whole;

/**
 * Saves and loads a {@link ReferenceModel} as a model file (suggested extension {@code .nfm}): a
 * {@link ModelArchive} whose manifest carries the settings and whose arrays carry the reference rows.
 *
 * <p>Arrays: {@code input.J} (f64, input J in manifest order), {@code response} (f64) or
 * {@code response_code} (i32), {@code group_code} (i32, only with a group), {@code source_line}
 * (i64: the CSV line, or for Parquet rows the file number and row index packed as {@link nearfit.table.RowSource}
 * packs them, the files listed in the manifest's {@code source.parquet_files}) and {@code heldout_residual} (f64,
 * each row's held-out residual; only when the manifest names {@code flags.residual_scheme}, absent in older files).
 * The manifest fields are listed in docs of {@link #manifestOf}; loading checks that each is
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
        if (model.residualScale().heldOut() != null) {
            arrays.put(HELD_OUT, model.residualScale().heldOut());
        }
        ModelArchive.write(target, force, inputs, manifestOf(model), arrays);
    }

    /**
     * The manifest fields of a model (ModelArchive adds format, format_version and entries):
     * tool_version, created (ISO 8601 UTC), source {name, size, sha256, parquet_files (only for Parquet rows:
     * [{name, size, sha256}], the files the packed source_line values point at)}, row_condition, rows,
     * columns {inputs, response, response_labels, group, group_labels}, scaling {method, center,
     * spread, whitening}, metric, weights, k, band, estimate (absent in files written before it: the
     * mean), flags {threshold, residual_median, residual_scale,
     * z_scale, residual_scheme (absent in older files and for a category)}, tuning (the tune JSON object, or null).
     */
    static ManifestDocument manifestOf(ReferenceModel model) {
        ModelColumns c = model.columns();
        KnnSettings s = model.settings();
        return new ManifestDocument(model.toolVersion(),
                model.created().truncatedTo(ChronoUnit.SECONDS).toString(),
                new ManifestDocument.SourceFields(model.source().name(),
                        model.source().sizeBytes() < 0 ? null : BigDecimal.valueOf(model.source().sizeBytes()),
                        model.source().sha256(), parquetFilesOf(model.source())),
                model.source().rowCondition(), BigDecimal.valueOf(model.rows().size()),
                new ManifestDocument.ColumnFields(c.inputs(), c.response(), c.responseLabels(), c.group(), c.groupLabels()),
                new ManifestDocument.ScalingFields(s.scaling().word(), ManifestDocument.listOf(model.scaleCenter()),
                        ManifestDocument.listOf(model.scaleSpread()), ManifestDocument.listOf(model.whitening())),
                s.metric().word(), s.weighting().word(), BigDecimal.valueOf(s.k()), s.band().word(),
                s.estimate().word(),
                new ManifestDocument.FlagFields(s.flagThreshold(), model.residualScale().median(),
                        model.residualScale().scale(), s.flagScale().word(), model.residualScale().scheme()),
                model.tuning() == null ? null : (ManifestDocument.TuningFields) model.tuning().toJson());
    }

    /** {@code source.parquet_files}: null for CSV lines, so a CSV model's manifest is what it always was. */
    private static List<ManifestDocument.FileFields> parquetFilesOf(SourceInfo source) {
        if (source.parquetFiles() == null) {
            return null;
        }
        List<ManifestDocument.FileFields> out = new ArrayList<>();
        for (SourceInfo.SourceFile f : source.parquetFiles()) {
            out.add(new ManifestDocument.FileFields(f.name(), BigDecimal.valueOf(f.sizeBytes()), f.sha256()));
        }
        return out;
    }

    /** The checked {@code source.parquet_files}, or null when absent (CSV lines). */
    private static List<SourceInfo.SourceFile> parquetFilesOf(List<ManifestDocument.FileFields> files) {
        if (files == null) {
            return null;
        }
        if (files.isEmpty() || files.size() > nearfit.table.RowSource.MAX_FILES) {
            throw ManifestDocument.bad("source.parquet_files", "has " + files.size() + " entries; Parquet rows come from 1 to "
                    + nearfit.table.RowSource.MAX_FILES + " files");
        }
        List<SourceInfo.SourceFile> out = new ArrayList<>(files.size());
        for (int i = 0; i < files.size(); i++) {
            String field = "source.parquet_files[" + i + "]";
            ManifestDocument.FileFields f = object(field, files.get(i));
            String name = text(field + ".name", f.name());
            if (name.isEmpty()) {
                throw ManifestDocument.bad(field + ".name", "is empty");
            }
            long size = whole(field + ".size", f.size(), 0, MAX_EXACT_WHOLE);
            String sha = text(field + ".sha256", f.sha256());
            if (!sha.matches("[0-9a-f]{64}")) {
                throw ManifestDocument.bad(field + ".sha256", "is not 64 lower-case hex digits");
            }
            out.add(new SourceInfo.SourceFile(name, size, sha));
        }
        return out;
    }

    /** Each stored row's source value names one of the recorded Parquet files (CSV lines are not checked). */
    private static void checkOrigins(ReferenceRows rows, SourceInfo source) {
        nearfit.table.RowSource origin = source.rowSource();
        long[] values = rows.sourceLines();
        for (int i = 0; i < values.length; i++) {
            if (!origin.holds(values[i])) {
                throw new IllegalArgumentException("entry source_line holds " + values[i] + " at stored row " + (i + 1)
                        + ", which names no file of \"source.parquet_files\"");
            }
        }
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
            ManifestDocument m = ManifestDocument.of(archive.manifest());
            int rows = integer("rows", m.rows(), 0, Integer.MAX_VALUE);
            ModelColumns columns = columnsOf(object("columns", m.columns()));
            Described described = describedOf(m, columns, rows);
            String residualScheme = residualSchemeOf(m, columns);
            List<ModelArchive.Need> needs = needs(columns, rows);
            if (residualScheme != null) {
                needs.add(new ModelArchive.Need(HELD_OUT, ModelArchive.ElementType.F64, rows));
            }
            ModelArchive.Contents contents = archive.read(needs);
            ReferenceRows stored = rowsOf(contents, columns);
            checkCodes(stored, columns);
            checkOrigins(stored, described.source());
            StoredRowCheck.check(stored, columns, described.settings(), described.center(), described.spread(),
                    described.whitening(), described.source().rowSource());
            return withHeldOut(described.with(stored), contents, residualScheme);
        } catch (IllegalArgumentException e) {
            // Each check says what is wrong in a sentence of its own (the field, entry or row, and why).
            throw NearfitException.inFile(name, e.getMessage(), e);
        } catch (NearfitException e) {
            throw e.file() != null ? e : NearfitException.inFile(name, e.detail(), e);
        }
    }

    /**
     * As {@link #read(Path)}, from a model file's bytes (as a fleet job's workers receive them): the ZIP
     * reader needs random access, so the bytes go to a private temporary file that is removed once read.
     * Errors name {@code name}, the file the bytes came from.
     */
    public static ReferenceModel read(byte[] bytes, String name) {
        Path copy = null;
        try {
            copy = Files.createTempFile("nearfit-model-", ".nfm");
            Files.write(copy, bytes);
            return read(copy);
        } catch (java.io.IOException e) {
            throw NearfitException.inFile(name, "cannot be copied to a temporary file: " + e.getMessage(), e);
        } catch (NearfitException e) {
            throw NearfitException.inFile(name, e.detail(), e);
        } finally {
            if (copy != null) {
                try {
                    Files.deleteIfExists(copy);
                } catch (java.io.IOException ignored) {
                    // a leftover temporary file is harmless; the model was read or its error is on its way
                }
            }
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

    /** The entry of each stored row's held-out residual (f64, stored-row order); older files lack it. */
    static final String HELD_OUT = "heldout_residual";

    /**
     * {@code flags.residual_scheme}: the {@code --cv} words of the scheme the stored held-out residuals come
     * from, or null in files written before they were stored (then there is no such entry, and the reference
     * z scale is one scale for the whole reference). Only for a number response.
     */
    private static String residualSchemeOf(ManifestDocument m, ModelColumns columns) {
        String words = object("flags", m.flags()).residualScheme();
        if (words == null) {
            return null;
        }
        if (columns.categoryResponse()) {
            throw ManifestDocument.bad("flags.residual_scheme", "must be absent for a category response");
        }
        if (!words.matches("[a-z0-9:+.]{1,64}")) {
            throw ManifestDocument.bad("flags.residual_scheme", "is not a held-out scheme's words (such as block:1d)");
        }
        return words;
    }

    /**
     * The model with its stored held-out residuals, checked: every value finite (the fit writes no other), and
     * their median and 1.4826·MAD exactly the manifest's {@code flags.residual_median} and
     * {@code flags.residual_scale} (both are computed from the same residuals, so any difference is damage).
     */
    private static ReferenceModel withHeldOut(ReferenceModel model, ModelArchive.Contents contents, String scheme) {
        if (scheme == null) {
            return model;
        }
        double[] heldOut = contents.doubles(HELD_OUT);
        for (int i = 0; i < heldOut.length; i++) {
            if (!Double.isFinite(heldOut[i])) {
                throw new IllegalArgumentException("entry " + HELD_OUT + " holds " + heldOut[i] + " at stored row "
                        + (i + 1) + "; a held-out residual is finite");
            }
        }
        ReferenceModel.ResidualScale written = model.residualScale();
        nearfit.knn.ZBasis.ReferenceResiduals found = nearfit.knn.Tuning.residualScale(heldOut);
        if (Double.compare(found.median(), written.median()) != 0 || Double.compare(found.scale(), written.scale()) != 0) {
            throw new IllegalArgumentException("entry " + HELD_OUT + " gives a median of " + spelled(found.median())
                    + " and a scale of " + spelled(found.scale()) + ", but the manifest's \"flags\" say "
                    + spelled(written.median()) + " and " + spelled(written.scale()));
        }
        return model.withResidualScale(new ReferenceModel.ResidualScale(written.median(), written.scale(), heldOut,
                scheme));
    }

    private static ModelColumns columnsOf(ManifestDocument.ColumnFields col) {
        List<String> inputs = texts("columns.inputs", col.inputs());
        String response = text("columns.response", col.response());
        List<String> responseLabels = texts("columns.response_labels", col.responseLabels());
        String group = col.group();
        List<String> groupLabels = texts("columns.group_labels", col.groupLabels());
        if (inputs.isEmpty() || inputs.size() > MAX_INPUTS) {
            throw ManifestDocument.bad("columns.inputs", "has " + inputs.size() + " names; a model has 1 to "
                    + MAX_INPUTS + " inputs");
        }
        try {
            return new ModelColumns(inputs, response, responseLabels, group, groupLabels);
        } catch (IllegalArgumentException e) {
            throw new IllegalArgumentException("manifest field \"columns\": " + e.getMessage(), e);
        }
    }

    /** What the manifest says of a model besides its rows, every value checked. */
    private record Described(String toolVersion, Instant created, SourceInfo source, ModelColumns columns,
                             KnnSettings settings, double[] center, double[] spread, double[] whitening,
                             ReferenceModel.ResidualScale residual, TuningSummary tuning) {
        ReferenceModel with(ReferenceRows rows) {
            return new ReferenceModel(toolVersion, created, source, columns, settings, center, spread, whitening,
                    residual, tuning, rows);
        }
    }

    private static Described describedOf(ManifestDocument m, ModelColumns columns, int rows) {
        ManifestDocument.SourceFields src = object("source", m.source());
        String sha = src.sha256();
        if (sha != null && !sha.matches("[0-9a-f]{64}")) {
            throw ManifestDocument.bad("source.sha256", "is not 64 lower-case hex digits");
        }
        String sourceName = text("source.name", src.name());
        if (sourceName.isEmpty()) {
            throw ManifestDocument.bad("source.name", "is empty");
        }
        SourceInfo source = new SourceInfo(sourceName,
                src.size() == null ? -1 : whole("source.size", src.size(), 0, MAX_EXACT_WHOLE), sha,
                m.rowCondition(), parquetFilesOf(src.parquetFiles()));
        KnnSettings settings = settingsOf(m, rows);
        ManifestDocument.ScalingFields scaling = m.scaling();
        int d = columns.inputs().size();
        double[] center = finiteDoubles("scaling.center", scaling.center(), d);
        double[] spread = finiteDoubles("scaling.spread", scaling.spread(), d);
        checkScaling(settings.scaling(), center, spread);
        double[] whitening = whiteningOf(scaling, settings.metric(), d);
        ManifestDocument.FlagFields flags = m.flags();
        ReferenceModel.ResidualScale residual = new ReferenceModel.ResidualScale(
                numberOrNaN("flags.residual_median", flags.residualMedian()),
                numberOrNaN("flags.residual_scale", flags.residualScale()));
        if (residual.scale() < 0) {
            throw ManifestDocument.bad("flags.residual_scale", "is " + spelled(residual.scale())
                    + "; a scale cannot be negative");
        }
        TuningSummary tuning = m.tuning() == null ? null : TuningSummary.fromManifest(m.tuning(), "tuning");
        return new Described(text("tool_version", m.toolVersion()), created(m), source, columns, settings, center,
                spread, whitening, residual, tuning);
    }

    /**
     * The settings; k must be at least 1 and at most the stored rows. A file stores no thread count: the
     * settings read have 1 (the reader of the model sets its own).
     */
    private static KnnSettings settingsOf(ManifestDocument m, int rows) {
        ManifestDocument.ScalingFields scaling = object("scaling", m.scaling());
        ManifestDocument.FlagFields flags = object("flags", m.flags());
        Metric metric = choice("metric", m.metric(), Metric.values());
        Weighting weights = choice("weights", m.weights(), Weighting.values());
        Scaling method = choice("scaling.method", scaling.method(), Scaling.values());
        Band band = choice("band", m.band(), Band.values());
        FlagScale zScale = choice("flags.z_scale", flags.zScale(), FlagScale.offered());
        if (rows == 0) {
            throw new IllegalArgumentException("the model holds no usable reference rows (its manifest says \"rows\": 0)");
        }
        int k = integer("k", m.k(), 1, rows);
        double threshold = number("flags.threshold", flags.threshold());
        if (!(threshold > 0)) {
            throw ManifestDocument.bad("flags.threshold", "is " + spelled(threshold)
                    + "; a flag threshold must be positive");
        }
        // Files written before the estimate existed have no field: they were fitted with the mean.
        EstimateKind estimate = m.estimate() != null ? choice("estimate", m.estimate(), EstimateKind.values())
                : EstimateKind.MEAN;
        return new KnnSettings(k, metric, weights, method, band, estimate, threshold, zScale, 1);
    }

    /** Spreads positive and of normal size (a subnormal divisor overflows); "none" is centre 0, spread 1. */
    private static void checkScaling(Scaling method, double[] center, double[] spread) {
        for (int j = 0; j < spread.length; j++) {
            if (!(spread[j] >= Double.MIN_NORMAL)) {
                throw ManifestDocument.bad("scaling.spread[" + j + "]", "is " + spelled(spread[j])
                        + "; a spread must be positive" + (spread[j] > 0 ? " and at least " + Double.MIN_NORMAL : ""));
            }
            if (method == Scaling.NONE && (center[j] != 0 || spread[j] != 1)) {
                throw ManifestDocument.bad(center[j] != 0 ? "scaling.center[" + j + "]" : "scaling.spread[" + j + "]",
                        "must be " + (center[j] != 0 ? "0" : "1") + " when \"scaling.method\" is none");
            }
        }
    }

    /**
     * The whitening matrix: for the Mahalanobis metric d×d finite values, lower triangular with a
     * positive diagonal (the inverse of a Cholesky factor, as the fit computes it); else null.
     */
    private static double[] whiteningOf(ManifestDocument.ScalingFields scaling, Metric metric, int d) {
        boolean mahalanobis = metric == Metric.MAHALANOBIS;
        if (!mahalanobis) {
            if (scaling.whitening() != null) {
                throw ManifestDocument.bad("scaling.whitening", "must be null for the " + metric.word() + " metric");
            }
            return null;
        }
        if (scaling.whitening() == null) {
            throw ManifestDocument.bad("scaling.whitening", "is missing (null); the mahalanobis metric needs it");
        }
        double[] w = finiteDoubles("scaling.whitening", scaling.whitening(), d * d);
        for (int i = 0; i < d; i++) {
            if (!(w[i * d + i] > 0)) {
                throw ManifestDocument.bad("scaling.whitening[" + (i * d + i) + "]", "is " + spelled(w[i * d + i])
                        + "; the diagonal of the whitening matrix must be positive");
            }
            for (int k = i + 1; k < d; k++) {
                if (w[i * d + k] != 0) {
                    throw ManifestDocument.bad("scaling.whitening[" + (i * d + k) + "]", "is " + spelled(w[i * d + k])
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

    private static Instant created(ManifestDocument m) {
        String text = text("created", m.created());
        try {
            return Instant.parse(text);
        } catch (DateTimeParseException e) {
            throw ManifestDocument.bad("created", "is not an ISO 8601 UTC time: " + text);
        }
    }
}
