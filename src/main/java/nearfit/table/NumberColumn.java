package nearfit.table;

/** A column of decimal numbers stored as doubles in chunks; NaN marks a missing value. */
public final class NumberColumn implements NumericColumn {
    private final String name;
    private final DoubleChunks values;
    private final long missing;
    private final long bad;

    NumberColumn(String name, DoubleChunks values, long missing, long bad) {
        this.name = name;
        this.values = values;
        this.missing = missing;
        this.bad = bad;
    }

    /** The value at {@code row}, NaN when missing. */
    public double get(int row) {
        return values.get(row);
    }

    @Override
    public double asDouble(int row) {
        return values.get(row);
    }

    @Override
    public void copyValues(RowSet rows, double[] dst, int offset) {
        for (int i = 0, n = rows.size(); i < n; i++) {
            dst[offset + i] = values.get(rows.row(i));
        }
    }

    @Override
    public String name() {
        return name;
    }

    @Override
    public ColumnType type() {
        return ColumnType.NUMBER;
    }

    @Override
    public int size() {
        return values.size();
    }

    @Override
    public boolean isMissing(int row) {
        return Double.isNaN(values.get(row));
    }

    @Override
    public long missingCount() {
        return missing;
    }

    @Override
    public long badCount() {
        return bad;
    }
}
