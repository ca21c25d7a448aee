package nearfit.spark;

import java.io.Serializable;

import org.apache.spark.broadcast.Broadcast;

/**
 * What every task needs to score its rows, sent with the task (the model's bytes by broadcast, once per
 * executor).
 *
 * @param model       the model file's bytes
 * @param modelName   the model file as named, for messages
 * @param modelSha256 its SHA-256, which with {@code zScale} keys the executor's restored model
 * @param zScale      the z scale in effect (local or reference)
 * @param threshold   the |z| above which a row is flagged
 * @param inputs      the model's input count
 * @param hasResponse whether the rows carry the response
 * @param category    whether the response is a category: rows get class votes, not fit, band and z
 * @param writeTime   whether output rows carry the time column on its own (it is not an input)
 * @param writeGroup  whether output rows carry the group
 * @param emit        which rows the job writes
 * @param blockRows   rows scored at a time
 * @param worstCount  worst rows kept per task
 * @param probe       the tasks' test hook ({@link TaskProbe#NONE} in every real job)
 */
record ScoringPlan(Broadcast<byte[]> model, String modelName, String modelSha256, String zScale, double threshold,
                   int inputs, boolean hasResponse, boolean category, boolean writeTime, boolean writeGroup, Emit emit,
                   int blockRows, int worstCount, TaskProbe probe) implements Serializable {
    /** Which rows a job writes: every kept row (predict), the flagged rows (check -o), or none (check). */
    enum Emit { ALL, FLAGGED, NONE }
}
