package nearfit.tui.bench;

/**
 * A {@link JobControl} that keeps what a job reports in volatile fields, read by another thread (the
 * explorer's, or the load screen's): whether it was cancelled, its progress and the rows read so far.
 */
public class JobReport implements JobControl {
    private volatile boolean cancelled;
    private volatile double fraction;
    private volatile long rows;

    @Override
    public boolean cancelled() {
        return cancelled;
    }

    /** Asks the job to stop at its next check. */
    public final void cancel() {
        cancelled = true;
    }

    /** Whether {@link #cancel} was called, without anything an override of {@link #cancelled} adds. */
    public final boolean cancelRequested() {
        return cancelled;
    }

    @Override
    public void progress(double f) {
        fraction = f;
    }

    /** The latest progress, 0 to 1. */
    public final double fraction() {
        return fraction;
    }

    @Override
    public void rows(long n) {
        rows = n;
    }

    /** The rows read so far. */
    public final long rowsRead() {
        return rows;
    }
}
