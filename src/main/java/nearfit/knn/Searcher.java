package nearfit.knn;

/**
 * Queries against one model from one thread: holds the scratch (neighbour list, estimator,
 * transformed point) so a query allocates nothing. Get one per thread from
 * {@link KnnModel#searcher()}; not thread-safe.
 */
public final class Searcher {
    private final KnnModel model;
    private final NeighborList list = new NeighborList();
    private final LocalEstimator estimator;
    private final double[] coords;
    private final double[] shares;
    private final double[] nearest;

    Searcher(KnnModel model) {
        this.model = model;
        this.estimator = new LocalEstimator(model.settings().metric());
        this.coords = new double[model.data().dimensions()];
        int c = Math.max(1, model.data().classCount());
        this.shares = new double[c];
        this.nearest = new double[c];
    }

    /**
     * The k nearest reference rows to a raw point (one value per input), and every row tied with
     * the k-th; valid until the next call. Positions map to table rows with {@link #rowId(int)};
     * {@link Metric#EUCLIDEAN} and {@link Metric#MAHALANOBIS} keys are squared distances.
     */
    public NeighborList neighbors(double[] raw) {
        model.transform().apply(raw, coords);
        model.index().search(coords, model.settings().k(), -1, list);
        return list;
    }

    /** The table row id of a reference position. */
    public int rowId(int position) {
        return model.data().rowIds()[position];
    }

    /** The estimate at a raw point (allocates the returned record only). */
    public Estimate estimate(double[] raw) {
        Estimates one = Estimates.ofSize(1);
        model.transform().apply(raw, coords);
        estimateAt(coords, -1, one, 0);
        return one.at(0);
    }

    /** The class vote at a raw point, for a category response. */
    public ClassVote vote(double[] raw) {
        model.transform().apply(raw, coords);
        int k = model.settings().k();
        find(coords, k, -1);
        estimator.load(list, model.classValues());
        estimator.prepare(model.settings().weighting(), k);
        int winner = estimator.vote(k, shares, nearest);
        return new ClassVote(winner, shares.clone(), estimator.counted(k));
    }

    /** Transforms a raw point into the scratch coordinates. */
    double[] transformed(double[] raw) {
        model.transform().apply(raw, coords);
        return coords;
    }

    NeighborList list() {
        return list;
    }

    LocalEstimator estimator() {
        return estimator;
    }

    /**
     * Searches k neighbours of scaled coordinates q, excluding a position; for tricube weights
     * also the first distance beyond the k-th, when a row lies beyond.
     */
    void find(double[] q, int k, int exclude) {
        find(q, k, exclude, model.settings().weighting() == Weighting.TRICUBE);
    }

    void find(double[] q, int k, int exclude, boolean beyond) {
        NeighborIndex index = model.index();
        if (!beyond) {
            index.search(q, k, exclude, list);
            return;
        }
        int available = index.size() - (exclude >= 0 ? 1 : 0);
        index.search(q, Math.min(k + 1, available), exclude, list);
        int c = list.count();
        if (c < available && list.key(c - 1) == list.key(k - 1)) {
            index.search(q, c + 1, exclude, list);
        }
    }

    /** The full estimate at scaled coordinates q into slot i of out. */
    void estimateAt(double[] q, int exclude, Estimates out, int i) {
        KnnSettings s = model.settings();
        int k = s.k();
        find(q, k, exclude);
        LocalEstimator est = estimator;
        est.load(list, model.data().response());
        est.prepare(s.weighting(), k);
        double fit = est.fit(k);
        double sd = est.sd(k, fit);
        out.fit()[i] = fit;
        out.localSd()[i] = sd;
        Band band = s.band();
        if (band.isQuantile()) {
            out.bandLow()[i] = est.quantile(k, band.lowProbability());
            out.bandHigh()[i] = est.quantile(k, band.highProbability());
        } else if (band == Band.SD2) {
            out.bandLow()[i] = fit - 2 * sd;
            out.bandHigh()[i] = fit + 2 * sd;
        } else {
            out.bandLow()[i] = Double.NaN;
            out.bandHigh()[i] = Double.NaN;
        }
        out.windowWidth()[i] = model.windowWidthOfKey(est.kthKey(k));
        out.neighbourCount()[i] = est.counted(k);
    }
}
