package nearfit.tui.keys;

import java.util.List;

import nearfit.knn.Band;
import nearfit.knn.EstimateKind;
import nearfit.knn.Metric;
import nearfit.knn.Scaling;
import nearfit.knn.Weighting;

/**
 * What a fit depends on: the rows, the response, the inputs and the estimator's settings.
 * Two equal settings give the same fit, so the explorer uses this record as the key of its jobs.
 *
 * @param condition the row condition, empty for all rows
 * @param response  the response column
 * @param inputs    the model inputs, at least one, in order
 * @param k         neighbours per estimate, at least 1
 * @param metric    the distance
 * @param weighting the neighbour weights
 * @param scaling   the input scaling
 * @param band      the band around the curve
 * @param estimate  the curve: the neighbours' weighted mean or median
 */
public record FitKey(String condition, String response, List<String> inputs, int k, Metric metric,
        Weighting weighting, Scaling scaling, Band band, EstimateKind estimate) {
    /** Copies the inputs so that the record stays immutable. */
    public FitKey {
        inputs = List.copyOf(inputs);
        if (inputs.isEmpty()) {
            throw new IllegalArgumentException("a model needs at least one input");
        }
        if (k < 1) {
            throw new IllegalArgumentException("k must be at least 1, not " + k);
        }
    }

    /** The settings with the mean as the estimate. */
    public FitKey(String condition, String response, List<String> inputs, int k, Metric metric,
            Weighting weighting, Scaling scaling, Band band) {
        this(condition, response, inputs, k, metric, weighting, scaling, band, EstimateKind.MEAN);
    }

    /** The same settings with another k; the tuning key ignores k. */
    public FitKey withK(int newK) {
        return new FitKey(condition, response, inputs, newK, metric, weighting, scaling, band, estimate);
    }
}
