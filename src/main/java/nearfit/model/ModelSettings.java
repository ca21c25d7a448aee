package nearfit.model;

import java.util.List;

/**
 * The estimator settings a model file records, spelled as the command line and the manifest spell
 * them ({@code euclidean}, {@code uniform}, {@code z}, {@code q05-q95}); immutable.
 *
 * <p>Kept as words rather than engine enums so that a model file can be read and checked without the
 * engine, and so that the manifest stays readable by people and other tools.
 *
 * @param metric        distance: euclidean, manhattan, chebyshev or mahalanobis
 * @param weights       neighbour weights: uniform, inverse or tricube
 * @param scaling       input scaling: z, robust, range or none
 * @param k             neighbours per estimate, at least 1
 * @param band          band: q10-q90, q05-q95, sd2 or none
 * @param flagThreshold |z| above which a row is flagged, greater than 0
 * @param zScale        what divides a residual to make z: {@code local} (the weighted SD of the k
 *                      neighbours' responses at the row) or {@code reference} (1.4826·MAD of the
 *                      reference's leave-one-out residuals, after subtracting their median)
 * @param estimate      the fit: {@code mean} or {@code median} of the neighbours' responses (weighted)
 */
public record ModelSettings(String metric, String weights, String scaling, int k, String band,
                            double flagThreshold, String zScale, String estimate) {
    /** The metric words accepted. */
    public static final List<String> METRICS = List.of("euclidean", "manhattan", "chebyshev", "mahalanobis");
    /** The weight words accepted. */
    public static final List<String> WEIGHTS = List.of("uniform", "inverse", "tricube");
    /** The scaling words accepted. */
    public static final List<String> SCALINGS = List.of("z", "robust", "range", "none");
    /** The band words accepted. */
    public static final List<String> BANDS = List.of("q10-q90", "q05-q95", "sd2", "none");
    /** The estimate words accepted; a manifest without the field means the first. */
    public static final List<String> ESTIMATES = List.of("mean", "median");
    /** The z scale words accepted. */
    public static final List<String> Z_SCALES = List.of("local", "reference");
    /** The flag threshold by default: the modified z-score cut-off of Iglewicz and Hoaglin (1993). */
    public static final double DEFAULT_FLAG_THRESHOLD = 3.5;

    /** Checks every field; a wrong one throws {@link IllegalArgumentException} naming it. */
    public ModelSettings {
        requireOneOf("metric", metric, METRICS);
        requireOneOf("weights", weights, WEIGHTS);
        requireOneOf("scaling", scaling, SCALINGS);
        requireOneOf("band", band, BANDS);
        requireOneOf("z scale", zScale, Z_SCALES);
        requireOneOf("estimate", estimate, ESTIMATES);
        if (k < 1) {
            throw new IllegalArgumentException("k must be at least 1, not " + k);
        }
        if (!(flagThreshold > 0) || Double.isInfinite(flagThreshold)) {
            throw new IllegalArgumentException("flag threshold must be a positive number, not " + flagThreshold);
        }
    }

    /** The settings with the mean as the estimate (what a manifest without the field holds). */
    public ModelSettings(String metric, String weights, String scaling, int k, String band, double flagThreshold,
                         String zScale) {
        this(metric, weights, scaling, k, band, flagThreshold, zScale, ESTIMATES.get(0));
    }

    /** The defaults: euclidean, uniform, z, q05-q95, threshold 3.5, local z scale, mean, with the given k. */
    public static ModelSettings defaults(int k) {
        return new ModelSettings("euclidean", "uniform", "z", k, "q05-q95", DEFAULT_FLAG_THRESHOLD, "local", "mean");
    }

    /** A copy with another k. */
    public ModelSettings withK(int newK) {
        return new ModelSettings(metric, weights, scaling, newK, band, flagThreshold, zScale, estimate);
    }

    private static void requireOneOf(String field, String value, List<String> allowed) {
        if (value == null || !allowed.contains(value)) {
            throw new IllegalArgumentException(field + " must be one of " + String.join(", ", allowed)
                    + ", not \"" + value + "\"");
        }
    }
}
