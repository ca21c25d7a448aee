package nearfit.table;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * A loaded CSV file as typed columns of primitive arrays, with each row's source line and the load report.
 * Immutable once loaded; safe to read from many threads.
 *
 * <p>Load one with {@link CsvLoader#load(String, LoadOptions)}; select rows with {@link #where(String)}.
 */
public final class Table {
    private final List<Column> columns;
    private final Map<String, Column> byName = new HashMap<>();
    private final LongChunks lines;
    private final LoadReport report;
    private final RowSource rowSource;

    Table(List<Column> columns, LongChunks lines, LoadReport report) {
        this(columns, lines, report, RowSource.CSV_LINES);
    }

    Table(List<Column> columns, LongChunks lines, LoadReport report, RowSource rowSource) {
        this.rowSource = rowSource;
        this.columns = List.copyOf(columns);
        for (Column c : columns) {
            byName.put(c.name(), c);
        }
        this.lines = lines;
        this.report = report;
    }

    /** The number of data rows. */
    public int rowCount() {
        return lines.size();
    }

    /** The number of columns kept. */
    public int columnCount() {
        return columns.size();
    }

    /** The columns in file order. */
    public List<Column> columns() {
        return columns;
    }

    /** The column at {@code index}, 0-based, in file order. */
    public Column column(int index) {
        return columns.get(index);
    }

    /** The column named {@code name}; fails naming the column and listing the others when there is none. */
    public Column column(String name) {
        Column c = byName.get(name);
        if (c == null) {
            throw NearfitException.inColumn(name, "no such column; the columns are " + String.join(", ", names()));
        }
        return c;
    }

    /** Whether a column of that name exists. */
    public boolean hasColumn(String name) {
        return byName.containsKey(name);
    }

    /** A numeric view of a number or time column; fails naming the column for a category or text column. */
    public NumericColumn numeric(String name) {
        Column c = column(name);
        if (c instanceof NumericColumn n) {
            return n;
        }
        throw NearfitException.inColumn(name, "is a " + c.type().label() + " column, not a number or time");
    }

    /** The column names in file order. */
    public List<String> names() {
        List<String> out = new ArrayList<>(columns.size());
        for (Column c : columns) {
            out.add(c.name());
        }
        return out;
    }

    /**
     * The source-row value of row {@code row}: for CSV the 1-based line where it starts (quoted line breaks
     * make it differ from row + 2); for Parquet its file and row index, read through {@link #rowSource()}.
     */
    public long lineOf(int row) {
        return lines.get(row);
    }

    /** What {@link #lineOf(int)}'s values mean and how to print them. */
    public RowSource rowSource() {
        return rowSource;
    }

    /** What the load found. */
    public LoadReport report() {
        return report;
    }

    /** The same columns with another load report (the loader adds warnings once the read is over). */
    Table withReport(LoadReport r) {
        return new Table(columns, lines, r, rowSource);
    }

    /** The same rows with other columns (a column's type decided after loading). */
    Table withColumns(List<Column> other) {
        return new Table(other, lines, report, rowSource);
    }

    /** Every row. */
    public RowSet allRows() {
        return RowSet.all(rowCount());
    }

    /** The rows meeting a row condition such as {@code turbine = T03 and wind_ms >= 4}; see {@link RowCondition}. */
    public RowSet where(String condition) {
        return RowCondition.parse(condition, this).select(this);
    }
}
