package nearfit.cli;

import java.io.PrintWriter;
import java.util.List;

import nearfit.knn.ClassVotes;
import nearfit.knn.Estimates;
import nearfit.knn.KnnModel;
import nearfit.knn.Progress;
import nearfit.knn.ScoredBlock;
import nearfit.knn.Scoring;
import nearfit.knn.ZBasis;
import nearfit.model.ModelColumns;
import nearfit.model.RestoredModel;
import nearfit.table.CategoryColumn;
import nearfit.table.Column;
import nearfit.table.NumericColumn;
import nearfit.table.RowSet;
import nearfit.table.Table;
import nearfit.table.TimeColumn;

/**
 * New rows scored against a model block by block: the rows of a file that meet the row condition,
 * and the core's scores at them ({@link Scoring}: fit, band, and where the file has the response,
 * residual, z and flag; class votes for a category response).
 *
 * <p>Scoring runs on blocks of at most {@code blockRows} rows, so what is held per row is only the
 * loaded table (the model's columns and line numbers); a block's inputs, estimates and z are
 * dropped once its consumer returns. At 10M rows the estimates of every row at once were 440 MB.
 * Each estimate depends only on its point, so the block size never changes a result.
 *
 * <p>z follows the model's z scale ({@code local}: the neighbours' spread at the row;
 * {@code reference}: the neighbours' held-out residuals stored in the model, or one reference-wide scale
 * from an older file; {@link RestoredModel#zBasis}), computed by the core; this class only copies the rows
 * out of the table and hands them over.
 */
final class ScoredRows {
    /**
     * Rows per block: 256 Ki rows hold about 23 MB at a time (estimates 44 bytes a row, plus inputs,
     * response, z, lines and the engine's scaled copy and query order), and still give each of the
     * engine's threads 128 chunks of 1024 rows.
     */
    static final int BLOCK_ROWS = 1 << 18;

    /** Takes each scored block in row order; E is what it may throw (an output's IOException). */
    @FunctionalInterface
    interface BlockConsumer<E extends Exception> {
        void accept(Block block) throws E;
    }

    /**
     * One block of scored rows; index i is the block's i-th row, the source's {@code from + i}-th.
     *
     * @param from        the position of the block's first row among the scored rows
     * @param lines       the source line of each row
     * @param times       the file's first time column at each row (epoch ms, NaN missing), or {@code null}
     *                    when the file has no time column
     * @param groups      the group code of each row (-1 missing), or {@code null} without a group column
     * @param x           the inputs' values, one array per input, NaN when missing (times in epoch ms)
     * @param response    the response values, or {@code null} (no response column, or a category response)
     * @param actualClass the file's class mapped to the model's codes (-1 missing or unknown), or {@code null}
     * @param scores      fit, band, residual, z and flag (number response), or {@code null}
     * @param votes       class votes (category response), or {@code null}
     */
    record Block(int from, long[] lines, double[] times, int[] groups, double[][] x, double[] response,
                 int[] actualClass, ScoredBlock scores, ClassVotes votes) {
        /** Rows in the block. */
        int size() {
            return lines.length;
        }

        /** Fit and band (number response), or {@code null}. */
        Estimates estimates() {
            return scores == null ? null : scores.estimates();
        }

        /** z at each row, or {@code null} without a number response in the file. */
        double[] z() {
            return scores == null || response == null ? null : scores.z();
        }
    }

    private final KnnModel engine;
    private final boolean category;
    private final ZBasis zBasis;
    private final double threshold;
    private final Table table;
    /** The rows meeting the row condition, or {@code null} for every row (saving 4 bytes a row). */
    private final RowSet rows;
    private final int rowCount;
    private final List<String> inputNames;
    private final NumericColumn[] inputs;
    private final boolean[] timeInputs;
    private final NumericColumn response;
    private final CategoryColumn actual;
    private final int[] modelCodeOfFileCode;
    private final CategoryColumn group;
    /** The file's first time column, or {@code null}: it lets a row be traced beyond its line. */
    private final TimeColumn time;
    private final PrintWriter err;
    private final boolean quiet;
    private final int blockRows;

    private ScoredRows(RestoredModel model, SourceTable source, ModelOptions options, double threshold,
                       PrintWriter err) {
        ModelColumns columns = model.stored().columns();
        this.engine = model.engine();
        this.category = columns.categoryResponse();
        this.zBasis = model.zBasis();
        this.threshold = threshold;
        this.table = source.table();
        boolean everyRow = options.where == null || options.where.isBlank();
        this.rows = everyRow ? null : source.rows(options.where);
        this.rowCount = everyRow ? table.rowCount() : rows.size();
        this.inputNames = columns.inputs();
        this.inputs = new NumericColumn[inputNames.size()];
        this.timeInputs = new boolean[inputs.length];
        for (int j = 0; j < inputs.length; j++) {
            inputs[j] = source.numeric("model input", inputNames.get(j));
            timeInputs[j] = inputs[j] instanceof TimeColumn;
        }
        boolean hasResponse = table.hasColumn(columns.response());
        this.response = hasResponse && !columns.categoryResponse()
                ? source.numeric("model response", columns.response()) : null;
        this.actual = hasResponse && columns.categoryResponse()
                ? source.category("model response", columns.response()) : null;
        this.modelCodeOfFileCode = actual == null ? null : codeMap(actual, columns.responseLabels());
        this.group = groupColumn(table, columns.group());
        this.time = firstTime(table);
        this.err = err;
        this.quiet = options.quiet;
        this.blockRows = options.blockRows;
    }

