package nearfit.table.bench;

import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * An embedded SQL engine's CSV reader as a peer in scripts/bench-load, through plain JDBC: the driver
 * jar is resolved by the script into bench-out/ and put on the class path at run time only, so
 * nothing here (nor in the tool) depends on it. Not a test: run by the script only.
 *
 * <p>{@code load URL FILE REPS WARMUP THREADS}: loads the whole file into an in-memory table
 * ({@code CREATE OR REPLACE TABLE ... AS SELECT * FROM read_csv(...)}) warm-up + REPS times and prints
 * {@code median_s=... rows=...}, as LoadBench does. {@code describe URL FILE THREADS}: one pass of
 * count, mean, SD, min, quartiles and max per column (exact quantiles), printing {@code rows N} and
 * {@code mean COLUMN VALUE} lines for the script's check, then the summary.
 */
public final class SqlCsvBench {
    private SqlCsvBench() {
    }

    public static void main(String[] args) throws SQLException {
        String url = args[1];
        String file = args[2].replace("'", "''");
        // A .parquet file goes through the engine's Parquet reader, anything else through its CSV reader.
        String source = file.endsWith(".parquet") ? "read_parquet('" + file + "')" : "read_csv('" + file + "')";
        try (Connection c = DriverManager.getConnection(url); Statement s = c.createStatement()) {
            if (args[0].equals("to-parquet")) {
                // bench-load's Parquet file: the CSV's rows, written by the engine (snappy, its default row groups).
                s.execute("COPY (SELECT * FROM " + source + ") TO '" + args[3].replace("'", "''") + "' (FORMAT parquet)");
            } else if (args[0].equals("load")) {
                s.execute("SET threads = " + Integer.parseInt(args[5]));
                load(s, source, Integer.parseInt(args[3]), Integer.parseInt(args[4]));
            } else {
                s.execute("SET threads = " + Integer.parseInt(args[3]));
                describe(s, source);
            }
        }
    }

    private static void load(Statement s, String source, int reps, int warmup) throws SQLException {
        double[] secs = new double[reps];
        long rows = 0;
        for (int i = -warmup; i < reps; i++) {
            long t0 = System.nanoTime();
            s.execute("CREATE OR REPLACE TABLE loaded AS SELECT * FROM " + source);
            try (ResultSet r = s.executeQuery("SELECT count(*) FROM loaded")) {
                r.next();
                rows = r.getLong(1);
            }
            long t1 = System.nanoTime();
            if (i >= 0) {
                secs[i] = (t1 - t0) / 1e9;
            }
        }
        Arrays.sort(secs);
        double median = reps % 2 == 1 ? secs[reps / 2] : (secs[reps / 2 - 1] + secs[reps / 2]) / 2;
        System.out.printf("median_s=%.4f rows=%d reps=%d%n", median, rows, reps);
    }

    private static void describe(Statement s, String source) throws SQLException {
        List<String> columns = new ArrayList<>();
        try (ResultSet r = s.executeQuery("DESCRIBE SELECT * FROM " + source)) {
            while (r.next()) {
                columns.add(r.getString(1));
            }
        }
        StringBuilder q = new StringBuilder("SELECT count(*)");
        for (String col : columns) {
            String c = '"' + col.replace("\"", "\"\"") + '"';
            q.append(", count(").append(c).append("), avg(").append(c).append("), stddev_samp(").append(c)
                    .append("), min(").append(c).append("), quantile_cont(").append(c).append(", 0.25), median(")
                    .append(c).append("), quantile_cont(").append(c).append(", 0.75), max(").append(c).append(')');
        }
        try (ResultSet r = s.executeQuery(q.append(" FROM ").append(source).toString())) {
            r.next();
            System.out.println("rows " + r.getLong(1));
            for (int j = 0; j < columns.size(); j++) {
                System.out.println("mean " + columns.get(j) + " " + r.getDouble(3 + 8 * j));
            }
            System.out.println("column count mean sd min q25 median q75 max");
            for (int j = 0; j < columns.size(); j++) {
                StringBuilder line = new StringBuilder(columns.get(j));
                for (int m = 0; m < 8; m++) {
                    line.append(' ').append(r.getString(2 + 8 * j + m));
                }
                System.out.println(line);
            }
        }
    }
}
