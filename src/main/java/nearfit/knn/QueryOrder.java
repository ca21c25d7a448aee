package nearfit.knn;

/**
 * An order to run a batch of queries in: by Morton (Z-order) code of their first three
 * coordinates (30 bits in all), so consecutive queries visit the same tree nodes and rows while they are in cache.
 * Only the order of work changes; each query's result goes to its own slot, so results do not
 * depend on it.
 */
final class QueryOrder {
    private static final int CODE_BITS = 30; // a 32-bit radix key: 30 bits for one input, 15 for two, 10 for three

    private QueryOrder() {
    }

    /** The processing order for n packed queries of d coordinates (NaN coordinates sort anywhere). */
    static int[] of(double[] q, int d, int n) {
        int used = Math.min(3, d);
        int bits = CODE_BITS / used;
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
        int[] code = new int[n];
        long cells = (1L << bits) - 1;
        for (int i = 0; i < n; i++) {
            int c = 0;
            for (int j = 0; j < used; j++) {
                double t = (q[i * d + j] - lo[j]) / span[j];
                long cell = t >= 0 && t <= 1 ? (long) (t * cells) : 0;
                c |= spread(cell, bits, used) << j;
            }
            code[i] = c;
        }
        return RadixSort.order32(code);
    }

    /** Spreads the low {@code bits} bits of v so that {@code used - 1} zero bits separate each. */
    private static int spread(long v, int bits, int used) {
        int x = 0;
        for (int b = 0; b < bits; b++) {
            x |= (int) ((v >>> b) & 1) << (b * used);
        }
        return x;
    }
}
