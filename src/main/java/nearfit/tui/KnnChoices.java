package nearfit.tui;

/** What the explorer's jobs hand the knn package besides the settings: threads and progress. */
final class KnnChoices {
    /**
     * Worker threads for one curve, tuning or leave-one-out run; the machine's processors. Leaving a core
     * to the curve halved the flags' speed on two cores, and a frame no longer needs one: a k change
     * redraws over points binned once.
     */
    static final int THREADS = Math.max(1, Runtime.getRuntime().availableProcessors());

    private KnnChoices() {
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
