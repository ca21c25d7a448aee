package nearfit.knn;

/**
 * A stable least-significant-digit radix sort of 32-bit keys (11-bit digits, three passes, a pass
 * skipped when every key shares its digit), giving the sorting permutation. Used for the canonical
 * row order and the Morton order of queries: linear time, sequential reads, no comparisons.
 */
final class RadixSort {
    private static final int BITS = 11;
    private static final int BUCKETS = 1 << BITS;

    private RadixSort() {
    }

    /** The bits of a finite double (or an infinity) as a long whose unsigned order is the numeric order. */
    static long sortableBits(double v) {
        long b = Double.doubleToRawLongBits(v + 0.0); // +0.0 turns -0.0 into 0.0: equal values sort as equal
        return b < 0 ? ~b : b ^ Long.MIN_VALUE;
    }

    /**
     * The indexes 0..n-1 ordered by ascending unsigned 32-bit key, equal keys in index order; the
     * keys are sorted in place along. Three passes of 11 bits, a pass skipped when every key shares
     * its digit.
     */
    static int[] order32(int[] key) {
        int n = key.length;
        int passes = 3;
        int[][] count = new int[passes][BUCKETS];
        for (int v : key) {
            for (int p = 0; p < passes; p++) {
                count[p][(v >>> (p * BITS)) & (BUCKETS - 1)]++;
            }
        }
        int[] k = key;
        int[] kNext = new int[n];
        int[] idx = new int[n];
        int[] idxNext = new int[n];
        for (int i = 0; i < n; i++) {
            idx[i] = i;
        }
        for (int p = 0; p < passes; p++) {
            int[] c = count[p];
            int shift = p * BITS;
            if (n == 0 || c[(k[0] >>> shift) & (BUCKETS - 1)] == n) {
                continue;
            }
            int sum = 0;
            for (int b = 0; b < BUCKETS; b++) {
                int t = c[b];
                c[b] = sum;
                sum += t;
            }
            for (int i = 0; i < n; i++) {
                int v = k[i];
                int at = c[(v >>> shift) & (BUCKETS - 1)]++;
                kNext[at] = v;
                idxNext[at] = idx[i];
            }
            int[] tk = k;
            k = kNext;
            kNext = tk;
            int[] ti = idx;
            idx = idxNext;
            idxNext = ti;
        }
        if (k != key) {
            System.arraycopy(k, 0, key, 0, n);
        }
        return idx;
    }
}
