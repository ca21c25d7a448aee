package nearfit.knn;

/**
 * Progress and cancellation for long runs. Runs call {@link #isCancelled()} once per batch of rows
 * and throw {@link CancelledException} when it returns true; {@link #report} is called from worker
 * threads, so implementations must be thread-safe.
 */
public interface Progress {
    /** Neither reports nor cancels. */
    Progress NONE = new Progress() { };

    /** Work done so far out of total, in rows. */
    default void report(long done, long total) {
    }

    /** Whether the run should stop. */
    default boolean isCancelled() {
        return false;
    }
}
