package nearfit.spark;

import static org.apache.spark.sql.functions.coalesce;
import static org.apache.spark.sql.functions.col;
import static org.apache.spark.sql.functions.expr;
import static org.apache.spark.sql.functions.lit;
import static org.apache.spark.sql.functions.when;

import java.io.IOException;
import java.time.Instant;
import java.time.LocalDate;
import java.time.LocalDateTime;
import java.time.OffsetDateTime;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

import nearfit.model.ModelColumns;
import nearfit.table.NearfitException;
import nearfit.table.RowCondition;
import org.apache.hadoop.conf.Configuration;
import org.apache.hadoop.fs.FSDataInputStream;
import org.apache.hadoop.fs.FileStatus;
import org.apache.hadoop.fs.FileSystem;
import org.apache.hadoop.fs.LocatedFileStatus;
import org.apache.hadoop.fs.Path;
import org.apache.hadoop.fs.RemoteIterator;
import org.apache.spark.sql.Column;
import org.apache.spark.sql.Dataset;
import org.apache.spark.sql.Row;
import org.apache.spark.sql.SparkSession;
import org.apache.spark.sql.types.DataType;
import org.apache.spark.sql.types.DataTypes;
import org.apache.spark.sql.types.DateType;
import org.apache.spark.sql.types.StructField;
import org.apache.spark.sql.types.StructType;
import org.apache.spark.sql.types.TimestampNTZType;
import org.apache.spark.sql.types.TimestampType;

/**
 * The rows of a job's input files as the scorer takes them, one typed row each: source file, row index (Parquet;
 * counted by the scorer for CSV), whether the row is kept (-1 malformed CSV line, 0 not meeting --where, 1
 * kept), bad cells, time (epoch ms), group label, then the model's inputs and response as doubles (null for a
 * category response), and for a category response its label as text, last.
 *
 * <p>Types come from the model, never from inference: every model column is read as a number with
 * {@code try_cast} (a time input as epoch milliseconds), so an unparseable cell is a missing value counted as a
 * bad cell, not a failed job (Spark 4 runs in ANSI mode, where a plain cast of "NA" throws). CSV is read with
 * every column as text, Parquet with the types its files carry.
 */
final class FleetInput {
    static final int FILE = 0;
    static final int ROW = 1;
    static final int KEEP = 2;
    static final int BAD = 3;
    static final int TIME = 4;
    static final int GROUP = 5;
    static final int FIRST_INPUT = 6;

    /** Malformed CSV lines (a wrong number of cells) go to this column; they are skipped, as single-machine. */
    private static final String CORRUPT = "_nearfit_malformed";
    /**
     * Split and open cost for CSV jobs: above any file, so each CSV file is read whole by one task (the row
     * index is the row's position in its file) and each file opens a partition of its own.
     */
    private static final String WHOLE_FILES = String.valueOf(1L << 50);

    enum Format { CSV, PARQUET }

    final Dataset<Row> typed;
    final Format format;
    final String timeColumn;
    final String groupColumn;
    final boolean hasResponse;
    final int files;

    private FleetInput(Dataset<Row> typed, Format format, String timeColumn, String groupColumn,
                       boolean hasResponse, int files) {
        this.typed = typed;
        this.format = format;
        this.timeColumn = timeColumn;
        this.groupColumn = groupColumn;
        this.hasResponse = hasResponse;
        this.files = files;
    }

