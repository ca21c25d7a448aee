package nearfit.cli;

import java.io.PrintWriter;

import nearfit.model.ModelSettings;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/**
 * The options shared by the commands that fit or score a reference (a picocli mixin). Values are kept
 * as given and checked by the accessors, so that a bad value is reported naming its option.
 */
final class ModelOptions {
    @Option(names = "--metric", paramLabel = "NAME",
            description = "Distance between rows: euclidean, manhattan, chebyshev, mahalanobis (default: euclidean; predict and check: the model's).")
    String metric;

    @Option(names = "--weights", paramLabel = "NAME",
            description = "Neighbour weights: uniform, inverse, tricube (default: uniform; predict and check: the model's).")
    String weights;

    @Option(names = "--scale", paramLabel = "NAME",
            description = "Input scaling: z, robust, range, none (default: z; predict and check: the model's).")
    String scale;

    @Option(names = "--band", paramLabel = "NAME",
            description = "Band around the fit: q10-q90, q05-q95, sd2, none (default: q05-q95; predict and check: the model's).")
    String band;

    @Option(names = "--estimate", paramLabel = "mean|median",
            description = "The fit: the neighbours' weighted mean, or their weighted median (the band's quantile rule "
                    + "at 0.5), which rows far off the rest (curtailment, icing) move less; tune and the flags use it "
                    + "too (default: mean; predict and check: the model's).")
    String estimate;

    @Option(names = "--z-scale", paramLabel = "local|reference",
            description = "What divides a residual to make z: local (the k neighbours' SD at the row) or reference "
                    + "(1.4826 MAD of the reference's leave-one-out residuals) (default: local; predict and check: the model's).")
    String zScale;

    @Option(names = "--where", paramLabel = "CONDITION",
            description = "Row condition: COLUMN OP VALUE joined by 'and', e.g. \"turbine != T03 and wind_ms > 3\".")
    String where;

    @Option(names = "--group", paramLabel = "COL", description = "Group column, e.g. a turbine id.")
    String group;

    @Option(names = "--threads", paramLabel = "N", description = "Worker threads (default: all cores).")
    String threads;

    @Option(names = "--quiet", description = "No progress messages on standard error.")
    boolean quiet;

    /** Rows scored at a time by predict and check; not an option (tests set it to show blocks change nothing). */
    int blockRows = ScoredRows.BLOCK_ROWS;

    @Option(names = "--force", description = "Replace output files that exist already.")
    boolean force;

    /** The command this mixin belongs to, for its streams. */
    @Spec(Spec.Target.MIXEE)
    CommandSpec command;

    /** Standard output: the results (CSV, reports, text plots, PNG bytes with {@code -}). */
    PrintWriter out() {
        return command.commandLine().getOut();
    }

    /** Standard error: progress, notes and warnings, whatever goes to standard output. */
    PrintWriter err() {
        return command.commandLine().getErr();
    }

    String metric() {
        return word("--metric", metric, "euclidean", ModelSettings.METRICS);
    }

    String weights() {
        return word("--weights", weights, "uniform", ModelSettings.WEIGHTS);
    }

    String scale() {
        return word("--scale", scale, "z", ModelSettings.SCALINGS);
    }

    String zScale() {
        return word("--z-scale", zScale, "local", ModelSettings.Z_SCALES);
    }

    String estimate() {
        return word("--estimate", estimate, "mean", ModelSettings.ESTIMATES);
    }

    String band() {
        return word("--band", band, "q05-q95", ModelSettings.BANDS);
    }

    private static String word(String option, String given, String fallback, java.util.List<String> allowed) {
        return given == null ? fallback : OptionValues.oneOf(option, given, allowed);
    }

    /** A model's settings with the options given on this command line in place of its own. */
    ModelSettings over(ModelSettings stored) {
        return new ModelSettings(metric == null ? stored.metric() : metric(),
                weights == null ? stored.weights() : weights(), scale == null ? stored.scaling() : scale(),
                stored.k(), band == null ? stored.band() : band(), stored.flagThreshold(),
                zScale == null ? stored.zScale() : zScale(), estimate == null ? stored.estimate() : estimate());
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
        zScale();
        estimate();
        threads();
    }

    /** The settings for a given k and flag threshold. */
    ModelSettings settings(int k, double flagThreshold) {
        return new ModelSettings(metric(), weights(), scale(), k, band(), flagThreshold, zScale(), estimate());
    }
}
