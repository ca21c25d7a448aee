package nearfit.knn;

/**
 * One input: the coordinates in ascending order (the canonical reference order guarantees it),
 * a binary search for the query, then a window grown on both sides, nearest side first. Keys grow
 * monotonically outwards on each side, so the window stops as soon as both next keys exceed the
 * largest key that ties the k-th ({@link Metric#tieHigh}). The window grows by blocks of equal key
 * (a contiguous position range on one side), the left block before the right one at an equal
 * key, so the output arrives in (key, position) order and needs no sort: with heavily tied inputs
 * (a sensor's rounding) the tied block holds hundreds of rows and sorting it per query dominated
 * the cost.
 */
public final class SortedIndex implements NeighborIndex {
    private final double[] x;
    private final Metric base;

    /**
     * @param x    ascending coordinates (checked)
     * @param base the metric (for one input every metric is |x - q|; Euclidean keys are squared)
     */
    public SortedIndex(double[] x, Metric base) {
        for (int i = 1; i < x.length; i++) {
            if (x[i] < x[i - 1]) {
                throw new IllegalArgumentException("coordinates not ascending at " + i);
            }
        }
        this.x = x;
        this.base = base.base();
    }

    private double key(int i, double q) {
        double t = x[i] - q;
        return base == Metric.EUCLIDEAN ? t * t : Math.abs(t);
    }

    @Override
    public void search(double[] query, int k, int exclude, NeighborList out) {
        double q = query[0];
        out.reset(k, base);
        if (Double.isNaN(q)) {
            searchOneByOne(q, k, exclude, out);
            return;
        }
        int n = x.length;
        int r = lowerBound(q);
        int l = r - 1;
        out.ensureOutput(Math.min(k, n) + 16);
        int count = 0;
        while (true) {
            if (l == exclude) {
                l--;
            }
            if (r == exclude) {
                r++;
            }
            if (l < 0 && r >= n) {
                break;
            }
            double kl = l >= 0 ? key(l, q) : Double.POSITIVE_INFINITY;
            double kr = r < n ? key(r, q) : Double.POSITIVE_INFINITY;
            double key = Math.min(kl, kr);
            if (count >= k && key > base.tieHigh(out.key(k - 1))) {
                break; // beyond every row that ties the k-th
            }
            if (l >= 0 && kl == key) {
                int a = blockStart(l, key, q, exclude);
                count = emit(out, count, a, l, key, exclude);
                l = a - 1;
            }
            if (r < n && kr == key) {
                int b = blockEnd(r, key, q, exclude);
                count = emit(out, count, r, b, key, exclude);
                r = b + 1;
            }
        }
        out.setCount(count);
    }

    /** The lowest position of the block of rows left of and including l whose key equals key. */
    private int blockStart(int l, double key, double q, int exclude) {
        int a = l;
        while (a > 0 && (a - 1 == exclude ? a > 1 && key(a - 2, q) == key : key(a - 1, q) == key)) {
            a -= a - 1 == exclude ? 2 : 1;
        }
        return a;
    }

    /** The highest position of the block of rows right of and including r whose key equals key. */
    private int blockEnd(int r, double key, double q, int exclude) {
        int n = x.length;
        int b = r;
        while (b < n - 1 && (b + 1 == exclude ? b < n - 2 && key(b + 2, q) == key : key(b + 1, q) == key)) {
            b += b + 1 == exclude ? 2 : 1;
        }
        return b;
    }

    /** Appends positions from..to (ascending, all at key, but for exclude); returns the new count. */
    private static int emit(NeighborList out, int count, int from, int to, double key, int exclude) {
        out.ensureOutput(count + to - from + 1);
        for (int p = from; p <= to; p++) {
            if (p != exclude) {
                out.setOutput(count++, key, p);
            }
        }
        return count;
    }

    /** The element-by-element window with a final sort, kept for a NaN query (no key compares equal). */
    private void searchOneByOne(double q, int k, int exclude, NeighborList out) {
        int n = x.length;
        int r = lowerBound(q);
        int l = r - 1;
        out.ensureOutput(Math.min(k, n) + 16);
        int count = 0;
        double kth = Double.NaN;
        while (true) {
            if (l == exclude) {
                l--;
            }
            if (r == exclude) {
                r++;
            }
            double kl = l >= 0 ? key(l, q) : Double.POSITIVE_INFINITY;
            double kr = r < n ? key(r, q) : Double.POSITIVE_INFINITY;
            if (l < 0 && r >= n) {
                break;
            }
            boolean left = kl <= kr;
            double key = left ? kl : kr;
            if (count >= k && key > base.tieHigh(kth)) {
                break;
            }
            out.ensureOutput(count + 1);
            out.setOutput(count++, key, left ? l-- : r++);
            if (count == k) {
                kth = key;
            }
        }
        out.setCount(count);
        out.sortOutput();
    }

    private int lowerBound(double q) {
        return lowerBound(x, q);
    }

    /** The first position whose coordinate is not below q (x.length when none). */
    static int lowerBound(double[] x, double q) {
        int lo = 0;
        int hi = x.length;
        while (lo < hi) {
            int mid = (lo + hi) >>> 1;
            if (x[mid] < q) {
                lo = mid + 1;
            } else {
                hi = mid;
            }
        }
        return lo;
    }

    /** The ascending coordinates (the stored array). */
    double[] coordinates() {
        return x;
    }

    @Override
    public int size() {
        return x.length;
    }

    @Override
    public int dimensions() {
        return 1;
    }

    @Override
    public Metric metric() {
        return base;
    }
}
