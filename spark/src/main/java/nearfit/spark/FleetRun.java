package nearfit.spark;

import java.io.IOException;
import java.io.InputStream;
import java.util.ArrayList;
import java.util.List;

import nearfit.model.ModelColumns;
import nearfit.model.ModelFile;
import nearfit.model.ReferenceModel;
import nearfit.table.NearfitException;
import org.apache.hadoop.conf.Configuration;
import org.apache.hadoop.fs.FileSystem;
import org.apache.hadoop.fs.Path;
import org.apache.spark.api.java.JavaSparkContext;
import org.apache.spark.sql.Dataset;
import org.apache.spark.sql.Encoders;
import org.apache.spark.sql.Row;
import org.apache.spark.sql.SaveMode;
import org.apache.spark.sql.SparkSession;
import org.apache.spark.sql.types.DataTypes;
import org.apache.spark.sql.types.StructType;

/**
 * One fleet job on the driver: reads and checks the model once, broadcasts its bytes, opens the inputs with the
 * model's types, then scores every partition and writes the rows the job keeps as Parquet through Spark's
 * committer (or nowhere), gathering the tally.
 */
final class FleetRun {
    final SparkSession spark;
    final ReferenceModel stored;
    final String modelSha256;
    final String zScale;
    final double threshold;
    final WorkerModel driverModel;
    final FleetInput input;
    private final ScoringPlan plan;

    private FleetRun(SparkSession spark, ReferenceModel stored, String modelSha256, String zScale, double threshold,
                     WorkerModel driverModel, FleetInput input, ScoringPlan plan) {
        this.spark = spark;
        this.stored = stored;
        this.modelSha256 = modelSha256;
        this.zScale = zScale;
        this.threshold = threshold;
        this.driverModel = driverModel;
        this.input = input;
        this.plan = plan;
    }

    /** Reads the model, starts Spark and opens the inputs; every input error is raised here, before any task. */
    static FleetRun start(FleetOptions o, String job, boolean needResponse, ScoringPlan.Emit emit, int worstCount) {
        o.validate();
        SparkSession spark = FleetSession.open(o.master, job);
        Configuration conf = spark.sparkContext().hadoopConfiguration();
        byte[] bytes = modelBytes(o.modelFile, conf);
        ReferenceModel stored = ModelFile.read(bytes, o.modelFile);
        ModelColumns columns = stored.columns();
        if (columns.categoryResponse()) {
            throw new NearfitException(job + ": needs a model of a number response; " + columns.response()
                    + " is a category (fleet jobs do not vote classes)");
        }
        String zScale = o.zScale != null ? o.zScale : stored.settings().flagScale().word();
        double threshold = o.threshold != null ? o.threshold : stored.settings().flagThreshold();
        WorkerModel driverModel = WorkerModel.restore(stored, zScale, Runtime.getRuntime().availableProcessors());
        FleetInput input = FleetInput.open(spark, o.inputs, columns, o.group, o.where, needResponse);
        boolean writeTime = input.timeColumn != null && !columns.inputs().contains(input.timeColumn);
        var broadcast = JavaSparkContext.fromSparkContext(spark.sparkContext()).broadcast(bytes);
        ScoringPlan plan = new ScoringPlan(broadcast, o.modelFile, sha256(bytes), zScale, threshold,
                columns.inputs().size(), input.hasResponse, writeTime, input.groupColumn != null, emit, o.blockRows,
                worstCount);
        return new FleetRun(spark, stored, plan.modelSha256(), zScale, threshold, driverModel, input, plan);
    }

    /**
     * Scores every row and writes those the plan keeps to {@code outDir} as Parquet (nowhere when it is
     * {@code null}); returns the tally. A job that fails removes the output folder it created: Spark's
     * committer leaves no partial files of failed or retried tasks, and no folder is left half written.
     */
    FleetTally execute(String outDir, boolean force) {
        TallyAccumulator acc = new TallyAccumulator(plan.inputs(), plan.worstCount());
        spark.sparkContext().register(acc, "nearfit tally");
        Dataset<Row> scored = input.typed.mapPartitions(new BlockScorer(plan, acc), Encoders.row(outputSchema()));
        if (outDir == null) {
            input.run(spark, () -> {
                scored.write().format("noop").mode(SaveMode.Overwrite).save();
                return null;
            });
            return acc.value();
        }
        Path out = new Path(outDir);
        boolean existed;
        FileSystem fs;
        try {
            fs = out.getFileSystem(spark.sparkContext().hadoopConfiguration());
            existed = fs.exists(out);
        } catch (IOException e) {
            throw NearfitException.inFile(outDir, "cannot be checked: " + e.getMessage(), e);
        }
        if (existed && !force) {
            throw NearfitException.inFile(outDir, "exists already; give --force to replace it");
        }
        try {
            input.run(spark, () -> {
                scored.write().mode(force ? SaveMode.Overwrite : SaveMode.ErrorIfExists).parquet(outDir);
                return null;
            });
        } catch (Exception e) {
            // Spark's task failures are checked exceptions Scala throws unchecked: catch them all here.
            try {
                if (fs.exists(out)) {
                    fs.delete(out, true);
                }
            } catch (IOException ignored) {
                // the job's own error is the one to report
            }
            throw e;
        }
        return acc.value();
    }

    /**
     * The output rows' columns: file, row (as the tool's Parquet output of a data set), [time], [group], inputs,
     * [response], fit, band, [resid, z].
     */
    StructType outputSchema() {
        ModelColumns c = stored.columns();
        StructType s = new StructType().add("file", DataTypes.StringType, false)
                .add("row", DataTypes.LongType, false);
        if (plan.writeTime()) {
            s = s.add(input.timeColumn, DataTypes.TimestampType);
        }
        if (plan.writeGroup()) {
            s = s.add(input.groupColumn, DataTypes.StringType);
        }
        for (String name : c.inputs()) {
            s = s.add(name, DataTypes.DoubleType);
        }
        List<String> tail = new ArrayList<>();
        if (plan.hasResponse()) {
            tail.add(c.response());
        }
        tail.addAll(List.of("fit", "band_lo", "band_hi"));
        if (plan.hasResponse()) {
            tail.addAll(List.of("resid", "z"));
        }
        for (String name : tail) {
            s = s.add(name, DataTypes.DoubleType);
        }
        return s;
    }

    /** The model file's bytes, read once on the driver from any file system Spark reads. */
    private static byte[] modelBytes(String name, Configuration conf) {
        try {
            Path p = new Path(name);
            FileSystem fs = p.getFileSystem(conf);
            if (!fs.exists(p)) {
                throw NearfitException.inFile(name, "no such file");
            }
            if (fs.getFileStatus(p).isDirectory()) {
                throw NearfitException.inFile(name, "is a folder, not a model file");
            }
            try (InputStream in = fs.open(p)) {
                return in.readAllBytes();
            }
        } catch (IOException e) {
            throw NearfitException.inFile(name, "cannot be read: " + e.getMessage(), e);
        }
    }

    static String sha256(byte[] bytes) {
        try {
            return java.util.HexFormat.of().formatHex(java.security.MessageDigest.getInstance("SHA-256").digest(bytes));
        } catch (java.security.NoSuchAlgorithmException e) {
            throw new IllegalStateException(e);
        }
    }
}
