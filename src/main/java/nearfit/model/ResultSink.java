package nearfit.model;

import java.io.Flushable;
import java.io.IOException;
import java.util.List;

/**
 * Where scored rows go, cell by cell in the column order of {@link ResultCsv#rowColumns}: a CSV
 * ({@link ResultCsv}) or a Parquet file ({@link ResultParquet}), so both forms share one column list and
 * one way of writing a row. A row is its cells in order, then {@link #endRow()}.
 */
public interface ResultSink extends Flushable {
    /** The column names, once, before any row. */
    void header(List<String> names) throws IOException;

    /** A text cell (a label or a name from the file); empty for {@code null}. */
    ResultSink text(String s) throws IOException;

    /** A number cell; empty (null) for NaN. */
    ResultSink number(double v) throws IOException;

    /** A whole number (a line or row index, a count). */
    ResultSink whole(long v) throws IOException;

    /** A time in epoch milliseconds; empty (null) for NaN. */
    ResultSink time(double epochMillis) throws IOException;

    /** An empty cell. */
    ResultSink empty() throws IOException;

    /** Ends the current row. */
    void endRow() throws IOException;

    /** Writes what is buffered and ends the file (a Parquet footer); the stream stays open. */
    default void finish() throws IOException {
        flush();
    }
}
