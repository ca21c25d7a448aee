package nearfit.table;

import java.util.Arrays;

/**
 * The present (non-NaN) values of a column, sorted once, for any number of quantiles (Hyndman and Fan 1996,
 * definition 7, as {@link Quantiles#type7}): what a face asks for held values and medians, so it computes no
 * quantile itself. Immutable.
 */
public final class SortedValues {
    private final double[] sorted;

    private SortedValues(double[] sorted) {
        this.sorted = sorted;
    }

    /** The present values of {@code column} at {@code rows}. */
    public static SortedValues of(NumericColumn column, RowSet rows) {
        return ofOwned(column.copyValues(rows));
    }

    /** The present values of {@code values} (copied; the array is left as it is). */
    public static SortedValues of(double[] values) {
        return ofOwned(values.clone());
    }

    private static SortedValues ofOwned(double[] all) {
        int n = 0;
        for (double v : all) {
            if (!Double.isNaN(v)) {
                all[n++] = v;
            }
        }
        double[] out = n == all.length ? all : Arrays.copyOf(all, n);
        Arrays.sort(out);
        return new SortedValues(out);
    }

    /** How many values are present. */
    public int count() {
        return sorted.length;
    }

    /** The p-quantile, p in [0, 1]; NaN when no value is present. */
    public double quantile(double p) {
        return Quantiles.type7(sorted, sorted.length, p);
    }

    /** The median (the 0.5 quantile). */
    public double median() {
        return quantile(0.5);
    }
}
