package nearfit.tui.bench;

/** The knn package's progress and cancellation, bridged to an explorer job. */
final class JobProgress {
    private JobProgress() {
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
