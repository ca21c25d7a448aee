package nearfit.spark;

import java.io.IOException;
import java.io.InputStream;
import java.util.List;

import nearfit.model.ModelColumns;
import nearfit.model.ModelFile;
import nearfit.model.ReferenceModel;
import nearfit.model.ResultCsv;
import nearfit.table.NearfitException;
import nearfit.table.RowSource;
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
    /** The input arguments as given (paths, folders, globs). */
    private final List<String> inputPaths;
    private final ScoringPlan plan;

    private FleetRun(SparkSession spark, ReferenceModel stored, String modelSha256, String zScale, double threshold,
                     WorkerModel driverModel, FleetInput input, List<String> inputPaths, ScoringPlan plan) {
        this.spark = spark;
        this.stored = stored;
        this.modelSha256 = modelSha256;
        this.zScale = zScale;
        this.threshold = threshold;
        this.driverModel = driverModel;
        this.input = input;
        this.inputPaths = List.copyOf(inputPaths);
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
        if (columns.categoryResponse() && emit != ScoringPlan.Emit.ALL) {
            // The single-machine check's line, word for word (FleetCategoryTest compares them).
            throw new NearfitException(job + ": needs a model of a number response; " + columns.response()
                    + " is a category (use predict for class votes)");
        }
        String zScale = o.zScale != null ? o.zScale : stored.settings().flagScale().word();
        double threshold = o.threshold != null ? o.threshold : stored.settings().flagThreshold();
        WorkerModel driverModel = WorkerModel.restore(stored, zScale, Runtime.getRuntime().availableProcessors());
        FleetInput input = FleetInput.open(spark, o.inputs, columns, o.group, o.where, needResponse);
        boolean writeTime = input.timeColumn != null && !columns.inputs().contains(input.timeColumn);
        var broadcast = JavaSparkContext.fromSparkContext(spark.sparkContext()).broadcast(bytes);
        ScoringPlan plan = new ScoringPlan(broadcast, o.modelFile, sha256(bytes), zScale, threshold,
                columns.inputs().size(), input.hasResponse, columns.categoryResponse(), writeTime,
                input.groupColumn != null, emit, o.blockRows, worstCount, o.probe);
        return new FleetRun(spark, stored, plan.modelSha256(), zScale, threshold, driverModel, input, o.inputs, plan);
    }

    /**
     * Scores every row and writes those the plan keeps to {@code outDir} as Parquet (nowhere when it is
     * {@code null}); returns the tally.
     *
     * <p>The rows go through Spark's committer to a hidden folder beside {@code outDir}
     * ({@code .NAME.nf-RANDOM.part}, a name Spark and Hadoop readers skip), which is renamed to {@code outDir}
     * only when the job has succeeded (with {@code force}, after the previous folder is removed). So a task
     * attempt that fails leaves nothing (the committer drops its files and Spark retries it), a job that fails
     * leaves no {@code outDir} and a previous one as it was, and a reader never sees a half-written folder.
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
        FileSystem fs;
        Path staging;
        try {
            fs = out.getFileSystem(spark.sparkContext().hadoopConfiguration());
            out = fs.makeQualified(out);
            refuseInput(fs, out, outDir);
            if (fs.exists(out) && !force) {
                throw NearfitException.inFile(outDir, "exists already; give --force to replace it");
            }
            if (out.getParent() == null) {
                throw NearfitException.inFile(outDir, "is a root folder; name a folder to write");
            }
            staging = new Path(out.getParent(), "." + out.getName() + ".nf-"
                    + java.util.UUID.randomUUID().toString().substring(0, 8) + ".part");
        } catch (IOException e) {
            throw NearfitException.inFile(outDir, "cannot be checked: " + e.getMessage(), e);
        }
        try {
            input.run(spark, () -> {
                scored.write().mode(SaveMode.ErrorIfExists).parquet(staging.toString());
                return null;
            });
        } catch (Exception e) {
            // Spark's task failures are checked exceptions Scala throws unchecked: catch them all here.
            remove(fs, staging);
            throw new NearfitException(null, NearfitException.NO_LINE, null, FleetMain.oneLine(e) + " (the job failed; "
                    + outDir + (force && exists(fs, out) ? " left as it was)" : " not written)"), e);
        }
        replace(fs, staging, out, outDir, force);
        return acc.value();
    }

    /**
     * Refuses an output folder that is one of the inputs, holds one, or lies inside an input folder: replacing
     * it would destroy the input, and output inside an input folder would be read as input by the next run.
     */
    private void refuseInput(FileSystem fs, Path out, String outDir) {
        String o = out.toString();
        for (String arg : inputPaths) {
            String in = fs.makeQualified(new Path(arg)).toString();
            boolean folder = !arg.matches(".*[*?\\[{].*");
            if (in.equals(o) || in.startsWith(o + "/") || folder && o.startsWith(in + "/")) {
                throw NearfitException.inFile(outDir, "is, holds or lies in an input of this run (" + arg
                        + "); choose another output folder");
            }
        }
    }

    /** Moves the finished output into place, over the previous folder when {@code force}. */
    private static void replace(FileSystem fs, Path staging, Path out, String outDir, boolean force) {
        try {
            if (fs.exists(out)) {
                if (!force) {
                    remove(fs, staging);
                    throw NearfitException.inFile(outDir, "was made by another program while the job ran; "
                            + "give --force to replace it");
                }
                fs.delete(out, true);
            }
            if (!fs.rename(staging, out)) {
                throw new IOException("renaming " + staging + " failed");
            }
        } catch (IOException e) {
            throw NearfitException.inFile(outDir, "cannot be written: " + e.getMessage() + "; the job's output is in "
                    + staging, e);
        }
    }

    /** Deletes a folder if it is there; a failure to is not the error to report. */
    private static void remove(FileSystem fs, Path p) {
        try {
            fs.delete(p, true);
        } catch (IOException ignored) {
            // the job's own error is the one to report
        }
    }

    private static boolean exists(FileSystem fs, Path p) {
        try {
            return fs.exists(p);
        } catch (IOException e) {
            return false;
        }
    }

    /**
     * The output rows' columns, named and ordered as the single-machine predict's ({@link ResultCsv#rowColumns})
     * with {@code file, row} in place of {@code line} (as the tool's Parquet output of a data set): file, row,
     * [time], [group], inputs, [response], then fit, band_lo, band_hi, [resid, z] or for a category response class
     * and share, then beyond (a whole number, as the single-machine Parquet output writes it).
     */
    StructType outputSchema() {
        ModelColumns c = stored.columns();
        String time = plan.writeTime() ? input.timeColumn : null;
        String group = plan.writeGroup() ? input.groupColumn : null;
        String response = plan.hasResponse() ? c.response() : null;
        List<String> names = ResultCsv.rowColumns(time, group, c.inputs(), response, plan.category(), true);
        StructType s = new StructType().add(ResultCsv.FILE, DataTypes.StringType, false)
                .add(ResultCsv.ROW, DataTypes.LongType, false);
        for (String name : names.subList(ResultCsv.originColumns(RowSource.CSV_LINES).size(), names.size())) {
            boolean text = name.equals(group) || name.equals(ResultCsv.CLASS)
                    || plan.category() && name.equals(response);
            s = s.add(name, name.equals(time) ? DataTypes.TimestampType
                    : text ? DataTypes.StringType
                    : name.equals(ResultCsv.BEYOND) ? DataTypes.LongType : DataTypes.DoubleType);
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
