package nearfit.knn;

/** Scans every row: for many inputs, tiny data, and as the reference the other indexes are tested against. */
public final class BruteForce implements NeighborIndex {
    private final double[] coords;
    private final int d;
    private final Metric base;

    /** An index over packed coordinates (n*d); the metric must be a base metric (not Mahalanobis). */
    public BruteForce(double[] coords, int d, Metric base) {
        this.coords = coords;
        this.d = d;
        this.base = base.base();
    }

    @Override
    public void search(double[] query, int k, int exclude, NeighborList out) {
        out.reset(k, base);
        int n = coords.length / d;
        for (int i = 0; i < n; i++) {
            if (i != exclude) {
                double key = Metric.key(base, coords, i, query, d);
                if (key <= out.bound()) {
                    out.offer(key, i);
                }
            }
        }
        out.finish();
    }

    @Override
    public int size() {
        return coords.length / d;
    }

    @Override
    public int dimensions() {
        return d;
    }

    @Override
    public Metric metric() {
        return base;
    }
}
