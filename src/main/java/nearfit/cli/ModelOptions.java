package nearfit.cli;

import nearfit.model.ModelSettings;
import picocli.CommandLine.Option;

/**
 * The options shared by the commands that fit or score a reference (a picocli mixin). Values are kept
 * as given and checked by the accessors, so that a bad value is reported naming its option.
 */
final class ModelOptions {
    @Option(names = "--metric", paramLabel = "NAME", defaultValue = "euclidean",
            description = "Distance between rows: euclidean, manhattan, chebyshev, mahalanobis (default: ${DEFAULT-VALUE}).")
    String metric;

    @Option(names = "--weights", paramLabel = "NAME", defaultValue = "uniform",
            description = "Neighbour weights: uniform, inverse, tricube (default: ${DEFAULT-VALUE}).")
    String weights;

    @Option(names = "--scale", paramLabel = "NAME", defaultValue = "z",
            description = "Input scaling: z, robust, range, none (default: ${DEFAULT-VALUE}).")
    String scale;

    @Option(names = "--band", paramLabel = "NAME", defaultValue = "q05-q95",
            description = "Band around the fit: q10-q90, q05-q95, sd2, none (default: ${DEFAULT-VALUE}).")
    String band;

    @Option(names = "--where", paramLabel = "CONDITION",
            description = "Row condition: COLUMN OP VALUE joined by 'and', e.g. \"turbine != T03 and wind_ms > 3\".")
    String where;

    @Option(names = "--group", paramLabel = "COL", description = "Group column, e.g. a turbine id.")
    String group;

    @Option(names = "--threads", paramLabel = "N", description = "Worker threads (default: all cores).")
    String threads;

    @Option(names = "--quiet", description = "No progress messages on standard error.")
    boolean quiet;

    @Option(names = "--force", description = "Replace output files that exist already.")
    boolean force;

    String metric() {
        return OptionValues.oneOf("--metric", metric, ModelSettings.METRICS);
    }

    String weights() {
        return OptionValues.oneOf("--weights", weights, ModelSettings.WEIGHTS);
    }

    String scale() {
        return OptionValues.oneOf("--scale", scale, ModelSettings.SCALINGS);
    }

    String band() {
        return OptionValues.oneOf("--band", band, ModelSettings.BANDS);
    }

    /** The thread count: the option's value, or every available core. */
    int threads() {
        return threads == null ? Runtime.getRuntime().availableProcessors()
                : OptionValues.positive("--threads", threads, "a whole number of at least 1");
    }

    /** Checks every value at once so that a bad one fails before any file is read. */
    void validate() {
        metric();
        weights();
        scale();
        band();
        threads();
    }

    /** The settings for a given k and flag threshold. */
    ModelSettings settings(int k, double flagThreshold) {
        return new ModelSettings(metric(), weights(), scale(), k, band(), flagThreshold);
    }
}
