package nearfit.knn;

import java.util.Arrays;

/**
 * The neighbours of one query: reference positions and keys, ascending by (key, position), with
 * every row that ties the k-th key included ({@link Metric#tieHigh}: within a relative 1e-12 of the
 * k-th distance), so {@link #count()} can exceed k. Also the search's scratch space (a max-heap of
 * the k best and a buffer of rows that tie the heap's top), reused from query to query: one list
 * per thread, not thread-safe.
 *
 * <p>Keys are those of {@link Metric}: squared distances for Euclidean and Mahalanobis. During a
 * search the heap holds index-specific <em>slots</em> (the k-d tree's tree-order row), mapped to
 * positions by {@link #finish(int[])}; the slots of the last search's k best are kept, so the next
 * search of the same index can start with a bound from them (see {@link #previousSlots}).
 */
public final class NeighborList {
    private int k;
    private Metric metric = Metric.EUCLIDEAN;
    private int heapSize;
    private double[] heapKey = new double[16];
    private int[] heapPos = new int[16];
    /**
     * The key a candidate must not exceed: once k are held, the largest key that ties the heap's top
     * ({@link Metric#tieHigh}); +infinity before, unless {@link #limit} lowered it.
     */
    private double bound;
    private double[] gaps = new double[0];
    private int tieCount;
    /** The largest key in the tie buffer (meaningful when tieCount &gt; 0). */
    private double tieMax;
    private double[] tieKey = new double[16];
    private int[] tiePos = new int[16];

    private Object previousOwner;
    private int previousCount;
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
        heapSize = 0;
        tieCount = 0;
        count = 0;
        bound = Double.POSITIVE_INFINITY;
        if (heapKey.length < newK) {
            heapKey = new double[newK];
            heapPos = new int[newK];
        }
    }

    /** The key a candidate must not exceed to matter: the tie bound of the heap's top once k are held. */
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
    double offer(double key, int pos) {
        if (heapSize < k) {
            push(key, pos);
            if (heapSize == k) {
                bound = Math.min(bound, metric.tieHigh(heapKey[0]));
            }
            return bound;
        }
        if (key > bound) {
            return bound;
        }
        double top = heapKey[0];
        if (key >= top) {
            addTie(key, pos);
            return bound;
        }
        int topPos = heapPos[0];
        replaceTop(key, pos);
        addTie(top, topPos);
        double newTop = heapKey[0];
        if (newTop < top) {
            bound = Math.min(bound, metric.tieHigh(newTop));
            if (tieMax > bound) {
                dropTiesAbove(bound); // buffered rows that tied the old top but not the new one
            }
        }
        return bound;
    }

    /** Removes buffered ties whose key exceeds the bound. */
    private void dropTiesAbove(double b) {
        int m = 0;
        double max = Double.NEGATIVE_INFINITY;
        for (int i = 0; i < tieCount; i++) {
            if (tieKey[i] <= b) {
                tieKey[m] = tieKey[i];
                tiePos[m++] = tiePos[i];
                max = Math.max(max, tieKey[i]);
            }
        }
        tieCount = m;
        tieMax = max;
    }

    private void push(double key, int pos) {
        int i = heapSize++;
        while (i > 0) {
            int parent = (i - 1) >>> 1;
            if (heapKey[parent] >= key) {
                break;
            }
            heapKey[i] = heapKey[parent];
            heapPos[i] = heapPos[parent];
            i = parent;
        }
        heapKey[i] = key;
        heapPos[i] = pos;
    }

    private void replaceTop(double key, int pos) {
        int i = 0;
        int n = heapSize;
        while (true) {
            int c = 2 * i + 1;
            if (c >= n) {
                break;
            }
            if (c + 1 < n && heapKey[c + 1] > heapKey[c]) {
                c++;
            }
            if (heapKey[c] <= key) {
                break;
            }
            heapKey[i] = heapKey[c];
            heapPos[i] = heapPos[c];
            i = c;
        }
        heapKey[i] = key;
        heapPos[i] = pos;
    }

    private void addTie(double key, int pos) {
        if (tieCount == tieKey.length) {
            tieKey = Arrays.copyOf(tieKey, tieCount * 2);
            tiePos = Arrays.copyOf(tiePos, tieCount * 2);
        }
        tieMax = tieCount == 0 ? key : Math.max(tieMax, key);
        tieKey[tieCount] = key;
        tiePos[tieCount++] = pos;
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

    /** Ends a search whose slots are positions. */
    void finish() {
        finish(null, null);
    }

    /**
     * Ends the search of {@code owner}: remembers the heap's slots, moves heap and ties to the
     * output with slots mapped to positions ({@code slotPosition[slot]}; null: the same), sorted by
     * (key, position).
     */
    void finish(Object owner, int[] slotPosition) {
        int n = heapSize + tieCount;
        ensureOutput(n);
        if (previousSlots.length < heapSize) {
            previousSlots = new int[heapKey.length];
        }
        System.arraycopy(heapPos, 0, previousSlots, 0, heapSize);
        previousCount = heapSize;
        previousOwner = owner;
        System.arraycopy(heapKey, 0, keys, 0, heapSize);
        System.arraycopy(tieKey, 0, keys, heapSize, tieCount);
        if (slotPosition == null) {
            System.arraycopy(heapPos, 0, positions, 0, heapSize);
            System.arraycopy(tiePos, 0, positions, heapSize, tieCount);
        } else {
            for (int i = 0; i < heapSize; i++) {
                positions[i] = slotPosition[heapPos[i]];
            }
            for (int i = 0; i < tieCount; i++) {
                positions[heapSize + i] = slotPosition[tiePos[i]];
            }
        }
        count = n;
        sortByKeyThenPosition(keys, positions, 0, n);
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
