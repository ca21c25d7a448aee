package nearfit.table;

/**
 * A column of ISO 8601 dates and date-times stored as {@code long} milliseconds since 1970-01-01T00:00Z.
 * Values without an offset are read as UTC. {@link #MISSING} marks a missing value.
 */
public final class TimeColumn implements NumericColumn {
    /** The sentinel stored for a missing time; no ISO 8601 value parses to it. */
    public static final long MISSING = Long.MIN_VALUE;

    private final String name;
    private final LongChunks values;
    private final long missing;
    private final long bad;

    TimeColumn(String name, LongChunks values, long missing, long bad) {
        this.name = name;
        this.values = values;
        this.missing = missing;
        this.bad = bad;
    }

    /** Epoch milliseconds at {@code row}, or {@link #MISSING}. */
    public long epochMillis(int row) {
        return values.get(row);
    }

    /** Epoch milliseconds as a double (exact below 2^53 ms, about 285 000 years); NaN when missing. */
    @Override
    public double asDouble(int row) {
        long v = values.get(row);
        return v == MISSING ? Double.NaN : (double) v;
    }

    @Override
    public void copyValues(RowSet rows, double[] dst, int offset) {
        for (int i = 0, n = rows.size(); i < n; i++) {
            dst[offset + i] = asDouble(rows.row(i));
        }
    }

    @Override
    public String name() {
        return name;
    }

    @Override
    public ColumnType type() {
        return ColumnType.TIME;
    }

    @Override
    public int size() {
        return values.size();
    }

    @Override
    public boolean isMissing(int row) {
        return values.get(row) == MISSING;
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
