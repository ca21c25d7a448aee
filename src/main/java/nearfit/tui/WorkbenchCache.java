package nearfit.tui;

import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.ExecutionException;

import nearfit.knn.KnnModel;
import nearfit.knn.ReferenceData;
import nearfit.table.CategoryColumn;
import nearfit.table.Column;
import nearfit.table.RowSet;
import nearfit.table.SortedValues;
import nearfit.table.Table;

/**
 * What the workbench keeps between calls: the rows of recent row conditions, sorted values for quantiles,
 * fitted models (one fit shared by the curve, tuning and flag jobs that ask for it at once, and reused with
 * another k, weighting or band) and the latest leave-one-out flags. Safe for concurrent use.
 */
final class WorkbenchCache {
    /** Entries kept per cache; a few settings back is enough to step back and forth. */
    private static final int KEEP = 4;

    private final Table table;
    private final Map<String, RowSet> rows = lru();
    private final Map<List<Object>, SortedValues> sorted = lru();
    private final Map<List<Object>, CompletableFuture<KnnModel>> models = lru();
    private final Map<FitKey, nearfit.knn.FlagResult> flags = lru();

    WorkbenchCache(Table table) {
        this.table = table;
    }

    private static <K, V> Map<K, V> lru() {
        return new LinkedHashMap<>(16, 0.75f, true) {
            @Override
            protected boolean removeEldestEntry(Map.Entry<K, V> e) {
                return size() > KEEP;
            }
        };
    }

    /** The rows of a condition (all rows when empty), checked by the table package's parser. */
    RowSet rows(String condition) {
        synchronized (rows) {
            RowSet r = rows.get(condition);
            if (r == null) {
                r = condition.isBlank() ? table.allRows() : table.where(condition);
                rows.put(condition, r);
            }
            return r;
        }
    }

    /** A quantile of the present values, Hyndman and Fan's definition 7 as the table package computes it. */
    double quantile(String column, String condition, double q) {
        SortedValues values;
        List<Object> key = List.of(column, condition);
        synchronized (sorted) {
            values = sorted.get(key);
        }
        if (values == null) {
            values = SortedValues.of(table.numeric(column), rows(condition));
            synchronized (sorted) {
                sorted.put(key, values);
            }
        }
        return values.quantile(q);
    }

    /**
     * The model for these settings, fitted once per rows, response, inputs, metric and scaling. With a
     * group column, the rows of group {@code group} are left out (the curve of the other groups).
     */
    KnnModel model(FitKey m, String groupColumn, int group) {
        List<Object> key = Arrays.asList(m.condition(), m.response(), m.inputs(), m.settings().metric(),
                m.settings().scaling(),
                groupColumn, groupColumn == null ? -1 : group);
        CompletableFuture<KnnModel> f;
        boolean mine = false;
        synchronized (models) {
            f = models.get(key);
            if (f == null) {
                f = new CompletableFuture<>();
                models.put(key, f);
                mine = true;
            }
        }
        if (mine) {
            try {
                f.complete(KnnModel.fit(data(m, groupColumn, group), m.settings()));
            } catch (RuntimeException e) {
                f.completeExceptionally(e);
                synchronized (models) {
                    models.remove(key);
                }
            }
        }
        try {
            return f.get().withSettings(m.settings());
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new java.util.concurrent.CancellationException("interrupted");
        } catch (ExecutionException e) {
            throw e.getCause() instanceof RuntimeException re ? re : new IllegalStateException(e.getCause());
        }
    }

    private ReferenceData data(FitKey m, String groupColumn, int group) {
        RowSet used = rows(m.condition());
        if (groupColumn != null && group >= 0) {
            used = without(used, (CategoryColumn) table.column(groupColumn), group);
            if (used.size() == 0) {
                // Said here, since the engine would only say that there are no rows at all.
                throw new nearfit.table.NearfitException("no rows of the other groups"
                        + (m.condition().isBlank() ? " to compare with" : " under this row condition"));
            }
        }
        int d = m.inputs().size();
        String[] names = m.inputs().toArray(new String[0]);
        double[][] inputs = new double[d][];
        for (int j = 0; j < d; j++) {
            inputs[j] = table.numeric(names[j]).copyValues(used);
        }
        int[] ids = used.toArray();
        Column response = table.column(m.response());
        if (response instanceof CategoryColumn c) {
            int[] codes = new int[ids.length];
            for (int i = 0; i < ids.length; i++) {
                codes[i] = c.code(ids[i]);
            }
            return ReferenceData.category(names, inputs, m.response(), codes, c.labels().size(), ids);
        }
        return ReferenceData.numeric(names, inputs, m.response(), table.numeric(m.response()).copyValues(used), ids);
    }

    /** The rows whose group code is not {@code group}. */
    static RowSet without(RowSet rows, CategoryColumn groups, int group) {
        int[] kept = new int[rows.size()];
        int n = 0;
        for (int i = 0; i < rows.size(); i++) {
            int r = rows.row(i);
            if (groups.code(r) != group) {
                kept[n++] = r;
            }
        }
        return RowSet.of(Arrays.copyOf(kept, n));
    }

    void keepFlags(FitKey m, nearfit.knn.FlagResult f) {
        synchronized (flags) {
            flags.put(m, f);
        }
    }

    /** The leave-one-out flags computed for these settings, or {@code null}. */
    nearfit.knn.FlagResult flags(FitKey m) {
        synchronized (flags) {
            return flags.get(m);
        }
    }
}
