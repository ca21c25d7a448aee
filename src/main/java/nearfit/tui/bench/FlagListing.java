package nearfit.tui.bench;

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
import nearfit.tui.results.FlaggedRow;
import nearfit.tui.results.FlaggedRows;

/** Lists the knn package's leave-one-out flags as the explorer shows them: the flagged rows, largest |z| first. */
final class FlagListing {
    private FlagListing() {
    }

    /** No flags: leave-one-out flags do not apply to a category response. */
    static FlaggedRows forCategory() {
        double[] none = new double[0];
        FlagResult empty = new FlagResult(new int[0], none, none, none, new boolean[0], 0, Double.NaN, Double.NaN,
                FlagScale.LOCAL_SD, KnnSettings.DEFAULT_FLAG_THRESHOLD);
        return new FlaggedRows(empty, Double.NaN, List.of());
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
        return new FlaggedRows(f, f.looRmse(), rows, examined, n, table.rowSource());
    }
}
