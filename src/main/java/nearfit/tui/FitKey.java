package nearfit.tui;

import java.util.List;

import nearfit.knn.KnnSettings;

/**
 * What a fit depends on: the rows, the response, the inputs and the estimator's settings.
 * Two equal keys give the same fit, so the explorer uses this record as the key of its jobs.
 *
 * @param condition the row condition, empty for all rows
 * @param response  the response column
 * @param inputs    the model inputs, at least one, in order
 * @param settings  the estimator's settings
 */
public record FitKey(String condition, String response, List<String> inputs, KnnSettings settings) {
    /** Copies the inputs so that the record stays immutable. */
    public FitKey {
        inputs = List.copyOf(inputs);
        if (inputs.isEmpty()) {
            throw new IllegalArgumentException("a model needs at least one input");
        }
    }

    /** The same key with another k; the tuning key ignores k. */
    public FitKey withK(int newK) {
        return new FitKey(condition, response, inputs, settings.withK(newK));
    }
}
