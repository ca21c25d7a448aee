package nearfit.cli;

import java.io.PrintWriter;
import java.time.Instant;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

import nearfit.knn.KnnSettings;
import nearfit.knn.ReferenceReach;
import nearfit.knn.ZBasis;
import nearfit.model.JsonText;
import nearfit.table.RowSource;
import nearfit.model.TuningSummary;
import nearfit.table.VisibleText;

/**
 * The outcome of {@code check}: what was checked, counts over all rows and per group, the rows beyond the
 * reference, the worst rows, and whether the check passed. Built by {@link Tally} block by block; printed as
 * text or JSON, both ending with the cautions.
 *
 * @param about     what was checked and how (model, data, settings, the run)
 * @param rows      rows read (after the row condition)
 * @param scored    rows with a finite z (inputs and response present)
 * @param flagged   scored rows with |z| above the threshold
 * @param limit     the allowed flagged share, a fraction
 * @param threshold the |z| threshold
 * @param beyond    scored rows beyond the reference, per input and far, with the allowed share
 * @param groups    per-group counts in dictionary order, empty without a group column
 * @param worst     the rows of largest |z|, largest first
 */
public record CheckReport(About about, long rows, long scored, long flagged, double limit, double threshold,
                   Beyond beyond, List<GroupCount> groups, List<WorstRow> worst) {

    /**
     * What a check ran on, so that a ticket built from the report can be reproduced.
     *
     * @param modelFile      the model file as named
     * @param modelSha256    its SHA-256, lower-case hex
     * @param dataFile       the data file as named ({@code -} for standard input)
     * @param rowCondition   the row condition, or {@code null}
     * @param settings       k, metric, weights, scaling, band and z scale in effect (the report spells them
     *                       with their command-line words)
     * @param scheme         how k was chosen, e.g. {@code leave-one-out (one-SE k)} or {@code given (not tuned)}
     * @param residualMedian the reference's median leave-one-out residual (response units)
     * @param residualScale  1.4826 times their MAD (response units)
     * @param toolVersion    the version of nearfit that ran the check
     * @param ranAt          when the check ran (UTC, whole seconds)
     * @param inputs         the model's inputs
     * @param response       the model's response
     * @param group          the group column, or {@code null}
     * @param timeColumn     the data file's time column shown beside each row, or {@code null}
     * @param rowSource      what a worst row's source-row value means (CSV line, or Parquet file and row)
     * @param basis          what divided the residuals ({@link Basis})
     */
    public record About(String modelFile, String modelSha256, String dataFile, String rowCondition, KnnSettings settings,
                 String scheme, double residualMedian,
                 double residualScale, String toolVersion, Instant ranAt, List<String> inputs, String response,
                 String group, String timeColumn, RowSource rowSource, Basis basis) {
        /** With the basis the settings name when nothing else is known: local, or one reference-wide scale. */
        public About(String modelFile, String modelSha256, String dataFile, String rowCondition, KnnSettings settings,
              String scheme, double residualMedian, double residualScale, String toolVersion, Instant ranAt,
              List<String> inputs, String response, String group, String timeColumn, RowSource rowSource) {
            this(modelFile, modelSha256, dataFile, rowCondition, settings, scheme, residualMedian, residualScale,
                    toolVersion, ranAt, inputs, response, group, timeColumn, rowSource,
                    Basis.of(settings.flagScale() == nearfit.knn.FlagScale.LOCAL_SD ? new ZBasis.LocalSpread()
                            : new ZBasis.ReferenceResiduals(residualMedian, residualScale), null));
        }

        /** This description with the basis the scoring really used. */
        public About withBasis(Basis b) {
            return new About(modelFile, modelSha256, dataFile, rowCondition, settings, scheme, residualMedian,
                    residualScale, toolVersion, ranAt, inputs, response, group, timeColumn, rowSource, b);
        }

        /** Rows of a CSV file, traced by line (a fleet job traces its rows itself, in {@link WorstRow#source}). */
        public About(String modelFile, String modelSha256, String dataFile, String rowCondition, KnnSettings settings,
              String scheme, double residualMedian, double residualScale, String toolVersion, Instant ranAt,
              List<String> inputs, String response, String group, String timeColumn) {
            this(modelFile, modelSha256, dataFile, rowCondition, settings, scheme, residualMedian, residualScale,
                    toolVersion, ranAt, inputs, response, group, timeColumn, RowSource.CSV_LINES);
        }
    }

    /**
     * What divided the residuals, for the report: {@code neighbour_spread} (local: the neighbours' spread of
     * responses), {@code neighbour_residuals} (reference: the median and 1.4826·MAD of the neighbours' held-out
     * residuals, at least {@code floor}) or {@code reference_wide} (reference, from a model file that stores no
     * per-row residuals: one scale for the whole reference).
     *
     * @param kind   one of the three words above
     * @param scheme the {@code --cv} words of the scheme the residuals were held out by, or {@code null}
     * @param floor  the smallest divisor of {@code neighbour_residuals}, NaN otherwise
     */
    public record Basis(String kind, String scheme, double floor) {
        /** The basis a scoring call was given, with the scheme of the model's stored residuals (or null). */
        public static Basis of(ZBasis z, String scheme) {
            if (z instanceof ZBasis.NeighbourResiduals r) {
                return new Basis("neighbour_residuals", scheme, r.floor());
            }
            return new Basis(z instanceof ZBasis.LocalSpread ? "neighbour_spread" : "reference_wide", null, Double.NaN);
        }

        /** The words of the text report's flags line. */
        String words() {
            return switch (kind) {
                case "neighbour_residuals" -> "the median and 1.4826 MAD of the neighbours' held-out residuals ("
                        + scheme + "), at least " + TuneReport.significant(floor);
                case "neighbour_spread" -> "the neighbours' spread of responses";
                default -> "one reference-wide scale";
            };
        }
    }

    /** Counts for one group; {@code beyond} of its scored rows lie beyond the reference. */
    public record GroupCount(String group, long rows, long scored, long flagged, long beyond) {
        double share() {
            return scored == 0 ? 0.0 : (double) flagged / scored;
        }

        double beyondShare() {
            return scored == 0 ? 0.0 : (double) beyond / scored;
        }
    }

    /**
     * One of the worst rows, with what traces it: line, time (epoch ms, NaN without a time column or when
     * missing), group, the inputs' values (times in epoch ms), then response, fit, band, residual and z.
     * {@code source} is {@code null} for a row of the one data file, {@code line} its line; a fleet job
     * names the row's file there, and {@code line} is then the row's index in that file (0 for its first row).
     */
    public record WorstRow(long line, double time, String group, double[] inputs, double response, double fit,
                           double bandLow, double bandHigh, double z, boolean beyond, String source) {
        double residual() {
            return response - fit;
        }
    }

    /**
     * Scored rows beyond the reference ({@link ReferenceReach}): per input below or above its range, far
     * from every reference row, and in all (a row counts once however many rules it meets).
     *
     * @param min           per input, the reference's smallest value
     * @param max           per input, the reference's largest value
     * @param below         per input, scored rows below min
     * @param above         per input, scored rows above max
     * @param far           scored rows whose window width exceeds {@code farWidth}
     * @param farWidth      the window width above which a row is far; NaN when the rule is off
     * @param rows          scored rows beyond the reference by any rule
     * @param maxOutside    the allowed share of such rows, a fraction; NaN for no limit
     */
    public record Beyond(double[] min, double[] max, long[] below, long[] above, long far, double farWidth, long rows,
                  double maxOutside) {
        boolean limited() {
            return !Double.isNaN(maxOutside);
        }
    }

    /** The share of scored rows flagged; 0 when none was scored. */
    double flaggedFraction() {
        return scored == 0 ? 0.0 : (double) flagged / scored;
    }

    /** The share of scored rows beyond the reference; 0 when none was scored. */
    double beyondFraction() {
        return scored == 0 ? 0.0 : (double) beyond.rows() / scored;
    }

    /** Whether the flagged share is within the limit. */
    boolean flagsWithinLimit() {
        return flaggedFraction() <= limit;
    }

    /** Whether the share beyond the reference is within {@code --max-outside} (always, without one). */
    boolean beyondWithinLimit() {
        return !beyond.limited() || beyondFraction() <= beyond.maxOutside();
    }

    /** Whether the check passed: flags within the limit and rows beyond the reference within theirs. */
    public boolean passed() {
        return flagsWithinLimit() && beyondWithinLimit();
    }

    /**
     * Counts rows one block at a time, in row order, keeping only the counts and the worst rows, so rows
     * can be scored and tallied block by block. Ties among the worst rows keep the earlier row.
     */
    static final class Tally {
        private final About about;
        private final List<String> groupLabels;
        private final double threshold;
        private final ReferenceReach reach;
        private final long[] gRows;
        private final long[] gScored;
        private final long[] gFlagged;
        private final long[] gBeyond;
        private final long[] below;
        private final long[] above;
        /** Unscored rows with input j missing (j < inputs), or with the response missing (j = inputs). */
        private final long[] missing;
        private final WorstRows<WorstRow> worst;
        private long rows;
        private long scored;
        private long flagged;
        private long far;
        private long beyond;

        /** A tally over the given group labels (empty without a group column); reach null counts nothing beyond. */
        Tally(About about, List<String> groupLabels, double threshold, ReferenceReach reach, int worstCount) {
            this.about = about;
            this.groupLabels = groupLabels;
            this.threshold = threshold;
            this.reach = reach;
            int groups = groupLabels.size();
            gRows = new long[groups];
            gScored = new long[groups];
            gFlagged = new long[groups];
            gBeyond = new long[groups];
            int d = about.inputs().size();
            below = new long[d];
            above = new long[d];
            missing = new long[d + 1];
            worst = new WorstRows<>(worstCount);
        }

        /** Counts every row of a scored block (a number response with the response in the file). */
        void add(ScoredRows.Block b) {
            double[] z = b.z();
            double[][] x = b.x();
            double[] width = b.estimates().windowWidth();
            for (int i = 0; i < b.size(); i++) {
                int group = b.groups() == null ? -1 : b.groups()[i];
                rows++;
                if (group >= 0) {
                    gRows[group]++;
                }
                if (Double.isNaN(z[i])) {
                    countMissing(x, b.response(), i);
                    continue;
                }
                scored++;
                boolean flag = b.scores().flagged()[i];
                boolean out = beyond(x, width[i], i);
                if (group >= 0) {
                    gScored[group]++;
                    gFlagged[group] += flag ? 1 : 0;
                    gBeyond[group] += out ? 1 : 0;
                }
                flagged += flag ? 1 : 0;
                beyond += out ? 1 : 0;
                double a = Math.abs(z[i]);
                if (worst.admits(a)) {
                    worst.offer(worstRow(b, i, group, out), a);
                }
            }
        }

        private void countMissing(double[][] x, double[] y, int i) {
            for (int j = 0; j < x.length; j++) {
                missing[j] += Double.isNaN(x[j][i]) ? 1 : 0;
            }
            missing[x.length] += Double.isNaN(y[i]) ? 1 : 0;
        }

        /** Counts row i against the reference's reach; whether it lies beyond by any rule. */
        private boolean beyond(double[][] x, double windowWidth, int i) {
            if (reach == null) {
                return false;
            }
            int met = reach.rulesMet(x, i, windowWidth, below, above);
            far += (met & ReferenceReach.FAR) != 0 ? 1 : 0;
            return met != 0;
        }

        private WorstRow worstRow(ScoredRows.Block b, int i, int group, boolean out) {
            double[] inputs = new double[b.x().length];
            for (int j = 0; j < inputs.length; j++) {
                inputs[j] = b.x()[j][i];
            }
            return new WorstRow(b.lines()[i], b.times() == null ? Double.NaN : b.times()[i],
                    group < 0 ? null : groupLabels.get(group), inputs, b.response()[i],
                    b.estimates().fit()[i], b.estimates().bandLow()[i], b.estimates().bandHigh()[i], b.z()[i], out, null);
        }

        /** Rows scored so far. */
        long scored() {
            return scored;
        }

        /** Rows counted so far (those meeting the row condition). */
        long rows() {
            return rows;
        }

        /**
         * Why rows were not scored, e.g. {@code wind_ms missing in 3, power_kw missing in 120}; empty when
         * every row was scored.
         */
        String missingValues() {
            StringBuilder sb = new StringBuilder();
            List<String> names = new ArrayList<>(about.inputs());
            names.add(about.response());
            for (int j = 0; j < missing.length; j++) {
                if (missing[j] > 0) {
                    sb.append(sb.length() == 0 ? "" : ", ").append(VisibleText.of(names.get(j)))
                            .append(" missing in ").append(missing[j]);
                }
            }
            return sb.toString();
        }

        /** The report of the rows counted so far; {@code maxOutside} NaN for no limit on rows beyond. */
        CheckReport report(double limit, double maxOutside) {
            List<GroupCount> byGroup = new ArrayList<>();
            for (int g = 0; g < gRows.length; g++) {
                if (gRows[g] > 0) {
                    byGroup.add(new GroupCount(groupLabels.get(g), gRows[g], gScored[g], gFlagged[g], gBeyond[g]));
                }
            }
            int d = below.length;
            double[] min = new double[d];
            double[] max = new double[d];
            for (int j = 0; j < d; j++) {
                min[j] = reach == null ? Double.NaN : reach.min(j);
                max[j] = reach == null ? Double.NaN : reach.max(j);
            }
            Beyond out = new Beyond(min, max, below.clone(), above.clone(), far,
                    reach == null ? Double.NaN : reach.farWidth(), beyond, maxOutside);
            return new CheckReport(about, rows, scored, flagged, limit, threshold, out, byGroup,
                    worst.largestFirst());
        }
    }

    /** The JSON document of {@code check --format json}. */
    public String toJson() {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("checked", aboutJson());
        m.put("rows", rows);
        m.put("scored", scored);
        m.put("flagged", flagged);
        m.put("flagged_fraction", flaggedFraction());
        m.put("limit", limit);
        m.put("passed", passed());
        m.put("threshold", threshold);
        m.put("beyond_reference", beyondJson());
        Map<String, Object> byGroup = new LinkedHashMap<>();
        for (GroupCount g : groups) {
            Map<String, Object> one = new LinkedHashMap<>();
            one.put("rows", g.rows());
            one.put("scored", g.scored());
            one.put("flagged", g.flagged());
            one.put("flagged_fraction", g.share());
            one.put("beyond_reference", g.beyond());
            one.put("beyond_fraction", g.beyondShare());
            byGroup.put(g.group(), one);
        }
        m.put("by_group", byGroup);
        List<Object> worstRows = new ArrayList<>();
        for (WorstRow w : worst) {
            Map<String, Object> one = new LinkedHashMap<>();
            RowSource src = about.rowSource();
            if (w.source() != null) {
                // A row a fleet job read: its file and 0-based row index there.
                one.put("file", w.source());
                one.put("row", w.line());
            } else if (!src.isParquet()) {
                one.put("line", w.line());
            } else {
                // A Parquet row: its file (the data set's file, or the one file) and 0-based row index.
                one.put("file", src.files().size() == 1 ? about.dataFile() : src.fileOf(w.line()));
                one.put("row", src.rowIndex(w.line()));
            }
            if (about.timeColumn() != null) {
                one.put("time", Double.isNaN(w.time()) ? null : Instant.ofEpochMilli((long) w.time()).toString());
            }
            one.put("group", w.group());
            Map<String, Object> inputs = new LinkedHashMap<>();
            for (int j = 0; j < w.inputs().length; j++) {
                inputs.put(about.inputs().get(j), w.inputs()[j]);
            }
            one.put("inputs", inputs);
            one.put("response", w.response());
            one.put("fit", w.fit());
            one.put("band_lo", w.bandLow());
            one.put("band_hi", w.bandHigh());
            one.put("resid", w.residual());
            one.put("z", w.z());
            one.put("beyond_reference", w.beyond());
            worstRows.add(one);
        }
        m.put("worst", worstRows);
        m.put("caution", Cautions.TEXT);
        return JsonText.write(m);
    }

    private Map<String, Object> aboutJson() {
        Map<String, Object> a = new LinkedHashMap<>();
        a.put("model", about.modelFile());
        a.put("model_sha256", about.modelSha256());
        a.put("data", about.dataFile());
        a.put("row_condition", about.rowCondition());
        a.put("inputs", about.inputs());
        a.put("response", about.response());
        a.put("group", about.group());
        a.put("time_column", about.timeColumn());
        KnnSettings s = about.settings();
        a.put("k", (long) s.k());
        a.put("k_chosen_by", about.scheme());
        a.put("metric", s.metric().word());
        a.put("weights", s.weighting().word());
        a.put("scaling", s.scaling().word());
        a.put("band", s.band().word());
        a.put("threshold", threshold);
        a.put("z_scale", s.flagScale().word());
        a.put("residual_median", about.residualMedian());
        a.put("residual_scale", about.residualScale());
        a.put("z_basis", about.basis().kind());
        a.put("residual_scheme", about.basis().scheme());
        a.put("z_floor", Double.isNaN(about.basis().floor()) ? null : (Object) about.basis().floor());
        a.put("tool_version", about.toolVersion());
        a.put("run_at", about.ranAt().toString());
        return a;
    }

    private Map<String, Object> beyondJson() {
        Map<String, Object> b = new LinkedHashMap<>();
        b.put("rows", beyond.rows());
        b.put("fraction", beyondFraction());
        b.put("max_outside", beyond.limited() ? (Object) beyond.maxOutside() : null);
        b.put("passed", beyondWithinLimit());
        Map<String, Object> inputs = new LinkedHashMap<>();
        for (int j = 0; j < beyond.min().length; j++) {
            Map<String, Object> one = new LinkedHashMap<>();
            one.put("reference_min", beyond.min()[j]);
            one.put("reference_max", beyond.max()[j]);
            one.put("below", beyond.below()[j]);
            one.put("above", beyond.above()[j]);
            inputs.put(about.inputs().get(j), one);
        }
        b.put("by_input", inputs);
        b.put("far", beyond.far());
        b.put("far_window_width", beyond.farWidth());
        return b;
    }

    /** The text report: what was checked, the verdict, rows beyond the reference, groups, worst rows, cautions. */
    public void writeText(PrintWriter out) {
        writeHeader(out);
        out.println();
        out.printf(Locale.ROOT, "rows %d, scored %d, flagged %d (%s %%, |z| > %s), limit %s %%: %s%n",
                rows, scored, flagged, percent(flaggedFraction()), TuneReport.significant(threshold),
                percent(limit), passed() ? "PASSED" : "FAILED");
        writeBeyond(out);
        String groupName = about.group() == null ? "" : VisibleText.of(about.group());
        if (!groups.isEmpty()) {
            out.println();
            out.printf(Locale.ROOT, "%-12s %10s %10s %10s %9s %10s %9s%n", VisibleText.of(groupName), "rows", "scored", "flagged",
                    "share %", "beyond", "share %");
            for (GroupCount g : groups) {
                out.printf(Locale.ROOT, "%-12s %10d %10d %10d %9s %10d %9s%n", VisibleText.of(g.group()), g.rows(),
                        g.scored(), g.flagged(), percent(g.share()), g.beyond(), percent(g.beyondShare()));
            }
        }
        if (!worst.isEmpty()) {
            out.println();
            out.println("worst rows (by |z|; * beyond the reference):");
            writeWorst(out, groupName);
        }
        out.println();
        out.println("Caution: " + Cautions.TEXT);
        out.flush();
    }

    private void writeHeader(PrintWriter out) {
        out.printf(Locale.ROOT, "model: %s (sha256 %s)%n", VisibleText.of(about.modelFile()), about.modelSha256());
        out.printf(Locale.ROOT, "data: %s%s%n", VisibleText.of(about.dataFile()), about.rowCondition() == null ? ""
                : ", where " + VisibleText.of(about.rowCondition()));
        KnnSettings s = about.settings();
        out.printf(Locale.ROOT, "settings: k %d (%s), metric %s, weights %s, scaling %s, band %s%n", s.k(),
                about.scheme(), s.metric().word(), s.weighting().word(), s.scaling().word(), s.band().word());
        out.printf(Locale.ROOT, "flags: |z| > %s, z scale %s: %s (reference residuals: median %s, 1.4826 MAD %s)%n",
                TuneReport.significant(threshold), s.flagScale().word(), about.basis().words(),
                TuneReport.significant(about.residualMedian()), TuneReport.significant(about.residualScale()));
        if (about.basis().kind().equals("reference_wide")) {
            out.println("note: the model file stores no per-row held-out residuals (written before they were), so z "
                    + "divides by one scale for the whole reference; fit again to have it follow the curve");
        }
        out.printf(Locale.ROOT, "run: nearfit %s at %s%n", about.toolVersion(), about.ranAt());
    }

    private void writeBeyond(PrintWriter out) {
        String limitText = beyond.limited()
                ? String.format(Locale.ROOT, "--max-outside %s %%: %s", percent(beyond.maxOutside()),
                        beyondWithinLimit() ? "within" : "EXCEEDED")
                : "no limit (--max-outside)";
        out.printf(Locale.ROOT, "beyond the reference: %d of %d scored rows (%s %%), %s%n", beyond.rows(), scored,
                percent(beyondFraction()), limitText);
        for (int j = 0; j < beyond.min().length; j++) {
            out.printf(Locale.ROOT, "  %s: %d below %s, %d above %s (the reference's range)%n",
                    VisibleText.of(about.inputs().get(j)), beyond.below()[j], TuneReport.significant(beyond.min()[j]),
                    beyond.above()[j], TuneReport.significant(beyond.max()[j]));
        }
        if (Double.isNaN(beyond.farWidth())) {
            out.println("  far from every reference row: not judged (k leaves no reference row out)");
        } else {
            out.printf(Locale.ROOT, "  far from every reference row: %d (window width above %s)%n", beyond.far(),
                    TuneReport.significant(beyond.farWidth()));
        }
    }

    private void writeWorst(PrintWriter out, String groupName) {
        boolean time = about.timeColumn() != null && !about.inputs().contains(about.timeColumn());
        RowSource src = about.rowSource();
        boolean sources = !worst.isEmpty() && worst.get(0).source() != null;
        boolean wide = sources || src.isParquet() && src.files().size() > 1;
        String origin = wide ? "%-40s" : "%10s";
        StringBuilder head = new StringBuilder(String.format(Locale.ROOT, origin, wide ? "file:row" : src.heading()));
        if (time) {
            head.append(String.format(Locale.ROOT, " %-20s", VisibleText.of(about.timeColumn())));
        }
        head.append(String.format(Locale.ROOT, " %-12s", groupName == null ? "" : VisibleText.of(groupName)));
        for (String input : about.inputs()) {
            head.append(String.format(Locale.ROOT, " %12s", VisibleText.of(input)));
        }
        head.append(String.format(Locale.ROOT, " %12s %12s %12s %12s %12s %9s", VisibleText.of(about.response()),
                "fit", "band_lo", "band_hi", "resid", "z"));
        out.println(head);
        for (WorstRow w : worst) {
            // A fleet job's row names its own file; the tool's rows go through the table's row source.
            String place = w.source() != null ? w.source() + ":" + w.line() : src.label(w.line());
            StringBuilder row = new StringBuilder(String.format(Locale.ROOT, origin, VisibleText.of(place)));
            if (time) {
                row.append(String.format(Locale.ROOT, " %-20s", timeText(w.time())));
            }
            row.append(String.format(Locale.ROOT, " %-12s", w.group() == null ? "" : VisibleText.of(w.group())));
            for (int j = 0; j < w.inputs().length; j++) {
                boolean isTime = about.inputs().get(j).equals(about.timeColumn());
                row.append(String.format(Locale.ROOT, " %12s",
                        isTime ? timeText(w.inputs()[j]) : TuneReport.significant(w.inputs()[j])));
            }
            row.append(String.format(Locale.ROOT, " %12s %12s %12s %12s %12s %9s%s",
                    TuneReport.significant(w.response()), TuneReport.significant(w.fit()),
                    TuneReport.significant(w.bandLow()), TuneReport.significant(w.bandHigh()),
                    TuneReport.significant(w.residual()), String.format(Locale.ROOT, "%.2f", w.z()),
                    w.beyond() ? " *" : ""));
            out.println(row);
        }
    }

    /** How the model's k was chosen, in words; what the model file records and nothing more. */
    public static String scheme(TuningSummary tuning) {
        if (tuning == null) {
            return "given at fit, not tuned";
        }
        if (tuning.scheme() != null) {
            return "one-SE k by " + tuning.scheme();
        }
        if (tuning.sampled() >= 0) {
            return "one-SE k by leave-one-out on " + tuning.sampled() + " sampled rows";
        }
        return "one-SE k by cross-validation; this model file does not record the scheme";
    }

    private static String timeText(double ms) {
        return Double.isNaN(ms) ? "-" : Instant.ofEpochMilli((long) ms).toString();
    }

    private static String percent(double fraction) {
        return String.format(Locale.ROOT, "%.2f", 100.0 * fraction);
    }
}
