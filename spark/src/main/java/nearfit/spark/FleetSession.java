package nearfit.spark;

import org.apache.spark.SparkConf;
import org.apache.spark.sql.SparkSession;

/**
 * The Spark session of a job: the one already running in this process (a test's, or spark-submit's), or a new
 * one on {@code --master}, spark-submit's master, or {@code local[2,2]} (the embedded default: no cluster; two
 * threads, each task tried at most twice).
 * Times are read and written in UTC, as the single-machine tool reads them.
 */
final class FleetSession {
    /** The master when none is given anywhere: two threads, and a failed task tried once more (as a cluster retries it). */
    static final String DEFAULT_MASTER = "local[2,2]";

    private FleetSession() {
    }

    static SparkSession open(String master, String job) {
        SparkSession.Builder b = SparkSession.builder().appName("nearfit " + job);
        if (master != null) {
            b.master(master);
        } else if (!new SparkConf().contains("spark.master")) {
            b.master(DEFAULT_MASTER);
        }
        if (master != null && master.startsWith("local") || !new SparkConf().contains("spark.master")) {
            // No web UI for a job run on this machine: it is a port and a second of start-up for nothing.
            b.config("spark.ui.enabled", "false");
        }
        SparkSession spark = b.config("spark.sql.session.timeZone", "UTC").getOrCreate();
        spark.conf().set("spark.sql.session.timeZone", "UTC");
        return spark;
    }

    /** Stops the session this process holds, if any (the command-line entry, on its way out). */
    static void stopIfStarted() {
        scala.Option<SparkSession> active = SparkSession.getDefaultSession();
        if (active.isDefined()) {
            active.get().stop();
        }
    }
}
