package nearfit.tui;

import java.time.Instant;
import java.util.ArrayList;
import java.util.List;

import it.unimi.dsi.fastutil.ints.IntArrays;
import nearfit.knn.FlagResult;
import nearfit.knn.FlagScale;
import nearfit.knn.KnnModel;
import nearfit.knn.KnnSettings;
import nearfit.knn.ReferenceData;
import nearfit.table.CategoryColumn;
import nearfit.table.RowSet;
import nearfit.table.Table;
import nearfit.table.TimeColumn;

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
 */
public record FlaggedRows(FlagResult result, double looRmse, List<FlaggedRow> rows, int shownExamined,
        int shownFlagged) {
    /** Copies the list so that the record stays immutable. */
    public FlaggedRows {
        rows = List.copyOf(rows);
    }

    /** Flags of which every reference row is shown. */
    public FlaggedRows(FlagResult result, double looRmse, List<FlaggedRow> rows) {
        this(result, looRmse, rows, result.rowIds().length, result.flaggedCount());
    }

    /** No flags: leave-one-out flags do not apply to a category response. */
    static FlaggedRows forCategory() {
        double[] none = new double[0];
        FlagResult empty = new FlagResult(new int[0], none, none, none, new boolean[0], 0, Double.NaN, Double.NaN,
                FlagScale.LOCAL_SD, KnnSettings.DEFAULT_FLAG_THRESHOLD);
        return new FlaggedRows(empty, Double.NaN, List.of());
    }

    /** The reference rows examined; 0 when flags do not apply. */
    public int examined() {
        return result.rowIds().length;
    }

    /** The flagged share of the shown rows, 0 when there are none. */
    public double share() {
        return shownExamined == 0 ? 0 : (double) shownFlagged / shownExamined;
    }

    /**
     * @param shown the rows the row condition shows, or {@code null} when every reference row is shown
     */
    static FlaggedRows of(Table table, KnnModel model, FlagResult f, String timeColumn, String groupColumn,
            RowSet shown) {
        int[] order = new int[f.flaggedCount()];
        int n = 0;
        int examined = 0;
        for (int i = 0; i < f.flagged().length; i++) {
            boolean in = shown == null || shown.contains(f.rowIds()[i]);
            examined += in ? 1 : 0;
            if (in && f.flagged()[i]) {
                order[n++] = i;
            }
        }
        double[] z = f.z();
        // Largest |z| first; ties by reference order, so the table never depends on thread count.
        IntArrays.mergeSort(order, 0, n, (a, b) -> {
            int c = Double.compare(Math.abs(z[b]), Math.abs(z[a]));
            return c != 0 ? c : Integer.compare(a, b);
        });
        ReferenceData data = model.data();
        TimeColumn time = timeColumn == null ? null : (TimeColumn) table.column(timeColumn);
        CategoryColumn group = groupColumn == null ? null : (CategoryColumn) table.column(groupColumn);
        List<FlaggedRow> rows = new ArrayList<>(n);
        for (int o = 0; o < n; o++) {
            int i = order[o];
            int row = f.rowIds()[i];
            List<Double> inputs = new ArrayList<>(data.dimensions());
            for (int j = 0; j < data.dimensions(); j++) {
                inputs.add(data.input(j)[i]);
            }
            String when = time == null || time.isMissing(row) ? "" : Instant.ofEpochMilli(time.epochMillis(row)).toString();
            String label = group == null || group.isMissing(row) ? "" : group.label(row);
            rows.add(new FlaggedRow(row, table.lineOf(row), when, label, inputs, data.response()[i], f.looFit()[i],
                    f.residual()[i], z[i]));
        }
        return new FlaggedRows(f, f.looRmse(), rows, examined, n);
    }
}
