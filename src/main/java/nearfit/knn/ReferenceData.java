package nearfit.knn;

import it.unimi.dsi.fastutil.ints.IntArrays;
import java.util.Arrays;
import nearfit.table.NearfitException;

/**
 * The reference rows a model is fitted on: the kept rows' inputs, response and row ids, and how
 * many rows were left out for a missing value.
 *
 * <p>A row is kept when every input and the response are present: finite for numbers (NaN and
 * infinities count as missing: an infinite reading cannot be placed or averaged), a code
 * {@code >= 0} for a category. Kept rows are stored in a <em>canonical order</em> (ascending by
 * input 0, then input 1, ..., then the response, then the row id), so every sum the engine takes runs in an order
 * that does not depend on the order the rows arrived in: shuffling the rows changes no result,
 * bit for bit. Arrays handed out are the stored ones; callers must not change them.
 */
public final class ReferenceData {
    private final String[] inputNames;
    private final String responseName;
    private final double[][] inputs;
    private final double[] response;
    private final int[] classes;
    private final int classCount;
    private final int[] rowIds;
    private final int[] droppedPerColumn;
    private final int droppedRows;

    private ReferenceData(String[] inputNames, String responseName, double[][] inputs, double[] response,
                          int[] classes, int classCount, int[] rowIds, int[] droppedPerColumn, int droppedRows) {
        this.inputNames = inputNames;
        this.responseName = responseName;
        this.inputs = inputs;
        this.response = response;
        this.classes = classes;
        this.classCount = classCount;
        this.rowIds = rowIds;
        this.droppedPerColumn = droppedPerColumn;
        this.droppedRows = droppedRows;
    }

    /**
     * Reference rows with a numeric response.
     *
     * @param inputNames   one name per input, for messages
     * @param inputs       one column per input, all of one length n (times as epoch ms)
     * @param responseName the response's name
     * @param response     the response column, length n
     * @param rowIds       the table's row index of each row, or {@code null} for 0..n-1
     */
    public static ReferenceData numeric(String[] inputNames, double[][] inputs, String responseName,
                                        double[] response, int[] rowIds) {
        int n = checkShape(inputNames, inputs, response.length, rowIds);
        return build(inputNames, inputs, responseName, response, null, 0, rowIds, n);
    }

    /**
     * Reference rows with a category response: codes {@code 0 .. classCount-1}, a negative code
     * for a missing value.
     */
    public static ReferenceData category(String[] inputNames, double[][] inputs, String responseName,
                                         int[] codes, int classCount, int[] rowIds) {
        int n = checkShape(inputNames, inputs, codes.length, rowIds);
        if (classCount < 1) {
            throw NearfitException.inColumn(responseName, "a category response needs at least one class");
        }
        for (int c : codes) {
            if (c >= classCount) {
                throw NearfitException.inColumn(responseName, "category code " + c + " is not below the class count " + classCount);
            }
        }
        return build(inputNames, inputs, responseName, null, codes, classCount, rowIds, n);
    }

    private static int checkShape(String[] names, double[][] inputs, int n, int[] rowIds) {
        if (inputs.length == 0 || names.length != inputs.length) {
            throw new NearfitException("a model needs at least one input and a name for each");
        }
        for (int j = 0; j < inputs.length; j++) {
            if (inputs[j].length != n) {
                throw NearfitException.inColumn(names[j], "has " + inputs[j].length + " values, the response " + n);
            }
        }
        if (rowIds != null && rowIds.length != n) {
            throw new NearfitException("row ids: " + rowIds.length + " for " + n + " rows");
        }
        return n;
    }

    private static ReferenceData build(String[] names, double[][] in, String responseName, double[] y,
                                       int[] codes, int classCount, int[] rowIds, int n) {
        int d = in.length;
        int[] dropped = new int[d + 1];
        int[] kept = new int[n];
        int m = 0;
        for (int i = 0; i < n; i++) {
            boolean ok = true;
            for (int j = 0; j < d; j++) {
                if (!Double.isFinite(in[j][i])) {
                    dropped[j]++;
                    ok = false;
                }
            }
            if (y != null ? !Double.isFinite(y[i]) : codes[i] < 0) {
                dropped[d]++;
                ok = false;
            }
            if (ok) {
                kept[m++] = i;
            }
        }
        kept = Arrays.copyOf(kept, m);
        double[][] keptIn = new double[d][];
        keptIn[0] = canonicalOrder(kept, in, y, codes, rowIds);
        for (int j = 1; j < d; j++) {
            keptIn[j] = new double[m];
        }
        double[] keptY = y == null ? null : new double[m];
        int[] keptC = codes == null ? null : new int[m];
        int[] ids = new int[m];
        int[] order = kept;
        // scattered reads, so two cores overlap their cache misses; each slot is written once
        Workers.run(m, Runtime.getRuntime().availableProcessors(), () -> null, (none, c, from, to) -> {
            for (int j = 1; j < d; j++) {
                double[] src = in[j];
                double[] dst = keptIn[j];
                for (int i = from; i < to; i++) {
                    dst[i] = src[order[i]];
                }
            }
            for (int i = from; i < to; i++) {
                int r = order[i];
                if (keptY != null) {
                    keptY[i] = y[r];
                } else {
                    keptC[i] = codes[r];
                }
                ids[i] = rowIds == null ? r : rowIds[r];
            }
        }, Progress.NONE);
        return new ReferenceData(names.clone(), responseName, keptIn, keptY, keptC, classCount, ids, dropped, n - m);
    }

