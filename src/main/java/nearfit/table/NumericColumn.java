package nearfit.table;

/**
 * A column whose values can serve as a numeric input: numbers as they are, times as epoch milliseconds.
 * Missing values read as NaN through this view.
 */
public sealed interface NumericColumn extends Column permits DecimalColumn, TimeColumn {
    /** The value at {@code row} as a double, NaN when missing. */
    double asDouble(int row);

    /**
     * Copies the values of the given rows, in row-set order, into a new array; the k-NN engine works on
     * primitive arrays. Missing values are NaN.
     */
    default double[] copyValues(RowSet rows) {
        double[] out = new double[rows.size()];
        copyValues(rows, out, 0);
        return out;
    }

    /** Copies the values of the given rows into {@code dst} from {@code offset}; missing values are NaN. */
    void copyValues(RowSet rows, double[] dst, int offset);
}
