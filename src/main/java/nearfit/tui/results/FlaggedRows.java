package nearfit.tui.results;

import java.util.List;

import nearfit.knn.FlagResult;
import nearfit.table.RowSource;

/**
 * The knn package's leave-one-out flags with the flagged rows as the explorer lists them, largest |z| first.
 *
 * @param result  the core's flags over every reference row; no rows for a category response
 * @param looRmse {@code result.looRmse()}, kept since that is a pass over the rows
 * @param rows    the flagged rows that the row condition shows, with their lines, times and group labels,
 *                largest |z| first
 * @param shownExamined the reference rows that the row condition shows (all of them when it narrows the
 *                reference itself)
 * @param shownFlagged  the flagged rows among them: the length of {@code rows}
 * @param source  what the rows' {@link FlaggedRow#line()} values mean (CSV lines, or Parquet files and row
 *                indexes): the table's {@link RowSource}, which heads and labels them
 */
public record FlaggedRows(FlagResult result, double looRmse, List<FlaggedRow> rows, int shownExamined,
        int shownFlagged, RowSource source) {
    /** Copies the list so that the record stays immutable. */
    public FlaggedRows {
        rows = List.copyOf(rows);
        java.util.Objects.requireNonNull(source, "source");
    }

    /** Flags of rows numbered by CSV line. */
    public FlaggedRows(FlagResult result, double looRmse, List<FlaggedRow> rows, int shownExamined, int shownFlagged) {
        this(result, looRmse, rows, shownExamined, shownFlagged, RowSource.CSV_LINES);
    }

    /** Flags of which every reference row is shown. */
    public FlaggedRows(FlagResult result, double looRmse, List<FlaggedRow> rows) {
        this(result, looRmse, rows, result.rowIds().length, result.flaggedCount());
    }

    /** A row's origin as the table shows it: its CSV line, its Parquet row index, or file:row in a data set. */
    public String origin(FlaggedRow row) {
        return source.label(row.line());
    }

    /** The reference rows examined; 0 when flags do not apply. */
    public int examined() {
        return result.rowIds().length;
    }

    /** The flagged share of the shown rows, 0 when there are none. */
    public double share() {
        return shownExamined == 0 ? 0 : (double) shownFlagged / shownExamined;
    }

    /** The |z| above which a row is flagged. */
    public double threshold() {
        return result.threshold();
    }
}
