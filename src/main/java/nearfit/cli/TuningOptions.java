package nearfit.cli;

import nearfit.knn.KnnModel;
import nearfit.knn.KnnSettings;
import nearfit.knn.Tuning;
import nearfit.knn.TuningTable;
import nearfit.table.NearfitException;
import picocli.CommandLine.Option;

/** How k is tuned: {@code --kmax}, {@code --cv loo|FOLDS}, {@code --sample M} (a picocli mixin). */
final class TuningOptions {
    /** The largest k tried by default (fewer when the reference has fewer rows). */
    static final int DEFAULT_KMAX = 50;

    @Option(names = "--kmax", paramLabel = "N", converter = OptionNumbers.Count.class, description = "Largest k tried (default: 50, at most rows - 1).")
    Integer kmax;

    @Option(names = "--cv", paramLabel = "loo|FOLDS", defaultValue = "loo",
            converter = OptionChoices.FoldsWords.class, completionCandidates = OptionChoices.FoldsWords.class,
            description = "Cross-validation: loo (leave-one-out) or a number of folds (default: loo).")
    int cv;

    @Option(names = "--sample", paramLabel = "M", converter = OptionNumbers.Count.class,
            description = "Leave-one-out on M rows chosen at random (seeded); by default "
                    + Tuning.DEFAULT_SAMPLE + " rows above " + Tuning.SAMPLE_ABOVE + ".")
    Integer sample;

    /** The folds of k-fold cross-validation, or 0 for leave-one-out. */
    int folds() {
        return cv;
    }

    /** Checks the values before any file is read. */
    void validate() {
        folds();
        if (sample != null) {
            if (folds() > 0) {
                throw new NearfitException("--sample: applies to leave-one-out, not to --cv " + cv);
            }
        }
    }

    /** The tuning table over the model's reference rows, and the rows sampled (or -1). */
    Result run(KnnModel model, TerminalProgress progress) {
        int n = model.data().size();
        if (n < 2) {
            throw new NearfitException("tuning needs at least 2 reference rows, not " + n);
        }
        int max = Math.min(kmax == null ? DEFAULT_KMAX : kmax, n - 1);
        int folds = folds();
        TuningTable t;
        if (folds > 0) {
            t = Tuning.kFold(model, max, folds, Tuning.DEFAULT_SEED, progress);
        } else if (sample != null) {
            int m = sample;
            t = Tuning.leaveOneOut(model, max, m, Tuning.DEFAULT_SEED, progress);
        } else {
            t = Tuning.leaveOneOut(model, max, progress);
        }
        progress.done();
        long sampled = t.evaluatedRows() < t.referenceRows() ? t.evaluatedRows() : -1;
        String scheme = folds > 0 ? folds + "-fold cross-validation"
                : sampled >= 0 ? "leave-one-out on " + sampled + " sampled rows" : "leave-one-out";
        return new Result(t, sampled, scheme);
    }

    /**
     * Fits the engine with the given k, or with {@code k = auto} ({@link OptionNumbers#K_AUTO}) tunes
     * and refits with the one-SE k; {@code given} carries every other setting and the thread count.
     */
    Fitted fit(nearfit.knn.ReferenceData data, KnnSettings given, int chosenK, java.io.PrintWriter err,
               boolean quiet) {
        boolean auto = chosenK == OptionNumbers.K_AUTO;
        KnnSettings settings = given.withK(auto ? 1 : chosenK);
        KnnModel engine = KnnModel.fit(data, settings);
        if (!auto) {
            return new Fitted(engine, null);
        }
        Result tuned = run(engine, TerminalProgress.of(err, "tuning", quiet));
        return new Fitted(engine.withSettings(settings.withK(tuned.table().oneSeK())), tuned);
    }

    /** A fitted engine and its tuning, {@code null} when k was given. */
    record Fitted(KnnModel engine, Result tuned) {
    }

    /** A tuning table, the sample size (-1 when every row was evaluated) and how rows were held out. */
    record Result(TuningTable table, long sampled, String scheme) {
    }
}
