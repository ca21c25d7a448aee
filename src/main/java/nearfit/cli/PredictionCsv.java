package nearfit.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.Writer;
import java.nio.file.Path;
import java.util.Collection;
import java.util.List;

import nearfit.model.ResultCsv;
import nearfit.model.ResultParquet;
import nearfit.knn.ReferenceReach;
import nearfit.model.ResultSink;
import nearfit.table.RowSource;

/**
 * Writes scored rows through {@link ResultCsv}, the one CSV writer: {@code line}, the file's first time
 * column (when it has one and it is not an input), the group, the inputs, the response, then
 * {@code fit, band_lo, band_hi, resid, z} for a number response or {@code class, share} for a category
 * response, then {@code beyond}: the reference's one per-row rule ({@link ReferenceReach#rulesMet}), 1 when the
 * row's fit or vote is an extrapolation, 0 when not, empty where there is none.
 */
final class PredictionCsv {
    /** Which rows of a block to write. */
    @FunctionalInterface
    interface RowFilter {
        boolean keep(ScoredRows.Block block, int i);
    }

    private final ResultSink csv;
    private final RowSource rowSource;
    private final ScoredRows source;
    private final List<String> classLabels;
    /** Whether the time column is written on its own (it is not one of the inputs). */
    private final boolean timeColumn;
    /** The reference's reach for the {@code beyond} column, or null for none. */
    private final ReferenceReach reach;

    /** Starts {@code sink} (a CSV or Parquet form) with the columns of {@code source}'s rows. */
    private PredictionCsv(ResultSink sink, ScoredRows source, String responseName, List<String> classLabels,
                          ReferenceReach reach) throws IOException {
        this.csv = sink;
        this.rowSource = source.rowSource();
        this.source = source;
        this.classLabels = classLabels;
        this.timeColumn = source.time() != null && !source.inputNames().contains(source.time().name());
        this.reach = reach;
        csv.header(ResultCsv.rowColumns(rowSource, timeColumn ? source.time().name() : null,
                source.group() == null ? null : source.group().name(), source.inputNames(),
                source.hasResponse() ? responseName : null, source.categoryResponse(), this.reach != null));
    }

    /**
     * Scores every row of {@code s} block by block and writes those {@code filter} keeps to {@code target}, or
     * to standard output when it is {@code null} or {@code -}.
     */
    static void write(ScoredRows s, String responseName, List<String> classLabels, ReferenceReach reach, Path target,
                      boolean force, Collection<Path> inputs, PrintWriter stdout, RowFilter filter) {
        open(target, force, inputs, stdout, s, responseName, classLabels, reach, csv -> {
            s.forEachBlock(b -> csv.rows(b, filter));
        });
    }

    /** What is written between the header and the end of the file. */
    @FunctionalInterface
    interface Body {
        void writeTo(PredictionCsv rows) throws IOException;
    }

    /**
     * Opens the rows' output: Parquet when {@code target}'s name ends in {@code .parquet} (any case), else
     * CSV; standard output ({@code null} or {@code -}) is always CSV. Writes the header, runs {@code body},
     * then ends the file. With {@code reach} not null, the rows end with {@code beyond}.
     */
    static void open(Path target, boolean force, Collection<Path> inputs, PrintWriter stdout, ScoredRows s,
                     String responseName, List<String> classLabels, ReferenceReach reach, Body body) {
        if (isParquet(target)) {
            CommandOutput.bytes(target, force, inputs, stdout, out -> {
                java.io.OutputStream buffered = new java.io.BufferedOutputStream(out, 1 << 16);
                PredictionCsv rows = new PredictionCsv(new ResultParquet(buffered, "nearfit " + ToolVersion.get()), s,
                        responseName, classLabels, reach);
                body.writeTo(rows);
                rows.csv.finish();
            });
            return;
        }
        CommandOutput.text(target, force, inputs, stdout, w -> {
            PredictionCsv rows = new PredictionCsv(CommandOutput.csv(w, target, stdout), s, responseName, classLabels,
                    reach);
            body.writeTo(rows);
            rows.csv.finish();
        });
    }

    /** Whether rows written to {@code target} are written as Parquet: a file whose name ends in .parquet. */
    static boolean isParquet(Path target) {
        return target != null && !CommandOutput.isStandardOutput(target)
                && target.getFileName().toString().toLowerCase(java.util.Locale.ROOT).endsWith(".parquet");
    }

    /** Writes the rows of {@code block} that {@code filter} keeps. */
    void rows(ScoredRows.Block block, RowFilter filter) throws IOException {
        for (int i = 0; i < block.size(); i++) {
            if (filter.keep(block, i)) {
                record(block, i);
            }
        }
    }

    void flush() throws IOException {
        csv.flush();
    }

    private void record(ScoredRows.Block b, int i) throws IOException {
        ResultCsv.origin(csv, rowSource, b.lines()[i]);
        if (timeColumn) {
            csv.time(b.times()[i]);
        }
        if (b.groups() != null) {
            int g = b.groups()[i];
            csv.text(g < 0 ? "" : source.group().labels().get(g));
        }
        for (int j = 0; j < b.x().length; j++) {
            if (source.timeInput(j)) {
                csv.time(b.x()[j][i]);
            } else {
                csv.number(b.x()[j][i]);
            }
        }
        if (b.scores() != null) {
            numbers(b, i);
        } else {
            if (b.actualClass() != null) {
                int a = b.actualClass()[i];
                csv.text(a < 0 ? "" : classLabels.get(a));
            }
            int c = b.votes().winner()[i];
            csv.text(c < 0 ? "" : classLabels.get(c));
            csv.number(b.votes().share()[i]);
            beyond(b.x(), i, c < 0, b.votes().windowWidth()[i]);
        }
        csv.endRow();
    }

    private void numbers(ScoredRows.Block b, int i) throws IOException {
        boolean hasResponse = b.response() != null;
        if (hasResponse) {
            csv.number(b.response()[i]);
        }
        csv.number(b.scores().fit()[i]).number(b.scores().bandLow()[i]).number(b.scores().bandHigh()[i]);
        if (hasResponse) {
            csv.number(b.scores().residual()[i]).number(b.scores().z()[i]);
        }
        beyond(b.x(), i, Double.isNaN(b.scores().fit()[i]), b.estimates().windowWidth()[i]);
    }

    /** The {@code beyond} cell, when written: empty where the row has no fit or vote, else 1 or 0. */
    private void beyond(double[][] x, int i, boolean none, double windowWidth) throws IOException {
        if (reach == null) {
            return;
        }
        if (none) {
            csv.empty();
        } else {
            csv.whole(reach.rulesMet(x, i, windowWidth, null, null) != 0 ? 1 : 0);
        }
    }
}
