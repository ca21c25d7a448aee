package nearfit.cli;

import java.io.PrintWriter;

import nearfit.knn.HeldOutBlocks;
import nearfit.knn.HeldOutScheme;
import nearfit.knn.KnnModel;
import nearfit.knn.KnnSettings;
import nearfit.knn.ReferenceData;
import nearfit.knn.Tuning;
import nearfit.knn.TuningTable;
import nearfit.table.CategoryColumn;
import nearfit.table.Column;
import nearfit.table.NearfitException;
import nearfit.table.Table;
import nearfit.table.TimeColumn;
import picocli.CommandLine.Option;

/** How k is tuned: {@code --kmax}, {@code --cv SCHEME}, {@code --time COL}, {@code --sample M} (a picocli mixin). */
final class TuningOptions {
    /** The largest k tried by default (fewer when the reference has fewer rows). */
    static final int DEFAULT_KMAX = 50;
    /**
     * {@code fit --k auto} doubles kmax while the one-SE k is the largest k tried, up to this k. Why not more: the
     * local z divides by the spread of a row's k neighbours, and a neighbourhood of hundreds of rows spans the
     * curve's own slope, so z shrinks and real drops pass (demo log, 2-input spring reference, T05 in November:
     * 5.3 % flagged at k = 55, 1.4 % at 200, 0.8 % and a pass at 800). A larger k must be asked for (--k, --kmax).
     */
    static final int WIDEN_CAP = 200;

    @Option(names = "--kmax", paramLabel = "N", converter = OptionNumbers.Count.class, description = "Largest k tried (default: 50, at most rows - 1).")
    Integer kmax;

    @Option(names = "--cv", paramLabel = "SCHEME", defaultValue = "auto",
            converter = HeldOutWords.class, completionCandidates = HeldOutWords.class,
            description = "Held-out scheme: loo, folds:N (or N), group (one --group value at a time), block:PERIOD "
                    + "(spans of time such as 1d, 12h, 7d or PT12H, over --time), group+block:PERIOD, or auto: "
                    + "block:1d when the rows' times span at least 10 days, else loo (default: auto).")
    HeldOutWords.Choice cv;

    @Option(names = "--time", paramLabel = "COL",
            description = "Time column for block schemes (default: the file's first time column).")
    String time;

    @Option(names = "--sample", paramLabel = "M", converter = OptionNumbers.Count.class,
            description = "Evaluate M rows chosen at random (seeded; neighbours from all rows outside the row's "
                    + "block); by default " + Tuning.DEFAULT_SAMPLE + " rows above " + Tuning.SAMPLE_ABOVE + ".")
    Integer sample;

    /** Checks the values before any file is read. */
    void validate() {
        if (time != null && time.isBlank()) {
            throw new NearfitException("--time: name a time column");
        }
    }

    /** Whether the load must keep the file's first time column (auto or a block scheme, no --time). */
    boolean wantsFirstTime() {
        return time == null && (cv.auto() || cv.scheme().period() != null);
    }

    /** The --time column name, or null. */
    String timeColumn() {
        return time == null ? null : time.trim();
    }

    /**
     * The blocks of the scheme over the reference rows: {@code auto} resolved (blocks of a day when the rows'
     * times span at least ten days, else leave-one-out), groups and times looked up by each row's table id.
     */
    HeldOutBlocks blocks(ReferenceData data, Table table, CategoryColumn group) {
        TimeColumn times = timeColumnOf(table);
        int n = data.size();
        long[] t = times == null ? null : HeldOutBlocks.timesOf(data, times);
        long min = Long.MAX_VALUE;
        long max = Long.MIN_VALUE;
        for (int i = 0; t != null && i < n; i++) {
            if (t[i] != HeldOutBlocks.NO_TIME) {
                min = Math.min(min, t[i]);
                max = Math.max(max, t[i]);
            }
        }
        HeldOutScheme scheme = cv.auto() ? HeldOutScheme.auto(min <= max, min, max) : cv.scheme();
        int[] g = group == null ? null : HeldOutBlocks.groupsOf(data, group);
        if (scheme.needsGroups() && g == null) {
            throw new NearfitException("--cv " + scheme.word() + ": name the group column with --group COL");
        }
        if (scheme.period() != null && times == null) {
            throw new NearfitException("--cv " + scheme.word() + ": the file has no time column; name one with --time COL");
        }
        return HeldOutBlocks.of(scheme, n, g, t);
    }