    /**
     * Resolves the inputs and builds the typed rows; fails in one line naming the path or column when a path
     * matches nothing, is empty or unreadable, formats are mixed, or a model input (with {@code needResponse},
     * the response; with {@code --group}, the group) is missing.
     */
    static FleetInput open(SparkSession spark, List<String> inputs, ModelColumns columns, String groupOption,
                           String where, boolean needResponse) {
        Configuration conf = spark.sparkContext().hadoopConfiguration();
        Format format = null;
        int files = 0;
        for (String input : inputs) {
            List<FileStatus> found = dataFiles(input, conf);
            files += found.size();
            Format f = formatOf(found.get(0), conf);
            if (format != null && f != format) {
                throw NearfitException.inFile(input, "is " + f + " while the inputs before it are " + format
                        + "; give one format per job");
            }
            format = f;
        }
        String[] paths = inputs.toArray(new String[0]);
        Dataset<Row> raw;
        if (format == Format.CSV) {
            String[] names = spark.read().option("header", "true").csv(paths).columns();
            StructType schema = new StructType();
            for (String n : names) {
                schema = schema.add(n, DataTypes.StringType);
            }
            schema = schema.add(CORRUPT, DataTypes.StringType);
            raw = spark.read().schema(schema).option("header", "true").option("mode", "PERMISSIVE")
                    .option("columnNameOfCorruptRecord", CORRUPT).csv(paths);
        } else {
            raw = spark.read().parquet(paths);
        }
        List<String> names = new ArrayList<>(Arrays.asList(raw.columns()));
        names.remove(CORRUPT);
        String first = inputs.get(0);
        for (String input : columns.inputs()) {
            require(names, input, first, "a model input");
        }
        boolean hasResponse = names.contains(columns.response());
        if (needResponse && !hasResponse) {
            throw NearfitException.inFile(first, "has no column \"" + columns.response()
                    + "\", the model's response, so nothing can be checked");
        }
        String group = groupOption != null ? groupOption : columns.group();
        if (groupOption != null) {
            require(names, groupOption, first, "the --group column");
        } else if (group != null && !names.contains(group)) {
            group = null;
        }
        List<String> times = timeColumns(raw, names, format);
        String time = times.isEmpty() ? null : times.get(0);
        List<Column> select = new ArrayList<>();
        select.add(col("_metadata.file_path"));
        select.add(format == Format.PARQUET ? col("_metadata.row_index") : lit(null).cast("long"));
        Column keep = where == null || where.isBlank() ? lit(true) : condition(where, names, times);
        Column keepCode = when(keep, lit(1)).otherwise(lit(0));
        if (format == Format.CSV) {
            keepCode = when(col(CORRUPT).isNotNull(), lit(-1)).otherwise(keepCode);
        }
        select.add(keepCode);
        List<String> numbers = new ArrayList<>(columns.inputs());
        boolean category = columns.categoryResponse();
        if (hasResponse && !category) {
            numbers.add(columns.response());
        }
        Column bad = lit(0);
        List<Column> values = new ArrayList<>();
        for (String n : numbers) {
            Column v = number(n, raw.schema().apply(n).dataType(), times.contains(n));
            values.add(v);
            bad = bad.plus(when(quoted(n).isNotNull().and(v.isNull()), lit(1)).otherwise(lit(0)));
        }
        select.add(bad);
        select.add(time == null ? lit(null).cast("double") : number(time, raw.schema().apply(time).dataType(), true));
        select.add(group == null ? lit(null).cast("string") : quoted(group).cast("string"));
        select.addAll(values);
        if (!hasResponse || category) {
            select.add(lit(null).cast("double"));
        }
        if (category) {
            select.add(hasResponse ? quoted(columns.response()).cast("string") : lit(null).cast("string"));
        }
        Dataset<Row> typed = raw.select(select.toArray(new Column[0]));
        return new FleetInput(typed, format, time, group, hasResponse, files);
    }

