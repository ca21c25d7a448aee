package nearfit.table;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

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

    /** Summarises the present values of {@code values[0..n)} (the array is sorted in place). */
    static ColumnSummary ofValues(String name, ColumnType type, double[] values, int n, long missing, long bad) {
        Arrays.sort(values, 0, n);
        double sum = 0;
        for (int i = 0; i < n; i++) {
            sum += values[i];
        }
        double mean = n == 0 ? Double.NaN : sum / n;
        double ss = 0;
        double drift = 0; // two-pass with the compensation term of Chan, Golub and LeVeque (1983)
        for (int i = 0; i < n; i++) {
            double d = values[i] - mean;
            ss += d * d;
            drift += d;
        }
        double sd = n < 2 ? Double.NaN : Math.sqrt((ss - drift * drift / n) / (n - 1));
        return new ColumnSummary(name, type, n, missing, bad, n == 0 ? Double.NaN : values[0],
                Quantiles.type7(values, n, 0.01), Quantiles.type7(values, n, 0.25),
                Quantiles.type7(values, n, 0.50), Quantiles.type7(values, n, 0.75),
                Quantiles.type7(values, n, 0.99), n == 0 ? Double.NaN : values[n - 1], mean, sd, 0, List.of());
    }

    private static ColumnSummary ofNumeric(NumericColumn c) {
        int rows = c.size();
        double[] values = new double[rows];
        int n = 0;
        for (int row = 0; row < rows; row++) {
            double v = c.asDouble(row);
            if (!Double.isNaN(v)) {
                values[n++] = v;
            }
        }
        return ofValues(c.name(), c.type(), values, n, c.missingCount(), c.badCount());
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
