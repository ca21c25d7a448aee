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
    private double localScale = Double.NaN;
    /** Whether {@link #list} holds the neighbours of the last estimate (false after a tied-run answer). */
    private boolean listCurrent;

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
        listCurrent = false;
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

    /** The class vote at scaled coordinates q into slot i of out. */
    void voteAt(double[] q, ClassVotes out, int i) {
        int k = model.settings().k();
        find(q, k, -1);
        estimator.load(list, model.classValues());
        estimator.prepare(model.settings().weighting(), k);
        int winner = estimator.vote(k, shares, nearest);
        out.winner()[i] = winner;
        out.share()[i] = shares[winner];
        out.neighbourCount()[i] = estimator.counted(k);
        out.windowWidth()[i] = model.windowWidthOfKey(estimator.kthKey(k));
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
     * also the first distance beyond the k-th's tie band, when a row lies beyond.
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
        if (c < available && list.key(c - 1) <= index.metric().tieHigh(list.key(k - 1))) {
            // every row found ties the k-th: search past them for the first row beyond
            index.search(q, c + 1, exclude, list);
        }
    }

    /**
     * The full estimate at scaled coordinates q into slot i of out, position {@code exclude} left
     * out (none when negative). Neighbours that are exactly one long tied run are summed from the
     * run's totals ({@link TiedRuns}; its median is the run's definition-7 quantile at 0.5), the
     * others row by row.
     */
    void estimateAt(double[] q, int exclude, Estimates out, int i) {
        KnnSettings s = model.settings();
        int k = s.k();
        Band band = s.band();
        TiedRuns runs = model.tiedRuns();
        int run = runs == null ? -1 : runs.runFor(q[0], k, exclude);
        double fit;
        double sd;
        double low = Double.NaN;
        double high = Double.NaN;
        double key;
        int counted;
        boolean median = s.estimate() == EstimateKind.MEDIAN;
        listCurrent = run < 0;
        if (run >= 0) {
            fit = median ? runs.quantile(run, exclude, 0.5) : runs.mean(run, exclude);
            sd = runs.sd(run, exclude);
            if (band.isQuantile()) {
                low = runs.quantile(run, exclude, band.lowProbability());
                high = runs.quantile(run, exclude, band.highProbability());
            }
            key = runs.key(run, q[0]);
            counted = runs.size(run, exclude);
        } else {
            LocalEstimator est = rowByRow(q, k, exclude);
            double mean = est.fit(k);
            sd = est.sd(k, mean); // the spread about the mean under either estimate
            fit = median ? est.median(k) : mean;
            if (band.isQuantile()) {
                low = est.quantile(k, band.lowProbability());
                high = est.quantile(k, band.highProbability());
            }
            key = est.kthKey(k);
            counted = est.counted(k);
        }
        if (band == Band.SD2) {
            low = fit - 2 * sd;
            high = fit + 2 * sd;
        }
        out.fit()[i] = fit;
        out.localSd()[i] = sd;
        out.bandLow()[i] = low;
        out.bandHigh()[i] = high;
        out.windowWidth()[i] = model.windowWidthOfKey(key);
        out.neighbourCount()[i] = counted;
    }

    /**
     * The fit (the settings' estimate) at scaled coordinates q for k with position {@code exclude} left out; afterwards
     * {@link #localScale()} holds the neighbours' spread the flag scale asks for (their SD, or
     * 1.4826 times their MAD; NaN for the global scale). Long tied runs are summed from their
     * totals, except for the local MAD, which walks the rows.
     */
    double fitLeavingOut(double[] q, int k, int exclude, FlagScale scale) {
        boolean median = model.settings().estimate() == EstimateKind.MEDIAN;
        TiedRuns runs = model.tiedRuns();
        int run = runs == null || scale == FlagScale.LOCAL_MAD ? -1 : runs.runFor(q[0], k, exclude);
        listCurrent = run < 0;
        if (run >= 0) {
            localScale = scale == FlagScale.LOCAL_SD ? runs.sd(run, exclude) : Double.NaN;
            return median ? runs.quantile(run, exclude, 0.5) : runs.mean(run, exclude);
        }
        rowByRow(q, k, exclude);
        double mean = estimator.fit(k);
        double fit = median ? estimator.median(k) : mean;
        if (scale == FlagScale.LOCAL_SD) {
            localScale = estimator.sd(k, mean);
        } else if (scale == FlagScale.LOCAL_MAD) {
            localScale = InputTransform.MAD_TO_SD * estimator.mad(k);
        } else {
            localScale = Double.NaN;
        }
        return fit;
    }

    /** The estimator loaded with the neighbours of q for k (position exclude left out), weighted. */
    private LocalEstimator rowByRow(double[] q, int k, int exclude) {
        find(q, k, exclude);
        listCurrent = true;
        estimator.load(list, model.data().response());
        estimator.prepare(model.settings().weighting(), k);
        return estimator;
    }

    /**
     * The weighted median and 1.4826 times the weighted MAD of {@code values} (one per reference position) over
     * the neighbours of the last estimate at q ({@link #estimateAt} or {@link #fitLeavingOut} with the same q, k
     * and exclude): the same counted rows and share weights as that fit (the tie rule, the settings' weighting),
     * so the spread describes the neighbourhood the fit averaged. A tied-run answer kept no list: the rows are
     * searched again (they are the run). Into {@code centre[i]} and {@code spread[i]}; the estimator then holds
     * these values, not the responses.
     */
    void neighbourSpread(double[] q, int k, int exclude, double[] values, double[] centre, double[] spread, int i) {
        if (!listCurrent) {
            find(q, k, exclude);
        }
        estimator.load(list, values);
        estimator.prepare(model.settings().weighting(), k);
        centre[i] = estimator.quantile(k, 0.5);
        spread[i] = InputTransform.MAD_TO_SD * estimator.mad(k);
    }

    /** The local spread of the last {@link #fitLeavingOut} call. */
    double localScale() {
        return localScale;
    }
}
