package nearfit.knn;

/**
 * An exact nearest-neighbour index over packed coordinates (row-major, n*d, canonical reference
 * order). Indexes are immutable and safe to share between threads; the per-thread state lives in
 * the {@link NeighborList} passed to {@link #search}.
 */
public sealed interface NeighborIndex permits SortedIndex, KdTree, BruteForce {

    /** Below this many rows every index is brute force. */
    int TINY = 64;

    /** Above this many inputs the k-d tree's pruning no longer pays, so brute force. */
    int MAX_TREE_DIMENSIONS = 16;

    /**
     * Finds the k nearest reference rows to {@code query} (scaled coordinates, length d), and every
     * row tied with the k-th key, skipping the row at position {@code exclude} (or none when
     * negative; duplicates of that row still count). Fewer than k only when fewer rows exist.
     */
    void search(double[] query, int k, int exclude, NeighborList out);

    /** Number of rows. */
    int size();

    /** Number of coordinates per row. */
    int dimensions();

    /** The metric applied to the coordinates (Euclidean for Mahalanobis). */
    Metric metric();

    /**
     * Chooses and builds an index: sorted for one input, k-d tree for 2..16, brute force for more
     * or for fewer than {@link #TINY} rows.
     *
     * @param coords  packed coordinates, n*d, not copied and not to be changed
     * @param d       dimensions
     * @param metric  the model's metric (Mahalanobis means Euclidean on whitened coordinates)
     * @param threads threads for building
     */
    static NeighborIndex build(double[] coords, int d, Metric metric, int threads) {
        int n = coords.length / d;
        Metric base = metric.base();
        if (n < TINY || d > MAX_TREE_DIMENSIONS) {
            return new BruteForce(coords, d, base);
        }
        if (d == 1) {
            return new SortedIndex(coords, base);
        }
        return KdTree.build(coords, d, base, threads);
    }
}
