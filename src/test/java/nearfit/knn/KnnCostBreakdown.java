package nearfit.knn;

/**
 * Where the time of a fit and an all-k leave-one-out pass goes, on one thread, for
 * {@code scripts/bench-knn --cost}: the k-d tree build, the neighbour searches alone (every row in
 * the pass's spatial order, k = kmax, the row itself excluded), the same plus loading each list into
 * the estimator (its sort by key and response), and the whole pass; the per-k accumulation (fits and
 * sums for every k) is the whole pass less the searches and loads. Not a test: run by the script only.
 */
public final class KnnCostBreakdown {
    private KnnCostBreakdown() {
    }

    /** One-thread costs on a model fitted with one thread: "cost_* seconds" lines (median of reps after warm-up). */
    public static void print(KnnModel model, int kmax, int reps, Timer timer) throws Exception {
        int d = model.data().dimensions();
        int n = model.data().size();
        double[] coords = model.coords();
        double[] y = model.data().response();
        int[] order = Tuning.spatialOrder(coords, d, Tuning.allRows(n));
        timer.time("cost_build_tree", reps, () -> NeighborIndex.build(coords, d, model.settings().metric(), 1).size());
        NeighborIndex index = model.index();
        timer.time("cost_search", reps, () -> searchAll(index, coords, d, order, kmax, null, null));
        timer.time("cost_search_and_load", reps,
                () -> searchAll(index, coords, d, order, kmax, new LocalEstimator(model.settings().metric()), y));
        timer.time("cost_whole_pass", reps, () -> Tuning.leaveOneOut(model, kmax, n, 1, Progress.NONE).rmse()[kmax - 1]);
    }

    private static double searchAll(NeighborIndex index, double[] coords, int d, int[] order, int kmax,
                                    LocalEstimator est, double[] y) {
        NeighborList list = new NeighborList();
        double[] q = new double[d];
        double sink = 0;
        for (int pos : order) {
            System.arraycopy(coords, pos * d, q, 0, d);
            index.search(q, kmax, pos, list);
            if (est != null) {
                est.load(list, y);
            }
            sink += list.count();
        }
        return sink;
    }

    /** The bench's timing loop (warm-up, then the median of reps). */
    public interface Timer {
        void time(String name, int reps, Case c) throws Exception;
    }

    /** One timed case; returns a value so the work is not optimised away. */
    public interface Case {
        double run() throws Exception;
    }
}
