package nearfit.tui;

/**
 * A {@link JobControl} that keeps what a job reports in volatile fields, read by the explorer's thread:
 * whether it was cancelled, its progress and the rows read so far.
 */
class JobReport implements JobControl {
    volatile boolean cancelled;
    volatile double fraction;
    volatile long rows;

    @Override
    public boolean cancelled() {
        return cancelled;
    }

    @Override
    public void progress(double f) {
        fraction = f;
    }

    @Override
    public void rows(long n) {
        rows = n;
    }
}
