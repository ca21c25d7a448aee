package nearfit.tui.bench;

import java.io.IOException;
import java.io.OutputStream;
import java.util.List;

import nearfit.knn.TuningTable;
import nearfit.table.LoadNotes;
import nearfit.tui.keys.FitKey;
import nearfit.tui.results.HeldOutChoice;
import nearfit.tui.results.Cells;
import nearfit.tui.results.ColumnInfo;
import nearfit.tui.results.CurveRequest;
import nearfit.tui.results.CurveResult;
import nearfit.tui.results.FlaggedRows;
import nearfit.tui.results.PlotCells;
import nearfit.tui.results.TuningFigures;

/**
 * The core packages as the explorer sees them: one loaded table and what can be fitted, tuned, flagged and
 * drawn from it. The explorer never computes statistics itself; everything numeric comes from here.
 *
 * <p>Long methods take a {@link JobControl}, report progress through it and stop with a
 * {@link java.util.concurrent.CancellationException} once it is cancelled. Implementations must allow
 * calls from several threads at once.
 */
public interface Workbench {
    /** The file as the user named it. */
    String source();

    /** Rows in the file. */
    long totalRows();

    /** What the loader found: rows read, ragged lines, blank and bad cells per column. */
    LoadNotes loadNotes();

    /** The columns in file order. */
    List<ColumnInfo> columns();

    /** The time column, or {@code null} when the table has none. */
    String timeColumn();

    /**
     * Rows that satisfy a row condition.
     *
     * @throws nearfit.table.NearfitException naming the problem when the condition does not parse
     */
    int rowsUsed(String condition);

    /** The {@code q}-quantile (0 to 1) of a numeric column over the rows of a condition; NaN when empty. */
    double quantile(String column, String condition, double q);

    /** The labels of a category column, by code. */
    List<String> labels(String column);

    /** The curve along the display input. */
    CurveResult curve(FitKey model, CurveRequest request, JobControl control);

    /**
     * Tuning over the k ladder with rows held out as {@code choice} says (days: UTC days of the time column;
     * group: the groups of {@code groupColumn}); does not depend on {@code model.k()}.
     */
    TuningTable tune(FitKey model, HeldOutChoice choice, String groupColumn, JobControl control);

    /**
     * Leave-one-out residuals at {@code model.k()} over the model's reference rows, and the flagged ones among
     * the rows of {@code shownCondition} (which may narrow them further), labelled by the group column.
     */
    FlaggedRows flags(FitKey model, String groupColumn, String shownCondition, JobControl control);

    /**
     * The plot (axes, points, curve, band, flags and crosshair) in {@code width} by {@code height} cells, and
     * under it one row of {@code width} cells showing the window width along the same horizontal axis.
     */
    PlotCells plot(PlotScene scene, int width, int height);

    /** RMSE against log k with the lowest and the one-SE k marked. */
    Cells tuningChart(TuningFigures tuning, int currentK, int width, int height, boolean ascii);

    /** The plot as a PNG image of {@code width} by {@code height} pixels. */
    void writePng(PlotScene scene, int width, int height, OutputStream out) throws IOException;
}
