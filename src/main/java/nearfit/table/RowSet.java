package nearfit.table;

import java.util.Arrays;

/**
 * An immutable set of row ids of one table, held as a strictly increasing {@code int} array.
 * Selecting rows never copies the columns; a row set only names rows.
 *
 * <p>Invariant: {@code ids[i] < ids[i + 1]} for every i, and every id is at least 0.
 */
public final class RowSet {
    private final int[] ids;

    private RowSet(int[] ids) {
        this.ids = ids;
    }

    /** Every row of a table with {@code rowCount} rows. */
    public static RowSet all(int rowCount) {
        int[] ids = new int[rowCount];
        for (int i = 0; i < rowCount; i++) {
            ids[i] = i;
        }
        return new RowSet(ids);
    }

    /** The given row ids, which must be strictly increasing and not negative; the array is copied. */
    public static RowSet of(int... ids) {
        for (int i = 0; i < ids.length; i++) {
            if (ids[i] < 0 || (i > 0 && ids[i] <= ids[i - 1])) {
                throw new IllegalArgumentException("row ids must be strictly increasing and >= 0 at " + i);
            }
        }
        return new RowSet(ids.clone());
    }

    /** Wraps an array the caller guarantees is strictly increasing and will not change. */
    static RowSet trusted(int[] ids) {
        return new RowSet(ids);
    }

    /** The number of rows in the set. */
    public int size() {
        return ids.length;
    }

    /** The {@code i}-th row id in increasing order. */
    public int row(int i) {
        return ids[i];
    }

    /** Whether {@code row} belongs to the set (binary search). */
    public boolean contains(int row) {
        return Arrays.binarySearch(ids, row) >= 0;
    }

    /** The rows in both sets. */
    public RowSet and(RowSet other) {
        int[] out = new int[Math.min(ids.length, other.ids.length)];
        int n = 0;
        int i = 0;
        int j = 0;
        while (i < ids.length && j < other.ids.length) {
            int a = ids[i];
            int b = other.ids[j];
            if (a == b) {
                out[n++] = a;
                i++;
                j++;
            } else if (a < b) {
                i++;
            } else {
                j++;
            }
        }
        return new RowSet(Arrays.copyOf(out, n));
    }

    /** A copy of the row ids. */
    public int[] toArray() {
        return ids.clone();
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof RowSet r && Arrays.equals(ids, r.ids);
    }

    @Override
    public int hashCode() {
        return Arrays.hashCode(ids);
    }

    @Override
    public String toString() {
        return "RowSet[" + ids.length + " rows]";
    }
}
