package nearfit.table;

/** A column of decimal numbers stored as doubles in chunks; NaN marks a missing value. */
public final class DecimalColumn extends NamedColumn implements NumericColumn {
    private final DoubleChunks values;

    DecimalColumn(String name, DoubleChunks values, long missing, long bad) {
        super(name, missing, bad);
        this.values = values;
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
}
