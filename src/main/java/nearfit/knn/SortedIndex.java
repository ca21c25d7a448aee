package nearfit.knn;

/**
 * One input: the coordinates in ascending order (the canonical reference order guarantees it),
 * a binary search for the query, then a window grown on both sides, nearest side first. Keys grow
 * monotonically outwards on each side, so the window stops as soon as both next keys exceed the
 * k-th key.
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
        int n = x.length;
        int r = lowerBound(q);
        int l = r - 1;
        out.reset(k);
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
            if (count >= k && key > kth) {
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
