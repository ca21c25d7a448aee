package nearfit.knn;

import nearfit.table.NearfitException;

/**
 * The settings of a fitted model. Changing {@code k}, {@code weighting}, {@code band},
 * {@code flagThreshold}, {@code flagScale} or {@code threads} keeps the index; changing
 * {@code metric} or {@code scaling} rebuilds it (see {@link KnnModel#withSettings}).
 *
 * @param k             number of neighbours, at least 1
 * @param metric        distance between scaled inputs
 * @param weighting     weights of the neighbours
 * @param scaling       scaling of each input, fitted on the reference rows
 * @param band          the band around the fit
 * @param flagThreshold a row is flagged when |z| exceeds this (3.5 by default, Iglewicz &amp; Hoaglin 1993)
 * @param flagScale     what divides the residual in the z-score
 * @param threads       worker threads for batch work, at least 1
 */
public record KnnSettings(int k, Metric metric, Weighting weighting, Scaling scaling, Band band,
                          double flagThreshold, FlagScale flagScale, int threads) {

    /** The default flag threshold, from Iglewicz &amp; Hoaglin (1993). */
    public static final double DEFAULT_FLAG_THRESHOLD = 3.5;

    /** Checks the values. */
    public KnnSettings {
        if (k < 1) {
            throw new NearfitException("k must be at least 1, got " + k);
        }
        if (metric == null || weighting == null || scaling == null || band == null || flagScale == null) {
            throw new NearfitException("model settings need a metric, weighting, scaling, band and flag scale");
        }
        if (!(flagThreshold > 0)) {
            throw new NearfitException("the flag threshold must be positive, got " + flagThreshold);
        }
        if (threads < 1) {
            throw new NearfitException("threads must be at least 1, got " + threads);
        }
    }

    /** k = 10, Euclidean, uniform, z scaling, band q10-q90, threshold 3.5 on the global MAD, all cores. */
    public static KnnSettings defaults() {
        return new KnnSettings(10, Metric.EUCLIDEAN, Weighting.UNIFORM, Scaling.Z, Band.Q10_Q90,
                DEFAULT_FLAG_THRESHOLD, FlagScale.GLOBAL_MAD, Runtime.getRuntime().availableProcessors());
    }

    /** A copy with another k. */
    public KnnSettings withK(int newK) {
        return new KnnSettings(newK, metric, weighting, scaling, band, flagThreshold, flagScale, threads);
    }

    /** A copy with another metric. */
    public KnnSettings withMetric(Metric m) {
        return new KnnSettings(k, m, weighting, scaling, band, flagThreshold, flagScale, threads);
    }

    /** A copy with another weighting. */
    public KnnSettings withWeighting(Weighting w) {
        return new KnnSettings(k, metric, w, scaling, band, flagThreshold, flagScale, threads);
    }

    /** A copy with another scaling. */
    public KnnSettings withScaling(Scaling s) {
        return new KnnSettings(k, metric, weighting, s, band, flagThreshold, flagScale, threads);
    }

    /** A copy with another band. */
    public KnnSettings withBand(Band b) {
        return new KnnSettings(k, metric, weighting, scaling, b, flagThreshold, flagScale, threads);
    }

    /** A copy with another flag threshold and scale. */
    public KnnSettings withFlags(double threshold, FlagScale scale) {
        return new KnnSettings(k, metric, weighting, scaling, band, threshold, scale, threads);
    }

    /** A copy with another thread count. */
    public KnnSettings withThreads(int t) {
        return new KnnSettings(k, metric, weighting, scaling, band, flagThreshold, flagScale, t);
    }

    /** Whether a model with these settings can keep the index built for {@code other}. */
    boolean sameIndexAs(KnnSettings other) {
        return metric == other.metric && scaling == other.scaling;
    }
}
