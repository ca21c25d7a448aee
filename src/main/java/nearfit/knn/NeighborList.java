package nearfit.knn;

import java.util.Arrays;

/**
 * The neighbours of one query: reference positions and keys, ascending by (key, position), with
 * every row that ties the k-th key included ({@link Metric#tieHigh}: within a relative 1e-12 of the
 * k-th distance), so {@link #count()} can exceed k. Also the search's scratch space, reused from
 * query to query: one list per thread, not thread-safe.
 *
 * <p>During a search the candidates are kept ascending by key (equal keys in arrival order) in
 * primitive arrays, each inserted at its place: the first k are the k best, and the rest are the rows
 * that tie the k-th. When the k-th key drops, the tail beyond the new tie bound is cut off. So the
 * held set is always "every offered row with a key up to the tie bound of the k-th smallest", the same
 * whatever the order of offers, and the end of a search needs no sort: only rows of exactly equal keys
 * are put in position order once slots are mapped to positions.
 *
 * <p>Keys are those of {@link Metric}: squared distances for Euclidean and Mahalanobis. During a
 * search the list holds index-specific <em>slots</em> (the k-d tree's tree-order row), mapped to
 * positions by {@link #finish(Object, int[])}; the slots of the last search's result are kept, so the
 * next search of the same index can start with a bound from them (see {@link #previousSlots}).
 */
public final class NeighborList {
    private int k;
    private Metric metric = Metric.EUCLIDEAN;
    /** Candidates held: ascending keys, their slots; the first min(k, held) are the best. */
    private int held;
    private double[] candKey = new double[16];
    private int[] candSlot = new int[16];
    /**
     * The key a candidate must not exceed: once k are held, the largest key that ties the k-th
     * ({@link Metric#tieHigh}); +infinity before, unless {@link #limit} lowered it.
     */
    private double bound;
    private double[] gaps = new double[0];

    private Object previousOwner;
    private int previousCount;
    /** The slot of the row the search excluded, once met (-1 before); the previous search's, after finish. */
    private int excludedSlot = -1;
    private int previousExcludedSlot = -1;
    private int[] previousSlots = new int[16];

    private int count;
    private double[] keys = new double[16];
    private int[] positions = new int[16];

    /** Number of neighbours found, including every row tied with the k-th. */
    public int count() {
        return count;
    }

    /** The reference position (canonical order) of neighbour i. */
    public int position(int i) {
        return positions[i];
    }

    /** The key of neighbour i (squared distance for Euclidean and Mahalanobis). */
    public double key(int i) {
        return keys[i];
    }

    double[] keys() {
        return keys;
    }

    int[] positions() {
        return positions;
    }

    /** Starts a search for k neighbours under a base metric (which fixes the tie bound). */
    void reset(int newK, Metric base) {
        k = newK;
        metric = base;
        held = 0;
        count = 0;
        bound = Double.POSITIVE_INFINITY;
        excludedSlot = -1;
        if (candKey.length <= newK) {
            candKey = new double[newK + 1];
            candSlot = new int[newK + 1];
        }
    }

    /** The key a candidate must not exceed to matter: the tie bound of the k-th held key once k are held. */
    double bound() {
        return bound;
    }

    /** Per-dimension scratch for the k-d tree's cell gaps (length at least d). */
    double[] gaps(int d) {
        if (gaps.length < d) {
            gaps = new double[d];
        }
        return gaps;
    }

    /**
     * Offers a candidate; keeps the k best and every candidate that ties the k-th. Returns the new
     * {@link #bound()}.
     */
    double offer(double key, int slot) {
        if (held < k) {
            insert(key, slot);
            if (held == k) {
                bound = Math.min(bound, metric.tieHigh(candKey[k - 1]));
            }
            return bound;
        }
        if (key > bound) {
            return bound;
        }
        double kth = candKey[k - 1];
        insert(key, slot);
        if (key < kth) {
            double newKth = candKey[k - 1];
            if (newKth < kth) {
                bound = Math.min(bound, metric.tieHigh(newKth));
                while (held > k && candKey[held - 1] > bound) {
                    held--; // rows that tied the old k-th but not the new one
                }
            }
        }
        return bound;
    }

    /**
     * Inserts after every held key {@code <= key}: one insertion-sort step from the end, whose
     * predictable loop beats a binary search and a copy call at the list lengths searched (k up to
     * a few hundred).
     */
    private void insert(double key, int slot) {
        if (held == candKey.length) {
            candKey = Arrays.copyOf(candKey, held * 2);
            candSlot = Arrays.copyOf(candSlot, held * 2);
        }
        double[] ck = candKey;
        int[] cs = candSlot;
        int i = held;
        while (i > 0 && ck[i - 1] > key) {
            ck[i] = ck[i - 1];
            cs[i] = cs[i - 1];
            i--;
        }
        ck[i] = key;
        cs[i] = slot;
        held++;
    }

    /**
     * Lowers the bound to the tie bound of {@code cap} before any candidate is offered: valid when
     * at least k rows the search may return have a key {@code <= cap}, since then the k-th key is
     * {@code <= cap} and no row the result holds (ties included, {@link Metric#tieHigh} being
     * monotone) is rejected.
     */
    void limit(double cap) {
        double b = metric.tieHigh(cap);
        if (b < bound) {
            bound = b;
        }
    }