    /**
     * Runs {@code action} with the session set so that each CSV file is one partition read whole (the scorer
     * counts row indexes), then restores the settings; Parquet carries row indexes and splits as Spark likes.
     */
    <T> T run(SparkSession spark, java.util.function.Supplier<T> action) {
        if (format != Format.CSV) {
            return action.get();
        }
        // Column pruning lets the parser skip the cells of unused columns, and with them the check of each
        // line's cell count: off, so malformed lines are found and skipped as the single-machine loader does.
        String[] keys = {"spark.sql.files.maxPartitionBytes", "spark.sql.files.openCostInBytes",
            "spark.sql.csv.parser.columnPruning.enabled"};
        String[] values = {WHOLE_FILES, WHOLE_FILES, "false"};
        String[] before = new String[keys.length];
        for (int i = 0; i < keys.length; i++) {
            before[i] = spark.conf().get(keys[i], null);
            spark.conf().set(keys[i], values[i]);
        }
        try {
            return action.get();
        } finally {
            for (int i = 0; i < keys.length; i++) {
                if (before[i] == null) {
                    spark.conf().unset(keys[i]);
                } else {
                    spark.conf().set(keys[i], before[i]);
                }
            }
        }
    }

    private static void require(List<String> names, String name, String file, String role) {
        if (!names.contains(name)) {
            throw NearfitException.inFile(file, "has no column \"" + name + "\", " + role + "; its columns are "
                    + String.join(", ", names));
        }
    }

    /** The data files of one input argument: a file, a folder's files (not _ or . names), or a glob's matches. */
    private static List<FileStatus> dataFiles(String input, Configuration conf) {
        try {
            Path p = new Path(input);
            FileSystem fs = p.getFileSystem(conf);
            FileStatus[] matched = fs.globStatus(p);
            if (matched == null || matched.length == 0) {
                throw NearfitException.inFile(input, p.toString().matches(".*[*?\\[{].*")
                        ? "matches no file" : "no such file or folder");
            }
            List<FileStatus> out = new ArrayList<>();
            for (FileStatus s : matched) {
                if (s.isDirectory()) {
                    RemoteIterator<LocatedFileStatus> it = fs.listFiles(s.getPath(), true);
                    while (it.hasNext()) {
                        LocatedFileStatus f = it.next();
                        if (!hidden(f.getPath(), s.getPath())) {
                            out.add(f);
                        }
                    }
                } else {
                    out.add(s);
                }
            }
            out.removeIf(f -> f.getLen() == 0);
            if (out.isEmpty()) {
                throw NearfitException.inFile(input, "is empty: no data in it");
            }
            return out;
        } catch (IOException e) {
            throw NearfitException.inFile(input, "cannot be read: " + e.getMessage(), e);
        }
    }

    /** Whether a file under a folder is Spark's or a hidden one (a name, or a folder, starting _ or .). */
    private static boolean hidden(Path file, Path root) {
        for (Path p = file; p != null && !p.equals(root); p = p.getParent()) {
            String n = p.getName();
            if (n.startsWith("_") || n.startsWith(".")) {
                return true;
            }
        }
        return false;
    }

    /** Parquet by its magic bytes ("PAR1"), CSV (plain or gzip) otherwise. */
    private static Format formatOf(FileStatus file, Configuration conf) {
        byte[] magic = new byte[4];
        try (FSDataInputStream in = file.getPath().getFileSystem(conf).open(file.getPath())) {
            int n = in.read(magic);
            return n == 4 && magic[0] == 'P' && magic[1] == 'A' && magic[2] == 'R' && magic[3] == '1'
                    ? Format.PARQUET : Format.CSV;
        } catch (IOException e) {
            throw NearfitException.inFile(file.getPath().toString(), "cannot be read: " + e.getMessage(), e);
        }
    }

    /**
     * The time columns in column order: Parquet's timestamp and date columns; for CSV, the columns whose
     * non-empty cells in the first rows all read as ISO 8601 dates or date-times.
     */
    private static List<String> timeColumns(Dataset<Row> raw, List<String> names, Format format) {
        List<String> out = new ArrayList<>();
        if (format == Format.PARQUET) {
            for (StructField f : raw.schema().fields()) {
                DataType t = f.dataType();
                if (t instanceof TimestampType || t instanceof TimestampNTZType || t instanceof DateType) {
                    out.add(f.name());
                }
            }
            return out;
        }
        Column[] cols = new Column[names.size()];
        for (int i = 0; i < cols.length; i++) {
            cols[i] = quoted(names.get(i));
        }
        List<Row> sample = raw.select(cols).limit(200).collectAsList();
        for (int j = 0; j < names.size(); j++) {
            int times = 0;
            boolean all = true;
            for (Row r : sample) {
                if (!r.isNullAt(j)) {
                    if (isTime(r.getString(j))) {
                        times++;
                    } else {
                        all = false;
                        break;
                    }
                }
            }
            if (all && times > 0) {
                out.add(names.get(j));
            }
        }
        return out;
    }

