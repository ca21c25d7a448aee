package nearfit.table;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.concurrent.atomic.AtomicReference;

/**
 * Summary statistics of one column. For numbers and times: the count of present values, missing, bad,
 * min, p01, p25, median, p75, p99, max (Hyndman and Fan definition 7, see {@link Quantiles}), mean and the
 * sample standard deviation (divisor n - 1, as R's sd(); NaN for fewer than two values; numpy's std
 * defaults to the population divisor n instead). Times are summarised in epoch milliseconds. For
 * categories: the number of distinct labels and the most frequent ones. Absent statistics are NaN.
 *
 * @param name     the column's name
 * @param type     the column's type
 * @param count    present (not missing) values
 * @param missing  missing values, bad cells included
 * @param bad      cells that did not parse
 * @param min      smallest value
 * @param p01      1st percentile
 * @param p25      lower quartile
 * @param median   median
 * @param p75      upper quartile
 * @param p99      99th percentile
 * @param max      largest value
 * @param mean     arithmetic mean
 * @param sd       sample standard deviation
 * @param distinct distinct labels of a category, else 0
 * @param top      the most frequent labels with their counts, most frequent first (categories only)
 */
public record ColumnSummary(String name, ColumnType type, long count, long missing, long bad, double min,
        double p01, double p25, double median, double p75, double p99, double max, double mean, double sd,
        int distinct, List<LabelCount> top) {
    /** How many of the most frequent labels a summary keeps. */
    public static final int TOP = 5;

    /** A label and how many rows hold it. */
    public record LabelCount(String label, long count) {
    }

    public ColumnSummary {
        top = List.copyOf(top);
    }

    /** Summarises one column. */
    public static ColumnSummary of(Column column) {
        if (column instanceof NumericColumn n) {
            return ofNumeric(n);
        }
        long present = column.size() - column.missingCount();
        if (column instanceof CategoryColumn c) {
            return ofCategory(c, present);
        }
        return new ColumnSummary(column.name(), column.type(), present, column.missingCount(), 0,
                Double.NaN, Double.NaN, Double.NaN, Double.NaN, Double.NaN, Double.NaN, Double.NaN,
                Double.NaN, Double.NaN, 0, List.of());
    }

    /**
     * Summarises every column, on up to {@code threads} threads, one column per task (each summary reads only its
     * own column); the result is in the columns' order and the same for any thread count.
     */
    public static List<ColumnSummary> ofAll(List<? extends Column> columns, int threads) {
        ColumnSummary[] out = new ColumnSummary[columns.size()];
        AtomicInteger next = new AtomicInteger();
        AtomicReference<Throwable> failure = new AtomicReference<>();
        Runnable work = () -> {
            try {
                for (int i; failure.get() == null && (i = next.getAndIncrement()) < out.length; ) {
                    out[i] = of(columns.get(i));
                }
            } catch (RuntimeException | Error e) { // out of memory above all: rethrown on the caller's thread
                failure.compareAndSet(null, e);
            }
        };
        int extra = Math.max(0, Math.min(threads, out.length) - 1);
        Thread[] helpers = new Thread[extra];
        for (int t = 0; t < extra; t++) {
            helpers[t] = new Thread(work, "nearfit-summary-" + t);
            helpers[t].start();
        }
        work.run();
        for (Thread t : helpers) {
            try {
                t.join();
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                throw new IllegalStateException("interrupted while summarising", e);
            }
        }
        Throwable f = failure.get();
        if (f instanceof Error e) {
            throw e;
        } else if (f != null) {
            throw (RuntimeException) f;
        }
        return List.of(out);
    }

    /** The probabilities of the quantiles a summary holds, in the record's order. */
    private static final double[] PROBABILITIES = {0.01, 0.25, 0.50, 0.75, 0.99};

    /**
     * Linear in the column's size and with no copy of it: one pass for count, extremes and mean, one for the
     * squared deviations, and the quantiles' order statistics by {@link RankSelection} (usually two passes).
     * Every statistic equals its value from the sorted column; the sums run in row order.
     */
    private static ColumnSummary ofNumeric(NumericColumn c) {
        int rows = c.size();
        long n = 0;
        double sum = 0;
        long minKey = -1L; // unsigned order: the largest key
        long maxKey = 0L;
        for (int row = 0; row < rows; row++) {
            double v = c.asDouble(row);
            if (v != v) {
                continue;
            }
            n++;
            sum += v;
            long k = RankSelection.key(v);
            if (Long.compareUnsigned(k, minKey) < 0) {
                minKey = k;
            }
            if (Long.compareUnsigned(k, maxKey) > 0) {
                maxKey = k;
            }
        }
        if (n == 0) {
            return new ColumnSummary(c.name(), c.type(), 0, c.missingCount(), c.badCount(), Double.NaN, Double.NaN,
                    Double.NaN, Double.NaN, Double.NaN, Double.NaN, Double.NaN, Double.NaN, Double.NaN, 0, List.of());
        }
        double mean = sum / n;
        double ss = 0;
        double drift = 0; // two-pass with the compensation term of Chan, Golub and LeVeque (1983)
        for (int row = 0; row < rows; row++) {
            double v = c.asDouble(row);
            if (v == v) {
                double d = v - mean;
                ss += d * d;
                drift += d;
            }
        }
        double sd = n < 2 ? Double.NaN : Math.sqrt((ss - drift * drift / n) / (n - 1));
        double[] q = quantiles(c, n);
        return new ColumnSummary(c.name(), c.type(), n, c.missingCount(), c.badCount(), RankSelection.value(minKey),
                q[0], q[1], q[2], q[3], q[4], RankSelection.value(maxKey), mean, sd, 0, List.of());
    }

    /** Definition-7 quantiles at {@link #PROBABILITIES} of the n present values, by selection. */
    private static double[] quantiles(NumericColumn c, long n) {
        int m = PROBABILITIES.length;
        long[] ranks = new long[2 * m];
        double[] frac = new double[m];
        for (int i = 0; i < m; i++) {
            double h = (n - 1) * PROBABILITIES[i];
            long lo = (long) Math.floor(h);
            ranks[2 * i] = lo;
            ranks[2 * i + 1] = Math.min(lo + 1, n - 1);
            frac[i] = lo >= n - 1 ? 0 : h - lo;
        }
        double[] at = RankSelection.select(c, n, ranks);
        double[] out = new double[m];
        for (int i = 0; i < m; i++) {
            out[i] = Quantiles.between(at[2 * i], at[2 * i + 1], frac[i]);
        }
        return out;
    }

    private static ColumnSummary ofCategory(CategoryColumn c, long present) {
        long[] counts = new long[c.labels().size()];
        for (int row = 0, rows = c.size(); row < rows; row++) {
            int code = c.code(row);
            if (code >= 0) {
                counts[code]++;
            }
        }
        List<LabelCount> all = new ArrayList<>();
        for (int code = 0; code < counts.length; code++) {
            all.add(new LabelCount(c.labels().get(code), counts[code]));
        }
        // Most frequent first; ties keep the order of first appearance (the sort is stable).
        all.sort((a, b) -> Long.compare(b.count(), a.count()));
        return new ColumnSummary(c.name(), c.type(), present, c.missingCount(), 0, Double.NaN, Double.NaN,
                Double.NaN, Double.NaN, Double.NaN, Double.NaN, Double.NaN, Double.NaN, Double.NaN,
                counts.length, all.subList(0, Math.min(TOP, all.size())));
    }
}
