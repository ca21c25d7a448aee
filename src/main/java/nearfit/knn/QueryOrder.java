package nearfit.knn;

/**
 * An order to run a batch of queries in: by Morton (Z-order) code of their first three
 * coordinates, so consecutive queries visit the same tree nodes and rows while they are in cache.
 * Only the order of work changes; each query's result goes to its own slot, so results do not
 * depend on it.
 */
final class QueryOrder {
    private static final int BITS = 21; // 3 x 21 bits fit a long

    private QueryOrder() {
    }

    /** The processing order for n packed queries of d coordinates (NaN coordinates sort anywhere). */
    static int[] of(double[] q, int d, int n) {
        int used = Math.min(3, d);
        double[] lo = new double[used];
        double[] span = new double[used];
        for (int j = 0; j < used; j++) {
            double mn = Double.POSITIVE_INFINITY;
            double mx = Double.NEGATIVE_INFINITY;
            for (int i = 0; i < n; i++) {
                double v = q[i * d + j];
                if (v < mn) {
                    mn = v;
                }
                if (v > mx) {
                    mx = v;
                }
            }
            lo[j] = mn;
            span[j] = mx > mn ? mx - mn : 1;
        }
        long[] code = new long[n];
        long cells = (1L << BITS) - 1;
        for (int i = 0; i < n; i++) {
            long c = 0;
            for (int j = 0; j < used; j++) {
                double t = (q[i * d + j] - lo[j]) / span[j];
                long cell = t >= 0 && t <= 1 ? (long) (t * cells) : 0;
                c |= spread(cell) << j;
            }
            code[i] = c;
        }
        return RadixSort.order(code);
    }

    /** Spreads 21 bits so that two zero bits separate each (bit i moves to bit 3i). */
    private static long spread(long v) {
        long x = v & 0x1fffffL;
        x = (x | x << 32) & 0x1f00000000ffffL;
        x = (x | x << 16) & 0x1f0000ff0000ffL;
        x = (x | x << 8) & 0x100f00f00f00f00fL;
        x = (x | x << 4) & 0x10c30c30c30c30c3L;
        x = (x | x << 2) & 0x1249249249249249L;
        return x;
    }
}
