package nearfit.table;

import java.util.List;

/**
 * What a load found, for the user: sizes, ragged rows, examples of bad cells, and the time taken.
 *
 * @param source         the file as the user named it ("-" for standard input)
 * @param rows           data rows kept (ragged rows are not among them)
 * @param bytes          input bytes read (decompressed for gzip)
 * @param delimiter      the field delimiter used; {@link #PARQUET} for a Parquet file or data set
 * @param headerPresent  whether the first row was read as a header
 * @param decimalComma   whether numbers were read with a decimal comma
 * @param shortRows      rows with fewer fields than the header, dropped (none of their cells is used)
 * @param longRows       rows with more fields than the header, dropped (none of their cells is used)
 * @param raggedExamples the first ragged rows (line and what was wrong)
 * @param badCells       total cells that did not parse in number or time columns
 * @param badExamples    the first bad cells (line, column, text)
 * @param nanos          wall-clock time of the load in nanoseconds
 * @param warnings       one line each about the input as a whole, without the "nearfit: " prefix
 *                       (for example a file that grew while it was read); empty for most loads
 */
public record LoadReport(String source, int rows, long bytes, char delimiter, boolean headerPresent,
        boolean decimalComma, long shortRows, long longRows, List<BadCell> raggedExamples, long badCells,
        List<BadCell> badExamples, long nanos, List<String> warnings) {
    /** The delimiter of a Parquet load, which has none. */
    public static final char PARQUET = '\0';

    /** How many examples of each kind a report keeps. */
    public static final int EXAMPLES = 10;

    public LoadReport {
        raggedExamples = List.copyOf(raggedExamples);
        badExamples = List.copyOf(badExamples);
        warnings = List.copyOf(warnings);
    }

    /** A report without warnings: the common case, and the form callers used before warnings existed. */
    public LoadReport(String source, int rows, long bytes, char delimiter, boolean headerPresent,
            boolean decimalComma, long shortRows, long longRows, List<BadCell> raggedExamples, long badCells,
            List<BadCell> badExamples, long nanos) {
        this(source, rows, bytes, delimiter, headerPresent, decimalComma, shortRows, longRows, raggedExamples,
                badCells, badExamples, nanos, List.of());
    }

    /** This report with one more warning. */
    public LoadReport withWarning(String warning) {
        List<String> w = new java.util.ArrayList<>(warnings);
        w.add(warning);
        return new LoadReport(source, rows, bytes, delimiter, headerPresent, decimalComma, shortRows, longRows,
                raggedExamples, badCells, badExamples, nanos, w);
    }

    /**
     * The delimiter as a word for reports: comma, semicolon, tab or bar (the delimiters the loader
     * detects), any other one quoted, e.g. {@code ':'}.
     */
    public String delimiterName() {
        return switch (delimiter) {
            case PARQUET -> "none (Parquet)";
            case ',' -> "comma";
            case ';' -> "semicolon";
            case '\t' -> "tab";
            case '|' -> "bar";
            default -> "'" + delimiter + "'";
        };
    }

    /** Rows with the wrong number of fields, short and long together: all dropped. */
    public long raggedRows() {
        return shortRows + longRows;
    }

    /** Rows not used: the ragged ones. */
    public long droppedRows() {
        return raggedRows();
    }

    /** Data rows read: those kept and those dropped. */
    public long rowsRead() {
        return rows + droppedRows();
    }

    /** Load time in seconds. */
    public double seconds() {
        return nanos / 1e9;
    }

    /** Throughput in MB (10^6 bytes) per second; 0 when the time is 0. */
    public double megabytesPerSecond() {
        return nanos == 0 ? 0 : bytes / 1e6 / seconds();
    }
}