    /**
     * The slots of the previous search's k best when it ran on {@code owner}, else null; valid
     * until the next {@link #finish}; {@link #previousCount()} of them.
     */
    int[] previousSlots(Object owner) {
        return owner == previousOwner ? previousSlots : null;
    }

    int previousCount() {
        return previousCount;
    }

    /** Notes the slot of the excluded row when the search meets it (its key is not offered). */
    void noteExcludedSlot(int slot) {
        excludedSlot = slot;
    }

    /** The slot the previous search of the same owner excluded, or -1 (read with {@link #previousSlots}). */
    int previousExcludedSlot() {
        return previousExcludedSlot;
    }

    /** Ends a search whose slots are positions. */
    void finish() {
        finish(null, null);
    }

    /**
     * Ends the search of {@code owner}: remembers the held slots, moves the candidates to the output
     * with slots mapped to positions ({@code slotPosition[slot]}; null: the same). They are ascending
     * by key already; rows of equal keys are put in position order.
     */
    void finish(Object owner, int[] slotPosition) {
        int n = held;
        ensureOutput(n);
        if (previousSlots.length < n) {
            previousSlots = new int[candSlot.length];
        }
        System.arraycopy(candSlot, 0, previousSlots, 0, n);
        previousCount = n;
        previousOwner = owner;
        previousExcludedSlot = excludedSlot;
        System.arraycopy(candKey, 0, keys, 0, n);
        if (slotPosition == null) {
            System.arraycopy(candSlot, 0, positions, 0, n);
        } else {
            for (int i = 0; i < n; i++) {
                positions[i] = slotPosition[candSlot[i]];
            }
        }
        count = n;
        orderEqualKeysByPosition(keys, positions, n);
    }

    /** With keys ascending, sorts positions within each run of equal keys (insertion: runs are short). */
    private static void orderEqualKeysByPosition(double[] key, int[] pos, int n) {
        for (int i = 1; i < n; i++) {
            double k = key[i];
            int p = pos[i];
            if (k != key[i - 1] || p > pos[i - 1]) {
                continue;
            }
            int j = i - 1;
            while (j >= 0 && key[j] == k && pos[j] > p) {
                pos[j + 1] = pos[j];
                j--;
            }
            pos[j + 1] = p;
        }
    }

    /** Makes room for n outputs (for indexes that write the output directly). */
    void ensureOutput(int n) {
        if (keys.length < n) {
            int len = Math.max(n, keys.length * 2);
            keys = Arrays.copyOf(keys, len);
            positions = Arrays.copyOf(positions, len);
        }
    }

    /** Sets the output directly; the caller then calls {@link #sortOutput()} unless it wrote in (key, position) order. */
    void setOutput(int i, double key, int pos) {
        keys[i] = key;
        positions[i] = pos;
    }

    void setCount(int n) {
        count = n;
        previousOwner = null;
    }

    void sortOutput() {
        sortByKeyThenPosition(keys, positions, 0, count);
    }

    /** Quicksort with insertion sort below 24; pairs are distinct since positions are. */
    static void sortByKeyThenPosition(double[] key, int[] pos, int from, int to) {
        while (to - from > 24) {
            int mid = (from + to) >>> 1;
            int p = median3(key, pos, from, mid, to - 1);
            double pk = key[p];
            int pp = pos[p];
            int i = from;
            int j = to - 1;
            while (i <= j) {
                while (less(key[i], pos[i], pk, pp)) {
                    i++;
                }
                while (less(pk, pp, key[j], pos[j])) {
                    j--;
                }
                if (i <= j) {
                    swap(key, pos, i++, j--);
                }
            }
            if (j - from < to - i) {
                sortByKeyThenPosition(key, pos, from, j + 1);
                from = i;
            } else {
                sortByKeyThenPosition(key, pos, i, to);
                to = j + 1;
            }
        }
        for (int i = from + 1; i < to; i++) {
            double k = key[i];
            int p = pos[i];
            int j = i - 1;
            while (j >= from && less(k, p, key[j], pos[j])) {
                key[j + 1] = key[j];
                pos[j + 1] = pos[j];
                j--;
            }
            key[j + 1] = k;
            pos[j + 1] = p;
        }
    }

    private static boolean less(double ka, int pa, double kb, int pb) {
        return ka < kb || (ka == kb && pa < pb);
    }

    private static int median3(double[] key, int[] pos, int a, int b, int c) {
        boolean ab = less(key[a], pos[a], key[b], pos[b]);
        boolean bc = less(key[b], pos[b], key[c], pos[c]);
        boolean ac = less(key[a], pos[a], key[c], pos[c]);
        if (ab == bc) {
            return b;
        }
        return ab == ac ? c : a;
    }

    private static void swap(double[] key, int[] pos, int i, int j) {
        double k = key[i];
        key[i] = key[j];
        key[j] = k;
        int p = pos[i];
        pos[i] = pos[j];
        pos[j] = p;
    }
}
