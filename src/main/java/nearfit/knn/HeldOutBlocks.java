package nearfit.knn;

import java.util.Arrays;

import nearfit.table.CategoryColumn;
import nearfit.table.NearfitException;
import nearfit.table.TimeColumn;

/**
 * A held-out scheme applied to the reference rows: one block id per reference position (canonical
 * order), ids 0..count-1. A row is predicted only from rows of other blocks.
 *
 * @param scheme  the scheme
 * @param blockOf the block of each reference position
 * @param count   the number of blocks
 * @param largest the rows of the largest block
 */
public record HeldOutBlocks(HeldOutScheme scheme, int[] blockOf, int count, int largest) {

    /** Marks a missing time in the {@code times} array of {@link #of}. */
    public static final long NO_TIME = Long.MIN_VALUE;

    /**
     * Each reference position's time, looked up by its table row (the canonical order is not the table's), as
     * {@link #of} takes them: epoch milliseconds, {@link #NO_TIME} where the cell is missing.
     */
    public static long[] timesOf(ReferenceData data, TimeColumn column) {
        int n = data.size();
        int[] ids = data.rowIds();
        long[] t = new long[n];
        for (int i = 0; i < n; i++) {
            long v = column.epochMillis(ids == null ? i : ids[i]);
            t[i] = v == TimeColumn.MISSING ? NO_TIME : v;
        }
        return t;
    }

    /** Each reference position's group code, looked up by its table row, as {@link #of} takes them. */
    public static int[] groupsOf(ReferenceData data, CategoryColumn column) {
        int n = data.size();
        int[] ids = data.rowIds();
        int[] g = new int[n];
        for (int i = 0; i < n; i++) {
            g[i] = column.code(ids == null ? i : ids[i]);
        }
        return g;
    }

    /**
     * Assigns the reference rows to blocks. A row with a missing group or time is a block of its
     * own (it is then held out alone, as under leave-one-out).
     *
     * @param scheme the scheme
     * @param n      reference rows
     * @param groups group code of each reference position (negative: missing), or null
     * @param times  epoch milliseconds of each reference position ({@link #NO_TIME}: missing), or null
     */
    public static HeldOutBlocks of(HeldOutScheme scheme, int n, int[] groups, long[] times) {
        long[] key = new long[n];
        boolean[] alone = new boolean[n];
        if (scheme instanceof HeldOutScheme.LeaveOneOut) {
            return new HeldOutBlocks(scheme, Tuning.allRows(n), n, n == 0 ? 0 : 1);
        }
        if (scheme instanceof HeldOutScheme.Folds f) {
            if (f.count() > n) {
                throw new NearfitException("folds must be between 2 and the " + n + " rows, got " + f.count());
            }
            int[] fold = new int[n];
            int[] order = Tuning.sample(n, n, f.seed());
            for (int i = 0; i < n; i++) {
                fold[order[i]] = i % f.count();
            }
            return new HeldOutBlocks(scheme, fold, f.count(), (n + f.count() - 1) / f.count());
        }
        if (scheme.needsGroups() && groups == null) {
            throw new NearfitException("--cv " + scheme.word() + ": needs a group column (--group COL)");
        }
        if (scheme.period() != null && times == null) {
            throw new NearfitException("--cv " + scheme.word() + ": needs a time column (--time COL)");
        }
        long period = scheme.period() == null ? 0 : scheme.period().toMillis();
        for (int i = 0; i < n; i++) {
            long span = 0;
            if (period > 0) {
                alone[i] |= times[i] == NO_TIME;
                span = Math.floorDiv(times[i], period);
            }
            int g = 0;
            if (groups != null && scheme.needsGroups()) {
                alone[i] |= groups[i] < 0;
                g = groups[i];
            }
            // one key per (span, group): span * 2^17 + group code (a category holds at most 65 536 labels)
            key[i] = alone[i] ? Long.MAX_VALUE : span * 131_072L + g;
        }
        return numbered(scheme, key, alone);
    }

    /** Numbers distinct keys 0..count-1 in ascending key order; rows marked alone get blocks of their own. */
    private static HeldOutBlocks numbered(HeldOutScheme scheme, long[] key, boolean[] alone) {
        int n = key.length;
        long[] distinct = key.clone();
        Arrays.sort(distinct);
        int m = 0;
        for (int i = 0; i < n; i++) {
            if (distinct[i] != Long.MAX_VALUE && (m == 0 || distinct[i] != distinct[m - 1])) {
                distinct[m++] = distinct[i];
            }
        }
        int[] block = new int[n];
        int next = m;
        for (int i = 0; i < n; i++) {
            block[i] = alone[i] ? next++ : Arrays.binarySearch(distinct, 0, m, key[i]);
        }
        int[] size = new int[next];
        int largest = 0;
        for (int b : block) {
            largest = Math.max(largest, ++size[b]);
        }
        return new HeldOutBlocks(scheme, block, next, largest);
    }

    /** Reference rows. */
    public int rows() {
        return blockOf.length;
    }
}
