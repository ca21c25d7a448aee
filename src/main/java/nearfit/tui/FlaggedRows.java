package nearfit.tui;

import java.time.Instant;
import java.util.ArrayList;
import java.util.List;

import it.unimi.dsi.fastutil.ints.IntArrays;
import nearfit.knn.KnnModel;
import nearfit.knn.ReferenceData;
import nearfit.table.CategoryColumn;
import nearfit.table.Table;
import nearfit.table.TimeColumn;

/** The knn package's leave-one-out flags as the rows of the explorer's flagged table, largest |z| first. */
final class FlaggedRows {
    private FlaggedRows() {
    }

    static FlagResult of(Table table, KnnModel model, nearfit.knn.FlagResult f, String timeColumn,
            String groupColumn) {
        int[] order = new int[f.flaggedCount()];
        int n = 0;
        for (int i = 0; i < f.flagged().length; i++) {
            if (f.flagged()[i]) {
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
        return new FlagResult(f.rowIds().length, n, f.looRmse(), f.threshold(), rows);
    }
}
