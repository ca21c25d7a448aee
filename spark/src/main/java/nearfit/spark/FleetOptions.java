package nearfit.spark;

import java.util.List;

import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/** The options both fleet jobs take, named and meaning as in the single-machine {@code check} and {@code predict}. */
final class FleetOptions {
    @Parameters(index = "0", paramLabel = "MODEL", description = "A model file written by nearfit fit.")
    String modelFile;

    @Parameters(index = "1..*", arity = "1..*", paramLabel = "INPUT",
            description = "CSV (plain or gzip) or Parquet files, folders of them, or path globs (quote them), "
                    + "on any file system Spark reads; one format per job.")
    List<String> inputs;

    @Option(names = "--where", paramLabel = "CONDITION",
            description = "Row condition: COLUMN OP VALUE joined by 'and', e.g. \"turbine != T03 and wind_ms > 3\".")
    String where;

    @Option(names = "--group", paramLabel = "COL", description = "Group column (default: the model's).")
    String group;

    @Option(names = "--threshold", paramLabel = "Z",
            description = "|z| above which a row is flagged (default: the model's, normally 3.5).")
    Double threshold;

    @Option(names = "--z-scale", paramLabel = "local|reference",
            description = "What divides a residual to make z: local or reference (default: the model's).")
    String zScale;

    @Option(names = "--master", paramLabel = "URL",
            description = "Spark master (default: spark-submit's, else local[2,2] on this machine: 2 threads, a failed task tried twice).")
    String master;

    @Option(names = "--force", description = "Replace an output folder that exists already.")
    boolean force;

    @Option(names = "--debug", description = "Stack traces with errors.")
    boolean debug;

    /** Rows scored at a time in a task; not an option (tests set it to show blocks change nothing). */
    int blockRows = BlockScorer.BLOCK_ROWS;

    /** The tasks' test hook ({@link TaskProbe}); not an option: only tests in this package set it. */
    TaskProbe probe = TaskProbe.NONE;

    /** Checks what picocli has not, before Spark starts. */
    void validate() {
        if (threshold != null && !(threshold > 0)) {
            throw new nearfit.table.NearfitException("--threshold: must be greater than 0, not " + threshold);
        }
        if (zScale != null && WorkerModel.flagScale(zScale) == null) {
            throw new nearfit.table.NearfitException("--z-scale: must be local or reference, not \"" + zScale + "\"");
        }
    }
}
