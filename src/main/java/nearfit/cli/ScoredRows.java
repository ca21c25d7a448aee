package nearfit.cli;

import java.io.PrintWriter;
import java.util.List;

import nearfit.knn.ClassVote;
import nearfit.knn.Estimates;
import nearfit.knn.KnnModel;
import nearfit.knn.Searcher;
import nearfit.model.ModelColumns;
import nearfit.model.ReferenceModel;
import nearfit.model.RestoredModel;
import nearfit.table.CategoryColumn;
import nearfit.table.Column;
import nearfit.table.NumericColumn;
import nearfit.table.RowSet;
import nearfit.table.TimeColumn;

/**
 * New rows scored against a model: the rows of a file that meet the row condition, the engine's
 * estimates at them, and where the file has the response, residuals and z.
 *
 * <p>z of a new row depends on the model's z scale. {@code local} (the default):
 * {@code resid / s} with s the weighted SD of the k neighbours' responses at the row, so a row is
 * judged by the spread of the reference where it lies (power residuals are near zero below cut-in
 * and at rated power, and large in between). {@code reference}: {@code (resid - median) / scale}
 * with the median and 1.4826·MAD of the reference's leave-one-out residuals stored in the model (the
 * modified z-score of Iglewicz and Hoaglin 1993, on the reference's scale). A zero scale gives z = 0
 * for a zero (centred) residual and an infinite z otherwise, as the engine's flags do. Rows with a
 * missing input or response get NaN.
 *
 * <p>The values are copied out of the table before scoring, and the table is let go: at 10M rows its
 * columns and line numbers are 240 MB that scoring does not need.
 *
 * @param read        the rows scored and their values, as read from the file
 * @param estimates   fit and band at each row (number response), or {@code null}
 * @param classes     the predicted class code at each row (category response), or {@code null}
 * @param shares      the vote share of the predicted class (category response), or {@code null}
 * @param z           z at each row, or {@code null} without a number response
 */
record ScoredRows(ReadRows read, Estimates estimates, int[] classes, double[] shares, double[] z) {

    /**
     * The rows of a file to score, copied out of its table.
     *
     * @param rows        the table rows scored, ascending
     * @param lines       the source line of each scored row
     * @param inputNames  the model's inputs
     * @param timeInputs  for each input, whether the file's column is a time (values are epoch ms)
     * @param x           the inputs' values at each scored row, one array per input, NaN when missing
     * @param response    the response values, or {@code null} when the file lacks the response column
     *                    or the response is a category
     * @param actualClass the file's class code mapped to the model's dictionary (-1 unknown), or {@code null}
     * @param group       the model's group column in the file, or {@code null}
     */
    record ReadRows(RowSet rows, long[] lines, List<String> inputNames, boolean[] timeInputs, double[][] x,
                    double[] response, int[] actualClass, CategoryColumn group) {
    }

    /** Loads {@code file} and scores its rows (those meeting {@code where}) against {@code model}. */
    static ScoredRows score(RestoredModel model, String file, ModelOptions options, PrintWriter err) {
        ReadRows read = read(model.stored().columns(), file, options, err);
        if (model.stored().columns().categoryResponse()) {
            return classify(model, read);
        }
        TerminalProgress progress = TerminalProgress.of(err, "scoring", options.quiet);
        Estimates est = model.engine().estimateAll(read.x(), progress);
        progress.done();
        double[] y = read.response();
        double[] z = y == null ? null : "local".equals(model.settings().zScale())
                ? localZ(y, est.fit(), est.localSd()) : zScores(y, est.fit(), model.stored().residualScale());
        return new ScoredRows(read, est, null, null, z);
    }

    /**
     * Loads the file, keeping only the model's columns and those of --where (a file of new readings may lack
     * the response or the group), and copies out what scoring and the reports use; the table is not kept.
     */
    private static ReadRows read(ModelColumns columns, String file, ModelOptions options, PrintWriter err) {
        ColumnRequest request = ColumnRequest.NONE.require("model input", columns.inputs())
                .allow(columns.response(), columns.group()).where(options.where);
        SourceTable source = SourceTable.load(file, request, options.threads(), options.quiet, err);
        RowSet rows = source.rows(options.where);
        int n = rows.size();
        double[][] x = new double[columns.inputs().size()][];
        boolean[] time = new boolean[x.length];
        for (int j = 0; j < x.length; j++) {
            NumericColumn c = source.numeric("model input", columns.inputs().get(j));
            x[j] = SourceTable.values(c, rows);
            time[j] = c instanceof TimeColumn;
        }
        long[] lines = new long[n];
        for (int i = 0; i < n; i++) {
            lines[i] = source.table().lineOf(rows.row(i));
        }
        boolean hasResponse = source.table().hasColumn(columns.response());
        double[] y = null;
        int[] actual = null;
        if (hasResponse && columns.categoryResponse()) {
            actual = actualClasses(columns, source, rows);
        } else if (hasResponse) {
            y = SourceTable.values(source.numeric("model response", columns.response()), rows);
        }
        return new ReadRows(rows, lines, columns.inputs(), time, x, y, actual, groupColumn(source, columns.group()));
    }

    /** z of each residual on the stored scale; NaN where the response or the fit is missing. */
    static double[] zScores(double[] y, double[] fit, ReferenceModel.ResidualScale scale) {
        double[] z = new double[y.length];
        double median = scale.median();
        double s = scale.scale();
        for (int i = 0; i < y.length; i++) {
            z[i] = scaled(y[i] - fit[i] - median, s);
        }
        return z;
    }

    /** z of each residual on the neighbours' SD at its row; NaN where the response or the fit is missing. */
    static double[] localZ(double[] y, double[] fit, double[] localSd) {
        double[] z = new double[y.length];
        for (int i = 0; i < y.length; i++) {
            z[i] = scaled(y[i] - fit[i], localSd[i]);
        }
        return z;
    }

    private static double scaled(double e, double s) {
        if (Double.isNaN(e)) {
            return Double.NaN;
        }
        if (s > 0) {
            return e / s;
        }
        return e == 0 ? 0 : Math.copySign(Double.POSITIVE_INFINITY, e);
    }

    private static ScoredRows classify(RestoredModel model, ReadRows read) {
        KnnModel engine = model.engine();
        Searcher searcher = engine.searcher();
        double[][] x = read.x();
        int n = read.rows().size();
        int[] classes = new int[n];
        double[] shares = new double[n];
        double[] point = new double[x.length];
        for (int i = 0; i < n; i++) {
            boolean missing = false;
            for (int j = 0; j < x.length; j++) {
                point[j] = x[j][i];
                missing |= Double.isNaN(point[j]);
            }
            if (missing) {
                classes[i] = -1;
                shares[i] = Double.NaN;
                continue;
            }
            ClassVote vote = searcher.vote(point);
            classes[i] = vote.winner();
            shares[i] = vote.shares()[vote.winner()];
        }
        return new ScoredRows(read, null, classes, shares, null);
    }

    private static int[] actualClasses(ModelColumns columns, SourceTable source, RowSet rows) {
        CategoryColumn c = source.category("model response", columns.response());
        int[] out = new int[rows.size()];
        for (int i = 0; i < out.length; i++) {
            int row = rows.row(i);
            out[i] = c.code(row) < 0 ? -1 : columns.responseLabels().indexOf(c.label(row));
        }
        return out;
    }

    private static CategoryColumn groupColumn(SourceTable source, String group) {
        if (group == null || !source.table().hasColumn(group)) {
            return null;
        }
        Column c = source.table().column(group);
        return c instanceof CategoryColumn cat ? cat : null;
    }
}