    /**
     * Sorts the kept row indexes lexicographically by input 0, ..., input d-1, response, row id.
     * First by the top 32 bits of input 0's sortable form, a stable three-pass radix sort of int
     * keys (a third of the old six passes over long keys, and faster than a two-core comparison
     * sort of packed longs: 1M rows 0.18 s to 0.13 s for the whole reference data); rows whose top
     * bits agree but whose values differ are then put in value order. Then a comparison sort inside
     * each run of equal input-0 values by the remaining keys, so the order within a run need not be
     * stable. A long run's remaining keys are first copied into scratch arrays, so its sort compares
     * values that sit together in cache instead of reaching into the whole columns (rounded 10M-row
     * inputs hold thousands of rows per value, and those scattered reads dominated).
     */
    private static double[] canonicalOrder(int[] kept, double[][] in, double[] y, int[] codes, int[] rowIds) {
        int m = kept.length;
        double[] x0 = in[0];
        int[] order = new int[m];
        double[] sorted = new double[m]; // input 0 in the order being built: one scattered pass only
        int[] top = new int[m];
        for (int i = 0; i < m; i++) {
            top[i] = (int) (RadixSort.sortableBits(x0[kept[i]]) >>> 32); // unsigned order of the value
        }
        int[] sortedRows = RadixSort.order32(top); // top sorted along; equal keys stay in index order
        // scattered reads, so two cores overlap their cache misses; each slot is written once
        Workers.run(m, Runtime.getRuntime().availableProcessors(), () -> null, (none, c, from, to) -> {
            for (int i = from; i < to; i++) {
                int row = kept[sortedRows[i]];
                order[i] = row;
                sorted[i] = x0[row] + 0.0;
            }
        }, Progress.NONE);
        orderEqualTopBits(order, sorted, top);
        top = null;
        RunSorter runs = new RunSorter(in, y, codes, rowIds);
        int from = 0;
        for (int i = 1; i <= m; i++) {
            if (i == m || sorted[i] != sorted[from]) {
                if (i - from > 1) {
                    runs.sort(order, from, i);
                }
                from = i;
            }
        }
        System.arraycopy(order, 0, kept, 0, m);
        return sorted;
    }

    /**
     * Within each group of rows whose values share their top 32 bits ({@code top}, sorted), puts the
     * rows and their values ({@code sorted}, in step with {@code order}) in ascending order of the
     * full value, equal values by row index.
     */
    private static void orderEqualTopBits(int[] order, double[] sorted, int[] top) {
        int m = order.length;
        double[] value = new double[0];
        double[] slot = new double[0];
        int from = 0;
        for (int i = 1; i <= m; i++) {
            if (i < m && top[i] == top[from]) {
                continue;
            }
            int len = i - from;
            if (len > 1 && !allEqual(sorted, from, i)) {
                if (slot.length < len) {
                    value = new double[Math.max(len, 2 * slot.length)];
                    slot = new double[value.length];
                }
                for (int t = 0; t < len; t++) {
                    value[t] = sorted[from + t];
                    slot[t] = order[from + t];
                }
                PairSort.sort(value, slot, 0, len);
                for (int t = 0; t < len; t++) {
                    sorted[from + t] = value[t];
                    order[from + t] = (int) slot[t];
                }
            }
            from = i;
        }
    }

    private static boolean allEqual(double[] v, int from, int to) {
        for (int t = from + 1; t < to; t++) {
            if (v[t] != v[from]) {
                return false;
            }
        }
        return true;
    }

