package nearfit.cli;

import java.io.PrintWriter;

import nearfit.knn.Band;
import nearfit.knn.EstimateKind;
import nearfit.knn.FlagScale;
import nearfit.knn.KnnSettings;
import nearfit.knn.Metric;
import nearfit.knn.Scaling;
import nearfit.knn.Weighting;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/**
 * The options shared by the commands that fit or score a reference (a picocli mixin). The choices are
 * typed options converting to the knn enums ({@link OptionChoices}), null when not given (predict and
 * check then keep the model's); {@link #settings} fills in the defaults the help states.
 */
final class ModelOptions extends PlainLine.Streams {
    @Option(names = "--metric", converter = OptionChoices.MetricWords.class,
            completionCandidates = OptionChoices.MetricWords.class, paramLabel = "METRIC",
            description = "Distance between rows: ${COMPLETION-CANDIDATES} (default: euclidean; predict and check: the model's).")
    Metric metric;

    @Option(names = "--weights", converter = OptionChoices.WeightsWords.class,
            completionCandidates = OptionChoices.WeightsWords.class, paramLabel = "WEIGHTS",
            description = "Neighbour weights: ${COMPLETION-CANDIDATES} (default: uniform; predict and check: the model's).")
    Weighting weights;

    @Option(names = "--scale", converter = OptionChoices.ScaleWords.class,
            completionCandidates = OptionChoices.ScaleWords.class, paramLabel = "SCALING",
            description = "Input scaling: ${COMPLETION-CANDIDATES} (default: z; predict and check: the model's).")
    Scaling scale;

    @Option(names = "--band", converter = OptionChoices.BandWords.class,
            completionCandidates = OptionChoices.BandWords.class, paramLabel = "BAND",
            description = "Band around the fit: ${COMPLETION-CANDIDATES} (default: q05-q95; predict and check: the model's).")
    Band band;

    @Option(names = "--estimate", converter = OptionChoices.EstimateWords.class,
            completionCandidates = OptionChoices.EstimateWords.class, paramLabel = "mean|median",
            description = "The fit: the neighbours' weighted mean, or their weighted median (the band's quantile rule "
                    + "at 0.5), which rows far off the rest (curtailment, icing) move less; tune and the flags use it "
                    + "too (default: mean; predict and check: the model's).")
    EstimateKind estimate;

    @Option(names = "--z-scale", converter = OptionChoices.ZScaleWords.class,
            completionCandidates = OptionChoices.ZScaleWords.class, paramLabel = "local|reference",
            description = "What divides a residual to make z: local (the k neighbours' SD at the row) or reference "
                    + "(1.4826 MAD of the reference's leave-one-out residuals) (default: local; predict and check: the model's).")
    FlagScale zScale;

    @Option(names = "--where", paramLabel = "CONDITION",
            description = "Row condition: COLUMN OP VALUE joined by 'and', e.g. \"turbine != T03 and wind_ms > 3\".")
    String where;

    @Option(names = "--group", paramLabel = "COL", description = "Group column, e.g. a turbine id.")
    String group;

    @Option(names = "--threads", paramLabel = "N", converter = OptionNumbers.Count.class, description = "Worker threads (default: all cores).")
    Integer threads;

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
        return givenOut() != null ? givenOut() : command.commandLine().getOut();
    }

    /** Standard error: progress, notes and warnings, whatever goes to standard output. */
    PrintWriter err() {
        return givenErr() != null ? givenErr() : command.commandLine().getErr();
    }

    /** A model's settings with the options given on this command line in place of its own, on {@link #threads}. */
    KnnSettings over(KnnSettings stored) {
        return new KnnSettings(stored.k(), metric == null ? stored.metric() : metric,
                weights == null ? stored.weighting() : weights, scale == null ? stored.scaling() : scale,
                band == null ? stored.band() : band, estimate == null ? stored.estimate() : estimate,
                stored.flagThreshold(), zScale == null ? stored.flagScale() : zScale, threads());
    }

    /** The thread count: the option's value, or every available core. */
    int threads() {
        return threads == null ? Runtime.getRuntime().availableProcessors() : threads;
    }

    /**
     * Checks the values picocli has not: the choices are typed options, refused while parsing, so
     * only the thread count is left to check before any file is read.
     */
    void validate() {
        threads();
    }

    /**
     * The settings for a given k and flag threshold on {@link #threads}; an option not given takes the
     * default its help states: euclidean, uniform, z, q05-q95, mean, local.
     */
    KnnSettings settings(int k, double flagThreshold) {
        return new KnnSettings(k, metric == null ? Metric.EUCLIDEAN : metric,
                weights == null ? Weighting.UNIFORM : weights, scale == null ? Scaling.Z : scale,
                band == null ? Band.Q05_Q95 : band, estimate == null ? EstimateKind.MEAN : estimate, flagThreshold,
                zScale == null ? FlagScale.LOCAL_SD : zScale, threads());
    }
}