    /**
     * Loads {@code file}, keeping only the model's columns and those of --where (a file of new readings
     * may lack the response or the group); scoring starts with {@link #forEachBlock}. Rows are flagged
     * when |z| is above {@code threshold}.
     */
    static ScoredRows open(RestoredModel model, String file, ModelOptions options, double threshold,
                           PrintWriter err) {
        ModelColumns columns = model.stored().columns();
        ColumnRequest request = ColumnRequest.NONE.require("model input", columns.inputs())
                .allow(columns.response(), columns.group()).where(options.where);
        // Scoring records no digest of the data file: none is computed.
        SourceTable source = SourceTable.load(file, request, true, false, options.threads(), options.quiet, err);
        return new ScoredRows(model, source, options, threshold, err);
    }

    /** What the rows' source-row values mean (CSV lines, or Parquet files and row indexes). */
    nearfit.table.RowSource rowSource() {
        return table.rowSource();
    }

    /** What divides the residuals (the model's z scale, as the core takes it). */
    ZBasis zBasis() {
        return zBasis;
    }

    /** Rows to score (those meeting the row condition). */
    int rowCount() {
        return rowCount;
    }

    /** Rows the file holds (ragged rows, dropped by the loader, not among them). */
    int fileRows() {
        return table.rowCount();
    }

    /** The file's first time column, or {@code null} when it has none. */
    TimeColumn time() {
        return time;
    }

    List<String> inputNames() {
        return inputNames;
    }

    /** For each input, whether the file's column is a time. */
    boolean timeInput(int j) {
        return timeInputs[j];
    }

    /** Whether the model's response is a category (blocks carry votes, not estimates). */
    boolean categoryResponse() {
        return category;
    }

    /** Whether the file has the model's response column. */
    boolean hasResponse() {
        return response != null || actual != null;
    }

    /** The group column in the file, or {@code null}. */
    CategoryColumn group() {
        return group;
    }

    /** Scores the rows block by block, in row order, on the model's threads; progress on a terminal. */
    <E extends Exception> void forEachBlock(BlockConsumer<E> consumer) throws E {
        TerminalProgress progress = TerminalProgress.of(err, "scoring", quiet);
        int n = rowCount;
        for (int from = 0; from < n; from += blockRows) {
            consumer.accept(score(from, Math.min(n, from + blockRows) - from, progress));
        }
        progress.done();
    }

    private Block score(int from, int size, TerminalProgress progress) {
        long[] lines = new long[size];
        int[] groups = group == null ? null : new int[size];
        for (int i = 0; i < size; i++) {
            int row = row(from + i);
            lines[i] = table.lineOf(row);
            if (groups != null) {
                groups[i] = group.code(row);
            }
        }
        double[] times = time == null ? null : values(time, from, size);
        double[][] x = new double[inputs.length][];
        for (int j = 0; j < x.length; j++) {
            x[j] = values(inputs[j], from, size);
        }
        Progress offset = blockProgress(progress, from);
        if (category) {
            return new Block(from, lines, times, groups, x, null, actualClasses(from, size), null,
                    engine.voteAll(x, offset));
        }
        double[] y = response == null ? null : values(response, from, size);
        return new Block(from, lines, times, groups, x, y, null,
                Scoring.score(engine, x, y, zBasis, threshold, offset), null);
    }

    /** The whole run's progress seen from a block starting at {@code from}. */
    private Progress blockProgress(TerminalProgress progress, int from) {
        long total = rowCount;
        return new Progress() {
            @Override
            public void report(long done, long blockTotal) {
                progress.report(from + done, total);
            }

            @Override
            public boolean isCancelled() {
                return progress.isCancelled();
            }
        };
    }

    /** The table row of the i-th scored row. */
    private int row(int i) {
        return rows == null ? i : rows.row(i);
    }

    private double[] values(NumericColumn column, int from, int size) {
        double[] out = new double[size];
        for (int i = 0; i < size; i++) {
            out[i] = column.asDouble(row(from + i));
        }
        return out;
    }

    private int[] actualClasses(int from, int size) {
        if (actual == null) {
            return null;
        }
        int[] out = new int[size];
        for (int i = 0; i < size; i++) {
            int code = actual.code(row(from + i));
            out[i] = code < 0 ? -1 : modelCodeOfFileCode[code];
        }
        return out;
    }

    /** For each label code of the file's column, the model's code of that label, or -1. */
    private static int[] codeMap(CategoryColumn column, List<String> modelLabels) {
        List<String> labels = column.labels();
        int[] map = new int[labels.size()];
        for (int c = 0; c < map.length; c++) {
            map[c] = modelLabels.indexOf(labels.get(c));
        }
        return map;
    }

    /** The first time column of the table (file order), or {@code null}. */
    private static TimeColumn firstTime(Table table) {
        for (Column c : table.columns()) {
            if (c instanceof TimeColumn t) {
                return t;
            }
        }
        return null;
    }

    private static CategoryColumn groupColumn(Table table, String group) {
        if (group == null || !table.hasColumn(group)) {
            return null;
        }
        Column c = table.column(group);
        return c instanceof CategoryColumn cat ? cat : null;
    }
}