    /** Whether a cell reads as an ISO 8601 date-time with offset, local date-time, or date. */
    static boolean isTime(String s) {
        String t = s.strip();
        try {
            OffsetDateTime.parse(t);
            return true;
        } catch (DateTimeParseException e) {
            // try the next form
        }
        try {
            LocalDateTime.parse(t);
            return true;
        } catch (DateTimeParseException e) {
            // try the next form
        }
        try {
            Instant.parse(t);
            return true;
        } catch (DateTimeParseException e) {
            // try the next form
        }
        try {
            LocalDate.parse(t);
            return true;
        } catch (DateTimeParseException e) {
            return false;
        }
    }

    /** A column as a double: a time as epoch milliseconds, anything else by try_cast (null when it does not read). */
    private static Column number(String name, DataType type, boolean time) {
        String q = "`" + name.replace("`", "``") + "`";
        if (time) {
            return expr("CAST(unix_millis(try_cast(" + q + " AS TIMESTAMP)) AS DOUBLE)");
        }
        if (type instanceof TimestampType || type instanceof TimestampNTZType || type instanceof DateType) {
            return expr("CAST(unix_millis(CAST(" + q + " AS TIMESTAMP)) AS DOUBLE)");
        }
        return expr("try_cast(" + q + " AS DOUBLE)");
    }

    private static Column quoted(String name) {
        return col("`" + name.replace("`", "``") + "`");
    }

    /**
     * The row condition as a Spark column: each clause compares numbers when its value is a number, times
     * when it is an ISO 8601 time, and text otherwise (= and != only); a missing cell meets no clause, as in
     * the single-machine tool.
     */
    private static Column condition(String where, List<String> names, List<String> times) {
        Column all = null;
        for (RowCondition.Clause c : RowCondition.clausesOf(where)) {
            if (!names.contains(c.column())) {
                throw NearfitException.inColumn(c.column(), "no such column in the row condition; the columns are "
                        + String.join(", ", names));
            }
            String q = "`" + c.column().replace("`", "``") + "`";
            String value = c.value().strip();
            Column left;
            Column right;
            if (isNumber(value) && !times.contains(c.column())) {
                left = expr("try_cast(" + q + " AS DOUBLE)");
                right = lit(Double.parseDouble(value));
            } else if (isTime(value)) {
                left = expr("try_cast(" + q + " AS TIMESTAMP)");
                right = expr("try_cast('" + value.replace("'", "''") + "' AS TIMESTAMP)");
            } else {
                if (c.op() != RowCondition.Op.EQ && c.op() != RowCondition.Op.NE) {
                    throw NearfitException.inColumn(c.column(), "\"" + c.value()
                            + "\" is text, which takes only = and !=, not " + c.op().symbol());
                }
                left = quoted(c.column()).cast("string");
                right = lit(c.value());
            }
            Column test = switch (c.op()) {
                case EQ -> left.equalTo(right);
                case NE -> left.notEqual(right);
                case LT -> left.lt(right);
                case LE -> left.leq(right);
                case GT -> left.gt(right);
                case GE -> left.geq(right);
            };
            all = all == null ? test : all.and(test);
        }
        return coalesce(all, lit(false));
    }

    private static boolean isNumber(String s) {
        try {
            Double.parseDouble(s);
            return !s.isEmpty() && Character.isDigit(s.charAt(s.length() - 1));
        } catch (NumberFormatException e) {
            return false;
        }
    }
}
