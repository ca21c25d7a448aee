package nearfit.tui.bench;

import nearfit.knn.FlagScale;
import nearfit.knn.KnnSettings;
import nearfit.tui.keys.FitKey;

/** The explorer's choices as the knn package's settings. */
final class KnnChoices {
    /** Worker threads for one curve or leave-one-out run; the machine's processors. */
    static final int THREADS = Math.max(1, Runtime.getRuntime().availableProcessors());

    private KnnChoices() {
    }

    /**
     * Flags divide each leave-one-out residual by the local spread of its neighbours, as {@code check}
     * does by default: on logs where most rows sit below cut-in or at rated power the global MAD is
     * tiny, and the global scale flagged about 10 % of the demo site's rows.
     */
    static KnnSettings settings(FitKey m) {
        return new KnnSettings(m.k(), m.metric(), m.weighting(), m.scaling(),
                m.band(), m.estimate(), KnnSettings.DEFAULT_FLAG_THRESHOLD, FlagScale.LOCAL_SD, THREADS);
    }

    /**
     * The settings for tuning and flags: the engine's batch leave-one-out on all {@link #THREADS}. Leaving a
     * core to the curve halved the flags' speed on two cores, and a frame no longer needs one: a k change
     * redraws over points binned once.
     */
    static KnnSettings longSettings(FitKey m) {
        return settings(m);
    }

    /** A knn progress that reports to and is cancelled by an explorer job. */
    static nearfit.knn.Progress progress(JobControl c) {
        return new nearfit.knn.Progress() {
            @Override
            public void report(long done, long total) {
                if (total > 0) {
                    c.progress((double) done / total);
                }
            }

            @Override
            public boolean isCancelled() {
                return c.cancelled();
            }
        };
    }
}
