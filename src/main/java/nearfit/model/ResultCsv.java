package nearfit.model;

import java.io.BufferedWriter;
import java.io.IOException;
import java.io.OutputStream;
import java.io.OutputStreamWriter;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;

import nearfit.table.RowSource;
import nearfit.table.VisibleText;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;

/**
 * The one writer of every CSV the tool writes ({@code predict}, {@code predict --loo}, {@code check -o}, the
 * explorer's curve and flagged-row exports): Commons CSV's printer with RFC 4180 quoting, {@code \n} line
 * ends, UTF-8, text cells (the file's own names and labels) neutralised by {@link CsvCells}, numbers in
 * {@link CsvCells#number} form, times in ISO 8601 UTC. The column names are this class's constants, so two
 * files of the same thing have the same header.
 *
 * <p>Rows: {@code line}, the file's time column (when it has one that is not an input), the group column,
 * the inputs, the response, then {@code fit, band_lo, band_hi, resid, z} (a number response; the band
 * cells are empty where there is no band, e.g. leave-one-out) or {@code class, share} (a category
 * response). A curve: the display input, then {@code fit, band_lo, band_hi, window_width, neighbours}.
 */
public final class ResultCsv implements ResultSink {
    public static final String LINE = "line";
    /** A Parquet source's row index (0-based) in its file, in place of {@link #LINE}. */
    public static final String ROW = "row";
    /** A Parquet data set's file (within its folder), before {@link #ROW}. */
    public static final String FILE = "file";
    public static final String FIT = "fit";
    public static final String BAND_LO = "band_lo";
    public static final String BAND_HI = "band_hi";
    public static final String RESID = "resid";
    public static final String Z = "z";
    public static final String CLASS = "class";
    public static final String SHARE = "share";
    public static final String WINDOW_WIDTH = "window_width";
    public static final String NEIGHBOURS = "neighbours";
    /** 1 when a scored row lies beyond the reference (outside an input's range or far from every row), else 0. */
    public static final String BEYOND = "beyond";

    /** RFC 4180 quoting with {@code \n} line ends (see DEVELOPERS, Decisions). */
    private static final CSVFormat FORMAT = CSVFormat.RFC4180.builder().setRecordSeparator('\n').get();

    private final CSVPrinter printer;
    /** Whether text cells have their control characters made visible ({@link #forTerminal}). */
    private final boolean visible;

    /** A CSV on {@code w}; the caller writes the header first ({@link #header}). */
    public ResultCsv(Writer w) throws IOException {
        this(w, false);
    }

    private ResultCsv(Writer w, boolean visible) throws IOException {
        this.printer = new CSVPrinter(w, FORMAT);
        this.visible = visible;
    }

    /**
     * A CSV that a person reads on a terminal: text cells (names and labels from the file) have every control
     * character made visible ({@link VisibleText}), so a label holding an escape sequence cannot drive the
     * terminal. A file, or a pipe, gets the cells as the file holds them ({@link #ResultCsv(Writer)}).
     */
    public static ResultCsv forTerminal(Writer w) throws IOException {
        return new ResultCsv(w, true);
    }

    /** A CSV on a byte stream, as UTF-8 through a 64 KiB buffer; {@link #flush} pushes it through. */
    public static ResultCsv on(OutputStream out) throws IOException {
        return new ResultCsv(new BufferedWriter(new OutputStreamWriter(out, StandardCharsets.UTF_8), 1 << 16));
    }

    /**
     * The columns of scored rows.
     *
     * @param time      the file's time column, or {@code null} (none, or it is one of the inputs)
     * @param group     the group column, or {@code null}
     * @param inputs    the model's inputs
     * @param response  the response, or {@code null} when the rows have none
     * @param category  whether the response is a category ({@code class, share} instead of fit and band)
     * @param beyond    whether the rows end with {@link #BEYOND} (rows scored or voted against a model)
     */
    public static List<String> rowColumns(String time, String group, List<String> inputs, String response,
                                          boolean category, boolean beyond) {
        return rowColumns(RowSource.CSV_LINES, time, group, inputs, response, category, beyond);
    }

    /**
     * As {@link #rowColumns(String, String, List, String, boolean, boolean)} for rows of {@code source}: a CSV's
     * rows start with {@code line}, one Parquet file's with {@code row}, a data set's with {@code file, row}.
     */
    public static List<String> rowColumns(RowSource source, String time, String group, List<String> inputs,
                                          String response, boolean category, boolean beyond) {
        List<String> names = new ArrayList<>(originColumns(source));
        if (time != null) {
            names.add(time);
        }
        if (group != null) {
            names.add(group);
        }
        names.addAll(inputs);
        if (response != null) {
            names.add(response);
        }
        if (category) {
            names.add(CLASS);
            names.add(SHARE);
        } else {
            names.addAll(List.of(FIT, BAND_LO, BAND_HI));
            if (response != null) {
                names.add(RESID);
                names.add(Z);
            }
        }
        if (beyond) {
            names.add(BEYOND);
        }
        return names;
    }

    /** The columns that say where a row comes from: {@code line}, {@code row} or {@code file, row}. */
    public static List<String> originColumns(RowSource source) {
        if (!source.isParquet()) {
            return List.of(LINE);
        }
        return source.files().size() == 1 ? List.of(ROW) : List.of(FILE, ROW);
    }

    /** Writes a row's origin cells (see {@link #originColumns}) for its source-row value. */
    public static void origin(ResultSink sink, RowSource source, long value) throws IOException {
        if (source.isParquet() && source.files().size() > 1) {
            sink.text(source.fileOf(value));
        }
        sink.whole(source.rowIndex(value));
    }

    /** The columns of a curve along {@code displayInput}. */
    public static List<String> curveColumns(String displayInput) {
        return List.of(displayInput, FIT, BAND_LO, BAND_HI, WINDOW_WIDTH, NEIGHBOURS);
    }

    /** Writes the header line; names from a file are neutralised like any text cell. */
    @Override
    public void header(List<String> names) throws IOException {
        for (String name : names) {
            text(name);
        }
        endRow();
    }

    /** A text cell (a label or a name from the file), neutralised; empty for {@code null}. */
    @Override
    public ResultCsv text(String s) throws IOException {
        printer.print(visible ? VisibleText.of(CsvCells.text(s)) : CsvCells.text(s));
        return this;
    }

    /** A number cell; empty for NaN. */
    @Override
    public ResultCsv number(double v) throws IOException {
        printer.print(CsvCells.number(v));
        return this;
    }

    /** A whole number (a line number, a count). */
    @Override
    public ResultCsv whole(long v) throws IOException {
        printer.print(Long.toString(v));
        return this;
    }

    /** A time given in epoch milliseconds (exact in a double) as ISO 8601 UTC; empty for NaN. */
    @Override
    public ResultCsv time(double epochMillis) throws IOException {
        printer.print(Double.isNaN(epochMillis) ? "" : Instant.ofEpochMilli((long) epochMillis).toString());
        return this;
    }

    /** An empty cell (a value that does not apply to the row, such as a band under leave-one-out). */
    @Override
    public ResultCsv empty() throws IOException {
        printer.print("");
        return this;
    }

    /** Ends the current row. */
    @Override
    public void endRow() throws IOException {
        printer.println();
    }

    @Override
    public void flush() throws IOException {
        printer.flush();
    }
}
