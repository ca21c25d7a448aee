package nearfit.spark;

import java.io.Serializable;

/**
 * A test hook: called by every task before each block it scores, with the task's partition and attempt
 * ({@code TaskContext.attemptNumber()}, 0 for the first), so a test can make one attempt fail (and Spark retry
 * it) or every attempt fail, after the task has begun writing. It is no option, property or environment
 * variable: only code in this package can set it ({@link FleetOptions#probe}, through
 * {@link FleetMain#run(String[], java.io.PrintWriter, java.io.PrintWriter, java.util.function.Consumer)}), so
 * no user reaches it by accident. Sent with each task, so it must be serializable and keep no state of its own.
 */
@FunctionalInterface
interface TaskProbe extends Serializable {
    /** The probe of every real job: does nothing. */
    TaskProbe NONE = (partition, attempt, block) -> { };

    /**
     * Runs before block {@code block} (0 for the first) of a task; what it throws fails the task attempt.
     *
     * @param partition the task's partition
     * @param attempt   the attempt, 0 for the first
     * @param block     the block about to be scored, 0 for the first
     */
    void beforeBlock(int partition, int attempt, int block);
}
