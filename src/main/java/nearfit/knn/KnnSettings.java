package nearfit.knn;

import nearfit.table.NearfitException;

/**
 * The settings of a fitted model. Changing {@code k}, {@code weighting}, {@code band}, {@code estimate},
 * {@code flagThreshold}, {@code flagScale} or {@code threads} keeps the index; changing
 * {@code metric} or {@code scaling} rebuilds it (see {@link KnnModel#withSettings}).
 *
 * @param k             number of neighbours, at least 1
 * @param metric        distance between scaled inputs
 * @param weighting     weights of the neighbours
 * @param scaling       scaling of each input, fitted on the reference rows
 * @param band          the band around the fit
 * @param estimate      the fit: the neighbours' weighted mean or weighted median
 * @param flagThreshold a row is flagged when |z| exceeds this (3.5 by default, Iglewicz &amp; Hoaglin 1993)
 * @param flagScale     what divides the residual in the z-score
 * @param threads       worker threads for batch work, at least 1
 */
public record KnnSettings(int k, Metric metric, Weighting weighting, Scaling scaling, Band band,
                          EstimateKind estimate, double flagThreshold, FlagScale flagScale, int threads) {

    /** The default flag threshold, from Iglewicz &amp; Hoaglin (1993). */
    public static final double DEFAULT_FLAG_THRESHOLD = 3.5;

    /** Checks the values. */
    public KnnSettings {
        if (k < 1) {
            throw new NearfitException("k must be at least 1, got " + k);
        }
        if (metric == null || weighting == null || scaling == null || band == null || estimate == null
                || flagScale == null) {
            throw new NearfitException(
                    "model settings need a metric, weighting, scaling, band, estimate and flag scale");
        }
        if (!(flagThreshold > 0)) {
            throw new NearfitException("the flag threshold must be positive, got " + flagThreshold);
        }
        if (threads < 1) {
            throw new NearfitException("threads must be at least 1, got " + threads);
        }
    }

    /** The settings with the mean as the estimate. */
    public KnnSettings(int k, Metric metric, Weighting weighting, Scaling scaling, Band band,
                       double flagThreshold, FlagScale flagScale, int threads) {
        this(k, metric, weighting, scaling, band, EstimateKind.MEAN, flagThreshold, flagScale, threads);
    }

    /** k = 10, Euclidean, uniform, z scaling, band q10-q90, the mean, threshold 3.5 on the global MAD, all cores. */
    public static KnnSettings defaults() {
        return new KnnSettings(10, Metric.EUCLIDEAN, Weighting.UNIFORM, Scaling.Z, Band.Q10_Q90, EstimateKind.MEAN,
                DEFAULT_FLAG_THRESHOLD, FlagScale.GLOBAL_MAD, Runtime.getRuntime().availableProcessors());
    }

    /** A copy with another k. */
    public KnnSettings withK(int newK) {
        return new KnnSettings(newK, metric, weighting, scaling, band, estimate, flagThreshold, flagScale, threads);
    }

    /** A copy with another metric. */
    public KnnSettings withMetric(Metric m) {
        return new KnnSettings(k, m, weighting, scaling, band, estimate, flagThreshold, flagScale, threads);
    }

    /** A copy with another weighting. */
    public KnnSettings withWeighting(Weighting w) {
        return new KnnSettings(k, metric, w, scaling, band, estimate, flagThreshold, flagScale, threads);
    }

    /** A copy with another scaling. */
    public KnnSettings withScaling(Scaling s) {
        return new KnnSettings(k, metric, weighting, s, band, estimate, flagThreshold, flagScale, threads);
    }

    /** A copy with another band. */
    public KnnSettings withBand(Band b) {
        return new KnnSettings(k, metric, weighting, scaling, b, estimate, flagThreshold, flagScale, threads);
    }

    /** A copy with another estimate. */
    public KnnSettings withEstimate(EstimateKind e) {
        return new KnnSettings(k, metric, weighting, scaling, band, e, flagThreshold, flagScale, threads);
    }

    /** A copy with another flag threshold and scale. */
    public KnnSettings withFlags(double threshold, FlagScale scale) {
        return new KnnSettings(k, metric, weighting, scaling, band, estimate, threshold, scale, threads);
    }

    /** A copy with another thread count. */
    public KnnSettings withThreads(int t) {
        return new KnnSettings(k, metric, weighting, scaling, band, estimate, flagThreshold, flagScale, t);
    }

    /** Whether a model with these settings can keep the index built for {@code other}. */
    boolean sameIndexAs(KnnSettings other) {
        return metric == other.metric && scaling == other.scaling;
    }
}