    /** Sorts runs of equal input 0 by the remaining keys: inputs 1..d-1, response, row id. */
    private static final class RunSorter {
        private final double[][] in;
        private final double[] y;
        private final int[] codes;
        private final int[] rowIds;
        private double[][] cols = new double[0][];
        private int[] ids = new int[0];
        private int[] local = new int[0];
        private int[] saved = new int[0];
        private double[] position = new double[0];

        RunSorter(double[][] in, double[] y, int[] codes, int[] rowIds) {
            this.in = in;
            this.y = y;
            this.codes = codes;
            this.rowIds = rowIds;
        }

        void sort(int[] order, int from, int to) {
            int len = to - from;
            int keys = in.length; // inputs 1..d-1, then the response
            if (cols.length == 0 || cols[0].length < len) {
                int cap = Math.max(len, 2 * ids.length);
                cols = new double[keys][cap];
                ids = new int[cap];
                local = new int[cap];
                saved = new int[cap];
            }
            for (int t = 0; t < len; t++) {
                int row = order[from + t];
                for (int j = 1; j < keys; j++) {
                    cols[j - 1][t] = in[j][row] + 0.0;
                }
                cols[keys - 1][t] = y != null ? y[row] + 0.0 : codes[row];
                ids[t] = rowIds == null ? row : rowIds[row];
                local[t] = t;
                saved[t] = row;
            }
            if (keys == 1 && ascending(ids, len)) {
                sortByResponse(order, from, len);
                return;
            }
            double[][] c = cols;
            int[] id = ids;
            IntArrays.quickSort(local, 0, len, (a, b) -> {
                for (double[] col : c) {
                    int r = Double.compare(col[a], col[b]);
                    if (r != 0) {
                        return r;
                    }
                }
                return Integer.compare(id[a], id[b]);
            });
            for (int t = 0; t < len; t++) {
                order[from + t] = saved[local[t]];
            }
        }

        /**
         * One input: sorts by (response, position in the run), which is (response, row id) because
         * the row ids ascend along the run; primitive pairs, no comparator.
         */
        private void sortByResponse(int[] order, int from, int len) {
            if (position.length < len) {
                position = new double[cols[0].length];
            }
            for (int t = 0; t < len; t++) {
                position[t] = t;
            }
            PairSort.sort(cols[0], position, 0, len);
            for (int t = 0; t < len; t++) {
                order[from + t] = saved[(int) position[t]];
            }
        }

        private static boolean ascending(int[] a, int len) {
            for (int t = 1; t < len; t++) {
                if (a[t] <= a[t - 1]) {
                    return false;
                }
            }
            return true;
        }
    }

    /** Number of kept rows. */
    public int size() {
        return rowIds.length;
    }

    /** Number of inputs. */
    public int dimensions() {
        return inputs.length;
    }

    /** The input names. */
    public String[] inputNames() {
        return inputNames.clone();
    }

    /** The response's name. */
    public String responseName() {
        return responseName;
    }

    /** The kept values of input j, in canonical order. */
    public double[] input(int j) {
        return inputs[j];
    }

    /** The kept numeric responses, or {@code null} for a category response. */
    public double[] response() {
        return response;
    }

    /** Whether the response is a category. */
    public boolean isCategory() {
        return classes != null;
    }

    /** The kept category codes, or {@code null} for a numeric response. */
    public int[] classes() {
        return classes;
    }

    /** The number of classes of a category response, 0 for a numeric one. */
    public int classCount() {
        return classCount;
    }

    /** The table row index of each kept row, in canonical order. */
    public int[] rowIds() {
        return rowIds;
    }

    /** Rows left out for a missing value in each input (0..d-1) and in the response (index d). */
    public int[] droppedPerColumn() {
        return droppedPerColumn.clone();
    }

    /** Rows left out for any missing value (a row missing two values counts once). */
    public int droppedRows() {
        return droppedRows;
    }

    /** The subset at the given canonical positions (ascending), keeping names. */
    ReferenceData subset(int[] positions) {
        int d = inputs.length;
        int m = positions.length;
        double[][] in = new double[d][m];
        for (int j = 0; j < d; j++) {
            for (int i = 0; i < m; i++) {
                in[j][i] = inputs[j][positions[i]];
            }
        }
        int[] ids = new int[m];
        double[] y = response == null ? null : new double[m];
        int[] c = classes == null ? null : new int[m];
        for (int i = 0; i < m; i++) {
            int p = positions[i];
            ids[i] = rowIds[p];
            if (y != null) {
                y[i] = response[p];
            } else {
                c[i] = classes[p];
            }
        }
        return new ReferenceData(inputNames, responseName, in, y, c, classCount, ids, new int[d + 1], 0);
    }
}