    private TimeColumn timeColumnOf(Table table) {
        if (time != null) {
            Column c = table.column(time.trim());
            if (c instanceof TimeColumn tc) {
                return tc;
            }
            throw new NearfitException("--time: column " + time.trim() + " is " + c.type().toString().toLowerCase(
                    java.util.Locale.ROOT) + ", not a time");
        }
        for (Column c : table.columns()) {
            if (c instanceof TimeColumn tc) {
                return tc;
            }
        }
        return null;
    }

    /** The tuning table over the model's reference rows under the blocks' scheme. */
    Result run(KnnModel model, HeldOutBlocks blocks, int largestK, TerminalProgress progress) {
        int n = model.data().size();
        if (n < 2) {
            throw new NearfitException("tuning needs at least 2 reference rows, not " + n);
        }
        boolean loo = blocks.scheme() instanceof HeldOutScheme.LeaveOneOut;
        int usable = n - (loo ? 1 : blocks.largest());
        if (usable < 1) {
            throw new NearfitException("--cv " + blocks.scheme().word() + ": one block holds all " + n
                    + " reference rows, so no row can be predicted from the others");
        }
        int max = Math.min(largestK, usable);
        TuningTable t = Tuning.heldOut(model, max, blocks, sample == null ? -1 : sample, Tuning.DEFAULT_SEED, progress);
        progress.done();
        long sampled = t.evaluatedRows() < t.referenceRows() ? t.evaluatedRows() : -1;
        return new Result(t, sampled, t.method(), usable);
    }

    /** The largest k asked for: --kmax or {@link #DEFAULT_KMAX}. */
    int largestK() {
        return kmax == null ? DEFAULT_KMAX : kmax;
    }

    /**
     * Fits the engine with the given k, or with {@code k = auto} ({@link OptionNumbers#K_AUTO}) tunes
     * and refits with the one-SE k; {@code given} carries every other setting and the thread count. While the one-SE k is the
     * largest k tried and more rows are usable, kmax is doubled (up to {@link #WIDEN_CAP}) and k tuned again;
     * each widening is said on {@code err}.
     */
    Fitted fit(ReferenceData data, HeldOutBlocks blocks, KnnSettings given, int chosenK, PrintWriter err,
               boolean quiet) {
        boolean auto = chosenK == OptionNumbers.K_AUTO;
        KnnSettings settings = given.withK(auto ? 1 : chosenK);
        KnnModel engine = KnnModel.fit(data, settings);
        if (!auto) {
            return new Fitted(engine, null);
        }
        int largest = largestK();
        Result tuned = run(engine, blocks, largest, TerminalProgress.of(err, "tuning", quiet));
        while (tuned.table().oneSeK() == tuned.table().kmax() && tuned.table().kmax() < tuned.usable()
                && tuned.table().kmax() < WIDEN_CAP) {
            int wider = Math.min(WIDEN_CAP, 2 * tuned.table().kmax());
            err.printf("nearfit: the one-SE k is the largest k tried (%d); tuning again up to k = %d%n",
                    tuned.table().kmax(), Math.min(wider, tuned.usable()));
            tuned = run(engine, blocks, wider, TerminalProgress.of(err, "tuning", quiet));
        }
        return new Fitted(engine.withSettings(settings.withK(tuned.table().oneSeK())), tuned);
    }

    /** A fitted engine and its tuning, {@code null} when k was given. */
    record Fitted(KnnModel engine, Result tuned) {
    }

    /**
     * A tuning table, the sample size (-1 when every row was evaluated), how rows were held out, and the
     * largest k the scheme allows (rows outside the largest block).
     */
    record Result(TuningTable table, long sampled, String scheme, int usable) {
    }
}
